/**
 * Closure phases.
 *
 * Triangle (i, j, k) with i < j < k in request order; its closure phase is
 * φ_ij + φ_jk − φ_ik = arg(V_ij · V_jk · V_ki) with V_ki = conj(V_ik), immune to
 * any phase error attached to a single station. N stations form N(N−1)(N−2)/6
 * triangles but only (N−1)(N−2)/2 independent closure phases (Monnier 2003).
 */
import { baselineIndex } from "./baselines";
import type { VisibilityCube } from "./visibilities";

/** Number of station triangles N(N−1)(N−2)/6 (0 for N < 3). */
export function triangleCount(nStations: number): number {
  return nStations < 3 ? 0 : (nStations * (nStations - 1) * (nStations - 2)) / 6;
}

/** Number of independent closure phases (N−1)(N−2)/2 (0 for N < 3). */
export function independentClosurePhaseCount(nStations: number): number {
  return nStations < 3 ? 0 : ((nStations - 1) * (nStations - 2)) / 2;
}

export interface TriangleSet {
  count: number;
  /** Station indices i < j < k of each triangle, lexicographic order. */
  i: Int32Array;
  j: Int32Array;
  k: Int32Array;
  /** Baseline indices of i–j, j–k and i–k (see baselines.ts). */
  bij: Int32Array;
  bjk: Int32Array;
  bik: Int32Array;
}

/** Every triangle of N stations in lexicographic order (0,1,2), (0,1,3), … */
export function stationTriangles(nStations: number): TriangleSet {
  const count = triangleCount(nStations);
  const out: TriangleSet = {
    count,
    i: new Int32Array(count),
    j: new Int32Array(count),
    k: new Int32Array(count),
    bij: new Int32Array(count),
    bjk: new Int32Array(count),
    bik: new Int32Array(count),
  };
  let t = 0;
  for (let i = 0; i < nStations; i++)
    for (let j = i + 1; j < nStations; j++)
      for (let k = j + 1; k < nStations; k++) {
        out.i[t] = i;
        out.j[t] = j;
        out.k[t] = k;
        out.bij[t] = baselineIndex(nStations, i, j);
        out.bjk[t] = baselineIndex(nStations, j, k);
        out.bik[t] = baselineIndex(nStations, i, k);
        t++;
      }
  return out;
}

/**
 * Closure phase in radians, (−π, π], from three complex visibilities
 * V_ij, V_jk and V_ik: arg(V_ij · V_jk · conj(V_ik)).
 */
export function closurePhase(
  reIJ: number,
  imIJ: number,
  reJK: number,
  imJK: number,
  reIK: number,
  imIK: number,
): number {
  const xr = reIJ * reJK - imIJ * imJK;
  const xi = reIJ * imJK + imIJ * reJK;
  return Math.atan2(xi * reIK - xr * imIK, xr * reIK + xi * imIK);
}

export interface ClosureCube {
  nTriangles: number;
  nSamples: number;
  nChannels: number;
  /** Closure phase, radians (−π, π]; index (t·nSamples + s)·nChannels + c. */
  phaseRad: Float64Array;
  /** Triple amplitude |V_ij V_jk V_ik|; same layout. */
  amplitude: Float64Array;
}

/**
 * Closure phases and triple amplitudes of every triangle, sample and channel
 * from a visibility cube. When `sampleMask` is given, samples with mask 0 are
 * skipped and left as NaN.
 */
export function closureCube(cube: VisibilityCube, triangles: TriangleSet, sampleMask?: Uint8Array): ClosureCube {
  const { nSamples: nS, nChannels: nC, re, im } = cube;
  const nT = triangles.count;
  const phaseRad = new Float64Array(nT * nS * nC);
  const amplitude = new Float64Array(nT * nS * nC);
  for (let t = 0; t < nT; t++) {
    const oIJ = triangles.bij[t] * nS * nC;
    const oJK = triangles.bjk[t] * nS * nC;
    const oIK = triangles.bik[t] * nS * nC;
    const oT = t * nS * nC;
    for (let s = 0; s < nS; s++) {
      const so = s * nC;
      if (sampleMask && sampleMask[s] === 0) {
        phaseRad.fill(Number.NaN, oT + so, oT + so + nC);
        amplitude.fill(Number.NaN, oT + so, oT + so + nC);
        continue;
      }
      for (let c = 0; c < nC; c++) {
        const a = oIJ + so + c;
        const b = oJK + so + c;
        const d = oIK + so + c;
        const ar = re[a];
        const ai = im[a];
        const br = re[b];
        const bi = im[b];
        const dr = re[d];
        const di = im[d];
        const xr = ar * br - ai * bi;
        const xi = ar * bi + ai * br;
        const yr = xr * dr + xi * di;
        const yi = xi * dr - xr * di;
        phaseRad[oT + so + c] = Math.atan2(yi, yr);
        amplitude[oT + so + c] = Math.sqrt(yr * yr + yi * yi);
      }
    }
  }
  return { nTriangles: nT, nSamples: nS, nChannels: nC, phaseRad, amplitude };
}
