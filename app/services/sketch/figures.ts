/**
 * What the Sketchpad's panels show, computed from an API answer: dense model curves, the beam's
 * fitted ellipse and image windows, a summary of why samples are unobservable, the notes and
 * cautions (the sampled tracks are in ./tracks.ts). Pure (no React, no Plotly).
 */
import {
  type CoverageSample,
  compileModel,
  type EphemerisResponse,
  evaluateVisibilities,
  type NightSampling,
  type TargetModel,
} from "~/engine";
import { angularSeparationDeg, observableWindows, sunSeparationDeg } from "./night";
import { plural, utcSpan } from "./words";

/** True when the model's visibility depends on the baseline length only (centred, circular). */
export function isCircular(model: TargetModel): boolean {
  return model.type !== "binary" && model.type !== "sum";
}

/**
 * Model V² along baselines of fixed position angle, from 0 to maxFreqMl (Mλ), `points` samples each.
 * A circular model gives one curve; others one per position angle (degrees east of north: the
 * baseline direction (u, v) = r (sin PA, cos PA)).
 */
export function modelVis2Curves(
  model: TargetModel,
  maxFreqMl: number,
  positionAnglesDeg = [0, 45, 90, 135],
  points = 241,
) {
  const compiled = compileModel(model);
  const pas = isCircular(model) ? [0] : positionAnglesDeg;
  return pas.map((pa) => {
    const r = new Float64Array(points);
    const u = new Float64Array(points);
    const v = new Float64Array(points);
    const s = Math.sin((pa * Math.PI) / 180);
    const c = Math.cos((pa * Math.PI) / 180);
    for (let k = 0; k < points; k++) {
      r[k] = (maxFreqMl * k) / (points - 1);
      u[k] = r[k] * 1e6 * s;
      v[k] = r[k] * 1e6 * c;
    }
    const re = new Float64Array(points);
    const im = new Float64Array(points);
    evaluateVisibilities(compiled, u, v, re, im);
    return {
      positionAngleDeg: isCircular(model) ? null : pa,
      freqMl: Array.from(r),
      vis2: Array.from(re, (x, k) => x * x + im[k] * im[k]),
    };
  });
}

// ---------------------------------------------------------------- beam

/**
 * How far from the phase centre a model's light reaches, mas: the radius of a disk or ring, the FWHM
 * of a Gaussian (its light is negligible beyond), a binary's separation, and for a sum the farthest
 * component (its offset plus its own reach).
 */
export function modelExtentMas(model: TargetModel): number {
  switch (model.type) {
    case "point":
      return 0;
    case "uniformDisk":
    case "limbDarkenedDisk":
    case "ring":
      return model.diameterMas / 2;
    case "gaussian":
      return model.fwhmMas;
    case "binary":
      return model.separationMas;
    case "sum":
      return Math.max(
        0,
        ...model.components.map((c) => Math.hypot(c.offsetEastMas, c.offsetNorthMas) + modelExtentMas(c.model)),
      );
  }
}

/**
 * Half width of the dirty image shown, mas: the model's reach three times over, and at least eight
 * beam widths (the main lobe and its first sidelobes around every part of the source). Infinity
 * (the whole image) when the beam has no fitted width.
 */
export function dirtyImageHalfWidthMas(model: TargetModel, fwhmMajorMas: number | null): number {
  if (!fwhmMajorMas) return Infinity;
  return Math.max(8 * fwhmMajorMas, 3 * modelExtentMas(model));
}

/**
 * Outline of the fitted beam at half power: an ellipse of full widths `majorMas` × `minorMas` whose
 * major axis lies at `positionAngleDeg` east of north. Returns east and north offsets in mas
 * (closed: the last point repeats the first).
 */
