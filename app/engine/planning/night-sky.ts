/**
 * The sky of one night at a site, sampled for the planner: the dark interval kept by the planner,
 * and on a fixed grid of instants the local mean sidereal time, the Sun's altitude and the Moon's
 * place. Instants are whole Unix seconds (UTC, treated as UT like the rest of the engine).
 *
 * The grid starts at the first dark second and steps PLAN_GRID_STEP_SEC; any other instant is
 * evaluated exactly on demand (and remembered for the life of this object).
 */
import { moonPosition } from "../astro/moon";
import { lmstRad } from "../astro/sidereal";
import { sunAltitudeRad } from "../astro/sun";
import { jdeFromJd, parseIsoDate } from "../astro/time";
import { type NightEvents, nightEvents } from "../astro/twilight";
import { SUN_DARK_LIMIT_DEG } from "../interferometry/observability";
import { clampedAsin, DEG_TO_RAD, JD_UNIX_EPOCH, SECONDS_PER_DAY } from "../math";
import { PLAN_GRID_STEP_SEC, PLAN_SAFETY_MARGINS } from "./inputs";

/** Earth's equatorial radius used for the Moon's horizontal parallax, km (Meeus 1998 ch. 47). */
const EARTH_RADIUS_KM = 6378.14;

/** The sky at one instant. */
export interface SkyAt {
  /** Local mean sidereal time, radians [0, 2π). */
  lmstRad: number;
  /** Geometric altitude of the Sun's centre, radians. */
  sunAltRad: number;
  /** Apparent geocentric place of the Moon, radians. */
  moonRaRad: number;
  moonDecRad: number;
  /** The Moon's equatorial horizontal parallax, radians. */
  moonParallaxRad: number;
}

export interface NightSky {
  latRad: number;
  lonEastRad: number;
  events: NightEvents;
  /** Julian ephemeris day of local midnight: J2000 positions are precessed to it (as coverage does). */
  precessionJde: number;
  /** Sun altitude a block must stay at or below, radians (−18° minus the safety margin). */
  sunLimitRad: number;
  /** Search window of the night of D (local mean noon to local mean noon), Unix seconds. */
  windowStartSec: number;
  windowEndSec: number;
  /** First and last whole second with the Sun at or below sunLimitRad; null when there is none. */
  darkStartSec: number | null;
  darkEndSec: number | null;
  /** Grid: originSec + k·stepSec, k < count (count 0 without darkness). */
  originSec: number;
  stepSec: number;
  count: number;
  lmstRad: Float64Array;
  sunAltRad: Float64Array;
  moonRaRad: Float64Array;
  moonDecRad: Float64Array;
  moonParallaxRad: Float64Array;
  /** The sky at any whole second (grid values on the grid, exact elsewhere). */
  at(sec: number): SkyAt;
  /** Grid index of an instant when it is a grid point, else −1. */
  gridIndex(sec: number): number;
}

/** Julian day (UT) of a Unix second. */
export function jdFromSec(sec: number): number {
  return sec / SECONDS_PER_DAY + JD_UNIX_EPOCH;
}

/** Unix second of a Julian day (UT), not rounded. */
export function secFromJd(jd: number): number {
  return (jd - JD_UNIX_EPOCH) * SECONDS_PER_DAY;
}

/** ISO-8601 UTC string of a whole Unix second, e.g. "2027-03-16T01:23:45Z". */
export function isoFromSec(sec: number): string {
  return new Date(sec * 1000).toISOString().replace(".000Z", "Z");
}

function skyAtJd(jd: number, latRad: number, lonEastRad: number): SkyAt {
  const moon = moonPosition(jdeFromJd(jd));
  return {
    lmstRad: lmstRad(jd, lonEastRad),
    sunAltRad: sunAltitudeRad(jd, latRad, lonEastRad),
    moonRaRad: moon.raRad,
    moonDecRad: moon.decRad,
    moonParallaxRad: clampedAsin(EARTH_RADIUS_KM / moon.distanceKm),
  };
}

/**
 * The first (forward) or last (backward) whole second between two instants at which the Sun is at
 * or below a limit: a 60 s scan from the starting end, a bisection of the crossing, then a check of
 * the whole second itself. Null when the Sun never gets that low.
 */
