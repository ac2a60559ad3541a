/**
 * The ephemeris of one night at a site: Sun events, sidereal time at dusk and
 * the Moon at local midnight. This is the request-level entry point used by
 * the command line (`ephemeris`) and `POST /api/ephemeris`.
 */
import type { EphemerisInput } from "../inputs";
import { DEG_TO_RAD, RAD_TO_DEG, roundTo } from "../math";
import { elevationRad } from "./horizon";
import { moonIlluminatedFraction, moonPosition } from "./moon";
import { gastRad, lmstHours } from "./sidereal";
import { isoUtcFromJulianDay, jdeFromJd, parseIsoDate } from "./time";
import { nightEvents } from "./twilight";

/**
 * Response of the ephemeris computation. Instants are ISO-8601 UTC strings
 * rounded to the second, null when the event does not occur that night (polar
 * day or night). The contract fields are sunsetUtc, astronomicalDuskUtc,
 * astronomicalDawnUtc, sunriseUtc, lstAtDuskH and the Moon fields; the others
 * are additions.
 */
/** The Sun's events of one night as ISO-8601 UTC instants; null when the Sun never reaches the altitude. */
export interface TwilightTimesUtc {
  /** Upper limb of the Sun on the horizon (centre at −0°50′), evening of D. */
  sunsetUtc: string | null;
  /** Sun centre at −6°, evening. */
  civilDuskUtc: string | null;
  /** Sun centre at −12°, evening. */
  nauticalDuskUtc: string | null;
  /** Sun centre at −18°, evening: start of the astronomical night. */
  astronomicalDuskUtc: string | null;
  /** Sun centre at −18°, morning: end of the astronomical night. */
  astronomicalDawnUtc: string | null;
  nauticalDawnUtc: string | null;
  civilDawnUtc: string | null;
  /** Upper limb on the horizon, morning of D + 1 (local). */
  sunriseUtc: string | null;
}

export interface EphemerisResponse extends TwilightTimesUtc {
  /** The date D whose evening starts the night. */
  date: string;
  site: { latitudeDeg: number; longitudeDeg: number; altitudeM: number };
  /** Local mean sidereal time at astronomical dusk, hours [0, 24); null without dusk. */
  lstAtDuskH: number | null;
  /** Local mean sidereal time at astronomical dawn, hours [0, 24); null without dawn. */
  lstAtDawnH: number | null;
  /** Length of the astronomically dark interval (Sun below −18°), hours; 0 when none. */
  darkHours: number;
  /** Local mean midnight (UT 0h of D + 1 minus longitude/15°), the instant of the Moon fields. */
  localMidnightUtc: string;
  /** Illuminated fraction of the Moon's disk at local midnight, 0 (new) .. 1 (full). */
  moonIlluminatedFraction: number;
  /** Apparent geocentric right ascension of the Moon at local midnight, degrees [0, 360). */
  moonRaDeg: number;
  /** Apparent geocentric declination of the Moon at local midnight, degrees. */
  moonDecDeg: number;
  /** Geocentric altitude of the Moon at local midnight, degrees (negative: below the horizon). */
  moonAltitudeDeg: number;
}

/**
 * Computes the ephemeris of the night of `request.date` at `request.site`.
 * Expects a request already validated by `parseEphemerisRequest`.
 */
export function computeEphemeris(request: EphemerisInput): EphemerisResponse {
  const date = parseIsoDate(request.date);
  if (!date) throw new RangeError(`invalid date ${request.date}`);
  const latRad = request.site.latitudeDeg * DEG_TO_RAD;
  const lonEastRad = request.site.longitudeDeg * DEG_TO_RAD;
  const ev = nightEvents(date, latRad, lonEastRad);
  const iso = (jd: number | null) => (jd === null ? null : isoUtcFromJulianDay(jd));
  const lst = (jd: number | null) => (jd === null ? null : roundTo(lmstHours(jd, lonEastRad), 6));

  const midJd = ev.localMidnightJd;
  const midJde = jdeFromJd(midJd);
  const moon = moonPosition(midJde);
  const moonHaRad = gastRad(midJd) + lonEastRad - moon.raRad;

  return {
    date: request.date,
    site: {
      latitudeDeg: request.site.latitudeDeg,
      longitudeDeg: request.site.longitudeDeg,
      altitudeM: request.site.altitudeM,
    },
    sunsetUtc: iso(ev.sunsetJd),
    civilDuskUtc: iso(ev.civilDuskJd),
    nauticalDuskUtc: iso(ev.nauticalDuskJd),
    astronomicalDuskUtc: iso(ev.astronomicalDuskJd),
    astronomicalDawnUtc: iso(ev.astronomicalDawnJd),
    nauticalDawnUtc: iso(ev.nauticalDawnJd),
    civilDawnUtc: iso(ev.civilDawnJd),
    sunriseUtc: iso(ev.sunriseJd),
    lstAtDuskH: lst(ev.astronomicalDuskJd),
    lstAtDawnH: lst(ev.astronomicalDawnJd),
    darkHours: ev.darkStartJd === null || ev.darkEndJd === null ? 0 : roundTo((ev.darkEndJd - ev.darkStartJd) * 24, 4),
    localMidnightUtc: isoUtcFromJulianDay(midJd),
    moonIlluminatedFraction: roundTo(moonIlluminatedFraction(midJde), 4),
    moonRaDeg: roundTo(moon.raRad * RAD_TO_DEG, 4),
    moonDecDeg: roundTo(moon.decRad * RAD_TO_DEG, 4),
    moonAltitudeDeg: roundTo(elevationRad(latRad, moon.decRad, moonHaRad) * RAD_TO_DEG, 2),
  };
}
