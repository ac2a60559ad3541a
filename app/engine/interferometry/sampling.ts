/**
 * Hour-angle samples: from an explicit list, or across the astronomical night
 * of a date at a fixed step.
 *
 * Night sampling: the target's J2000.0 coordinates are precessed to the mean
 * equinox of local midnight; sample instants are the multiples of the step
 * (counted from 0h UT of the date) inside the dark interval (Sun below −18°);
 * hour angle H = LMST − α of date, wrapped to [−12 h, 12 h).
 * Explicit list: hour angles are used as given and the declination as given
 * (no instant, hence no precession and no Sun check).
 */
import { float64Arrays } from "../arrays";
import { elevationRad } from "../astro/horizon";
import { precessFromJ2000 } from "../astro/precession";
import { lmstRad } from "../astro/sidereal";
import { sunAltitudeRad } from "../astro/sun";
import { type CalendarDate, jdeFromJd, julianDayAt0hUt } from "../astro/time";
import { type NightEvents, nightEvents } from "../astro/twilight";
import { HOUR_TO_RAD, wrapPi } from "../math";

export interface HourAngleSamples {
  /** Hour angle of each sample, radians in [−π, π) for night sampling, as given otherwise. */
  haRad: Float64Array;
  /** Target elevation at each sample, radians. */
  elevationRad: Float64Array;
  /** Instant of each sample, Julian day UT; null for an explicit hour-angle list. */
  jd: Float64Array | null;
  /** Sun altitude at each sample, radians; null for an explicit list. */
  sunAltitudeRad: Float64Array | null;
  /** Right ascension used for the hour angles (of date when a night is sampled), radians. */
  raRad: number;
  /** Declination used for the projection (of date when a night is sampled), radians. */
  decRad: number;
  /** The night's events when a night is sampled. */
  night: NightEvents | null;
  /** Time per sample, hours: the step for a night, the median hour-angle spacing for a list (0 for one sample). */
  sampleDurationH: number;
}

/**
 * Samples from an explicit list of hour angles (hours).
 * @param latRad site latitude, radians
 */
export function samplesFromHourAngles(
  hourAnglesH: readonly number[],
  raRad: number,
  decRad: number,
  latRad: number,
): HourAngleSamples {
  const n = hourAnglesH.length;
  const [haRad, el] = float64Arrays(2, n);
  for (let s = 0; s < n; s++) {
    haRad[s] = hourAnglesH[s] * HOUR_TO_RAD;
    el[s] = elevationRad(latRad, decRad, haRad[s]);
  }
  const sorted = Array.from(new Set(hourAnglesH)).sort((a, b) => a - b);
  const gaps: number[] = [];
  for (let i = 1; i < sorted.length; i++) gaps.push(sorted[i] - sorted[i - 1]);
  gaps.sort((a, b) => a - b);
  const sampleDurationH = gaps.length === 0 ? 0 : gaps[Math.floor((gaps.length - 1) / 2)];
  return { haRad, elevationRad: el, jd: null, sunAltitudeRad: null, raRad, decRad, night: null, sampleDurationH };
}

/**
 * Samples across the astronomical night of a date.
 * @param raJ2000Rad, decJ2000Rad target coordinates at J2000.0, radians
 * @param latRad, lonEastRad site, radians (longitude east positive)
 * @param stepMin sampling step, minutes (> 0)
 * @returns no samples when the Sun never gets below −18° that night.
 */
export function samplesAcrossNight(
  date: CalendarDate,
  stepMin: number,
  raJ2000Rad: number,
  decJ2000Rad: number,
  latRad: number,
  lonEastRad: number,
): HourAngleSamples {
  const night = nightEvents(date, latRad, lonEastRad);
  const ofDate = precessFromJ2000(raJ2000Rad, decJ2000Rad, jdeFromJd(night.localMidnightJd));
  const jd0 = julianDayAt0hUt(date);
  const times: number[] = [];
  if (night.darkStartJd !== null && night.darkEndJd !== null) {
    const startMin = (night.darkStartJd - jd0) * 1440;
    const endMin = (night.darkEndJd - jd0) * 1440;
    for (let k = Math.ceil(startMin / stepMin); k * stepMin <= endMin; k++) times.push(jd0 + (k * stepMin) / 1440);
  }
  const n = times.length;
  const jd = Float64Array.from(times);
  const [haRad, el, sun] = float64Arrays(3, n);
  for (let s = 0; s < n; s++) {
    haRad[s] = wrapPi(lmstRad(jd[s], lonEastRad) - ofDate.raRad);
    if (haRad[s] === Math.PI) haRad[s] = -Math.PI;
    el[s] = elevationRad(latRad, ofDate.decRad, haRad[s]);
    sun[s] = sunAltitudeRad(jd[s], latRad, lonEastRad);
  }
  return {
    haRad,
    elevationRad: el,
    jd,
    sunAltitudeRad: sun,
    raRad: ofDate.raRad,
    decRad: ofDate.decRad,
    night,
    sampleDurationH: stepMin / 60,
  };
}
