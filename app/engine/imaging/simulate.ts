/**
 * What a planned coverage would measure: the model's squared visibilities and closure phases at every
 * observable sample and channel of a coverage request, with Gaussian errors.
 *
 * Error model (the `simulate` contract): σ(V²) = vis2Relative × max(V², 0.01) with V² the model's,
 * σ(CP) = closurePhaseDeg; measured = model + σ·z with z standard normal deviates of a Mersenne Twister
 * seeded by `noise.seed` (random.ts); closure phases are wrapped into (−180°, 180°]. Deviates are drawn
 * in a fixed order — every V² entry in response order, then every closure phase of every triangle (also
 * the ones not returned) — so a seed gives the same values whichever triangles are asked for.
 *
 * Independent closure phases: the (N−1)(N−2)/2 triangles that contain the first station (Monnier 2003,
 * Rep. Prog. Phys. 66, 789 counts them; every other closure phase is a sum of these).
 *
 * Order of entries: V² by baseline (request order), sample, channel; closure phases by triangle
 * (lexicographic), sample, channel.
 */

import { lmstHours } from "../astro/sidereal";
import { isoUtcFromJulianDay, julianDay } from "../astro/time";
import { computeCoverageArrays } from "../interferometry/coverage";
import { RAD_TO_DEG, RAD_TO_HOUR, roundTo, wrapHours24, wrapPi } from "../math";
import type { ClosurePhaseDatum, ClosurePhaseTriangles, NoiseInput, SimulateInput, Vis2Datum } from "./inputs";
import { Mt19937 } from "./random";

/** Ratio of sidereal to solar time, 360.98564736629° / 360° per day (Meeus 1998, eq. 12.4). */
const SIDEREAL_PER_SOLAR = 360.98564736629 / 360;
/** Nominal day of the instants when a request gives hour angles only: 2000-01-01 (0h UT). */
const NOMINAL_JD0 = julianDay(2000, 1, 1);

/** The simulated measurements in typed arrays (used by the response and the OIFITS writer). */
export interface SimulatedData {
  stationNames: string[];
  wavelengthsM: number[];
  /** Per observable sample q: hour angle (hours, as in the response) and instant (Julian day UT). */
  hourAngleH: Float64Array;
  jd: Float64Array;
  /** True when the instants are nominal (hour-angle list: no date known). */
  nominalTimes: boolean;
  /** Integration time of a sample, seconds. */
  intTimeS: number;
  /** Baselines: stations (indices) of each; uM/vM per (baseline b, sample q) at index b·nQ + q. */
  baselineFirst: Int32Array;
  baselineSecond: Int32Array;
  uM: Float64Array;
  vM: Float64Array;
  /** V² and its σ per (b, q, channel c) at (b·nQ + q)·nC + c. */
  vis2: Float64Array;
  vis2Err: Float64Array;
  /** Returned triangles (station indices a < b < c) and the baseline indices of a–b and b–c. */
  triA: Int32Array;
  triB: Int32Array;
  triC: Int32Array;
  triAB: Int32Array;
  triBC: Int32Array;
  /** Closure phase and σ, radians, per (triangle t, q, c) at (t·nQ + q)·nC + c. */
  closurePhaseRad: Float64Array;
  closurePhaseErrRad: Float64Array;
  closurePhaseTriangles: ClosurePhaseTriangles;
  noise: NoiseInput;
}

/** Simulates the data of a validated request. */
export function simulateData(request: SimulateInput): SimulatedData {
  const arrays = computeCoverageArrays(request);
  const { observation: obs, vis2: modelVis2, triangles, closurePhaseRad: modelCp } = arrays;
  const { samples, tracks, observability, baselines } = obs;
  const nS = tracks.nSamples;
  const nB = tracks.nBaselines;
  const nC = obs.wavelengthsM.length;
  const observed: number[] = [];
  for (let s = 0; s < nS; s++) if (observability.observable[s]) observed.push(s);
  const nQ = observed.length;

  const hourAngleH = new Float64Array(nQ);
  for (let q = 0; q < nQ; q++) {
    const s = observed[q];
    hourAngleH[q] = request.hourAnglesH ? request.hourAnglesH[s] : roundTo(samples.haRad[s] * RAD_TO_HOUR, 6);
  }
  const jd = new Float64Array(nQ);
  const nominalTimes = samples.jd === null;
  if (samples.jd) {
    for (let q = 0; q < nQ; q++) jd[q] = samples.jd[observed[q]];
  } else if (nQ > 0) {
    // The instant of the first sample on the nominal day (LMST = H + α), the others at sidereal rate.
    const lst0 = lmstHours(NOMINAL_JD0, obs.lonEastRad);
    const ha0 = hourAngleH[0];
    const first = NOMINAL_JD0 + wrapHours24(ha0 + samples.raRad * RAD_TO_HOUR - lst0) / 24 / SIDEREAL_PER_SOLAR;
    for (let q = 0; q < nQ; q++) jd[q] = first + (hourAngleH[q] - ha0) / 24 / SIDEREAL_PER_SOLAR;
  }

  const rng = new Mt19937(request.noise.seed);
  const relV2 = request.noise.vis2Relative;
  const sigmaCp = request.noise.closurePhaseDeg * (Math.PI / 180);

  const uM = new Float64Array(nB * nQ);
  const vM = new Float64Array(nB * nQ);
  const vis2 = new Float64Array(nB * nQ * nC);
  const vis2Err = new Float64Array(nB * nQ * nC);
  for (let b = 0; b < nB; b++)
    for (let q = 0; q < nQ; q++) {
      const k = b * nS + observed[q];
      uM[b * nQ + q] = tracks.uM[k];
      vM[b * nQ + q] = tracks.vM[k];
      for (let c = 0; c < nC; c++) {
        const truth = modelVis2[k * nC + c];
        const sigma = relV2 * Math.max(truth, 0.01);
        const i = (b * nQ + q) * nC + c;
        const z = rng.nextGaussian();
        vis2[i] = truth + sigma * z;
        vis2Err[i] = sigma;
      }
    }

  const keep = request.closurePhaseTriangles === "independent" ? (t: number) => triangles.i[t] === 0 : () => true;
  const kept: number[] = [];
  for (let t = 0; t < triangles.count; t++) if (keep(t)) kept.push(t);
  const nT = kept.length;
  const closurePhaseRad = new Float64Array(nT * nQ * nC);
  const closurePhaseErrRad = new Float64Array(nT * nQ * nC).fill(sigmaCp);
  let slot = 0;
  for (let t = 0; t < triangles.count; t++) {
    const out = kept[slot] === t ? slot++ : -1;
    for (let q = 0; q < nQ; q++)
      for (let c = 0; c < nC; c++) {
        const z = rng.nextGaussian();
        if (out < 0) continue;
        const truth = modelCp[(t * nS + observed[q]) * nC + c];
        closurePhaseRad[(out * nQ + q) * nC + c] = wrapPi(truth + sigmaCp * z);
      }
  }
  const pick = (src: Int32Array) => Int32Array.from(kept, (t) => src[t]);

  return {
    stationNames: obs.stationNames,
    wavelengthsM: [...obs.wavelengthsM],
    hourAngleH,
    jd,
    nominalTimes,
    intTimeS: samples.sampleDurationH * 3600,
    baselineFirst: baselines.first,
    baselineSecond: baselines.second,
    uM,
    vM,
    vis2,
    vis2Err,
    triA: pick(triangles.i),
    triB: pick(triangles.j),
    triC: pick(triangles.k),
    triAB: pick(triangles.bij),
    triBC: pick(triangles.bjk),
    closurePhaseRad,
    closurePhaseErrRad,
    closurePhaseTriangles: request.closurePhaseTriangles,
    noise: { ...request.noise },
  };
}

