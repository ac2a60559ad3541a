/**
 * The rules of the report's lines: each turns figures into a verdict (pass / caution / fail) and the
 * reason in plain words. Pure.
 */
import type { TargetModel } from "~/engine";
import { listWords } from "../words";
import {
  FEASIBILITY_THRESHOLDS,
  type FeasibilityBand,
  type FeasibilityCheck,
  type FeasibilityLine,
  type FeasibilityNight,
  type Verdict,
} from "./types";

const fmt = (x: number, d: number) => x.toFixed(d);

/** A line of one check under one label: `lineOf("magnitude", "Magnitude")("pass", "…")`. */
export const lineOf =
  (check: FeasibilityCheck, label: string) =>
  (verdict: Verdict, reason: string): FeasibilityLine => ({ check, label, verdict, reason });

const NIGHT_WORDS = { start: "first", middle: "middle", end: "last" } as const;

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
  const line = lineOf("magnitude", "Magnitude");
  const limit = band.limitingMagnitude;
  if (magnitude === null) {
    return line(
      "caution",
      `No ${band.name}-band magnitude given, so it cannot be compared with the limit of ${fmt(limit, 1)} mag.`,
    );
  }
  const margin = FEASIBILITY_THRESHOLDS.magnitudeMarginMag;
  const given = `${band.name} = ${fmt(magnitude, 2)} mag`;
  if (magnitude > limit) return line("fail", `${given} is fainter than the band's limit of ${fmt(limit, 1)} mag.`);
  if (magnitude > limit - margin) {
    return line(
      "caution",
      `${given} is within ${fmt(margin, 1)} mag of the band's limit of ${fmt(limit, 1)} mag: fringe tracking may be marginal.`,
    );
  }
  return line("pass", `${given}, ${fmt(limit - magnitude, 1)} mag brighter than the limit of ${fmt(limit, 1)} mag.`);
}

/**
 * The squared-visibility line from the V² at the shortest projected baseline (best channel), the
 * lowest V² anywhere and the highest V² anywhere. For a single disk, Gaussian or ring the lowest V²
 * is the one at the longest baseline; for binaries and composite models "anywhere" keeps a lucky
 * high value at the longest baseline from hiding a resolved pair.
 */
export function visibilityLine(vis2AtShortest: number, vis2Min: number, vis2Max: number): FeasibilityLine {
  const t = FEASIBILITY_THRESHOLDS;
  const line = lineOf("visibility", "Squared visibility");
  const range = `expected V² ${fmt(vis2Min, 3)}–${fmt(vis2Max, 3)}`;
  if (vis2AtShortest < t.tooResolvedVis2) {
    return line(
      "fail",
      `Too resolved: V² is ${fmt(vis2AtShortest, 3)} even on the shortest projected baseline (below ${t.tooResolvedVis2}); the fringes would be too faint to measure. Choose shorter baselines (${range}).`,
    );
  }
  if (vis2Min > t.unresolvedVis2) {
    return line(
      "caution",
      `Barely resolved: V² stays above ${t.unresolvedVis2} on every baseline (${range}); a size would need very precise calibration. Longer baselines or a shorter wavelength would help.`,
    );
  }
  return line("pass", `${range[0].toUpperCase()}${range.slice(1)}: the baselines sample the drop of the visibility.`);
}

/** The resolution line: λ/(2 B_max) against the model's size. */
export function resolutionLine(resolutionMas: number, sizeMas: number, modelType: string): FeasibilityLine {
  const line = lineOf("resolution", "Resolution");
  if (modelType === "point" || sizeMas === 0) {
    return line(
      "caution",
      `The model is a point source: there is no size to resolve (resolution ${fmt(resolutionMas, 2)} mas). Fine for a check star, not for measuring structure.`,
    );
  }
  const element = `the resolution element λ/2B = ${fmt(resolutionMas, 2)} mas`;
  if (sizeMas < resolutionMas) {
    return line(
      "caution",
      `The target (${fmt(sizeMas, 2)} mas) is smaller than ${element}: its size shows only as a partial drop of the visibility.`,
    );
  }
  return line("pass", `The target (${fmt(sizeMas, 2)} mas) is larger than ${element}.`);
}

