/**
 * What the pages ask of the computation API at most: the beam grid, the hour-angle samples, the
 * rows of the ranking, and the API's own request-size limits checked before asking (docs/cli.md,
 * "Size limits"). Pure.
 */
import { baselineCount, MAX_CLOSURE_VALUES, MAX_UV_POINTS, type ParamRange, triangleCount } from "~/engine";
import { plural } from "./words";

/** Dirty-beam grid of the Sketchpad: 256² keeps the fitted FWHM within a few per cent (docs/cli.md). */
export const SKETCH_GRID_SIZE = 256;
/** Most hour-angle samples the Sketchpad asks for in one request. */
export const MAX_SKETCH_HOUR_ANGLES = 2000;
/**
 * Time steps of a sampled night the pages accept, minutes: finer than a minute adds nothing a plot
 * shows, coarser than two hours leaves a handful of samples (the API itself takes 0.07–720 min).
 */
export const NIGHT_STEP_RANGE: ParamRange = { min: 1, max: 120, unit: "min" };
/** Minimum elevations the pages accept, degrees (the API's own range). */
export const MIN_ELEVATION_RANGE: ParamRange = { min: 0, max: 90, unit: "°" };
/** Rows the Triangle finder asks for. */
export const TRIANGLE_ROWS = 50;

/** Checks the request-size limits of the API before asking (docs/cli.md, "Size limits"). */
export function sizeFailure(stations: number, samples: number, channels: number, withClosures = true): string | null {
  const baselines = baselineCount(stations);
  const triangles = triangleCount(stations);
  const uv = baselines * samples * channels;
  if (uv > MAX_UV_POINTS) {
    return `${plural(baselines, "baseline")} × ${plural(samples, "sample")} × ${plural(channels, "channel")} = ${uv} uv points, above the limit of ${MAX_UV_POINTS}; use a larger time step`;
  }
  const cp = triangles * samples * channels;
  if (withClosures && cp > MAX_CLOSURE_VALUES) {
    return `${plural(triangles, "triangle")} × ${plural(samples, "sample")} × ${plural(channels, "channel")} = ${cp} closure phases, above the limit of ${MAX_CLOSURE_VALUES}; use a larger time step or fewer stations`;
  }
  return null;
}
