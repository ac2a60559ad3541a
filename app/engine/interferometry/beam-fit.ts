/**
 * Central-lobe fit and peak sidelobe of a dirty beam image.
 *
 * Method:
 *  1. Along 180 directions from the centre (every 2°), the beam is sampled
 *     by bicubic (Catmull–Rom) interpolation every 0.1 pixel; the first radius
 *     where it falls to one half is refined by bisection. The ellipse
 *     A x² + B xy + C y² = 1 fitted to these 180 half-power points by linear
 *     least squares gives the FWHM along its major and minor axes and the
 *     major axis' position angle (east of north, [0°, 180°)). An elliptical
 *     half-power contour (e.g. a Gaussian or an affinely stretched Airy lobe)
 *     is recovered exactly.
 *  2. The main lobe extends, in each direction, to the first point where the
 *     beam stops decreasing or reaches zero. The peak sidelobe is the largest
 *     beam value outside that region, relative to the peak (1).
 * When the beam does not fall to one half within the image in some direction
 * (a single baseline, a grid too small for the coverage), the FWHM fields are
 * null; the sidelobe is still reported.
 */
export interface BeamFit {
  /** FWHM along the major axis, radians; null when undefined (see module comment). */
  fwhmMajorRad: number | null;
  /** FWHM along the minor axis, radians; null when undefined. */
  fwhmMinorRad: number | null;
  /** Position angle of the major axis, east of north, radians in [0, π); null when undefined. */
  positionAngleRad: number | null;
  /** Largest beam value outside the main lobe (peak = 1); 0 when nothing lies outside. */
  peakSidelobe: number;
}

const DIRECTIONS = 180;
const STEP_PX = 0.1;

/**
 * Bicubic (Catmull–Rom, Keys a = −0.5) interpolation of an N × N row-major
 * image at fractional pixel coordinates (x = column, y = row). Exact at pixel
 * centres. Returns NaN within 2 pixels of the edge.
 */
export function sampleBicubic(image: Float64Array, n: number, x: number, y: number): number {
  const x0 = Math.floor(x);
  const y0 = Math.floor(y);
  if (x0 < 1 || y0 < 1 || x0 > n - 3 || y0 > n - 3) return Number.NaN;
  const tx = x - x0;
  const ty = y - y0;
  const tx2 = tx * tx;
  const tx3 = tx2 * tx;
  const ty2 = ty * ty;
  const ty3 = ty2 * ty;
  const ax0 = -0.5 * tx3 + tx2 - 0.5 * tx;
  const ax1 = 1.5 * tx3 - 2.5 * tx2 + 1;
  const ax2 = -1.5 * tx3 + 2 * tx2 + 0.5 * tx;
  const ax3 = 0.5 * tx3 - 0.5 * tx2;
  const ay = [
    -0.5 * ty3 + ty2 - 0.5 * ty,
    1.5 * ty3 - 2.5 * ty2 + 1,
    -1.5 * ty3 + 2 * ty2 + 0.5 * ty,
    0.5 * ty3 - 0.5 * ty2,
  ];
  let sum = 0;
  for (let j = 0; j < 4; j++) {
    const row = (y0 - 1 + j) * n + x0 - 1;
    sum += ay[j] * (ax0 * image[row] + ax1 * image[row + 1] + ax2 * image[row + 2] + ax3 * image[row + 3]);
  }
  return sum;
}

/**
 * Fits the central lobe of a beam image (centre at (N/2, N/2), peak 1) and
 * finds its peak sidelobe.
 * @param pixelRad pixel size, radians (x east, y north)
 */