/** A simulated V² value: a datum of the wire format, always with its stations and hour angle. */
export interface SimulatedVis2 extends Vis2Datum {
  stations: [string, string];
  hourAngleH: number;
}

/** A simulated closure phase: a datum of the wire format, always with its stations and hour angle. */
export interface SimulatedClosurePhase extends ClosurePhaseDatum {
  stations: [string, string, string];
  hourAngleH: number;
}

export interface SimulateResponse {
  vis2: SimulatedVis2[];
  closurePhases: SimulatedClosurePhase[];
  /** Addition: which closure phases are listed ("all" triangles or the "independent" set). */
  closurePhaseTriangles: ClosurePhaseTriangles;
  /** Addition: the error model used. */
  noise: NoiseInput;
  /** Addition: first sample's instant (ISO UTC) and whether the instants are nominal (hour-angle list). */
  firstSampleUtc: string | null;
  nominalTimes: boolean;
}

/** Serializes simulated data to the response of the `simulate` contract (V² to 1e-10, angles to 1e-6°). */
export function simulateResponse(data: SimulatedData): SimulateResponse {
  const nQ = data.hourAngleH.length;
  const nC = data.wavelengthsM.length;
  const names = data.stationNames;
  const vis2: SimulatedVis2[] = [];
  for (let b = 0; b < data.baselineFirst.length; b++) {
    const stations: [string, string] = [names[data.baselineFirst[b]], names[data.baselineSecond[b]]];
    for (let q = 0; q < nQ; q++) {
      const uM = roundTo(data.uM[b * nQ + q], 6);
      const vM = roundTo(data.vM[b * nQ + q], 6);
      for (let c = 0; c < nC; c++) {
        const i = (b * nQ + q) * nC + c;
        vis2.push({
          stations: [stations[0], stations[1]],
          hourAngleH: data.hourAngleH[q],
          uM,
          vM,
          wavelengthM: data.wavelengthsM[c],
          vis2: roundTo(data.vis2[i], 10),
          vis2Err: roundTo(data.vis2Err[i], 10),
        });
      }
    }
  }
  const closurePhases: SimulatedClosurePhase[] = [];
  for (let t = 0; t < data.triA.length; t++) {
    const stations: [string, string, string] = [names[data.triA[t]], names[data.triB[t]], names[data.triC[t]]];
    for (let q = 0; q < nQ; q++) {
      const ab = data.triAB[t] * nQ + q;
      const bc = data.triBC[t] * nQ + q;
      for (let c = 0; c < nC; c++) {
        const i = (t * nQ + q) * nC + c;
        let deg = roundTo(data.closurePhaseRad[i] * RAD_TO_DEG, 6);
        if (deg === -180) deg = 180;
        closurePhases.push({
          stations: [stations[0], stations[1], stations[2]],
          hourAngleH: data.hourAngleH[q],
          wavelengthM: data.wavelengthsM[c],
          u1M: roundTo(data.uM[ab], 6),
          v1M: roundTo(data.vM[ab], 6),
          u2M: roundTo(data.uM[bc], 6),
          v2M: roundTo(data.vM[bc], 6),
          closurePhaseDeg: deg,
          closurePhaseErrDeg: roundTo(data.closurePhaseErrRad[i] * RAD_TO_DEG, 6),
        });
      }
    }
  }
  return {
    vis2,
    closurePhases,
    closurePhaseTriangles: data.closurePhaseTriangles,
    noise: data.noise,
    firstSampleUtc: nQ > 0 ? isoUtcFromJulianDay(data.jd[0]) : null,
    nominalTimes: data.nominalTimes,
  };
}
