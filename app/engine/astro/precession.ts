/**
 * Precession of equatorial coordinates from the J2000.0 mean equator and
 * equinox to the mean equator and equinox of date (Meeus ch. 21, rigorous
 * method, eq. 21.2–21.4), with optional annual proper motions.
 */
import { JDEToJulianYear } from "astronomia/base";
import { position } from "astronomia/precess";
import { wrapTwoPi } from "../math";

export interface EquatorialRad {
  /** Right ascension, radians in [0, 2π). */
  raRad: number;
  /** Declination, radians in [−π/2, π/2]. */
  decRad: number;
}

/**
 * Precesses J2000.0 coordinates to the mean equinox of date.
 * @param raRad right ascension at J2000.0, radians
 * @param decRad declination at J2000.0, radians
 * @param jde target instant, Julian ephemeris day
 * @param pmRaRadPerYear proper motion in right ascension (dα/dt, not cos δ·dα/dt), radians per Julian year
 * @param pmDecRadPerYear proper motion in declination, radians per Julian year
 * @returns coordinates of date; RA wrapped into [0, 2π). Valid near the poles
 *   (the library switches to acos for |δ| close to 90°).
 */
export function precessFromJ2000(
  raRad: number,
  decRad: number,
  jde: number,
  pmRaRadPerYear = 0,
  pmDecRadPerYear = 0,
): EquatorialRad {
  const out = position({ ra: raRad, dec: decRad }, 2000.0, JDEToJulianYear(jde), pmRaRadPerYear, pmDecRadPerYear);
  return { raRad: wrapTwoPi(out.ra), decRad: out.dec };
}
