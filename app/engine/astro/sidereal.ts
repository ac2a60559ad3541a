/**
 * Sidereal time at Greenwich and at a site.
 *
 * Mean sidereal time follows the IAU 1982 expression (Meeus 12.4); apparent
 * sidereal time adds the nutation in right ascension. The planner refers
 * target coordinates to the mean equator and equinox of date (precession only)
 * and therefore pairs them with MEAN sidereal time; the two differ by at most
 * about 1.2 s of time.
 */
import { apparent, mean } from "astronomia/sidereal";
import { HOUR_TO_RAD, SECONDS_PER_DAY, TWO_PI, wrapTwoPi } from "../math";

/** Greenwich mean sidereal time in radians, [0, 2π), for a Julian day in UT. */
export function gmstRad(jd: number): number {
  return (mean(jd) / SECONDS_PER_DAY) * TWO_PI;
}

/** Greenwich apparent sidereal time in radians, [0, 2π), for a Julian day in UT. */
export function gastRad(jd: number): number {
  return (apparent(jd) / SECONDS_PER_DAY) * TWO_PI;
}

/** Greenwich mean sidereal time in hours, [0, 24). */
export function gmstHours(jd: number): number {
  return gmstRad(jd) / HOUR_TO_RAD;
}

/**
 * Local mean sidereal time in radians, [0, 2π).
 * @param lonEastRad site longitude, east positive (−π..π).
 */
export function lmstRad(jd: number, lonEastRad: number): number {
  return wrapTwoPi(gmstRad(jd) + lonEastRad);
}

/** Local mean sidereal time in hours, [0, 24). lonEastRad east positive. */
export function lmstHours(jd: number, lonEastRad: number): number {
  return lmstRad(jd, lonEastRad) / HOUR_TO_RAD;
}
