/**
 * The size limits of the computation requests, checked as validation rules (a failure is a 400 naming
 * the field): the lengths of the lists and the uv points and closure phases a request produces. The
 * cost budget checked after validation (422) is in ./budget.ts. Pure: no I/O.
 */
import type { BeamOptions } from "../inputs";

/** Most hour-angle samples a request may ask for (explicit list or night sampling). */
export const MAX_SAMPLES = 20_000;
/** Most stations in one request. */
export const MAX_STATIONS = 64;
/** Most spectral channels (wavelengths) in one request. */
export const MAX_WAVELENGTHS = 2000;
/** Most uv points (baselines × samples × wavelengths) one request may produce. */
export const MAX_UV_POINTS = 3_000_000;
/** Most closure-phase values (triangles × samples × wavelengths) one request may produce. */
export const MAX_CLOSURE_VALUES = 6_000_000;
/** Longest wavelength accepted, metres: catches micrometres typed as metres. */
export const MAX_WAVELENGTH_M = 1e-3;
/** Default minimum elevation when a request gives none, degrees (air mass 2). */
export const DEFAULT_MIN_ELEVATION_DEG = 30;
/** Default dirty-beam grid size, pixels per side. */
export const DEFAULT_GRID_SIZE = 256;
/** Default number of triangles returned by the triangle finder (all when larger). */
export const DEFAULT_MAX_TRIANGLES = 50;

/** Largest number of samples a night of at most 24 h can produce at a step (aligned to the step). */
export function maxNightSamples(stepMin: number): number {
  return Math.floor(1440 / stepMin) + 1;
}

interface SamplingShape {
  site?: { latitudeDeg: number };
  stations: unknown[];
  wavelengthsM: number[];
  hourAnglesH?: number[];
  night?: { stepMin: number };
}

/** The Sun's largest declination over the years the requests accept, degrees (obliquity 23.44°, rounded up). */
const SUN_MAX_DECLINATION_DEG = 23.5;
/** Sun altitude at the ends of the astronomical night, degrees. */
const DARK_SUN_ALTITUDE_DEG = -18;
/** Added to the longest night for the Sun's motion in declination during one night, minutes. */
const NIGHT_MARGIN_MIN = 10;

/**
 * Longest astronomical night (Sun below −18°) of the year at a latitude, minutes, with a margin: the
 * largest over the Sun's declinations δ of 24 h less twice its hour angle at −18°, cos H0 = (sin h0 −
 * sin φ sin δ) / (cos φ cos δ) (Meeus, Astronomical Algorithms, 2nd ed., eq. 15.1). 24 h where the Sun
 * can stay below −18° all day.
 */
export function longestNightMinutes(latitudeDeg: number): number {
  const d2r = Math.PI / 180;
  const phi = latitudeDeg * d2r;
  let longest = 0;
  for (let deltaDeg = -SUN_MAX_DECLINATION_DEG; deltaDeg <= SUN_MAX_DECLINATION_DEG; deltaDeg += 0.5) {
    const delta = deltaDeg * d2r;
    const cosH0 =
      (Math.sin(DARK_SUN_ALTITUDE_DEG * d2r) - Math.sin(phi) * Math.sin(delta)) / (Math.cos(phi) * Math.cos(delta));
    if (!(cosH0 < 1)) return 1440;
    const h0Deg = Math.acos(Math.max(-1, cosH0)) / d2r;
    longest = Math.max(longest, (360 - 2 * h0Deg) * 4);
  }
  return Math.min(1440, longest + NIGHT_MARGIN_MIN);
}

/**
 * Upper bound of the number of hour-angle samples a validated request can produce: the list's length,
 * or the samples of the longest astronomical night at the site's latitude (24 h without a site).
 */
export function sampleCountBound(req: {
  site?: { latitudeDeg: number };
  hourAnglesH?: number[];
  night?: { stepMin: number };
}): number {
  if (req.hourAnglesH) return req.hourAnglesH.length;
  if (!req.night) return 0;
  const minutes = req.site ? longestNightMinutes(req.site.latitudeDeg) : 1440;
  return Math.min(MAX_SAMPLES, maxNightSamples(req.night.stepMin), Math.floor(minutes / req.night.stepMin) + 1);
}

/**
 * The size of what a request asks for, against its limit: `pairs` (baselines) or `triples` (closure
 * triangles) of stations × samples × wavelengths.
 */
function sizeCheck(r: SamplingShape, of: "uv points" | "closure phases"): { text: string; ok: boolean } {
  const n = r.stations.length;
  const groups = of === "uv points" ? (n * (n - 1)) / 2 : (n * (n - 1) * (n - 2)) / 6;
  const groupName = of === "uv points" ? "baselines" : "triangles";
  const limit = of === "uv points" ? MAX_UV_POINTS : MAX_CLOSURE_VALUES;
  const s = sampleCountBound(r);
  const c = r.wavelengthsM.length;
  const total = groups * s * c;
  return {
    ok: total <= limit,
    text: `request too large: ${groups} ${groupName} × ${s} samples × ${c} wavelengths = ${total} ${of} (limit ${limit})`,
  };
}

/**
 * Cross-field rules of coverage and triangle requests, checked after the
 * schema: sampling given exactly once and the size limits. Returns the first
 * failure or null.
 */
export function samplingRuleFailure(r: SamplingShape): { message: string; field: string } | null {
  if (r.hourAnglesH && r.night) return { field: "hourAnglesH", message: "give either hourAnglesH or night, not both" };
  if (!r.hourAnglesH && !r.night)
    return { field: "hourAnglesH", message: "is required (or give night: {date, stepMin})" };
  const uv = sizeCheck(r, "uv points");
  if (!uv.ok) return { field: "wavelengthsM", message: uv.text };
  const cl = sizeCheck(r, "closure phases");
  if (!cl.ok) return { field: "stations", message: cl.text };
  return null;
}

/** Largest grid for which the beam and dirty images are returned (they grow as gridSize²). */
export const MAX_IMAGE_GRID = 512;

/** Cross-field rules of a coverage request: the sampling rules plus the image size. */
export function coverageRuleFailure(r: SamplingShape & { beam: BeamOptions | null }): {
  message: string;
  field: string;
} | null {
  const sampling = samplingRuleFailure(r);
  if (sampling) return sampling;
  if (r.beam?.includeImages && r.beam.gridSize > MAX_IMAGE_GRID) {
    return { field: "beam.includeImages", message: `images are returned only for gridSize up to ${MAX_IMAGE_GRID}` };
  }
  return null;
}
