/**
 * Target models and their complex visibilities.
 *
 * Sign convention: V(u, v) = ∫ I(α, δ) exp(−2πi(uα + vδ)) dα dδ / ∫ I, with α
 * the offset toward east and δ toward north (radians), u and v in wavelengths.
 * So a point at offset (α0, δ0) has V = exp(−2πi(uα0 + vδ0)). Squared
 * visibility and |closure phase| do not depend on this choice.
 *
 * Models (sizes in milliarcseconds at the edge, radians inside; r = √(u²+v²)):
 *  - point:             V = 1
 *  - uniform disk θ:    V = 2 J1(x)/x,                 x = π θ r
 *  - Gaussian FWHM θ:   V = exp(−(π θ r)² / (4 ln 2))
 *  - limb-darkened disk θ, linear law I(μ) = 1 − a(1 − μ):
 *                       V = [(1−a) J1(x)/x + a √(π/2) J_{3/2}(x)/x^{3/2}] / [(1−a)/2 + a/3]
 *  - thin ring θ:       V = J0(x)
 *  - binary: two points, the primary at the phase centre, the secondary at
 *    separation ρ and position angle PA (east of north), flux ratio
 *    f = secondary/primary: V = (1 + f·exp(−2πi(u ρ sin PA + v ρ cos PA))) / (1 + f)
 *  - sum: Σ F_k V_k(u,v) exp(−2πi(u α_k + v δ_k)) / Σ F_k with each
 *    component shifted by its offset (α_k east, δ_k north).
 */
import type { TargetModel } from "../inputs";
import { DEG_TO_RAD, LN2, MAS_TO_RAD, TWO_PI } from "../math";
import { besselJ0, besselJ1OverX, sphericalJ1OverX } from "./bessel";

/** A model with every angle converted to radians and fluxes normalized. */
export type CompiledModel =
  | { kind: "point" }
  | { kind: "uniformDisk"; diameterRad: number }
  | { kind: "gaussian"; fwhmRad: number }
  | { kind: "limbDarkenedDisk"; diameterRad: number; coefficient: number }
  | { kind: "ring"; diameterRad: number }
  | { kind: "binary"; offsetEastRad: number; offsetNorthRad: number; fluxRatio: number }
  | {
      kind: "sum";
      components: { model: CompiledModel; weight: number; offsetEastRad: number; offsetNorthRad: number }[];
    };

/** Converts a validated request model (mas, degrees) to the internal form (radians, normalized weights). */
export function compileModel(model: TargetModel): CompiledModel {
  switch (model.type) {
    case "point":
      return { kind: "point" };
    case "uniformDisk":
      return { kind: "uniformDisk", diameterRad: model.diameterMas * MAS_TO_RAD };
    case "gaussian":
      return { kind: "gaussian", fwhmRad: model.fwhmMas * MAS_TO_RAD };
    case "limbDarkenedDisk":
      return { kind: "limbDarkenedDisk", diameterRad: model.diameterMas * MAS_TO_RAD, coefficient: model.coefficient };
    case "ring":
      return { kind: "ring", diameterRad: model.diameterMas * MAS_TO_RAD };
    case "binary": {
      const rho = model.separationMas * MAS_TO_RAD;
      const pa = model.positionAngleDeg * DEG_TO_RAD;
      return {
        kind: "binary",
        offsetEastRad: rho * Math.sin(pa),
        offsetNorthRad: rho * Math.cos(pa),
        fluxRatio: model.fluxRatio,
      };
    }
    case "sum": {
      const total = model.components.reduce((acc, c) => acc + c.flux, 0);
      return {
        kind: "sum",
        components: model.components.map((c) => ({
          model: compileModel(c.model),
          weight: c.flux / total,
          offsetEastRad: c.offsetEastMas * MAS_TO_RAD,
          offsetNorthRad: c.offsetNorthMas * MAS_TO_RAD,
        })),
      };
    }
  }
}

