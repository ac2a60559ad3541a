/**
 * Ranking of station triangles for a target.
 *
 * For each triangle (i, j, k), over the samples where it can observe (target
 * above the minimum elevation, Sun below −18° when a night is sampled, and its
 * own three baselines within the delay-line stroke):
 *  - closure-phase signal: RMS of the model's closure phase over those samples
 *    and all channels, degrees (0 for a point source; 0°/180° values only for
 *    a centro-symmetric model, which is said in the reasons);
 *  - mean triple amplitude |V_ij V_jk V_ik| (how bright the fringes are);
 *  - uv spread, 0..1: mean of the position-angle and radial filling (see
 *    coverage-quality.ts) of its three tracks, radii measured against the
 *    longest projected baseline of the whole station pool;
 *  - observable hours: observable samples × time per sample.
 * Score = 0.5 · signal / best signal + 0.25 · uv spread + 0.25 · hours / most
 * hours (each part 0 when its maximum is 0); a triangle that is never
 * observable scores 0. Ties keep the triangles' lexicographic order.
 */

import { RAD_TO_DEG } from "../math";
import type { BaselineSet } from "./baselines";
import type { ClosureCube, TriangleSet } from "./closure";
import { binFilling } from "./coverage-quality";
import type { UvwTracks } from "./uv-tracks";

export const SCORE_WEIGHTS = { signal: 0.5, uvSpread: 0.25, hours: 0.25 } as const;

export interface TriangleRankingInput {
  triangles: TriangleSet;
  /** Closure phases and triple amplitudes for every sample (no mask applied). */
  closure: ClosureCube;
  /** 1 when elevation (and Sun) allow observing at the sample. */
  skyOk: Uint8Array;
  /** 1 when baseline b is within the stroke at sample s (index b·nSamples + s). */
  baselineInRange: Uint8Array;
  /** Reason a sample is unobservable because of the sky, for the never-observable case. */
  skyReasons: (string | null)[];
  tracks: UvwTracks;
  baselines: BaselineSet;
  wavelengthsM: readonly number[];
  sampleDurationH: number;
  stationNames: readonly string[];
}

export interface RankedTriangle {
  /** Index of the triangle in lexicographic order. */
  triangle: number;
  stations: [string, string, string];
  score: number;
  closurePhaseSignalDeg: number;
  meanTripleAmplitude: number;
  uvSpread: number;
  observableSamples: number;
  observableHours: number;
  reasons: string[];
}

