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

  const shown = figure
    ? {
        figure,
        height: 400,
        label:
          "Target elevation and air mass against UTC and local sidereal time, with twilight and the observable window",
      }
    : byHourAngle
      ? { figure: byHourAngle, height: 380, label: "Target elevation and air mass against hour angle" }
      : null;
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
      {shown ? (
        <>
          <Plot label={shown.label} height={shown.height} data={shown.figure.data} layout={shown.figure.layout} />
          <SeriesLegend label="Elevation plot legend" items={shown.figure.legend} />
        </>
      ) : (
        <p className="py-16 text-center text-sm text-night-600">Waiting for the night's ephemeris…</p>
      )}
    </Panel>
  );
}