/** Visibility of a centred radially symmetric model at radius r (wavelengths); real-valued. */
function radialVisibility(model: CompiledModel, r: number): number {
  switch (model.kind) {
    case "uniformDisk":
      return 2 * besselJ1OverX(Math.PI * model.diameterRad * r);
    case "gaussian": {
      const x = Math.PI * model.fwhmRad * r;
      return Math.exp(-(x * x) / (4 * LN2));
    }
    case "limbDarkenedDisk": {
      const a = model.coefficient;
      const x = Math.PI * model.diameterRad * r;
      return ((1 - a) * besselJ1OverX(x) + a * sphericalJ1OverX(x)) / ((1 - a) / 2 + a / 3);
    }
    case "ring":
      return besselJ0(Math.PI * model.diameterRad * r);
    default:
      return 1;
  }
}

/**
 * Complex visibility at one spatial frequency (u, v in wavelengths).
 * Returns {re, im}; |V| ≤ 1 for the positive models here.
 */
export function visibilityAt(model: CompiledModel, uW: number, vW: number): { re: number; im: number } {
  const re = new Float64Array(1);
  const im = new Float64Array(1);
  evaluateVisibilities(model, Float64Array.of(uW), Float64Array.of(vW), re, im);
  return { re: re[0], im: im[0] };
}

/**
 * Fills outRe/outIm with the model's complex visibility at each (u[k], v[k])
 * (wavelengths). Arrays must have equal length. Works in place on the output
 * arrays; allocates scratch arrays only for sums.
 */
export function evaluateVisibilities(
  model: CompiledModel,
  uW: Float64Array,
  vW: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
): void {
  const n = uW.length;
  switch (model.kind) {
    case "point":
      outRe.fill(1, 0, n);
      outIm.fill(0, 0, n);
      return;
    case "uniformDisk": {
      const k = Math.PI * model.diameterRad;
      for (let i = 0; i < n; i++) {
        const u = uW[i];
        const v = vW[i];
        outRe[i] = 2 * besselJ1OverX(k * Math.sqrt(u * u + v * v));
        outIm[i] = 0;
      }
      return;
    }
    case "gaussian": {
      const c = (Math.PI * model.fwhmRad) ** 2 / (4 * LN2);
      for (let i = 0; i < n; i++) {
        const u = uW[i];
        const v = vW[i];
        outRe[i] = Math.exp(-c * (u * u + v * v));
        outIm[i] = 0;
      }
      return;
    }
    case "limbDarkenedDisk":
    case "ring":
      for (let i = 0; i < n; i++) {
        const u = uW[i];
        const v = vW[i];
        outRe[i] = radialVisibility(model, Math.sqrt(u * u + v * v));
        outIm[i] = 0;
      }
      return;
    case "binary": {
      const f = model.fluxRatio;
      const norm = 1 / (1 + f);
      const ax = TWO_PI * model.offsetEastRad;
      const ay = TWO_PI * model.offsetNorthRad;
      for (let i = 0; i < n; i++) {
        const phi = ax * uW[i] + ay * vW[i];
        outRe[i] = (1 + f * Math.cos(phi)) * norm;
        outIm[i] = -f * Math.sin(phi) * norm;
      }
      return;
    }
    case "sum": {
      outRe.fill(0, 0, n);
      outIm.fill(0, 0, n);
      const re = new Float64Array(n);
      const im = new Float64Array(n);
      for (const c of model.components) {
        evaluateVisibilities(c.model, uW, vW, re, im);
        const w = c.weight;
        const ax = TWO_PI * c.offsetEastRad;
        const ay = TWO_PI * c.offsetNorthRad;
        if (ax === 0 && ay === 0) {
          for (let i = 0; i < n; i++) {
            outRe[i] += w * re[i];
            outIm[i] += w * im[i];
          }
        } else {
          for (let i = 0; i < n; i++) {
            const phi = ax * uW[i] + ay * vW[i];
            const c0 = Math.cos(phi);
            const s0 = -Math.sin(phi);
            outRe[i] += w * (re[i] * c0 - im[i] * s0);
            outIm[i] += w * (re[i] * s0 + im[i] * c0);
          }
        }
      }
      return;
    }
  }
}
