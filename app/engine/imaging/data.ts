/**
 * Measurements prepared for the reconstruction: spatial frequencies in wavelengths, one list of distinct
 * uv points shared by the V² and closure-phase terms, inverse variances.
 *
 * Each closure phase (u1, v1), (u2, v2) needs the visibilities of a–b, b–c and c–a, the last at
 * (−u1−u2, −v1−v2): φ = arg V(u1) + arg V(u2) + arg V(u3) (the contract's φ_ab + φ_bc − φ_ac). Points that
 * coincide with another point or its mirror (within 1e-7 of the longest spatial frequency) are computed
 * once: a point is stored in the half plane u > 0 (or u = 0, v ≥ 0) and a datum refers to it with a sign,
 * +1 for V and −1 for conj V. With simulated data every closure-phase point is a V² point, so the
 * transform evaluates each baseline, sample and channel once.
 *
 * Errors: σ ≤ 0 (noise-free data) is replaced by a floor so χ² stays finite — 1 % of max(|V²|, 0.01) for
 * V², 0.5° for closure phases; the count is reported.
 *
 * Closure-phase weights of the fit ("amplitude" weighting, the default): a phase cannot be known better
 * than the amplitude it rides on. With circular Gaussian noise on a visibility, σ_φ = σ_|V| / |V| at high
 * signal-to-noise (Thompson, Moran & Swenson 2017, ch. 9 — chapter from memory), and σ_|V| = σ(V²) / (2|V|). Each
 * of the three baselines whose measured V² has a signal-to-noise V²/σ(V²) below 10 (near a visibility
 * null) adds (σ(V²) / (2 max(V², σ(V²))))² to the closure phase's variance (V² and σ the inverse-variance
 * mean at that point; nothing when no V² was measured there); the variance is capped at π². Elsewhere the
 * weights are the given ones; near a null this stops a closure phase that flips by 180° as the amplitude
 * passes through zero from pulling the image into a false minimum. χ² with the errors as given uses
 * `cpInvVarGiven`.
 */
import { DEG_TO_RAD } from "../math";
import type { ImagingData } from "./inputs";

export const VIS2_ERROR_FLOOR_RELATIVE = 0.01;
export const CLOSURE_ERROR_FLOOR_RAD = 0.5 * DEG_TO_RAD;
/** V² signal-to-noise below which a baseline widens the closure phases it takes part in. */
export const SNR_LIMIT = 10;

export interface PreparedData {
  /** Distinct uv points, wavelengths (half plane). */
  uW: Float64Array;
  vW: Float64Array;
  /** Largest |(u, v)| of any datum, wavelengths. */
  maxRadiusW: number;
  vis2Point: Int32Array;
  vis2: Float64Array;
  vis2InvVar: Float64Array;
  /** Three points per closure phase and their signs (+1: V, −1: conj V). */
  cpPoint: Int32Array;
  cpSign: Float64Array;
  cpRad: Float64Array;
  /** Inverse variances used by the fit, and as given (after the floors). */
  cpInvVar: Float64Array;
  cpInvVarGiven: Float64Array;
  /** Errors replaced by the floors above. */
  flooredErrors: number;
}

