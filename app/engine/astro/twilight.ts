/**
 * Sunset, twilights and sunrise for the night of a date at a site.
 *
 * The night of date D is the one that begins on the local evening of D. The
 * search window runs from local mean noon of D to local mean noon of D + 1
 * (local mean noon = 12h UT − longitude/15°). At a site at longitude −68.9° the
 * window is about 16:36 UT of D to 16:36 UT of D + 1: the evening events fall
 * late on D or early on D + 1 in UT, the morning events on D + 1.
 *
 * Method: the Sun's geometric altitude is scanned every 10 minutes across the
 * window and every threshold crossing is refined by bisection to 0.1 s.
 * Thresholds: sunset/sunrise −0°50′ (refraction 34′ plus semidiameter 16′,
 * upper limb on the horizon), civil −6°, nautical −12°, astronomical −18°.
 */
import { DEG_TO_RAD } from "../math";
import { sunAltitudeRad } from "./sun";
import { type CalendarDate, julianDayAt0hUt } from "./time";

/** Altitudes of the Sun's centre defining each event, degrees. */
export const SUN_ALTITUDE_DEG = {
  sunset: -50 / 60,
  civil: -6,
  nautical: -12,
  astronomical: -18,
} as const;

/** Event instants as Julian days (UT); null when the event does not happen in the window. */
export interface NightEvents {
  /** Local mean noon of D (start of the search window). */
  windowStartJd: number;
  /** Local mean noon of D + 1 (end of the search window). */
  windowEndJd: number;
  /** Local mean midnight between D and D + 1. */
  localMidnightJd: number;
  sunsetJd: number | null;
  civilDuskJd: number | null;
  nauticalDuskJd: number | null;
  astronomicalDuskJd: number | null;
  astronomicalDawnJd: number | null;
  nauticalDawnJd: number | null;
  civilDawnJd: number | null;
  sunriseJd: number | null;
  /**
   * Start and end of the astronomically dark interval (Sun below −18°). Equal to
   * dusk/dawn normally; the window edges when it is already/still dark there
   * (polar night); both null when the Sun never gets below −18° (e.g. a
   * high-latitude summer night).
   */
  darkStartJd: number | null;
  darkEndJd: number | null;
}

const SCAN_STEP_DAYS = 10 / 1440;
const BISECT_TOLERANCE_DAYS = 0.1 / 86400;

/**
 * Computes the night events of date D at a site.
 * @param date calendar date D (the evening the night begins)
 * @param latRad site latitude, radians (−π/2..π/2)
 * @param lonEastRad site longitude, east positive, radians (−π..π)
 */
export function nightEvents(date: CalendarDate, latRad: number, lonEastRad: number): NightEvents {
  const windowStartJd = julianDayAt0hUt(date) + 0.5 - lonEastRad / (2 * Math.PI);
  const windowEndJd = windowStartJd + 1;
  const altitude = (jd: number) => sunAltitudeRad(jd, latRad, lonEastRad);

  const n = Math.round((windowEndJd - windowStartJd) / SCAN_STEP_DAYS);
  const times = new Float64Array(n + 1);
  const alts = new Float64Array(n + 1);
  for (let k = 0; k <= n; k++) {
    times[k] = windowStartJd + k * SCAN_STEP_DAYS;
    alts[k] = altitude(times[k]);
  }

  const crossing = (thresholdDeg: number, descending: boolean, afterJd: number): number | null => {
    const h = thresholdDeg * DEG_TO_RAD;
    for (let k = 0; k < n; k++) {
      if (times[k + 1] <= afterJd) continue;
      const a0 = alts[k] - h;
      const a1 = alts[k + 1] - h;
      const hit = descending ? a0 > 0 && a1 <= 0 : a0 <= 0 && a1 > 0;
      if (!hit) continue;
      let lo = times[k];
      let hi = times[k + 1];
      while (hi - lo > BISECT_TOLERANCE_DAYS) {
        const mid = 0.5 * (lo + hi);
        const above = altitude(mid) - h > 0;
        if (above === descending) lo = mid;
        else hi = mid;
      }
      return 0.5 * (lo + hi);
    }
    return null;
  };

  const pair = (thresholdDeg: number): [number | null, number | null] => {
    const dusk = crossing(thresholdDeg, true, -Infinity);
    const dawn = crossing(thresholdDeg, false, dusk ?? -Infinity);
    return [dusk, dawn];
  };

  const [sunsetJd, sunriseJd] = pair(SUN_ALTITUDE_DEG.sunset);
  const [civilDuskJd, civilDawnJd] = pair(SUN_ALTITUDE_DEG.civil);
  const [nauticalDuskJd, nauticalDawnJd] = pair(SUN_ALTITUDE_DEG.nautical);
  const [astronomicalDuskJd, astronomicalDawnJd] = pair(SUN_ALTITUDE_DEG.astronomical);

  const darkLimit = SUN_ALTITUDE_DEG.astronomical * DEG_TO_RAD;
  let darkStartJd: number | null = null;
  let darkEndJd: number | null = null;
  if (astronomicalDuskJd !== null) darkStartJd = astronomicalDuskJd;
  else if (alts[0] < darkLimit) darkStartJd = windowStartJd;
  if (darkStartJd !== null) {
    if (astronomicalDawnJd !== null) darkEndJd = astronomicalDawnJd;
    else if (alts[n] < darkLimit) darkEndJd = windowEndJd;
    else darkStartJd = null;
  }

  return {
    windowStartJd,
    windowEndJd,
    localMidnightJd: windowStartJd + 0.5,
    sunsetJd,
    civilDuskJd,
    nauticalDuskJd,
    astronomicalDuskJd,
    astronomicalDawnJd,
    nauticalDawnJd,
    civilDawnJd,
    sunriseJd,
    darkStartJd,
    darkEndJd,
  };
}
