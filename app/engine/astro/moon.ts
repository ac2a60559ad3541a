/**
 * Position and illuminated fraction of the Moon (Meeus ch. 47 and 48).
 * Positions are geocentric: the topocentric place can differ by up to about 1°
 * (lunar parallax), which is irrelevant to a planner that only reports the
 * Moon's phase and rough whereabouts.
 */
import { AU, Coord, illuminated } from "astronomia/base";
import { phaseAngleEquatorial } from "astronomia/moonillum";
import { position } from "astronomia/moonposition";
import { meanObliquity, nutation } from "astronomia/nutation";
import { clampedAsin, wrapTwoPi } from "../math";
import { sunPosition } from "./sun";

export interface MoonPosition {
  /** Apparent right ascension, true equinox of date, radians [0, 2π). */
  raRad: number;
  /** Apparent declination, radians. */
  decRad: number;
  /** Apparent ecliptic longitude (nutation included), radians [0, 2π). */
  eclipticLonRad: number;
  /** Ecliptic latitude, radians. */
  eclipticLatRad: number;
  /** Earth–Moon centre distance, km. */
  distanceKm: number;
}

/** Apparent geocentric position of the Moon at a Julian ephemeris day. */
export function moonPosition(jde: number): MoonPosition {
  const p = position(jde);
  const [dPsi, dEps] = nutation(jde);
  const lon = wrapTwoPi(p.lon + dPsi);
  const lat = p.lat;
  const eps = meanObliquity(jde) + dEps;
  const sinLon = Math.sin(lon);
  const raRad = wrapTwoPi(Math.atan2(sinLon * Math.cos(eps) - Math.tan(lat) * Math.sin(eps), Math.cos(lon)));
  const decRad = clampedAsin(Math.sin(lat) * Math.cos(eps) + Math.cos(lat) * Math.sin(eps) * sinLon);
  return { raRad, decRad, eclipticLonRad: lon, eclipticLatRad: lat, distanceKm: p.range };
}

/**
 * Illuminated fraction of the Moon's disk, 0 (new) .. 1 (full), at a Julian
 * ephemeris day (Meeus 48.1–48.3 from the geocentric positions of Moon and Sun).
 */
export function moonIlluminatedFraction(jde: number): number {
  const m = moonPosition(jde);
  const s = sunPosition(jde);
  const moon = new Coord(m.raRad, m.decRad, m.distanceKm);
  const sun = new Coord(s.raRad, s.decRad, s.distanceAu * AU);
  return illuminated(phaseAngleEquatorial(moon, sun));
}
