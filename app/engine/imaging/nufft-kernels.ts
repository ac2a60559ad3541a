/**
 * Inner loops of the non-uniform FFT (nufft.ts): interpolation of the extended grid at the points and its
 * adjoint, spreading, with the separable kernel weights tabulated per point (wx, wy: `w` values each, point
 * i in storage order, `order[i]` its index in the caller's arrays, `base[i]` its first extended cell,
 * `conj[i]` = 1 when the point was mirrored to the half plane). The width-8 versions are unrolled, which
 * roughly halves their time in V8. Nothing is allocated.
 */

export function interpolate(
  ext: Float64Array,
  stride: number,
  w: number,
  order: Int32Array,
  base: Int32Array,
  conj: Uint8Array,
  wx: Float64Array,
  wy: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
): void {
  for (let i = 0; i < order.length; i++) {
    const ow = i * w;
    let sr = 0;
    let si = 0;
    let row = 2 * base[i];
    for (let b = 0; b < w; b++) {
      let rr = 0;
      let ri = 0;
      let idx = row;
      for (let a = 0; a < w; a++) {
        const f = wx[ow + a];
        rr += f * ext[idx];
        ri += f * ext[idx + 1];
        idx += 2;
      }
      const g = wy[ow + b];
      sr += g * rr;
      si += g * ri;
      row += stride;
    }
    const p = order[i];
    outRe[p] = sr;
    outIm[p] = conj[i] ? -si : si;
  }
}

export function interpolate8(
  ext: Float64Array,
  stride: number,
  order: Int32Array,
  base: Int32Array,
  conj: Uint8Array,
  wx: Float64Array,
  wy: Float64Array,
  outRe: Float64Array,
  outIm: Float64Array,
): void {
  for (let i = 0; i < order.length; i++) {
    const o = 8 * i;
    const f0 = wx[o];
    const f1 = wx[o + 1];
    const f2 = wx[o + 2];
    const f3 = wx[o + 3];
    const f4 = wx[o + 4];
    const f5 = wx[o + 5];
    const f6 = wx[o + 6];
    const f7 = wx[o + 7];
    let sr = 0;
    let si = 0;
    let j = 2 * base[i];
    for (let b = 0; b < 8; b++) {
      const rr =
        f0 * ext[j] +
        f1 * ext[j + 2] +
        f2 * ext[j + 4] +
        f3 * ext[j + 6] +
        f4 * ext[j + 8] +
        f5 * ext[j + 10] +
        f6 * ext[j + 12] +
        f7 * ext[j + 14];
      const ri =
        f0 * ext[j + 1] +
        f1 * ext[j + 3] +
        f2 * ext[j + 5] +
        f3 * ext[j + 7] +
        f4 * ext[j + 9] +
        f5 * ext[j + 11] +
        f6 * ext[j + 13] +
        f7 * ext[j + 15];
      const g = wy[o + b];
      sr += g * rr;
      si += g * ri;
      j += stride;
    }
    const p = order[i];
    outRe[p] = sr;
    outIm[p] = conj[i] ? -si : si;
  }
}

export function spread(
  ext: Float64Array,
  stride: number,
  w: number,
  order: Int32Array,
  base: Int32Array,
  conj: Uint8Array,
  wx: Float64Array,
  wy: Float64Array,
  gRe: Float64Array,
  gIm: Float64Array,
): void {
  for (let i = 0; i < order.length; i++) {
    const p = order[i];
    const a0 = gRe[p];
    const b0 = conj[i] ? -gIm[p] : gIm[p];
    const ow = i * w;
    let row = 2 * base[i];
    for (let b = 0; b < w; b++) {
      const g = wy[ow + b];
      const ga = g * a0;
      const gb = g * b0;
      let idx = row;
      for (let a = 0; a < w; a++) {
        const f = wx[ow + a];
        ext[idx] += f * ga;
        ext[idx + 1] += f * gb;
        idx += 2;
      }
      row += stride;
    }
  }
}

export function spread8(
  ext: Float64Array,
  stride: number,
  order: Int32Array,
  base: Int32Array,
  conj: Uint8Array,
  wx: Float64Array,
  wy: Float64Array,
  gRe: Float64Array,
  gIm: Float64Array,
): void {
  for (let i = 0; i < order.length; i++) {
    const p = order[i];
    const a0 = gRe[p];
    const b0 = conj[i] ? -gIm[p] : gIm[p];
    const o = 8 * i;
    const f0 = wx[o];
    const f1 = wx[o + 1];
    const f2 = wx[o + 2];
    const f3 = wx[o + 3];
    const f4 = wx[o + 4];
    const f5 = wx[o + 5];
    const f6 = wx[o + 6];
    const f7 = wx[o + 7];
    let j = 2 * base[i];
    for (let b = 0; b < 8; b++) {
      const g = wy[o + b];
      const ga = g * a0;
      const gb = g * b0;
      ext[j] += f0 * ga;
      ext[j + 1] += f0 * gb;
      ext[j + 2] += f1 * ga;
      ext[j + 3] += f1 * gb;
      ext[j + 4] += f2 * ga;
      ext[j + 5] += f2 * gb;
      ext[j + 6] += f3 * ga;
      ext[j + 7] += f3 * gb;
      ext[j + 8] += f4 * ga;
      ext[j + 9] += f4 * gb;
      ext[j + 10] += f5 * ga;
      ext[j + 11] += f5 * gb;
      ext[j + 12] += f6 * ga;
      ext[j + 13] += f6 * gb;
      ext[j + 14] += f7 * ga;
      ext[j + 15] += f7 * gb;
      j += stride;
    }
  }
}