export function beamEllipse(majorMas: number, minorMas: number, positionAngleDeg: number, points = 97) {
  const pa = (positionAngleDeg * Math.PI) / 180;
  // Unit vectors (east, north): major axis toward PA, minor axis 90° further east of north.
  const maj = [Math.sin(pa), Math.cos(pa)];
  const min = [Math.cos(pa), -Math.sin(pa)];
  const east: number[] = [];
  const north: number[] = [];
  for (let k = 0; k < points; k++) {
    const t = (2 * Math.PI * k) / (points - 1);
    const a = (majorMas / 2) * Math.cos(t);
    const b = (minorMas / 2) * Math.sin(t);
    east.push(a * maj[0] + b * min[0]);
    north.push(a * maj[1] + b * min[1]);
  }
  return { east, north };
}

/**
 * A square window of a gridSize² image (row-major, rows toward north, columns toward east, phase
 * centre at (n/2, n/2)) as Plotly heatmap arrays: x = east offsets, y = north offsets (mas) and
 * z[row][col]. `halfWidthMas` limits the window (at least 8 pixels, at most the whole image).
 */
export function imageWindow(image: readonly number[], gridSize: number, pixelMas: number, halfWidthMas = Infinity) {
  const n = gridSize;
  const half = Math.max(8, Math.min(n / 2, Math.ceil(halfWidthMas / pixelMas)));
  const lo = n / 2 - half;
  const hi = Math.min(n - 1, n / 2 + half);
  const axis: number[] = [];
  for (let k = lo; k <= hi; k++) axis.push((k - n / 2) * pixelMas);
  const z: number[][] = [];
  for (let row = lo; row <= hi; row++) z.push(image.slice(row * n + lo, row * n + hi + 1) as number[]);
  return { x: axis, y: axis, z };
}

// ---------------------------------------------------------------- samples, reasons, cautions

/** A sample of the coverage answer, as far as the summaries read it. */
export type SampleLike = Omit<CoverageSample, "lstH">;

/**
 * Why samples are unobservable, counted by rule, e.g. ["12 samples below 30.0° elevation",
 * "4 samples out of delay-line range (worst X02–X05 needs 299.9 m, stroke 90 m)"]. A sample that
 * fails several rules counts under each.
 */
export function summariseReasons(samples: readonly SampleLike[]): string[] {
  let low = 0;
  let minEl: string | null = null;
  let sun = 0;
  let delay = 0;
  let worstNeed = -1;
  let worstText = "";
  const other = new Map<string, number>();
  for (const s of samples) {
    if (s.observable || !s.reason) continue;
    for (const part of s.reason.split(";").map((p) => p.trim())) {
      const el = /^elevation .*below minimum ([\d.]+)°/.exec(part);
      const dl = /^delay line out of range.*\(worst (\S+) needs ([\d.]+) m, stroke ([\d.]+) m\)/.exec(part);
      if (el) {
        low++;
        minEl = el[1];
      } else if (/^Sun at/.test(part)) sun++;
      else if (dl || /^delay line out of range/.test(part)) {
        delay++;
        if (dl && Number(dl[2]) > worstNeed) {
          worstNeed = Number(dl[2]);
          worstText = `worst ${dl[1]} needs ${dl[2]} m, stroke ${dl[3]} m`;
        }
      } else other.set(part, (other.get(part) ?? 0) + 1);
    }
  }
  const out: string[] = [];
  if (low) out.push(`${plural(low, "sample")} below ${minEl}° elevation`);
  if (sun) out.push(`${plural(sun, "sample")} with the Sun above −18°`);
  if (delay) out.push(`${plural(delay, "sample")} out of delay-line range${worstText ? ` (${worstText})` : ""}`);
  for (const [text, n] of other) out.push(`${plural(n, "sample")}: ${text}`);
  return out;
}

/** Smallest and largest air mass over the observable samples, or null when none has one. */
export function airmassRange(samples: readonly SampleLike[]): { min: number; max: number } | null {
  const values = samples.filter((s) => s.observable && s.airmass !== null).map((s) => s.airmass as number);
  if (values.length === 0) return null;
  return { min: Math.min(...values), max: Math.max(...values) };
}