function darkEdgeSec(fromSec: number, toSec: number, forward: boolean, alt: (sec: number) => number, limit: number) {
  const dir = forward ? 1 : -1;
  const inside = (s: number) => (forward ? s <= toSec : s >= toSec);
  let prev = fromSec;
  let hit: number | null = null;
  for (let s = fromSec; inside(s); s += dir * 60) {
    if (alt(s) <= limit) {
      hit = s;
      break;
    }
    prev = s;
  }
  if (hit === null) {
    if (alt(toSec) <= limit) hit = toSec;
    else return null;
  }
  let good = hit;
  let bad = prev;
  if (alt(bad) > limit) {
    while (Math.abs(good - bad) > 0.25) {
      const mid = 0.5 * (good + bad);
      if (alt(mid) <= limit) good = mid;
      else bad = mid;
    }
  }
  let sec = forward ? Math.ceil(good) : Math.floor(good);
  while (alt(sec) > limit && inside(sec)) sec += dir;
  return inside(sec) ? sec : null;
}

/**
 * Builds the night of `date` at a site.
 * @param date "YYYY-MM-DD": the night begins on the local evening of this date
 * @param latitudeDeg, longitudeDeg site, degrees (east positive)
 */
export function buildNightSky(date: string, latitudeDeg: number, longitudeDeg: number): NightSky {
  const cal = parseIsoDate(date);
  if (!cal) throw new RangeError(`invalid date ${date}`);
  const latRad = latitudeDeg * DEG_TO_RAD;
  const lonEastRad = longitudeDeg * DEG_TO_RAD;
  const events = nightEvents(cal, latRad, lonEastRad);
  const sunLimitRad = (SUN_DARK_LIMIT_DEG - PLAN_SAFETY_MARGINS.sunAltitudeDeg) * DEG_TO_RAD;
  const sunAlt = (sec: number) => sunAltitudeRad(jdFromSec(sec), latRad, lonEastRad);

  let darkStartSec: number | null = null;
  let darkEndSec: number | null = null;
  if (events.darkStartJd !== null && events.darkEndJd !== null) {
    const a = secFromJd(events.darkStartJd);
    const b = secFromJd(events.darkEndJd);
    darkStartSec = darkEdgeSec(a, b, true, sunAlt, sunLimitRad);
    darkEndSec = darkStartSec === null ? null : darkEdgeSec(b, darkStartSec, false, sunAlt, sunLimitRad);
    if (darkEndSec === null || darkStartSec === null || darkEndSec < darkStartSec) {
      darkStartSec = null;
      darkEndSec = null;
    }
  }

  const stepSec = PLAN_GRID_STEP_SEC;
  const originSec = darkStartSec ?? Math.ceil(secFromJd(events.windowStartJd));
  const count =
    darkStartSec === null || darkEndSec === null ? 0 : Math.floor((darkEndSec - darkStartSec) / stepSec) + 1;
  const grid = {
    lmstRad: new Float64Array(count),
    sunAltRad: new Float64Array(count),
    moonRaRad: new Float64Array(count),
    moonDecRad: new Float64Array(count),
    moonParallaxRad: new Float64Array(count),
  };
  for (let k = 0; k < count; k++) {
    const s = skyAtJd(jdFromSec(originSec + k * stepSec), latRad, lonEastRad);
    grid.lmstRad[k] = s.lmstRad;
    grid.sunAltRad[k] = s.sunAltRad;
    grid.moonRaRad[k] = s.moonRaRad;
    grid.moonDecRad[k] = s.moonDecRad;
    grid.moonParallaxRad[k] = s.moonParallaxRad;
  }

  const gridIndex = (sec: number): number => {
    const d = sec - originSec;
    if (d < 0 || d % stepSec !== 0) return -1;
    const k = d / stepSec;
    return k < count ? k : -1;
  };
  const cache = new Map<number, SkyAt>();
  const at = (sec: number): SkyAt => {
    const k = gridIndex(sec);
    if (k >= 0) {
      return {
        lmstRad: grid.lmstRad[k],
        sunAltRad: grid.sunAltRad[k],
        moonRaRad: grid.moonRaRad[k],
        moonDecRad: grid.moonDecRad[k],
        moonParallaxRad: grid.moonParallaxRad[k],
      };
    }
    let s = cache.get(sec);
    if (!s) {
      s = skyAtJd(jdFromSec(sec), latRad, lonEastRad);
      cache.set(sec, s);
    }
    return s;
  };

  return {
    latRad,
    lonEastRad,
    events,
    precessionJde: jdeFromJd(events.localMidnightJd),
    sunLimitRad,
    windowStartSec: secFromJd(events.windowStartJd),
    windowEndSec: secFromJd(events.windowEndJd),
    darkStartSec,
    darkEndSec,
    originSec,
    stepSec,
    count,
    ...grid,
    at,
    gridIndex,
  };
}
