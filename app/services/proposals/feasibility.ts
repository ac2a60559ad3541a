/**
 * The feasibility report of a proposal: for each target × each requested configuration, over the
 * cycle, whether the array can do what the proposal asks. Pure computation on top of the engine
 * (no database, HTTP or React imports); feasibility.server.ts loads the inputs.
 *
 * Each target × configuration gets lines with a verdict (pass / caution / fail) and the reason in
 * plain words:
 *  - Combiner: the configuration's station count against the instrument's telescope limit.
 *  - Observable time: hours the target is observable (elevation ≥ the limit, Sun below −18°, every
 *    baseline within the delay-line stroke) on the first, middle and last night of the cycle.
 *  - Time-critical windows (when the target has any): observable hours inside each window.
 *  - Resolution: the resolution element λ/(2 B_max) (central wavelength, longest projected
 *    baseline seen) against the model's characteristic size. Baselines and visibilities are taken
 *    where the target is up in darkness and that baseline is within the delay-line stroke (a
 *    subset of the stations can observe when the whole configuration cannot).
 *  - Squared visibility: the expected V² range over every observable point and channel, with the
 *    "too resolved" and "unresolved" flags (thresholds below).
 *  - Magnitude: the target's magnitude in the band against the band's limiting magnitude.
 *  - Closure phases: station triangles observable at least once on the sampled nights.
 * The verdict of a target × configuration is its worst line; the proposal's verdict is the worst of
 * everything, including proposal-level problems (no band, no target, no configuration).
 */
import * as v from "valibot";
import {
  channelWavelengthsM,
  computeCoverageArrays,
  independentClosurePhaseCount,
  parseCoverageRequest,
  RAD_TO_MAS,
  roundTo,
  type StationInput,
  stationTriangles,
  type TargetModel,
  TargetModelSchema,
} from "~/engine";

// ---------------------------------------------------------------- documented choices

/**
 * Thresholds of the report. They are our choices (common practice for a first look, not a
 * standard), stated on the report page so a proposer can see why a line reads as it does.
 */
export const FEASIBILITY_THRESHOLDS = {
  /** Hour-angle sampling of each night, minutes (coarser than the Sketchpad's, for speed). */
  stepMin: 15,
  /** Below this many observable hours on a sampled night the line is a caution. */
  minHoursPerNight: 1,
  /** "Too resolved": V² at the shortest projected baseline (best channel) below this. */
  tooResolvedVis2: 0.05,
  /** "Unresolved": the lowest V² anywhere (every observable point and channel) above this. */
  unresolvedVis2: 0.95,
  /** A magnitude within this margin of the band's limit (brighter side) is a caution. */
  magnitudeMarginMag: 0.5,
  /** At most this many nights are sampled inside one time-critical window. */
  maxWindowNights: 14,
} as const;

export type Verdict = "pass" | "caution" | "fail";
const RANK: Record<Verdict, number> = { pass: 0, caution: 1, fail: 2 };

export function worstVerdict(list: Iterable<Verdict>): Verdict {
  let out: Verdict = "pass";
  for (const v of list) if (RANK[v] > RANK[out]) out = v;
  return out;
}

// ---------------------------------------------------------------- inputs

export interface FeasibilitySite {
  latitudeDeg: number;
  longitudeDeg: number;
  altitudeM: number;
  /** The array's own elevation limit, degrees. */
  minElevationDeg: number;
  /** Delay-line stroke, metres. */
  delayLineStrokeM: number;
}

export interface FeasibilityBand {
  instrumentName: string;
  /** Telescopes the combiner takes at once. */
  maxTelescopes: number;
  name: string;
  centralWavelengthM: number;
  bandwidthM: number;
  channels: number;
  limitingMagnitude: number;
}

export interface FeasibilityConfiguration {
  name: string;
  /** Stations in configuration order, with their fixed path offsets. */
  stations: StationInput[];
}

export interface FeasibilityTarget {
  name: string;
  raDeg: number;
  decDeg: number;
  /** As stored; validated here with the API's model schema. */
  model: unknown;
  magnitudes: Record<string, number>;
  /** The target's own elevation limit, degrees; null = the site's. */
  minElevationDeg: number | null;
  timeWindows: { startUtc: string; endUtc: string; note?: string }[];
}

