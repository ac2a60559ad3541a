/**
 * The top three calibrators of the current target, for a page that shows a target live (the
 * Sketchpad): SWR over `POST /api/calibrators` keyed by the request, the last answer kept while the next
 * one is computed. Each line: name, distance, estimated diameter and V² on the longest baseline, hours
 * together; a link to the full shortlist when `moreHref` is given.
 */
import { Link } from "react-router";
import useSWR from "swr";
import type { CalibratorsResponse } from "~/engine";
import { type CatalogueApiError, postJson, SWR_OPTIONS } from "./fetch";

export type CalibratorPeekProps = {
  /** J2000 position of the target, degrees; null while none is typed (nothing is asked). */
  target: { raDeg: number; decDeg: number; bandMag?: number | null } | null;
  wavelengthM: number;
  longestBaselineM: number;
  site: { latitudeDeg: number; longitudeDeg: number; altitudeM: number };
  /** The night (YYYY-MM-DD; it begins on the local evening of the date). */
  date: string;
  minElevationDeg?: number;
  /** The full Calibrator shortlist of the same target (see calibratorShortlistHref). */
  moreHref?: string;
};

/** How many calibrators the peek shows. */
export const PEEK_SIZE = 3;

/** The address of the Calibrator shortlist page for a target and settings (each one optional). */
export function calibratorShortlistHref(q: {
  target?: string;
  ra?: string;
  dec?: string;
  /** Registry ids of a band and a configuration. */
  band?: number;
  config?: number;
  /** A baseline typed in metres, used when no configuration is given. */
  baselineM?: number;
  date?: string;
}): string {
  const params = new URLSearchParams();
  if (q.target) params.set("target", q.target);
  if (q.ra) params.set("ra", q.ra);
  if (q.dec) params.set("dec", q.dec);
  if (q.band !== undefined) params.set("band", String(q.band));
  if (q.config !== undefined) params.set("config", String(q.config));
  else if (q.baselineM !== undefined) {
    params.set("config", "");
    params.set("baseline", String(Math.round(q.baselineM * 10) / 10));
  }
  if (q.date) params.set("date", q.date);
  return `/catalogue/calibrators?${params.toString()}`;
}

export function CalibratorPeek(props: CalibratorPeekProps) {
  const { target, wavelengthM, longestBaselineM, site, date, minElevationDeg = 30, moreHref } = props;
  const usable = target !== null && Number.isFinite(target.raDeg) && Number.isFinite(target.decDeg);
  const body = usable
    ? JSON.stringify({
        target: { raDeg: target.raDeg, decDeg: target.decDeg, bandMag: target.bandMag ?? null },
        wavelengthM,
        longestBaselineM: Math.round(longestBaselineM * 10) / 10,
        site,
        date,
        minElevationDeg,
        limit: PEEK_SIZE,
      })
    : null;
  const { data, error, isLoading } = useSWR<CalibratorsResponse, CatalogueApiError, readonly [string, string] | null>(
    body === null ? null : (["/api/calibrators", body] as const),
    postJson<CalibratorsResponse>,
    SWR_OPTIONS,
  );
  return (
    <section aria-label="Calibrators" className="space-y-2 text-sm">
      <h3 className="font-semibold text-night-800">Calibrators</h3>
      {!usable ? (
        <p className="text-night-600">Type the target's coordinates to see its best calibrators.</p>
      ) : error ? (
        <p className="text-caution-700">No shortlist: {error.message}</p>
      ) : !data ? (
        <p className="text-night-500">{isLoading ? "Finding calibrators…" : ""}</p>
      ) : data.calibrators.length === 0 ? (
        <p className="text-night-600">No catalogue star within 10° passes every rule for this night.</p>
      ) : (
        <ol className="space-y-1">
          {data.calibrators.map((c) => (
            <li key={c.hip} className="rounded-md bg-night-50 px-2 py-1 ring-1 ring-night-200">
              <span className="font-medium">{c.name}</span>{" "}
              <span className="num text-night-600">
                {c.distanceDeg.toFixed(1)}° away · {c.diameterMas.toFixed(2)} ± {c.diameterErrMas.toFixed(2)} mas
                (estimate) · V² {c.vis2.toFixed(2)} · {c.observableHours.toFixed(1)} h together
              </span>
            </li>
          ))}
        </ol>
      )}
      {data?.warnings.length ? <p className="text-caution-700">{data.warnings.join("; ")}</p> : null}
      {moreHref ? (
        <Link to={moreHref} className="font-medium text-ember-700 underline">
          The full Calibrator shortlist
        </Link>
      ) : null}
    </section>
  );
}
