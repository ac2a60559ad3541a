/** Angle units written in the tests, independent of the engine's own constants. */

/** Degrees → radians. */
export const rad = (d: number) => (d * Math.PI) / 180;

/** Radians → degrees. */
export const deg = (r: number) => (r * 180) / Math.PI;

/** One milliarcsecond in radians. */
export const MAS = Math.PI / (180 * 3600 * 1000);
