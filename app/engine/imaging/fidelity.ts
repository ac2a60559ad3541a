/**
 * How faithful a reconstruction is to the model it was simulated from.
 *
 * Clean beam: the elliptical Gaussian with the FWHM and position angle of the dirty beam's central lobe,
 * fitted by interferometry/beam-fit.ts to the dirty beam of the data's uv points (natural weights) at the
 * reconstruction's pixel scale; when the lobe cannot be fitted (e.g. a single baseline) or comes out
 * narrower than half a pixel, a circular beam of FWHM λ/(2 B_max) = 1/(2 r_max).
 * Model image: the model convolved with the clean beam, computed in the Fourier plane (the model's
 * visibilities times the beam's transform, grid-dft.ts), so points and sharp edges are exact.
 * Fidelity: the normalized cross-correlation (Pearson coefficient over the pixels)
 *   ρ = Σ (a − ā)(b − b̄) / √(Σ (a − ā)² Σ (b − b̄)²)
 * between the reconstruction convolved with the clean beam a (the restored image: both images at the
 * resolution the data support, so a sharper-than-the-beam reconstruction is not penalized) and the model
 * image b, after moving b's centroid onto a's by whole pixels and taking the best of the shifts within
 * ±2 pixels of that (the data fix no absolute position). The same figure against the unconvolved
 * reconstruction is reported beside it.
 * Dirty image: the model's visibilities at the data's uv points imaged with the dirty beam (what the
 * coverage shows without deconvolution), same grid.
 */
import { fitBeam } from "../interferometry/beam-fit";
import { dirtyBeam, dirtyImage } from "../interferometry/dirty-beam";
import { type CompiledModel, evaluateVisibilities } from "../interferometry/models";
import { GridDft } from "./grid-dft";
import { recentre } from "./reconstruct";

export interface GaussianBeam {
  fwhmMajorRad: number;
  fwhmMinorRad: number;
  /** East of north, radians. */
  positionAngleRad: number;
  /** False when the fallback circular beam is used. */
  fitted: boolean;
}

/** Fourier transform of the unit-flux elliptical Gaussian beam at (u, v) wavelengths. */
export function beamTransform(beam: GaussianBeam, u: number, v: number): number {
  const s = Math.sin(beam.positionAngleRad);
  const c = Math.cos(beam.positionAngleRad);
  const along = u * s + v * c;
  const across = u * c - v * s;
  const k = (Math.PI * Math.PI) / (4 * Math.LN2);
  return Math.exp(-k * (beam.fwhmMajorRad ** 2 * along * along + beam.fwhmMinorRad ** 2 * across * across));
}

function nextPow2(x: number): number {
  let p = 32;
  while (p < x) p *= 2;
  return p;
}

/** The central n × n part of a big × big image (both centred at their half sizes). */
function crop(image: Float64Array, big: number, n: number): Float64Array {
  const off = big / 2 - Math.floor(n / 2);
  const out = new Float64Array(n * n);
  for (let y = 0; y < n; y++) for (let x = 0; x < n; x++) out[y * n + x] = image[(y + off) * big + x + off];
  return out;
}

/** Clean beam and the model's dirty image for the uv points (wavelengths) on an n × n grid of pixel Δ. */
export function cleanBeamAndDirtyImage(
  model: CompiledModel,
  uW: Float64Array,
  vW: Float64Array,
  maxRadiusW: number,
  n: number,
  pixelRad: number,
): { beam: GaussianBeam; dirty: Float64Array } {
  const big = nextPow2(Math.max(64, 2 * n));
  const result = dirtyBeam(uW, vW, { gridSize: big, pixelRad });
  const fit = fitBeam(result.image, big, pixelRad);
  const measurable =
    fit.fwhmMajorRad !== null &&
    fit.fwhmMinorRad !== null &&
    fit.positionAngleRad !== null &&
    fit.fwhmMinorRad >= 0.5 * pixelRad &&
    Number.isFinite(fit.fwhmMajorRad);
  const beam: GaussianBeam =
    measurable && fit.fwhmMajorRad !== null && fit.fwhmMinorRad !== null && fit.positionAngleRad !== null
      ? {
          fwhmMajorRad: fit.fwhmMajorRad,
          fwhmMinorRad: fit.fwhmMinorRad,
          positionAngleRad: fit.positionAngleRad,
          fitted: true,
        }
      : { fwhmMajorRad: 1 / (2 * maxRadiusW), fwhmMinorRad: 1 / (2 * maxRadiusW), positionAngleRad: 0, fitted: false };
  const re = new Float64Array(uW.length);
  const im = new Float64Array(uW.length);
  evaluateVisibilities(model, uW, vW, re, im);
  const dirty = crop(dirtyImage(result.weights, re, im).image, big, n);
  return { beam, dirty };
}