/** Solar elongation below which the Sketchpad warns, degrees. */
export const SUN_CAUTION_DEG = 45;

/**
 * Short cautions about the Sun and twilight. The Sketchpad only predicts geometry; the observatory's
 * operating rules decide what may be observed, so each caution says so.
 */
export function cautions(opts: {
  sunSeparationDeg: number | null;
  hourAngleSampling: boolean;
  windows: { startMs: number; endMs: number }[];
  duskMs: number | null;
  dawnMs: number | null;
  stepMin: number;
}): string[] {
  const out: string[] = [];
  const rules = "the observatory's operating rules on solar avoidance and twilight decide";
  if (opts.sunSeparationDeg !== null && opts.sunSeparationDeg < SUN_CAUTION_DEG) {
    out.push(
      `The target is ${opts.sunSeparationDeg.toFixed(0)}° from the Sun that night: it is up mostly in daylight or twilight, ` +
        `and pointing near the Sun may be restricted — ${rules}.`,
    );
  }
  if (opts.hourAngleSampling) {
    out.push(
      `Hour-angle sampling ignores the Sun: some of these hour angles may fall in daylight or twilight — ${rules}. ` +
        "Sample a night to see only the dark hours.",
    );
  }
  const tol = opts.stepMin * 60_000;
  const edge = opts.windows.some(
    (w) =>
      (opts.duskMs !== null && w.startMs - opts.duskMs <= tol) ||
      (opts.dawnMs !== null && opts.dawnMs - w.endMs <= tol),
  );
  if (edge) {
    out.push(
      `The observable window reaches astronomical dusk or dawn: the sky is dark only from −18° Sun altitude, ` +
        `and twilight time is often kept for calibration — ${rules}.`,
    );
  }
  return out;
}

/**
 * The notes under a sketch: the cautions, and the Moon at local midnight when the ephemeris of the
 * sketched night is at hand (`ephemeris` of another night is ignored).
 */
export function sketchNotes(
  body: { night?: NightSampling; target: { raDeg: number; decDeg: number } },
  samples: readonly SampleLike[],
  ephemeris: EphemerisResponse | undefined,
): { cautions: string[]; moon: string | null; windows: string[] } {
  const stepMin = body.night?.stepMin ?? null;
  let sunSep: number | null = null;
  let moon: string | null = null;
  let duskMs: number | null = null;
  let dawnMs: number | null = null;
  if (ephemeris && body.night && ephemeris.date === body.night.date) {
    const midnight = Date.parse(ephemeris.localMidnightUtc);
    sunSep = sunSeparationDeg(body.target.raDeg, body.target.decDeg, midnight);
    const moonSep = angularSeparationDeg(
      body.target.raDeg,
      body.target.decDeg,
      ephemeris.moonRaDeg,
      ephemeris.moonDecDeg,
    );
    moon =
      `Moon at local midnight (${new Date(midnight).toISOString().slice(11, 16)} UTC): ${Math.round(ephemeris.moonIlluminatedFraction * 100)} % illuminated, ` +
      `about ${moonSep.toFixed(0)}° from the target, altitude ${ephemeris.moonAltitudeDeg.toFixed(0)}°.`;
    duskMs = ephemeris.astronomicalDuskUtc ? Date.parse(ephemeris.astronomicalDuskUtc) : null;
    dawnMs = ephemeris.astronomicalDawnUtc ? Date.parse(ephemeris.astronomicalDawnUtc) : null;
  }
  const windows = stepMin === null ? [] : observableWindows(samples, stepMin);
  return {
    cautions: cautions({
      sunSeparationDeg: sunSep,
      hourAngleSampling: stepMin === null,
      windows,
      duskMs,
      dawnMs,
      stepMin: stepMin ?? 0,
    }),
    moon,
    windows: windows.map((w) => utcSpan(w.startMs, w.endMs)),
  };
}
