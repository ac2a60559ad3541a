/**
 * Sampling the nights of a cycle for one target × configuration: which nights are looked at (the
 * first, middle and last of the cycle; up to a fixed number inside a time-critical window), and what
 * the engine says about each (hours up and observable, projected baselines, V², triangles).
 */
import { computeCoverageArrays, parseCoverageRequest, type TargetModel } from "~/engine";
import type { FeasibilityConfiguration, FeasibilityInput, FeasibilityNight, FeasibilityTarget } from "./types";

/** Adds whole days to a YYYY-MM-DD date. */
export function addDays(date: string, days: number): string {
  const t = Date.parse(`${date}T00:00:00Z`) + days * 86_400_000;
  return new Date(t).toISOString().slice(0, 10);
}

/** Days from a to b (YYYY-MM-DD), b − a. */
export function daysBetween(a: string, b: string): number {
  return Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);
}

/** The first, middle and last night of an observing period. */
export function cycleNights(
  observingStart: string,
  observingEnd: string,
): { date: string; when: FeasibilityNight["when"] }[] {
  const span = Math.max(0, daysBetween(observingStart, observingEnd));
  return [
    { date: observingStart, when: "start" },
    { date: addDays(observingStart, Math.floor(span / 2)), when: "middle" },
    { date: observingEnd, when: "end" },
  ];
}

/**
 * `count` nights from `first` on, every one when there are at most `most`, else `most` of them
 * spread evenly from the first to the last.
 */
export function spreadNights(first: string, count: number, most: number): string[] {
  const dates: string[] = [];
  if (count <= most) for (let d = 0; d < count; d++) dates.push(addDays(first, d));
  else for (let d = 0; d < most; d++) dates.push(addDays(first, Math.round((d * (count - 1)) / (most - 1))));
  return dates;
}

/** A stored target or configuration the engine cannot take (names the field). */
export class FeasibilityInputError extends Error {}

/** What one target × configuration is looked at with: the model read, the band's channels, the limit. */
export type CellSubject = {
  input: FeasibilityInput;
  config: FeasibilityConfiguration;
  target: FeasibilityTarget;
  model: TargetModel;
  wavelengthsM: number[];
  /** The stricter of the site's and the target's elevation limits, degrees. */
  minElevationDeg: number;
  stepMin: number;
};

export type NightResult = {
  observableHours: number;
  upHours: number;
  darkHours: number;
  /** Per observable sample and baseline: projected length (m); with V² per channel. */
  minLenM: number | null;
  maxLenM: number | null;
  vis2AtShortest: number | null;
  vis2Min: number | null;
  vis2Max: number | null;
  /** Triangle t observable at least once. */
  triangleSeen: Uint8Array;
  /** Observable sample instants (Julian days) for the window checks. */
  observableJd: number[];
  sampleDurationH: number;
};

/** One night of `date` through the engine: hours, baselines, V² and triangles where the target can be observed. */
export function observeNight(subject: CellSubject, date: string): NightResult {
  const { input, config, target, model, wavelengthsM, minElevationDeg, stepMin } = subject;
  const parsed = parseCoverageRequest({
    site: {
      latitudeDeg: input.site.latitudeDeg,
      longitudeDeg: input.site.longitudeDeg,
      altitudeM: input.site.altitudeM,
    },
    stations: config.stations,
    target: { name: target.name, raDeg: target.raDeg, decDeg: target.decDeg, model },
    wavelengthsM,
    night: { date, stepMin },
    minElevationDeg,
    delayLineStrokeM: input.site.delayLineStrokeM,
    beam: null,
  });
  if (!parsed.ok) throw new FeasibilityInputError(parsed.message);
  const { observation, vis2, triangles } = computeCoverageArrays(parsed.value);
  const { tracks, observability, samples } = observation;
  const nS = tracks.nSamples;
  const nB = tracks.nBaselines;
  const nC = wavelengthsM.length;
  let observable = 0;
  let up = 0;
  const observableJd: number[] = [];
  for (let s = 0; s < nS; s++) {
    if (observability.skyOk[s]) up++;
    if (observability.observable[s]) {
      observable++;
      if (samples.jd) observableJd.push(samples.jd[s]);
    }
  }
  let minLen = Infinity;
  let maxLen = -Infinity;
  let atShortest: number | null = null;
  let vMin = Infinity;
  let vMax = -Infinity;
  // Each baseline counts where the target is up in darkness and that baseline is within the stroke
  // (a subset of the stations can observe even when the whole configuration cannot).
  let points = 0;
  for (let b = 0; b < nB; b++) {
    for (let s = 0; s < nS; s++) {
      const k = b * nS + s;
      if (!observability.skyOk[s] || !observability.baselineInRange[k]) continue;
      points++;
      const len = Math.hypot(tracks.uM[k], tracks.vM[k]);
      let best = -Infinity;
      for (let c = 0; c < nC; c++) {
        const x = vis2[k * nC + c];
        if (x < vMin) vMin = x;
        if (x > vMax) vMax = x;
        if (x > best) best = x;
      }
      if (len < minLen) {
        minLen = len;
        atShortest = best;
      }
      if (len > maxLen) maxLen = len;
    }
  }
  const triangleSeen = new Uint8Array(triangles.count);
  for (let t = 0; t < triangles.count; t++) {
    for (let s = 0; s < nS; s++) {
      if (
        observability.skyOk[s] &&
        observability.baselineInRange[triangles.bij[t] * nS + s] &&
        observability.baselineInRange[triangles.bjk[t] * nS + s] &&
        observability.baselineInRange[triangles.bik[t] * nS + s]
      ) {
        triangleSeen[t] = 1;
        break;
      }
    }
  }
  const night = samples.night;
  const darkHours =
    night?.darkStartJd != null && night.darkEndJd != null ? (night.darkEndJd - night.darkStartJd) * 24 : 0;
  const has = points > 0;
  return {
    observableHours: observable * samples.sampleDurationH,
    upHours: up * samples.sampleDurationH,
    darkHours,
    minLenM: has ? minLen : null,
    maxLenM: has ? maxLen : null,
    vis2AtShortest: has ? atShortest : null,
    vis2Min: has ? vMin : null,
    vis2Max: has ? vMax : null,
    triangleSeen,
    observableJd,
    sampleDurationH: samples.sampleDurationH,
  };
}

/** The extremes over several nights: shortest and longest baseline, V² at the shortest, V² range, triangles seen. */
export function combineNights(results: NightResult[], nTriangles: number) {
  let minLen: number | null = null;
  let maxLen: number | null = null;
  let atShortest: number | null = null;
  let vMin: number | null = null;
  let vMax: number | null = null;
  const seen = new Uint8Array(nTriangles);
  for (const r of results) {
    if (r.minLenM !== null && (minLen === null || r.minLenM < minLen)) {
      minLen = r.minLenM;
      atShortest = r.vis2AtShortest;
    }
    if (r.maxLenM !== null && (maxLen === null || r.maxLenM > maxLen)) maxLen = r.maxLenM;
    if (r.vis2Min !== null && (vMin === null || r.vis2Min < vMin)) vMin = r.vis2Min;
    if (r.vis2Max !== null && (vMax === null || r.vis2Max > vMax)) vMax = r.vis2Max;
    for (let i = 0; i < nTriangles; i++) if (r.triangleSeen[i]) seen[i] = 1;
  }
  return { minLen, maxLen, atShortest, vMin, vMax, observableTriangles: seen.reduce((a, b) => a + b, 0) };
}