export function fitBeam(image: Float64Array, n: number, pixelRad: number): BeamFit {
  const c = n / 2;
  const maxR = n / 2 - 3;
  const halfR = new Float64Array(DIRECTIONS);
  const lobeR = new Float64Array(DIRECTIONS);
  let halfDefined = true;
  const value = (dx: number, dy: number, r: number) => sampleBicubic(image, n, c + dx * r, c + dy * r);

  for (let k = 0; k < DIRECTIONS; k++) {
    const theta = (2 * Math.PI * k) / DIRECTIONS; // east of north
    const dx = Math.sin(theta);
    const dy = Math.cos(theta);
    // Half-power radius: first fall to 0.5, refined by bisection.
    let half = Number.NaN;
    for (let r = 0; r + STEP_PX <= maxR; r += STEP_PX) {
      if (value(dx, dy, r + STEP_PX) <= 0.5) {
        let lo = r;
        let hi = r + STEP_PX;
        for (let it = 0; it < 30; it++) {
          const mid = 0.5 * (lo + hi);
          if (value(dx, dy, mid) > 0.5) lo = mid;
          else hi = mid;
        }
        half = 0.5 * (lo + hi);
        break;
      }
    }
    // Main-lobe edge: from the half-power radius on, the first point where the
    // beam reaches zero or stops decreasing.
    let lobe = maxR;
    if (!Number.isNaN(half)) {
      let prev = value(dx, dy, half);
      for (let r = half; r + STEP_PX <= maxR; r += STEP_PX) {
        const b = value(dx, dy, r + STEP_PX);
        if (b <= 0) {
          lobe = r + STEP_PX;
          break;
        }
        if (b >= prev) {
          lobe = r;
          break;
        }
        prev = b;
      }
    }
    if (Number.isNaN(half)) halfDefined = false;
    halfR[k] = half;
    lobeR[k] = lobe;
  }

  // Peak sidelobe: largest value outside the star-shaped main-lobe region.
  let maxLobe = 0;
  for (let k = 0; k < DIRECTIONS; k++) if (lobeR[k] > maxLobe) maxLobe = lobeR[k];
  const reach = Math.ceil(maxLobe) + 1;
  let sidelobe = 0;
  for (let y = 0; y < n; y++) {
    const dy = y - c;
    for (let x = 0; x < n; x++) {
      const dx = x - c;
      const v = image[y * n + x];
      if (v <= sidelobe) continue;
      if (Math.abs(dx) <= reach && Math.abs(dy) <= reach) {
        const r = Math.sqrt(dx * dx + dy * dy);
        let theta = Math.atan2(dx, dy);
        if (theta < 0) theta += 2 * Math.PI;
        const k = Math.round((theta / (2 * Math.PI)) * DIRECTIONS) % DIRECTIONS;
        if (r <= lobeR[k]) continue;
      }
      sidelobe = v;
    }
  }

  if (!halfDefined) return { fwhmMajorRad: null, fwhmMinorRad: null, positionAngleRad: null, peakSidelobe: sidelobe };

  // Least squares for A x² + B xy + C y² = 1 over the half-power points (pixels).
  const m = [0, 0, 0, 0, 0, 0, 0, 0, 0];
  const rhs = [0, 0, 0];
  for (let k = 0; k < DIRECTIONS; k++) {
    const theta = (2 * Math.PI * k) / DIRECTIONS;
    const x = halfR[k] * Math.sin(theta);
    const y = halfR[k] * Math.cos(theta);
    const f = [x * x, x * y, y * y];
    for (let a = 0; a < 3; a++) {
      rhs[a] += f[a];
      for (let b = 0; b < 3; b++) m[3 * a + b] += f[a] * f[b];
    }
  }
  const sol = solve3(m, rhs);
  if (!sol) return { fwhmMajorRad: null, fwhmMinorRad: null, positionAngleRad: null, peakSidelobe: sidelobe };
  const [A, B, C] = sol;
  // Quadratic form [[A, B/2], [B/2, C]]: eigenvalues μ; semi-axis 1/√μ.
  const tr = A + C;
  const det = A * C - (B * B) / 4;
  const disc = Math.sqrt(Math.max(0, (tr * tr) / 4 - det));
  const muSmall = tr / 2 - disc;
  const muLarge = tr / 2 + disc;
  if (!(muSmall > 0)) return { fwhmMajorRad: null, fwhmMinorRad: null, positionAngleRad: null, peakSidelobe: sidelobe };
  // Major axis = eigenvector of the small eigenvalue: (A − μ) ex + (B/2) ey = 0.
  let ex: number;
  let ey: number;
  if (Math.abs(B) > 1e-15 * (Math.abs(A) + Math.abs(C))) {
    ex = B / 2;
    ey = muSmall - A;
  } else if (A <= C) {
    ex = 1;
    ey = 0;
  } else {
    ex = 0;
    ey = 1;
  }
  let pa = Math.atan2(ex, ey);
  if (pa < 0) pa += Math.PI;
  if (pa >= Math.PI) pa -= Math.PI;
  return {
    fwhmMajorRad: (2 / Math.sqrt(muSmall)) * pixelRad,
    fwhmMinorRad: (2 / Math.sqrt(muLarge)) * pixelRad,
    positionAngleRad: pa,
    peakSidelobe: sidelobe,
  };
}

/** Solves a 3 × 3 linear system (row-major matrix) by Cramer's rule; null when singular. */
function solve3(m: number[], r: number[]): [number, number, number] | null {
  const det3 = (a: number[]) =>
    a[0] * (a[4] * a[8] - a[5] * a[7]) - a[1] * (a[3] * a[8] - a[5] * a[6]) + a[2] * (a[3] * a[7] - a[4] * a[6]);
  const d = det3(m);
  if (!(Math.abs(d) > 0) || !Number.isFinite(d)) return null;
  const withCol = (col: number) => m.map((v, i) => (i % 3 === col ? r[Math.floor(i / 3)] : v));
  return [det3(withCol(0)) / d, det3(withCol(1)) / d, det3(withCol(2)) / d];
}