export interface FeasibilityInput {
  site: FeasibilitySite;
  cycle: { name: string; observingStart: string; observingEnd: string };
  band: FeasibilityBand | null;
  configurations: FeasibilityConfiguration[];
  targets: FeasibilityTarget[];
  /** Sampling step, minutes; default FEASIBILITY_THRESHOLDS.stepMin. */
  stepMin?: number;
}

// ---------------------------------------------------------------- outputs

export type FeasibilityCheck =
  | "combiner"
  | "observable-time"
  | "windows"
  | "resolution"
  | "visibility"
  | "magnitude"
  | "closure"
  | "model";

export interface FeasibilityLine {
  check: FeasibilityCheck;
  label: string;
  verdict: Verdict;
  reason: string;
}

export interface FeasibilityNight {
  /** The night that begins on the evening of this date. */
  date: string;
  /** "start", "middle" or "end" of the cycle. */
  when: "start" | "middle" | "end";
  darkHours: number;
  /** Hours the target is above its elevation limit in darkness, whatever the delay lines. */
  upHours: number;
  /** Hours with every baseline of the configuration within the delay-line stroke as well. */
  observableHours: number;
}

export interface FeasibilityCell {
  target: string;
  configuration: string;
  verdict: Verdict;
  nights: FeasibilityNight[];
  figures: {
    longestBaselineM: number | null;
    shortestBaselineM: number | null;
    resolutionMas: number | null;
    sizeMas: number | null;
    vis2Min: number | null;
    vis2Max: number | null;
    observableTriangles: number | null;
    triangles: number;
  };
  lines: FeasibilityLine[];
}

export interface FeasibilityReport {
  computedAt: string;
  cycle: string;
  band: string | null;
  stepMin: number;
  thresholds: typeof FEASIBILITY_THRESHOLDS;
  verdict: Verdict;
  /** Problems of the proposal as a whole (no band, no target, no configuration). */
  problems: FeasibilityLine[];
  cells: FeasibilityCell[];
  /** Milliseconds the computation took. */
  elapsedMs: number;
}

// ---------------------------------------------------------------- helpers

const fmt = (x: number, d: number) => x.toFixed(d);

const NIGHT_WORDS = { start: "first", middle: "middle", end: "last" } as const;

/** "a", "a and b", "a, b and c". */
function listWords(items: string[]): string {
  if (items.length <= 1) return items.join("");
  return `${items.slice(0, -1).join(", ")} and ${items[items.length - 1]}`;
}

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
 * The characteristic angular size of a model, mas: the diameter of a disk or ring, the FWHM of a
 * Gaussian, the separation of a binary; for a sum, the largest of its components' sizes and of the
 * distances between component centres. A point has size 0.
 */
export function modelSizeMas(model: TargetModel): number {
  switch (model.type) {
    case "point":
      return 0;
    case "uniformDisk":
    case "limbDarkenedDisk":
    case "ring":
      return model.diameterMas;
    case "gaussian":
      return model.fwhmMas;
    case "binary":
      return model.separationMas;
    case "sum": {
      let size = 0;
      const c = model.components;
      for (let i = 0; i < c.length; i++) {
        size = Math.max(size, modelSizeMas(c[i].model));
        for (let j = i + 1; j < c.length; j++) {
          size = Math.max(
            size,
            Math.hypot(c[i].offsetEastMas - c[j].offsetEastMas, c[i].offsetNorthMas - c[j].offsetNorthMas),
          );
        }
      }
      return size;
    }
  }
}

/** Magnitude of a target in a band (band names compared without regard to case); null if not given. */
export function magnitudeIn(magnitudes: Record<string, number>, bandName: string): number | null {
  for (const [k, val] of Object.entries(magnitudes)) {
    if (k.trim().toLowerCase() === bandName.trim().toLowerCase() && Number.isFinite(val)) return val;
  }
  return null;
}

