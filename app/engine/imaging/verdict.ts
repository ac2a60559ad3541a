/**
 * Plain-words verdict on what a reconstruction recovers of its model, from simple measurements.
 *
 *  - binary: the two brightest local maxima of the reconstruction at least 2 pixels apart; each
 *    component's position is the flux-weighted centroid within 2 pixels of its peak and its flux the sum
 *    there; the fainter is the secondary. Separation and position angle (east of north, secondary relative
 *    to primary) are compared with the model: recovered when within one pixel and 5° (the angle taken
 *    modulo 180° when the flux ratio exceeds 0.8, where the brighter component is ambiguous).
 *  - uniform or limb-darkened disk: the diameter D of the uniform disk that, convolved with the clean
 *    beam, best matches the reconstruction convolved with the clean beam (least squares in the Fourier
 *    plane, equivalent to the image plane by Parseval's theorem; golden-section search over D from one
 *    pixel to 0.9 of the field); recovered when within 10 % of the model's. A disk smaller than half the
 *    clean beam is reported as unresolved.
 *  - any other model: bands of the fidelity ρ — ≥ 0.9 recovers the structure, ≥ 0.7 the overall shape,
 *    ≥ 0.5 only the broad outline, below that the coverage does not support imaging it (our bands).
 */
import type { TargetModel } from "../inputs";
import { besselJ1OverX } from "../interferometry/bessel";
import { MAS_TO_RAD, RAD_TO_DEG, RAD_TO_MAS } from "../math";
import { beamTransform, type GaussianBeam } from "./fidelity";
import { GridDft } from "./grid-dft";
import { scanMinimum } from "./scan-minimum";

export interface BinaryMeasurement {
  separationMas: number;
  positionAngleDeg: number;
  fluxRatio: number;
  separationErrorPixels: number;
  positionAngleErrorDeg: number;
}

export interface Verdict {
  kind: "binary" | "disk" | "general";
  recovered: boolean;
  text: string;
  binary?: BinaryMeasurement | null;
  diameterMas?: number | null;
}

/** Two brightest components of an image; null when fewer than two local maxima exist. */
export function measureBinary(image: Float64Array, n: number, pixelRad: number) {
  const peaks: { v: number; x: number; y: number }[] = [];
  for (let y = 1; y < n - 1; y++)
    for (let x = 1; x < n - 1; x++) {
      const v = image[y * n + x];
      if (!(v > 0)) continue;
      let top = true;
      for (let dy = -1; dy <= 1 && top; dy++)
        for (let dx = -1; dx <= 1; dx++) if ((dx || dy) && image[(y + dy) * n + x + dx] > v) top = false;
      if (top) peaks.push({ v, x, y });
    }
  peaks.sort((a, b) => b.v - a.v);
  const first = peaks[0];
  const second = peaks.find((p) => first && Math.hypot(p.x - first.x, p.y - first.y) >= 2);
  if (!first || !second) return null;
  const component = (p: { x: number; y: number }) => {
    let f = 0;
    let sx = 0;
    let sy = 0;
    for (let y = Math.max(0, p.y - 2); y <= Math.min(n - 1, p.y + 2); y++)
      for (let x = Math.max(0, p.x - 2); x <= Math.min(n - 1, p.x + 2); x++) {
        if ((x - p.x) ** 2 + (y - p.y) ** 2 > 4) continue;
        const v = image[y * n + x];
        f += v;
        sx += v * x;
        sy += v * y;
      }
    return { flux: f, x: sx / f, y: sy / f };
  };
  let a = component(first);
  let b = component(second);
  if (b.flux > a.flux) [a, b] = [b, a];
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  let pa = Math.atan2(dx, dy) * RAD_TO_DEG;
  if (pa < 0) pa += 360;
  return {
    separationMas: Math.hypot(dx, dy) * pixelRad * RAD_TO_MAS,
    positionAngleDeg: pa,
    fluxRatio: b.flux / a.flux,
  };
}

/**
 * Uniform-disk diameter (radians) whose image convolved with `beam` best matches `image` convolved with
 * `beam` (least squares in the Fourier plane), searched in [Δ, 0.9 N Δ].
 */
