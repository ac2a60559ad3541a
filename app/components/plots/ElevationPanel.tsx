import { useMemo } from "react";
import type { CoverageResponse, EphemerisResponse } from "~/engine";
import { hourAngleFigure, nightFigure } from "./elevation-figure";
import { Panel, SeriesLegend } from "./Panel";
import { Plot } from "./Plot";

/**
 * The target's elevation and air mass through the night of a sketch (with twilight, the observable
 * window, sidereal time and the Moon), or against hour angle when the sketch samples hour angles.
 */
export function ElevationPanel({
  coverage,
  ephemeris,
  site,
  raDeg,
  decDeg,
  stepMin,
  minElevationDeg,
}: {
  coverage: CoverageResponse;
  ephemeris: EphemerisResponse | undefined;
  site: { latitudeDeg: number; longitudeDeg: number };
  raDeg: number;
  decDeg: number;
  /** Night sampling step; null when the sketch samples a list of hour angles. */
  stepMin: number | null;
  minElevationDeg: number;
}) {
  const figure = useMemo(
    () =>
      stepMin === null || !ephemeris
        ? null
        : nightFigure({ coverage, ephemeris, site, raDeg, decDeg, stepMin, minElevationDeg }),
    [coverage, ephemeris, site, raDeg, decDeg, stepMin, minElevationDeg],
  );
  const byHourAngle = useMemo(
    () => (stepMin !== null ? null : hourAngleFigure(coverage, minElevationDeg)),
    [coverage, stepMin, minElevationDeg],
  );

  return (
    <Panel
      id="elevation"
      title="Elevation through the night"
      note={
        stepMin === null
          ? "Sampled by hour angle: no clock time, so no twilight or sidereal time. Sample a night to see them."
          : "Curves are geometric (no refraction). The Moon's altitude is geocentric. Shaded: daylight and the civil, nautical and astronomical twilights; green: the observable window above the minimum elevation."
      }
    >
      {figure ? (
        <>
          <Plot
            label="Target elevation and air mass against UTC and local sidereal time, with twilight and the observable window"
            height={400}
            data={figure.data}
            layout={figure.layout}
          />
          <SeriesLegend label="Elevation plot legend" items={figure.legend} />
        </>
      ) : byHourAngle ? (
        <>
          <Plot
            label="Target elevation and air mass against hour angle"
            height={380}
            data={byHourAngle.data}
            layout={byHourAngle.layout}
          />
          <SeriesLegend label="Elevation plot legend" items={byHourAngle.legend} />
        </>
      ) : (
        <p className="py-16 text-center text-sm text-night-600">Waiting for the night's ephemeris…</p>
      )}
    </Panel>
  );
}
