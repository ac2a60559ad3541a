/**
 * Shared numerical constants and guarded elementary functions.
 *
 * Everything inside the engine works in radians, metres, seconds and Julian days;
 * degrees, milliarcseconds and hours appear only at the public edge and are
 * converted with the constants below. This module imports nothing, so both the
 * astro and the interferometry folders may depend on it.
 */

export const PI = Math.PI;
export const TWO_PI = 2 * Math.PI;
export const HALF_PI = Math.PI / 2;

/** Degrees → radians. */
export const DEG_TO_RAD = Math.PI / 180;
/** Radians → degrees. */
export const RAD_TO_DEG = 180 / Math.PI;
/** Hours of angle (15° each) → radians. */
export const HOUR_TO_RAD = Math.PI / 12;
/** Radians → hours of angle. */
export const RAD_TO_HOUR = 12 / Math.PI;
/** Milliarcseconds → radians (1 mas = π / (180·3600·1000) rad ≈ 4.848e-9 rad). */
export const MAS_TO_RAD = Math.PI / (180 * 3600 * 1000);
/** Radians → milliarcseconds. */
export const RAD_TO_MAS = (180 * 3600 * 1000) / Math.PI;

/** Seconds in a day. */
export const SECONDS_PER_DAY = 86400;
/** Milliseconds in a day. */
export const MS_PER_DAY = 86_400_000;
/** Julian day of the Unix epoch 1970-01-01T00:00:00Z. */
export const JD_UNIX_EPOCH = 2440587.5;
/** Julian day of J2000.0 (2000-01-01T12:00 TT). */
export const JD_J2000 = 2451545.0;

/** ln 2, used by Gaussian FWHM conversions. */
export const LN2 = Math.LN2;

/**
 * asin with its argument clamped to [−1, 1], so round-off just outside the
 * domain (e.g. 1.0000000000000002) yields ±π/2 instead of NaN. NaN stays NaN.
 */
export function clampedAsin(x: number): number {
  return Math.asin(x > 1 ? 1 : Math.max(x, -1));
}

/**
 * acos with its argument clamped to [−1, 1] (returns 0 or π at the ends instead
 * of NaN). NaN stays NaN.
 */
export function clampedAcos(x: number): number {
  return Math.acos(x > 1 ? 1 : Math.max(x, -1));
}

/** Wraps an angle in radians into [0, 2π). */
export function wrapTwoPi(rad: number): number {
  const r = rad % TWO_PI;
  return r < 0 ? r + TWO_PI : r;
}

/** Wraps an angle in radians into (−π, π]. */
export function wrapPi(rad: number): number {
  let r = wrapTwoPi(rad);
  if (r > PI) r -= TWO_PI;
  return r;
}

/** Wraps a value in hours into [0, 24). */
export function wrapHours24(h: number): number {
  const r = h % 24;
  return r < 0 ? r + 24 : r;
}

/** Wraps a value in hours into [−12, 12). */
export function wrapHours12(h: number): number {
  return wrapHours24(h + 12) - 12;
}

/** Wraps degrees into (−180, 180]. */
export function wrapDeg180(deg: number): number {
  let r = deg % 360;
  if (r <= -180) r += 360;
  else if (r > 180) r -= 360;
  return r;
}

/** True when n is an integer power of two (1, 2, 4, ...). */
export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n > 0 && (n & (n - 1)) === 0;
}

/** Median of a list (copy sorted); NaN for an empty list. */
export function median(values: ArrayLike<number>): number {
  const n = values.length;
  if (n === 0) return Number.NaN;
  const s = Array.from(values).sort((a, b) => a - b);
  return n % 2 === 1 ? s[(n - 1) / 2] : 0.5 * (s[n / 2 - 1] + s[n / 2]);
}

/**
 * Rounds to a number of decimal places for serialization (not for further
 * computation). Non-finite values pass through unchanged.
 */
export function roundTo(x: number, decimals: number): number {
  if (!Number.isFinite(x)) return x;
  const f = 10 ** decimals;
  return Math.round(x * f) / f;
}