/** Prepares wire data (metres, degrees) for the reconstruction. */
export function prepareData(data: ImagingData, closureWeighting: "amplitude" | "given" = "amplitude"): PreparedData {
  let maxR = 0;
  const radius = (u: number, v: number) => {
    const r = Math.hypot(u, v);
    if (r > maxR) maxR = r;
  };
  for (const d of data.vis2) radius(d.uM / d.wavelengthM, d.vM / d.wavelengthM);
  for (const d of data.closurePhases) {
    const l = d.wavelengthM;
    radius(d.u1M / l, d.v1M / l);
    radius(d.u2M / l, d.v2M / l);
    radius((d.u1M + d.u2M) / l, (d.v1M + d.v2M) / l);
  }
  const quantum = maxR > 0 ? 1e-7 * maxR : 1;
  const index = new Map<string, number>();
  const us: number[] = [];
  const vs: number[] = [];
  /** Index of the point (u, v) with its sign packed as ±(index + 1). */
  const point = (u: number, v: number): number => {
    let sign = 1;
    if (u < 0 || (u === 0 && v < 0)) {
      u = -u;
      v = -v;
      sign = -1;
    }
    const key = `${Math.round(u / quantum)},${Math.round(v / quantum)}`;
    let i = index.get(key);
    if (i === undefined) {
      i = us.length;
      index.set(key, i);
      us.push(u);
      vs.push(v);
    }
    return sign * (i + 1);
  };

  let floored = 0;
  const nV = data.vis2.length;
  const vis2Point = new Int32Array(nV);
  const vis2 = new Float64Array(nV);
  const vis2InvVar = new Float64Array(nV);
  data.vis2.forEach((d, k) => {
    vis2Point[k] = Math.abs(point(d.uM / d.wavelengthM, d.vM / d.wavelengthM)) - 1;
    vis2[k] = d.vis2;
    let s = d.vis2Err;
    if (!(s > 0)) {
      s = VIS2_ERROR_FLOOR_RELATIVE * Math.max(Math.abs(d.vis2), 0.01);
      floored++;
    }
    vis2InvVar[k] = 1 / (s * s);
  });

  const nC = data.closurePhases.length;
  const cpPoint = new Int32Array(3 * nC);
  const cpSign = new Float64Array(3 * nC);
  const cpRad = new Float64Array(nC);
  const cpInvVar = new Float64Array(nC);
  data.closurePhases.forEach((d, k) => {
    const l = d.wavelengthM;
    const refs = [
      point(d.u1M / l, d.v1M / l),
      point(d.u2M / l, d.v2M / l),
      point(-(d.u1M + d.u2M) / l, -(d.v1M + d.v2M) / l),
    ];
    for (let j = 0; j < 3; j++) {
      cpPoint[3 * k + j] = Math.abs(refs[j]) - 1;
      cpSign[3 * k + j] = Math.sign(refs[j]);
    }
    cpRad[k] = d.closurePhaseDeg * DEG_TO_RAD;
    let s = d.closurePhaseErrDeg * DEG_TO_RAD;
    if (!(s > 0)) {
      s = CLOSURE_ERROR_FLOOR_RAD;
      floored++;
    }
    cpInvVar[k] = 1 / (s * s);
  });

  const cpInvVarGiven = cpInvVar.slice();
  if (closureWeighting === "amplitude") {
    const nP = us.length;
    const sum = new Float64Array(nP);
    const w = new Float64Array(nP);
    for (let k = 0; k < nV; k++) {
      sum[vis2Point[k]] += vis2[k] * vis2InvVar[k];
      w[vis2Point[k]] += vis2InvVar[k];
    }
    for (let k = 0; k < nC; k++) {
      let extra = 0;
      for (let j = 0; j < 3; j++) {
        const p = cpPoint[3 * k + j];
        if (w[p] === 0) continue;
        const mean = sum[p] / w[p];
        const sigma = 1 / Math.sqrt(w[p]);
        if (mean >= SNR_LIMIT * sigma) continue;
        const e = sigma / (2 * Math.max(mean, sigma));
        extra += e * e;
      }
      const v = 1 / cpInvVar[k] + extra;
      cpInvVar[k] = 1 / Math.min(v, Math.PI * Math.PI);
    }
  }

  return {
    uW: Float64Array.from(us),
    vW: Float64Array.from(vs),
    maxRadiusW: maxR,
    vis2Point,
    vis2,
    vis2InvVar,
    cpPoint,
    cpSign,
    cpRad,
    cpInvVar,
    cpInvVarGiven,
    flooredErrors: floored,
  };
}
