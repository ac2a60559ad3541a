/**
 * Position of the Sun (Meeus ch. 25, low-accuracy theory, about 0.01°), and its
 * geometric altitude at a site.
 */
import { J2000Century } from "astronomia/base";
import { apparentEquatorial, radius } from "astronomia/solar";
import { wrapTwoPi } from "../math";
import { elevationRad } from "./horizon";
import { gastRad } from "./sidereal";
import { jdeFromJd } from "./time";

export interface SunPosition {
  /** Apparent right ascension, true equinox of date, radians [0, 2π). */
  raRad: number;
  /** Apparent declination, radians. */
  decRad: number;
  /** Earth–Sun distance, astronomical units. */
  distanceAu: number;
}

/** Apparent geocentric position of the Sun at a Julian ephemeris day. */
export function sunPosition(jde: number): SunPosition {
  const c = apparentEquatorial(jde);
  return { raRad: wrapTwoPi(c.ra), decRad: c.dec, distanceAu: radius(J2000Century(jde)) };
}

/**
 * Geometric altitude of the Sun's centre, radians, at a Julian day (UT) for a
 * site; no refraction and no parallax (8.8″, negligible here).
 * @param latRad site latitude, radians
 * @param lonEastRad site longitude, east positive, radians
 */
export function sunAltitudeRad(jd: number, latRad: number, lonEastRad: number): number {
  const sun = sunPosition(jdeFromJd(jd));
  const haRad = gastRad(jd) + lonEastRad - sun.raRad; // apparent place ↔ apparent sidereal time
  return elevationRad(latRad, sun.decRad, haRad);
}