/** Spectrum of the model times the beam on the grid of `dft` (pixel Δ). */
export function convolvedModelSpectrum(
  model: CompiledModel,
  dft: GridDft,
  pixelRad: number,
  beam: GaussianBeam,
): { re: Float64Array; im: Float64Array } {
  const m = dft.m;
  const u = new Float64Array(m * m);
  const v = new Float64Array(m * m);
  for (let l = 0; l < m; l++)
    for (let k = 0; k < m; k++) {
      u[l * m + k] = dft.frequency(k, pixelRad);
      v[l * m + k] = dft.frequency(l, pixelRad);
    }
  const re = new Float64Array(m * m);
  const im = new Float64Array(m * m);
  evaluateVisibilities(model, u, v, re, im);
  for (let i = 0; i < m * m; i++) {
    const b = beamTransform(beam, u[i], v[i]);
    re[i] *= b;
    im[i] *= b;
  }
  return { re, im };
}

/** The model convolved with the beam on the n × n grid (unit total flux over the periodic field). */
export function convolvedModelImage(
  model: CompiledModel,
  n: number,
  pixelRad: number,
  beam: GaussianBeam,
): Float64Array {
  const dft = new GridDft(n);
  const s = convolvedModelSpectrum(model, dft, pixelRad, beam);
  return dft.inverse(s.re, s.im);
}

/** An n × n image convolved with the beam (Fourier plane, grid-dft.ts). */
export function convolveWithBeam(image: Float64Array, n: number, pixelRad: number, beam: GaussianBeam): Float64Array {
  const dft = new GridDft(n);
  const { re, im } = dft.forward(image);
  const m = dft.m;
  for (let l = 0; l < m; l++)
    for (let k = 0; k < m; k++) {
      const b = beamTransform(beam, dft.frequency(k, pixelRad), dft.frequency(l, pixelRad));
      re[l * m + k] *= b;
      im[l * m + k] *= b;
    }
  return dft.inverse(re, im);
}

/** Pearson correlation of two images of equal size (0 when either is constant). */
export function normalizedCrossCorrelation(a: Float64Array, b: Float64Array): number {
  const n = a.length;
  let ma = 0;
  let mb = 0;
  for (let i = 0; i < n; i++) {
    ma += a[i];
    mb += b[i];
  }
  ma /= n;
  mb /= n;
  let sab = 0;
  let saa = 0;
  let sbb = 0;
  for (let i = 0; i < n; i++) {
    const x = a[i] - ma;
    const y = b[i] - mb;
    sab += x * y;
    saa += x * x;
    sbb += y * y;
  }
  return saa > 0 && sbb > 0 ? sab / Math.sqrt(saa * sbb) : 0;
}

function shifted(image: Float64Array, n: number, dx: number, dy: number): Float64Array {
  const out = new Float64Array(n * n);
  for (let y = 0; y < n; y++) {
    const sy = y - dy;
    if (sy < 0 || sy >= n) continue;
    for (let x = 0; x < n; x++) {
      const sx = x - dx;
      if (sx >= 0 && sx < n) out[y * n + x] = image[sy * n + sx];
    }
  }
  return out;
}

/**
 * Fidelity of `reconstruction` against `modelImage` (both n × n): the best correlation over whole-pixel
 * shifts of the model image within ±2 pixels of the centroid alignment, with the shift used.
 */
export function fidelity(
  reconstruction: Float64Array,
  modelImage: Float64Array,
  n: number,
): { ncc: number; shiftPixels: [number, number] } {
  const target = reconstruction.slice();
  const [rx, ry] = recentre(target, n);
  const aligned = modelImage.slice();
  const [mx, my] = recentre(aligned, n);
  let best = -2;
  let shift: [number, number] = [0, 0];
  for (let dy = -2; dy <= 2; dy++)
    for (let dx = -2; dx <= 2; dx++) {
      const r = normalizedCrossCorrelation(reconstruction, shifted(aligned, n, dx - rx, dy - ry));
      if (r > best) {
        best = r;
        shift = [dx - rx + mx, dy - ry + my];
      }
    }
  return { ncc: best, shiftPixels: shift };
}
