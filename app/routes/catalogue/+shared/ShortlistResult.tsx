/**
 * A computed shortlist: what was asked (target, band, baseline, night), the engine's warnings, the
 * table, what was left out and why, and how the score is made.
 */
import type { ReactNode } from "react";
import { CalibratorTable } from "~/components/catalogue/CalibratorTable";
import { Alert, Card, DetailList } from "~/components/ui";
import type { CalibratorEntry, CalibratorsResponse } from "~/engine";
import { formatDeclination, formatRightAscension } from "~/lib/coordinates";
import type { ShortlistRun } from "~/services/catalogue/shortlist.server";

const utc = (iso: string | null) => (iso ? `${iso.slice(0, 16).replace("T", " ")} UTC` : "none");

const EXCLUDED: [keyof CalibratorsResponse["excluded"], string][] = [
  ["target", "the target itself (or within 60″ of it)"],
  ["noColour", "no B−V in the catalogue"],
  ["colourOutOfRange", "B−V outside −0.30 … 1.51, where the diameter relation holds"],
  ["resolved", "too resolved (V² below the limit)"],
  ["magnitude", "band magnitude out of range or beyond the band limit"],
  ["notTogether", "never up with the target during the night"],
];

function Summary({
  run,
}: {
  run: ShortlistRun & { result: CalibratorsResponse; asked: NonNullable<ShortlistRun["asked"]> };
}) {
  const { result, asked } = run;
  const t = result.target;
  const targetText = `${asked.targetName ?? "Typed position"} — RA ${formatRightAscension(t.raDeg, 1)}, Dec ${formatDeclination(t.decDeg, 0)} (J2000)`;
  const photometry =
    t.vMag === null
      ? "no catalogue star at this position"
      : `V ${t.vMag.toFixed(2)}, B−V ${t.bv === null ? "not given" : t.bv.toFixed(2)}`;
  const bandMag =
    t.bandMag === null
      ? "unknown (the magnitude rules are skipped)"
      : `${t.bandMag.toFixed(2)} mag (${t.bandMagSource === "estimate" ? "estimate from V and B−V" : "as given"})`;
  return (
    <DetailList
      className="grid gap-x-6 gap-y-2 sm:grid-cols-2 lg:grid-cols-3"
      valueClassName="font-medium text-night-900"
      items={[
        { label: "Target", value: targetText },
        { label: "Catalogue photometry", value: photometry },
        { label: `Target's ${result.band.name} magnitude`, value: bandMag },
        {
          label: "Band",
          value: `${asked.band.label}; estimates in ${result.band.name} (${(result.band.centralWavelengthM * 1e6).toFixed(3)} µm)`,
        },
        {
          label: "Longest baseline",
          value: `${asked.baselineM.toFixed(1)} m${asked.configuration ? ` (${asked.configuration.name}, between stations on the ground; a projected baseline is never longer)` : ""}`,
        },
        {
          label: "Astronomical night",
          value: `${utc(result.night.astronomicalDuskUtc)} to ${utc(result.night.astronomicalDawnUtc)}, sampled every ${result.night.stepMin} min`,
        },
        { label: "Target observable", value: `${result.target.observableHours.toFixed(2)} h` },
        { label: "Candidates that pass", value: `${result.candidates} (shown: ${result.calibrators.length})` },
      ]}
    />
  );
}

export function ShortlistResult({
  run,
  exportName,
  action,
}: {
  run: ShortlistRun;
  exportName: string;
  action?: { header: string; cell: (entry: CalibratorEntry) => ReactNode };
}) {
  const { result, asked } = run;
  if (!result || !asked) return null;
  const left = EXCLUDED.filter(([k]) => result.excluded[k] > 0);
  return (
    <>
      <Card title="What was asked">
        <Summary run={{ ...run, result, asked }} />
      </Card>
      {result.warnings.map((w) => (
        <Alert key={w} tone="caution">
          {w}
        </Alert>
      ))}
      <Card title="Calibrator shortlist">
        <CalibratorTable result={result} baselineM={asked.baselineM} exportName={exportName} action={action} />
      </Card>
      <Card title="Left out, and how the score is made">
        {left.length ? (
          <ul className="mb-3 list-disc pl-5 text-sm text-night-700">
            {left.map(([k, words]) => (
              <li key={k}>
                {result.excluded[k]} {result.excluded[k] === 1 ? "star" : "stars"}: {words}
              </li>
            ))}
          </ul>
        ) : (
          <p className="mb-3 text-sm text-night-700">No star within the distance was left out.</p>
        )}
        <p className="text-sm text-night-700">{result.scoring}</p>
        <p className="mt-2 text-sm text-night-600">
          The estimates assume an unreddened dwarf of about solar metallicity (the catalogue gives no luminosity class);
          for red giants they overstate the diameter, which errs toward a lower V². Check a calibrator's literature
          (multiplicity, variability) before relying on it.
        </p>
      </Card>
    </>
  );
}
