/**
 * Bessel functions of the first kind needed by the target models.
 *
 * Polynomial approximations of Abramowitz & Stegun (1964) §9.4: eq. 9.4.1/9.4.3
 * for J0 and 9.4.4/9.4.6 for J1. Absolute error below 5e-8 (J0) and 1.3e-8
 * (x⁻¹J1 for |x| ≤ 3, J1 beyond), which is far below any measurable visibility.
 * All functions are even or odd as the true functions and accept any finite x;
 * NaN in gives NaN out.
 */

/** J0(x), the Bessel function of the first kind of order 0. */
export function besselJ0(x: number): number {
  const ax = Math.abs(x);
  if (ax <= 3) {
    const y = (x / 3) * (x / 3);
    return 1 + y * (-2.2499997 + y * (1.2656208 + y * (-0.3163866 + y * (0.0444479 + y * (-0.0039444 + y * 0.00021)))));
  }
  const z = 3 / ax;
  const f0 =
    0.79788456 +
    z * (-0.00000077 + z * (-0.0055274 + z * (-0.00009512 + z * (0.00137237 + z * (-0.00072805 + z * 0.00014476)))));
  const t0 =
    ax -
    0.78539816 +
    z * (-0.04166397 + z * (-0.00003954 + z * (0.00262573 + z * (-0.00054125 + z * (-0.00029333 + z * 0.00013558)))));
  return (f0 * Math.cos(t0)) / Math.sqrt(ax);
}

/**
 * J1(x)/x, finite at x = 0 where it equals 1/2. Used as 2·J1(x)/x, the
 * visibility of a uniform disk.
 */
export function besselJ1OverX(x: number): number {
  const ax = Math.abs(x);
  if (ax <= 3) {
    const y = (x / 3) * (x / 3);
    return (
      0.5 +
      y * (-0.56249985 + y * (0.21093573 + y * (-0.03954289 + y * (0.00443319 + y * (-0.00031761 + y * 0.00001109)))))
    );
  }
  return besselJ1(ax) / ax;
}

/** J1(x), the Bessel function of the first kind of order 1 (odd in x). */
export function besselJ1(x: number): number {
  const ax = Math.abs(x);
  if (ax <= 3) return x * besselJ1OverX(x);
  const z = 3 / ax;
  const f1 =
    0.79788456 +
    z * (0.00000156 + z * (0.01659667 + z * (0.00017105 + z * (-0.00249511 + z * (0.00113653 - z * 0.00020033)))));
  const t1 =
    ax -
    2.35619449 +
    z * (0.12499612 + z * (0.0000565 + z * (-0.00637879 + z * (0.00074348 + z * (0.00079824 - z * 0.00029166)))));
  const j = (f1 * Math.cos(t1)) / Math.sqrt(ax);
  return x < 0 ? -j : j;
}

/**
 * (sin x / x − cos x) / x², which equals √(π/2)·J_{3/2}(x)/x^{3/2}; it tends to
 * 1/3 at x = 0 and is evaluated there by its Taylor series (|x| < 0.1) to avoid
 * cancellation. Even in x.
 */
export function sphericalJ1OverX(x: number): number {
  const ax = Math.abs(x);
  if (ax < 0.1) {
    const y = ax * ax;
    return 1 / 3 - y / 30 + (y * y) / 840 - (y * y * y) / 45360;
  }
  return (Math.sin(ax) / ax - Math.cos(ax)) / (ax * ax);
}
