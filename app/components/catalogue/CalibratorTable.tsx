/**
 * The Calibrator shortlist as a table: name, distance, V, B−V, the estimated band magnitude and angular
 * diameter (each marked "estimate", with its 1σ), V² on the longest baseline, hours observable together
 * with the target, score and the reasons. Sortable by any column; the CSV export carries every number
 * with its uncertainty in a column of its own. `action` adds a last column (e.g. "Add as calibrator").
 */
import type { ReactNode } from "react";
import type { CalibratorEntry, CalibratorsResponse } from "~/engine";
import { Button } from "../ui/Button";
import { type Column, DataTable, download, fixedColumn, tableToCsv } from "../ui/DataTable";

/** A value with its 1σ, marked as an estimate. */
function Estimate({ value, error, digits }: { value: number | null; error: number | null; digits: number }) {
  if (value === null) return <span className="text-night-500">none</span>;
  return (
    <span className="whitespace-nowrap">
      {value.toFixed(digits)}
      {error === null ? null : <span className="text-night-600"> ± {error.toFixed(digits)}</span>}
      <span className="ml-1 text-xs text-night-500">estimate</span>
    </span>
  );
}

/** The columns of the export: one per number, uncertainties apart, the reasons joined. */
function exportColumns(band: string, baselineM: number): Column<CalibratorEntry>[] {
  return [
    { key: "name", header: "name", value: (c) => c.name },
    { key: "hip", header: "hip", value: (c) => c.hip },
    { key: "ra", header: "ra_j2000", unit: "deg", value: (c) => c.raDeg },
    { key: "dec", header: "dec_j2000", unit: "deg", value: (c) => c.decDeg },
    { key: "distance", header: "distance", unit: "deg", value: (c) => c.distanceDeg },
    { key: "v", header: "V", unit: "mag", value: (c) => c.vMag },
    { key: "bv", header: "B-V", unit: "mag", value: (c) => c.bv },
    { key: "band", header: `${band} estimate`, unit: "mag", value: (c) => c.bandMag },
    { key: "bandErr", header: `${band} estimate 1 sigma`, unit: "mag", value: (c) => c.bandMagErr },
    { key: "diameter", header: "diameter estimate", unit: "mas", value: (c) => c.diameterMas },
    { key: "diameterErr", header: "diameter estimate 1 sigma", unit: "mas", value: (c) => c.diameterErrMas },
    { key: "vis2", header: `V2 at ${baselineM} m`, value: (c) => c.vis2 },
    { key: "hours", header: "hours together", unit: "h", value: (c) => c.observableHours },
    { key: "score", header: "score", value: (c) => c.score },
    { key: "why", header: "why", value: (c) => c.reasons.join("; ") },
  ];
}

export function CalibratorTable({
  result,
  baselineM,
  exportName,
  action,
}: {
  result: CalibratorsResponse;
  /** The longest baseline the V² is computed on, metres. */
  baselineM: number;
  /** File name of the CSV export, without extension. */
  exportName: string;
  action?: { header: string; cell: (entry: CalibratorEntry) => ReactNode };
}) {
  const band = result.band.name;
  const columns: Column<CalibratorEntry>[] = [
    {
      key: "name",
      header: "Name",
      value: (c) => c.name,
      render: (c) => (
        <span className="whitespace-nowrap">
          <span className="font-medium">{c.name}</span>
          {c.name !== `HIP ${c.hip}` ? <span className="block text-xs text-night-500">HIP {c.hip}</span> : null}
        </span>
      ),
    },
    fixedColumn({ key: "distance", header: "Distance", unit: "°", digits: 2, value: (c) => c.distanceDeg }),
    fixedColumn({ key: "v", header: "V", unit: "mag", digits: 2, value: (c) => c.vMag }),
    fixedColumn({ key: "bv", header: "B−V", unit: "mag", digits: 3, value: (c) => c.bv }),
    {
      key: "band",
      header: `${band} magnitude`,
      unit: "mag",
      align: "right",
      value: (c) => c.bandMag,
      render: (c) => <Estimate value={c.bandMag} error={c.bandMagErr} digits={2} />,
    },
    {
      key: "diameter",
      header: "Diameter",
      unit: "mas",
      align: "right",
      value: (c) => c.diameterMas,
      render: (c) => <Estimate value={c.diameterMas} error={c.diameterErrMas} digits={3} />,
    },
    fixedColumn({ key: "vis2", header: `V² at ${baselineM} m`, digits: 3, value: (c) => c.vis2 }),
    fixedColumn({ key: "hours", header: "Hours together", unit: "h", digits: 2, value: (c) => c.observableHours }),
    fixedColumn({ key: "score", header: "Score", digits: 1, value: (c) => c.score }),
    ...(action ? [{ key: "action", header: action.header, value: () => null, render: action.cell }] : []),
    {
      key: "why",
      header: "Why",
      value: (c) => c.reasons.join("; "),
      // The reasons in full on demand; a variable star's flag in sight.
      render: (c) => {
        const flags = c.reasons.filter((r) => /variable/.test(r));
        return (
          <details className="min-w-40 text-xs text-night-700">
            <summary className="cursor-pointer">
              {flags.length ? <span className="text-caution-700">{flags.join("; ")}</span> : "Reasons"}
            </summary>
            <ul className="mt-1 min-w-64 list-disc space-y-0.5 pl-4">
              {c.reasons.map((r) => (
                <li key={r}>{r}</li>
              ))}
            </ul>
          </details>
        );
      },
    },
  ];
  return (
    <div className="space-y-2">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-sm text-night-600">
          Best first. Diameters and {band} magnitudes are estimates from V and B−V (1σ shown); V² is that of a uniform
          disk of the estimated diameter.
        </p>
        <Button
          variant="secondary"
          size="sm"
          onClick={() => download(`${exportName}.csv`, tableToCsv(exportColumns(band, baselineM), result.calibrators))}
        >
          Export CSV
        </Button>
      </div>
      <DataTable
        caption="Calibrator shortlist"
        columns={columns}
        rows={result.calibrators}
        rowKey={(c) => c.hip}
        empty="No catalogue star passes every rule: widen the distance or lower the smallest V²."
      />
    </div>
  );
}