export function fitDiskDiameterRad(image: Float64Array, n: number, pixelRad: number, beam: GaussianBeam): number {
  const dft = new GridDft(n);
  const { re, im } = dft.forward(image);
  const m = dft.m;
  const r = new Float64Array(m * m);
  const w = new Float64Array(m * m);
  // The image's own centroid as the disk's centre: remove its phase slope by shifting to the centroid.
  let sx = 0;
  let sy = 0;
  let s = 0;
  const c = Math.floor(n / 2);
  for (let y = 0; y < n; y++)
    for (let x = 0; x < n; x++) {
      sx += image[y * n + x] * (x - c);
      sy += image[y * n + x] * (y - c);
      s += image[y * n + x];
    }
  const ox = (sx / s) * pixelRad;
  const oy = (sy / s) * pixelRad;
  for (let l = 0; l < m; l++)
    for (let k = 0; k < m; k++) {
      const u = dft.frequency(k, pixelRad);
      const v = dft.frequency(l, pixelRad);
      const i = l * m + k;
      const ph = 2 * Math.PI * (u * ox + v * oy);
      const cr = re[i] * Math.cos(ph) - im[i] * Math.sin(ph);
      const ci = re[i] * Math.sin(ph) + im[i] * Math.cos(ph);
      re[i] = cr / s;
      im[i] = ci / s;
      r[i] = Math.hypot(u, v);
      const b = beamTransform(beam, u, v);
      w[i] = b * b;
    }
  const cost = (d: number) => {
    let total = 0;
    for (let i = 0; i < m * m; i++) {
      const dr = re[i] - 2 * besselJ1OverX(Math.PI * d * r[i]);
      total += w[i] * (dr * dr + im[i] * im[i]);
    }
    return total;
  };
  const lo = pixelRad;
  const hi = 0.9 * n * pixelRad;
  const steps = 48;
  return scanMinimum(cost, (k) => lo * (hi / lo) ** (k / (steps - 1)), steps, 30);
}

/** The verdict for a reconstruction of `model` with fidelity `ncc`. */
export function verdictFor(
  model: TargetModel,
  image: Float64Array,
  n: number,
  pixelRad: number,
  beam: GaussianBeam,
  ncc: number,
): Verdict {
  const pixelMas = pixelRad * RAD_TO_MAS;
  if (model.type === "binary") {
    const m = measureBinary(image, n, pixelRad);
    if (!m)
      return { kind: "binary", recovered: false, text: "the binary is not resolved into two components", binary: null };
    const sepErrPx = Math.abs(m.separationMas - model.separationMas) / pixelMas;
    const period = model.fluxRatio > 0.8 ? 180 : 360;
    let dpa = Math.abs(m.positionAngleDeg - model.positionAngleDeg) % period;
    dpa = Math.min(dpa, period - dpa);
    const sepOk = sepErrPx <= 1;
    const paOk = dpa <= 5;
    const binary = { ...m, separationErrorPixels: sepErrPx, positionAngleErrorDeg: dpa };
    const text =
      sepOk && paOk
        ? "the coverage recovers the binary's separation and position angle"
        : sepOk
          ? "the coverage recovers the binary's separation but not its position angle"
          : paOk
            ? "the coverage recovers the binary's position angle but not its separation"
            : "the coverage recovers neither the binary's separation nor its position angle";
    return { kind: "binary", recovered: sepOk && paOk, text, binary };
  }
  if (model.type === "uniformDisk" || model.type === "limbDarkenedDisk") {
    const beamRad = Math.sqrt(beam.fwhmMajorRad * beam.fwhmMinorRad);
    if (model.diameterMas * MAS_TO_RAD < 0.5 * beamRad) {
      return { kind: "disk", recovered: false, text: "the disk is not resolved by the coverage", diameterMas: null };
    }
    const d = fitDiskDiameterRad(image, n, pixelRad, beam) * RAD_TO_MAS;
    const ok = Math.abs(d - model.diameterMas) <= 0.1 * model.diameterMas;
    const text = ok ? "the coverage recovers the disk's diameter" : "the disk's edge is not constrained";
    return { kind: "disk", recovered: ok, text, diameterMas: d };
  }
  const text =
    ncc >= 0.9
      ? "the coverage recovers the model's structure"
      : ncc >= 0.7
        ? "the coverage recovers the model's overall shape but not its finer detail"
        : ncc >= 0.5
          ? "the coverage recovers only the model's broad outline"
          : "the coverage does not support imaging this model";
  return { kind: "general", recovered: ncc >= 0.7, text };
}