/** The magnitude line: pass, caution within the margin of the limit, fail beyond it. */
export function magnitudeLine(
  magnitude: number | null,
  band: Pick<FeasibilityBand, "name" | "limitingMagnitude">,
): FeasibilityLine {
  const label = "Magnitude";
  const limit = band.limitingMagnitude;
  if (magnitude === null) {
    return {
      check: "magnitude",
      label,
      verdict: "caution",
      reason: `No ${band.name}-band magnitude given, so it cannot be compared with the limit of ${fmt(limit, 1)} mag.`,
    };
  }
  const margin = FEASIBILITY_THRESHOLDS.magnitudeMarginMag;
  if (magnitude > limit) {
    return {
      check: "magnitude",
      label,
      verdict: "fail",
      reason: `${band.name} = ${fmt(magnitude, 2)} mag is fainter than the band's limit of ${fmt(limit, 1)} mag.`,
    };
  }
  if (magnitude > limit - margin) {
    return {
      check: "magnitude",
      label,
      verdict: "caution",
      reason: `${band.name} = ${fmt(magnitude, 2)} mag is within ${fmt(margin, 1)} mag of the band's limit of ${fmt(limit, 1)} mag: fringe tracking may be marginal.`,
    };
  }
  return {
    check: "magnitude",
    label,
    verdict: "pass",
    reason: `${band.name} = ${fmt(magnitude, 2)} mag, ${fmt(limit - magnitude, 1)} mag brighter than the limit of ${fmt(limit, 1)} mag.`,
  };
}

/**
 * The squared-visibility line from the V² at the shortest projected baseline (best channel), the
 * lowest V² anywhere and the highest V² anywhere. For a single disk, Gaussian or ring the lowest V²
 * is the one at the longest baseline; for binaries and composite models "anywhere" keeps a lucky
 * high value at the longest baseline from hiding a resolved pair.
 */
export function visibilityLine(vis2AtShortest: number, vis2Min: number, vis2Max: number): FeasibilityLine {
  const t = FEASIBILITY_THRESHOLDS;
  const label = "Squared visibility";
  const range = `expected V² ${fmt(vis2Min, 3)}–${fmt(vis2Max, 3)}`;
  if (vis2AtShortest < t.tooResolvedVis2) {
    return {
      check: "visibility",
      label,
      verdict: "fail",
      reason: `Too resolved: V² is ${fmt(vis2AtShortest, 3)} even on the shortest projected baseline (below ${t.tooResolvedVis2}); the fringes would be too faint to measure. Choose shorter baselines (${range}).`,
    };
  }
  if (vis2Min > t.unresolvedVis2) {
    return {
      check: "visibility",
      label,
      verdict: "caution",
      reason: `Barely resolved: V² stays above ${t.unresolvedVis2} on every baseline (${range}); a size would need very precise calibration. Longer baselines or a shorter wavelength would help.`,
    };
  }
  return {
    check: "visibility",
    label,
    verdict: "pass",
    reason: `${range[0].toUpperCase()}${range.slice(1)}: the baselines sample the drop of the visibility.`,
  };
}

/** The resolution line: λ/(2 B_max) against the model's size. */
export function resolutionLine(resolutionMas: number, sizeMas: number, modelType: string): FeasibilityLine {
  const label = "Resolution";
  if (modelType === "point" || sizeMas === 0) {
    return {
      check: "resolution",
      label,
      verdict: "caution",
      reason: `The model is a point source: there is no size to resolve (resolution ${fmt(resolutionMas, 2)} mas). Fine for a check star, not for measuring structure.`,
    };
  }
  if (sizeMas < resolutionMas) {
    return {
      check: "resolution",
      label,
      verdict: "caution",
      reason: `The target (${fmt(sizeMas, 2)} mas) is smaller than the resolution element λ/2B = ${fmt(resolutionMas, 2)} mas: its size shows only as a partial drop of the visibility.`,
    };
  }
  return {
    check: "resolution",
    label,
    verdict: "pass",
    reason: `The target (${fmt(sizeMas, 2)} mas) is larger than the resolution element λ/2B = ${fmt(resolutionMas, 2)} mas.`,
  };
}

// ---------------------------------------------------------------- the computation