/** The resolution and visibility lines when no baseline could observe: both fail for the same reason. */
export function unobservedLines(): FeasibilityLine[] {
  const reason =
    "No baseline can observe on the sampled nights (target down, or beyond the delay-line stroke), so resolution and visibilities cannot be predicted.";
  return [
    lineOf("resolution", "Resolution")("fail", reason),
    lineOf("visibility", "Squared visibility")("fail", reason),
  ];
}

/** The combiner line: the configuration's station count against the instrument's telescope limit. */
export function combinerLine(band: FeasibilityBand, configName: string, nStations: number): FeasibilityLine {
  const line = lineOf("combiner", "Combiner");
  return nStations > band.maxTelescopes
    ? line(
        "fail",
        `${band.instrumentName} combines at most ${band.maxTelescopes} telescopes; ${configName} has ${nStations} stations.`,
      )
    : line("pass", `${band.instrumentName} takes the ${nStations} stations of ${configName}.`);
}

/** The observable-time line from the sampled nights. */
export function observableTimeLine(
  nights: FeasibilityNight[],
  context: {
    configName: string;
    nStations: number;
    minElevationDeg: number;
    siteMinElevationDeg: number;
    delayLineStrokeM: number;
  },
): FeasibilityLine {
  const t = FEASIBILITY_THRESHOLDS;
  const { configName, nStations, minElevationDeg } = context;
  const line = lineOf("observable-time", "Observable time");
  const elevationNote =
    minElevationDeg > context.siteMinElevationDeg
      ? ` (elevation limit ${fmt(minElevationDeg, 0)}° set for this target)`
      : "";
  const hoursText = nights.map((n) => `${fmt(n.observableHours, 2)} h on ${n.date}`).join(", ");
  const short = nights.filter((n) => n.observableHours < t.minHoursPerNight);
  const stroke = `${fmt(context.delayLineStrokeM, 0)} m delay-line stroke`;
  const upText = nights.map((n) => `${fmt(n.upHours, 2)} h`).join(", ");
  const limitedByDelay = nights.some((n) => n.upHours - n.observableHours >= t.minHoursPerNight);
  const delayNote = limitedByDelay
    ? ` The target is up in darkness longer (${upText}), but the ${stroke} does not cover every baseline of ${configName} at once for the rest.`
    : "";
  if (nights.every((n) => n.observableHours === 0)) {
    return line(
      "fail",
      nights.some((n) => n.upHours > 0)
        ? `Not observable with all ${nStations} stations on the first, middle or last night of the cycle: the target is up in darkness (${upText}), but the ${stroke} never covers every baseline of ${configName} at once${elevationNote}.`
        : `Never above the ${fmt(minElevationDeg, 0)}° elevation limit in darkness on the first, middle or last night of the cycle${elevationNote}.`,
    );
  }
  if (short.length > 0) {
    return line(
      "caution",
      `Less than ${t.minHoursPerNight} h on the ${listWords(short.map((n) => `${NIGHT_WORDS[n.when]} night`))} of the cycle: ${hoursText}${elevationNote}.${delayNote}`,
    );
  }
  return line("pass", `Observable ${hoursText}${elevationNote}.${delayNote}`);
}

/** The closure-phase line: station triangles observable at least once on the sampled nights. */
export function closureLine(
  configName: string,
  nStations: number,
  observable: { triangles: number; of: number; independent: number },
): FeasibilityLine {
  const line = lineOf("closure", "Closure phases");
  const n = observable.of;
  if (nStations < 3)
    return line("caution", `${configName} has ${nStations} stations: no closure phases (a triangle needs 3).`);
  if (observable.triangles === 0) {
    return line(
      "fail",
      `None of the ${n} station triangles is observable on the sampled nights (every one has a baseline beyond the delay-line stroke, or the target is down).`,
    );
  }
  if (observable.triangles < n) {
    return line(
      "caution",
      `${observable.triangles} of ${n} station triangles observable; the others always have a baseline beyond the delay-line stroke (${observable.independent} independent closure phases with all stations).`,
    );
  }
  return line(
    "pass",
    n === 1
      ? "The configuration's one station triangle is observable (1 closure phase)."
      : `All ${n} station triangles observable (${observable.independent} independent closure phases).`,
  );
}