/** Scores and sorts every triangle (best first). */
export function rankTriangleSet(input: TriangleRankingInput): RankedTriangle[] {
  const { triangles, closure, skyOk, baselineInRange, tracks, wavelengthsM, stationNames } = input;
  const nS = tracks.nSamples;
  const nC = wavelengthsM.length;
  const lMin = Math.min(...wavelengthsM);

  // Longest projected baseline of the pool at samples where the sky allows observing.
  let bMaxPool = 0;
  for (let b = 0; b < tracks.nBaselines; b++)
    for (let s = 0; s < nS; s++) {
      if (!skyOk[s]) continue;
      const k = b * nS + s;
      const r = Math.sqrt(tracks.uM[k] * tracks.uM[k] + tracks.vM[k] * tracks.vM[k]);
      if (r > bMaxPool) bMaxPool = r;
    }
  const rMaxW = bMaxPool / lMin;

  const partial = [];
  for (let t = 0; t < triangles.count; t++) {
    const bs = [triangles.bij[t], triangles.bjk[t], triangles.bik[t]];
    const ok: number[] = [];
    let delayBlocked = 0;
    for (let s = 0; s < nS; s++) {
      if (!skyOk[s]) continue;
      if (bs.every((b) => baselineInRange[b * nS + s] === 1)) ok.push(s);
      else delayBlocked++;
    }
    let sum2 = 0;
    let sumAmp = 0;
    let symmetricOnly = true;
    const off = t * nS * nC;
    for (const s of ok)
      for (let c = 0; c < nC; c++) {
        const phi = closure.phaseRad[off + s * nC + c];
        sum2 += phi * phi;
        sumAmp += closure.amplitude[off + s * nC + c];
        const a = Math.abs(phi);
        if (a > 1e-6 && Math.PI - a > 1e-6) symmetricOnly = false;
      }
    const values = ok.length * nC;
    const rmsDeg = values > 0 ? Math.sqrt(sum2 / values) * RAD_TO_DEG : 0;
    const meanAmp = values > 0 ? sumAmp / values : 0;

    const u: number[] = [];
    const v: number[] = [];
    for (const b of bs)
      for (const s of ok)
        for (let c = 0; c < nC; c++) {
          u.push(tracks.uM[b * nS + s] / wavelengthsM[c]);
          v.push(tracks.vM[b * nS + s] / wavelengthsM[c]);
        }
    const fill = binFilling(u, v, null, rMaxW);
    const uvSpread = ok.length > 0 ? (fill.radial + fill.positionAngle) / 2 : 0;
    partial.push({ t, ok, delayBlocked, rmsDeg, meanAmp, uvSpread, fill, symmetricOnly });
  }

  const maxSignal = Math.max(0, ...partial.filter((p) => p.ok.length > 0).map((p) => p.rmsDeg));
  const maxHours = Math.max(0, ...partial.map((p) => p.ok.length * input.sampleDurationH));
  const firstSkyReason = input.skyReasons.find((r) => r !== null) ?? null;

  const ranked: RankedTriangle[] = partial.map((p) => {
    const hours = p.ok.length * input.sampleDurationH;
    const names: [string, string, string] = [
      stationNames[triangles.i[p.t]],
      stationNames[triangles.j[p.t]],
      stationNames[triangles.k[p.t]],
    ];
    const reasons: string[] = [];
    let score = 0;
    if (p.ok.length === 0) {
      if (p.delayBlocked > 0)
        reasons.push(
          "never observable: a baseline of this triangle is beyond the delay-line stroke whenever the target is up",
        );
      else reasons.push(`never observable: ${firstSkyReason ?? "no sample"}`);
    } else {
      score =
        SCORE_WEIGHTS.signal * (maxSignal > 0 ? p.rmsDeg / maxSignal : 0) +
        SCORE_WEIGHTS.uvSpread * p.uvSpread +
        SCORE_WEIGHTS.hours * (maxHours > 0 ? hours / maxHours : 0);
      reasons.push(
        `observable ${hours.toFixed(2)} h (${p.ok.length} of ${input.skyOk.length} samples)` +
          (p.delayBlocked > 0 ? `; delay line out of range at ${p.delayBlocked} samples with the target up` : ""),
      );
      if (p.rmsDeg === 0) reasons.push("no closure-phase signal: the model gives 0° on this triangle");
      else if (p.symmetricOnly)
        reasons.push(
          `closure phases only 0° or 180° (${p.rmsDeg.toFixed(1)}° rms): a centro-symmetric signature, no asymmetry`,
        );
      else
        reasons.push(
          `closure-phase signal ${p.rmsDeg.toFixed(1)}° rms` +
            (p.rmsDeg === maxSignal ? " (strongest of all triangles)" : ""),
        );
      reasons.push(
        `uv spread ${p.uvSpread.toFixed(2)}: position angles ${Math.round(p.fill.positionAngle * 100)} %, radii ${Math.round(p.fill.radial * 100)} %`,
      );
      if (p.meanAmp < 0.01) reasons.push(`faint fringes: mean triple amplitude ${p.meanAmp.toExponential(1)}`);
    }
    return {
      triangle: p.t,
      stations: names,
      score,
      closurePhaseSignalDeg: p.rmsDeg,
      meanTripleAmplitude: p.meanAmp,
      uvSpread: p.uvSpread,
      observableSamples: p.ok.length,
      observableHours: hours,
      reasons,
    };
  });
  ranked.sort((a, b) => b.score - a.score || a.triangle - b.triangle);
  return ranked;
}
