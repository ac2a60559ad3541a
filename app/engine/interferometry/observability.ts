/**
 * Observability of each hour-angle sample.
 *
 * A sample is observable when
 *  1. the target's elevation is at least the minimum elevation,
 *  2. the Sun is below −18° (checked only when samples carry instants, i.e.
 *     when a night is sampled; an explicit hour-angle list has no time of day),
 *  3. every baseline i–j is within the delay-line stroke S:
 *     |w_ij + P_j − P_i| ≤ S, with P the stations' fixed path offsets
 *     (skipped when no stroke is given).
 * Every unobservable sample carries a one-line reason naming each failed rule.
 */

import { RAD_TO_DEG } from "../math";
import type { BaselineSet } from "./baselines";
import type { UvwTracks } from "./uv-tracks";

/** Sun altitude limit of astronomical darkness, degrees. */
export const SUN_DARK_LIMIT_DEG = -18;

export interface ObservabilityInput {
  /** Target elevation at each sample, radians. */
  elevationRad: Float64Array;
  /** Minimum elevation, radians. */
  minElevationRad: number;
  /** Sun altitude at each sample, radians; null when samples have no instant. */
  sunAltitudeRad: Float64Array | null;
  tracks: UvwTracks;
  baselines: BaselineSet;
  /** Station names in request order (for the reasons). */
  stationNames: readonly string[];
  /** Delay-line stroke S, metres; null for no delay-line check. */
  delayLineStrokeM: number | null;
}

export interface Observability {
  /** 1 when the sample is observable. */
  observable: Uint8Array;
  /** 1 when elevation and Sun allow observing, whatever the delay lines (used per triangle). */
  skyOk: Uint8Array;
  /** 1 when baseline b is within the stroke at sample s; index b·nSamples + s. */
  baselineInRange: Uint8Array;
  /** Reason per sample, null when observable. */
  reasons: (string | null)[];
}

/** Applies the three rules to every sample. */
export function assessObservability(input: ObservabilityInput): Observability {
  const { elevationRad, minElevationRad, sunAltitudeRad, tracks, baselines, stationNames, delayLineStrokeM } = input;
  const nS = tracks.nSamples;
  const nB = tracks.nBaselines;
  const observable = new Uint8Array(nS);
  const skyOk = new Uint8Array(nS);
  const baselineInRange = new Uint8Array(nB * nS).fill(1);
  const reasons: (string | null)[] = new Array(nS).fill(null);
  const sunLimitRad = SUN_DARK_LIMIT_DEG / RAD_TO_DEG;

  if (delayLineStrokeM !== null) {
    for (let b = 0; b < nB; b++) {
      const dp = baselines.pathOffsetDiffM[b];
      const off = b * nS;
      for (let s = 0; s < nS; s++) {
        if (Math.abs(tracks.wM[off + s] + dp) > delayLineStrokeM) baselineInRange[off + s] = 0;
      }
    }
  }

  for (let s = 0; s < nS; s++) {
    const why: string[] = [];
    const el = elevationRad[s];
    if (!(el >= minElevationRad)) {
      why.push(
        `elevation ${(el * RAD_TO_DEG).toFixed(1)}° below minimum ${(minElevationRad * RAD_TO_DEG).toFixed(1)}°`,
      );
    }
    if (sunAltitudeRad && !(sunAltitudeRad[s] < sunLimitRad)) {
      why.push(`Sun at ${(sunAltitudeRad[s] * RAD_TO_DEG).toFixed(1)}°, above ${SUN_DARK_LIMIT_DEG}°`);
    }
    skyOk[s] = why.length === 0 ? 1 : 0;
    if (delayLineStrokeM !== null) {
      let bad = 0;
      let worstB = -1;
      let worstNeed = 0;
      for (let b = 0; b < nB; b++) {
        if (baselineInRange[b * nS + s] === 0) {
          bad++;
          const need = Math.abs(tracks.wM[b * nS + s] + baselines.pathOffsetDiffM[b]);
          if (need > worstNeed) {
            worstNeed = need;
            worstB = b;
          }
        }
      }
      if (bad > 0) {
        const pair = `${stationNames[baselines.first[worstB]]}–${stationNames[baselines.second[worstB]]}`;
        why.push(
          `delay line out of range on ${bad} baseline${bad > 1 ? "s" : ""} (worst ${pair} needs ${worstNeed.toFixed(1)} m, stroke ${delayLineStrokeM} m)`,
        );
      }
    }
    observable[s] = why.length === 0 ? 1 : 0;
    reasons[s] = why.length === 0 ? null : why.join("; ");
  }
  return { observable, skyOk, baselineInRange, reasons };
}

/**
 * The observable and sky-ok masks of {@link assessObservability}, by the same three rules, without the
 * per-sample reasons and the per-baseline table: for callers that assess many targets and need only
 * which samples pass (the committee's LST pressure). Returns 1/0 per sample, in sample order.
 */
export function observabilityMasks(input: ObservabilityInput): { observable: Uint8Array; skyOk: Uint8Array } {
  const { elevationRad, minElevationRad, sunAltitudeRad, tracks, baselines, delayLineStrokeM } = input;
  const nS = tracks.nSamples;
  const nB = tracks.nBaselines;
  const observable = new Uint8Array(nS);
  const skyOk = new Uint8Array(nS);
  const sunLimitRad = SUN_DARK_LIMIT_DEG / RAD_TO_DEG;
  for (let s = 0; s < nS; s++) {
    const sky = elevationRad[s] >= minElevationRad && (!sunAltitudeRad || sunAltitudeRad[s] < sunLimitRad);
    skyOk[s] = sky ? 1 : 0;
    let inRange = true;
    if (delayLineStrokeM !== null) {
      for (let b = 0; b < nB && inRange; b++) {
        if (Math.abs(tracks.wM[b * nS + s] + baselines.pathOffsetDiffM[b]) > delayLineStrokeM) inRange = false;
      }
    }
    observable[s] = sky && inRange ? 1 : 0;
  }
  return { observable, skyOk };
}