type NightResult = {
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

function observeNight(
  input: FeasibilityInput,
  config: FeasibilityConfiguration,
  target: FeasibilityTarget,
  model: TargetModel,
  wavelengthsM: number[],
  minElevationDeg: number,
  date: string,
  stepMin: number,
): NightResult {
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

/** A stored target or configuration the engine cannot take (names the field). */
export class FeasibilityInputError extends Error {}

function windowLines(
  input: FeasibilityInput,
  config: FeasibilityConfiguration,
  target: FeasibilityTarget,
  model: TargetModel,
  wavelengthsM: number[],
  minElevationDeg: number,
  stepMin: number,
): FeasibilityLine[] {
  const out: FeasibilityLine[] = [];
  const t = FEASIBILITY_THRESHOLDS;
  const periodStartMs = Date.parse(`${input.cycle.observingStart}T12:00:00Z`);
  // The last night of the period ends on the morning after observingEnd.
  const periodEndMs = Date.parse(`${addDays(input.cycle.observingEnd, 1)}T18:00:00Z`);
  target.timeWindows.forEach((w, idx) => {
    const label = `Time window ${idx + 1}`;
    const startMs = Date.parse(w.startUtc);
    const endMs = Date.parse(w.endUtc);
    const span = `${w.startUtc.slice(0, 16).replace("T", " ")} – ${w.endUtc.slice(0, 16).replace("T", " ")} UTC`;
    if (!(endMs > startMs)) {
      out.push({ check: "windows", label, verdict: "fail", reason: `The window ${span} ends before it starts.` });
      return;
    }
    if (endMs <= periodStartMs || startMs >= periodEndMs) {
      out.push({
        check: "windows",
        label,
        verdict: "fail",
        reason: `The window ${span} lies outside the observing period ${input.cycle.observingStart} to ${input.cycle.observingEnd}.`,
      });
      return;
    }
    // Nights that can overlap the window: from the evening before its start to its end date.
    const first = new Date(Math.max(startMs, periodStartMs) - 86_400_000).toISOString().slice(0, 10);
    const last = new Date(Math.min(endMs, periodEndMs)).toISOString().slice(0, 10);
    const count = Math.max(1, daysBetween(first, last) + 1);
    const dates: string[] = [];
    if (count <= t.maxWindowNights) for (let d = 0; d < count; d++) dates.push(addDays(first, d));
    else
      for (let d = 0; d < t.maxWindowNights; d++)
        dates.push(addDays(first, Math.round((d * (count - 1)) / (t.maxWindowNights - 1))));
    let hours = 0;
    for (const date of dates) {
      if (date < addDays(input.cycle.observingStart, -1) || date > input.cycle.observingEnd) continue;
      const night = observeNight(input, config, target, model, wavelengthsM, minElevationDeg, date, stepMin);
      for (const jd of night.observableJd) {
        const ms = Math.round((jd - 2440587.5) * 86_400_000);
        if (ms >= startMs && ms <= endMs) hours += night.sampleDurationH;
      }
    }
    const sampled = count > t.maxWindowNights ? ` (${t.maxWindowNights} of its ${count} nights sampled)` : "";
    if (hours === 0) {
      out.push({
        check: "windows",
        label,
        verdict: "fail",
        reason: `The target is never observable inside ${span}${sampled}.`,
      });
    } else {
      out.push({
        check: "windows",
        label,
        verdict: "pass",
        reason: `${fmt(hours, 2)} h observable inside ${span}${sampled}.`,
      });
    }
  });
  return out;
}

/** A failed cell with no figures yet, to which the assessment adds its lines. */
function emptyCell(
  target: FeasibilityTarget,
  config: FeasibilityConfiguration,
  lines: FeasibilityLine[],
): FeasibilityCell {
  return {
    target: target.name,
    configuration: config.name,
    verdict: "fail",
    nights: [],
    figures: {
      longestBaselineM: null,
      shortestBaselineM: null,
      resolutionMas: null,
      sizeMas: null,
      vis2Min: null,
      vis2Max: null,
      observableTriangles: null,
      triangles: stationTriangles(config.stations.length).count,
    },
    lines,
  };
}

function assessCell(
  input: FeasibilityInput,
  band: FeasibilityBand,
  config: FeasibilityConfiguration,
  target: FeasibilityTarget,
  stepMin: number,
): FeasibilityCell {
  const t = FEASIBILITY_THRESHOLDS;
  const lines: FeasibilityLine[] = [];
  const nStations = config.stations.length;
  const nTriangles = stationTriangles(nStations).count;
  const empty = emptyCell(target, config, lines);

  if (nStations > band.maxTelescopes) {
    lines.push({
      check: "combiner",
      label: "Combiner",
      verdict: "fail",
      reason: `${band.instrumentName} combines at most ${band.maxTelescopes} telescopes; ${config.name} has ${nStations} stations.`,
    });
  } else {
    lines.push({
      check: "combiner",
      label: "Combiner",
      verdict: "pass",
      reason: `${band.instrumentName} takes the ${nStations} stations of ${config.name}.`,
    });
  }

  const modelParse = v.safeParse(TargetModelSchema, target.model);
  if (!modelParse.success) {
    lines.push({
      check: "model",
      label: "Model",
      verdict: "fail",
      reason: "The target's model could not be read; edit the target and choose a model again.",
    });
    return empty;
  }
  const model = modelParse.output;
  const minElevationDeg = Math.max(input.site.minElevationDeg, target.minElevationDeg ?? -Infinity);
  const wavelengthsM = channelWavelengthsM(band.centralWavelengthM, band.bandwidthM, band.channels);

  const nights: FeasibilityNight[] = [];
  const results: NightResult[] = [];
  for (const n of cycleNights(input.cycle.observingStart, input.cycle.observingEnd)) {
    const r = observeNight(input, config, target, model, wavelengthsM, minElevationDeg, n.date, stepMin);
    results.push(r);
    nights.push({
      date: n.date,
      when: n.when,
      darkHours: roundTo(r.darkHours, 2),
      upHours: roundTo(r.upHours, 2),
      observableHours: roundTo(r.observableHours, 2),
    });
  }

  // Observable time.
  const elevationNote =
    minElevationDeg > input.site.minElevationDeg
      ? ` (elevation limit ${fmt(minElevationDeg, 0)}° set for this target)`
      : "";
  const hoursText = nights.map((n) => `${fmt(n.observableHours, 2)} h on ${n.date}`).join(", ");
  const never = nights.every((n) => n.observableHours === 0);
  const short = nights.filter((n) => n.observableHours < t.minHoursPerNight);
  const stroke = `${fmt(input.site.delayLineStrokeM, 0)} m delay-line stroke`;
  const upText = nights.map((n) => `${fmt(n.upHours, 2)} h`).join(", ");
  const limitedByDelay = nights.some((n) => n.upHours - n.observableHours >= t.minHoursPerNight);
  const delayNote = limitedByDelay
    ? ` The target is up in darkness longer (${upText}), but the ${stroke} does not cover every baseline of ${config.name} at once for the rest.`
    : "";
  if (never) {
    const up = nights.some((n) => n.upHours > 0);
    lines.push({
      check: "observable-time",
      label: "Observable time",
      verdict: "fail",
      reason: up
        ? `Not observable with all ${nStations} stations on the first, middle or last night of the cycle: the target is up in darkness (${upText}), but the ${stroke} never covers every baseline of ${config.name} at once${elevationNote}.`
        : `Never above the ${fmt(minElevationDeg, 0)}° elevation limit in darkness on the first, middle or last night of the cycle${elevationNote}.`,
    });
  } else if (short.length > 0) {
    lines.push({
      check: "observable-time",
      label: "Observable time",
      verdict: "caution",
      reason: `Less than ${t.minHoursPerNight} h on the ${listWords(short.map((n) => `${NIGHT_WORDS[n.when]} night`))} of the cycle: ${hoursText}${elevationNote}.${delayNote}`,
    });
  } else {
    lines.push({
      check: "observable-time",
      label: "Observable time",
      verdict: "pass",
      reason: `Observable ${hoursText}${elevationNote}.${delayNote}`,
    });
  }

  if (target.timeWindows.length > 0) {
    lines.push(...windowLines(input, config, target, model, wavelengthsM, minElevationDeg, stepMin));
  }

  // Baselines and visibilities over every observable point of the three nights.
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
  const sizeMas = modelSizeMas(model);
  const resolutionMas = maxLen !== null && maxLen > 0 ? (band.centralWavelengthM / (2 * maxLen)) * RAD_TO_MAS : null;

  if (resolutionMas === null || atShortest === null || vMin === null || vMax === null) {
    const reason =
      "No baseline can observe on the sampled nights (target down, or beyond the delay-line stroke), so resolution and visibilities cannot be predicted.";
    lines.push({ check: "resolution", label: "Resolution", verdict: "fail", reason });
    lines.push({ check: "visibility", label: "Squared visibility", verdict: "fail", reason });
  } else {
    lines.push(resolutionLine(resolutionMas, sizeMas, model.type));
    lines.push(visibilityLine(atShortest, vMin, vMax));
  }

  lines.push(magnitudeLine(magnitudeIn(target.magnitudes, band.name), band));

  let observableTriangles: number | null = null;
  if (nStations < 3) {
    lines.push({
      check: "closure",
      label: "Closure phases",
      verdict: "caution",
      reason: `${config.name} has ${nStations} stations: no closure phases (a triangle needs 3).`,
    });
  } else {
    observableTriangles = seen.reduce((a, b) => a + b, 0);
    const independent = independentClosurePhaseCount(nStations);
    if (observableTriangles === 0) {
      lines.push({
        check: "closure",
        label: "Closure phases",
        verdict: "fail",
        reason: `None of the ${nTriangles} station triangles is observable on the sampled nights (every one has a baseline beyond the delay-line stroke, or the target is down).`,
      });
    } else if (observableTriangles < nTriangles) {
      lines.push({
        check: "closure",
        label: "Closure phases",
        verdict: "caution",
        reason: `${observableTriangles} of ${nTriangles} station triangles observable; the others always have a baseline beyond the delay-line stroke (${independent} independent closure phases with all stations).`,
      });
    } else {
      lines.push({
        check: "closure",
        label: "Closure phases",
        verdict: "pass",
        reason:
          nTriangles === 1
            ? "The configuration's one station triangle is observable (1 closure phase)."
            : `All ${nTriangles} station triangles observable (${independent} independent closure phases).`,
      });
    }
  }

  return {
    target: target.name,
    configuration: config.name,
    verdict: worstVerdict(lines.map((l) => l.verdict)),
    nights,
    figures: {
      longestBaselineM: maxLen === null ? null : roundTo(maxLen, 2),
      shortestBaselineM: minLen === null ? null : roundTo(minLen, 2),
      resolutionMas: resolutionMas === null ? null : roundTo(resolutionMas, 3),
      sizeMas: roundTo(sizeMas, 3),
      vis2Min: vMin === null ? null : roundTo(vMin, 4),
      vis2Max: vMax === null ? null : roundTo(vMax, 4),
      observableTriangles,
      triangles: nTriangles,
    },
    lines,
  };
}

/**
 * Computes the report. Never throws for a target the engine refuses: that cell fails with the
 * reason. `now` is the instant written into the report.
 */
export function computeFeasibility(input: FeasibilityInput, now: Date = new Date()): FeasibilityReport {
  const started = performance.now();
  const stepMin = input.stepMin ?? FEASIBILITY_THRESHOLDS.stepMin;
  const problems: FeasibilityLine[] = [];
  if (!input.band)
    problems.push({
      check: "combiner",
      label: "Instrument and band",
      verdict: "fail",
      reason: "No instrument band chosen: choose one in the proposal.",
    });
  if (input.targets.length === 0)
    problems.push({
      check: "observable-time",
      label: "Targets",
      verdict: "fail",
      reason: "The proposal has no target yet.",
    });
  if (input.configurations.length === 0) {
    problems.push({
      check: "observable-time",
      label: "Configurations",
      verdict: "fail",
      reason: "No hours requested for any configuration yet.",
    });
  }
  const cells: FeasibilityCell[] = [];
  if (input.band) {
    for (const target of input.targets) {
      for (const config of input.configurations) {
        try {
          cells.push(assessCell(input, input.band, config, target, stepMin));
        } catch (e) {
          if (!(e instanceof FeasibilityInputError)) throw e;
          cells.push(
            emptyCell(target, config, [
              {
                check: "model",
                label: "Input",
                verdict: "fail",
                reason: `The engine refused this target or configuration: ${e.message}.`,
              },
            ]),
          );
        }
      }
    }
  }
  const verdict = worstVerdict([...problems, ...cells].map((x) => x.verdict));
  return {
    computedAt: now.toISOString(),
    cycle: input.cycle.name,
    band: input.band ? `${input.band.instrumentName} ${input.band.name}` : null,
    stepMin,
    thresholds: FEASIBILITY_THRESHOLDS,
    verdict,
    problems,
    cells,
    elapsedMs: Math.round(performance.now() - started),
  };
}
