/**
 * One object (a science target or a calibrator) through the night: its place of date, and at every
 * grid instant its elevation, the largest delay its baselines need, its distance from the Moon and
 * which constraints fail there (with the planner's safety margins). Any interval can then be checked
 * in constant time on the grid plus an exact evaluation of its two ends.
 *
 * Constraints (bits of `bad`): DARK — the Sun above −18° minus its margin; ELEVATION — below the
 * object's limit plus its margin; DELAY — some baseline i–j with |w_ij + P_j − P_i| beyond the
 * stroke minus its margin (as in interferometry/observability.ts); MOON — closer to the Moon than
 * the limit plus the Moon's horizontal parallax plus a margin (only when the limit is above 0).
 */
import { float64Arrays } from "../arrays";
import { elevationRad } from "../astro/horizon";
import { precessFromJ2000 } from "../astro/precession";
import { sunPosition } from "../astro/sun";
import { jdeFromJd } from "../astro/time";
import type { BaselineSet } from "../interferometry/baselines";
import { DEG_TO_RAD } from "../math";
import { PLAN_SAFETY_MARGINS } from "./inputs";
import { jdFromSec, type NightSky, type SkyAt } from "./night-sky";
import { angularSeparationRad } from "./separation";

export const BAD_DARK = 1;
export const BAD_ELEVATION = 2;
export const BAD_DELAY = 4;
export const BAD_MOON = 8;

/** What every object of one request shares. */
export interface TrackSetting {
  sky: NightSky;
  baselines: BaselineSet;
  /** Delay-line stroke, metres, or null. */
  delayLineStrokeM: number | null;
  /** Moon distance limit, radians (0: none). */
  moonMinRad: number;
}

/** An object's state at one instant. */
export interface ObjectState {
  sky: SkyAt;
  haRad: number;
  elevRad: number;
  /** max over baselines of |w + ΔP|, metres (0 without baselines). */
  delayNeedM: number;
  /** Geocentric distance from the Moon, radians. */
  moonSepRad: number;
  /** Failed constraints (BAD_* bits), 0 when observable. */
  bad: number;
}

export interface ObjectTrack {
  name: string;
  /** Place of date (mean equator and equinox of local midnight), radians. */
  raRad: number;
  decRad: number;
  /** Elevation limit (without margin), radians. */
  minElevationRad: number;
  /** Least distance from the Sun at dusk, midnight and dawn, radians. */
  sunSeparationRad: number;
  elevRad: Float64Array;
  delayNeedM: Float64Array;
  moonSepRad: Float64Array;
  bad: Uint8Array;
  /** badPrefix[k] = number of grid points before k with some failure. */
  badPrefix: Int32Array;
  /** For an observable grid point, the index of the last point of its observable run; else −1. */
  runEnd: Int32Array;
  stateAt(sec: number): ObjectState;
  /** OR of the failures at both ends and every grid point inside [startSec, endSec] (exact samples off the grid). */
  intervalBad(startSec: number, endSec: number): number;
  /** True when a block [startSec, endSec] inside the dark interval meets every constraint. */
  intervalOk(startSec: number, endSec: number): boolean;
}

/**
 * Tracks one object.
 * @param raJ2000Deg, decJ2000Deg J2000.0 position, degrees
 * @param minElevationDeg elevation limit, degrees
 */
export function buildObjectTrack(
  setting: TrackSetting,
  name: string,
  raJ2000Deg: number,
  decJ2000Deg: number,
  minElevationDeg: number,
): ObjectTrack {
  const { sky, baselines, delayLineStrokeM, moonMinRad } = setting;
  const place = precessFromJ2000(raJ2000Deg * DEG_TO_RAD, decJ2000Deg * DEG_TO_RAD, sky.precessionJde);
  const { raRad, decRad } = place;
  const sd = Math.sin(decRad);
  const cd = Math.cos(decRad);
  const minElevationRad = minElevationDeg * DEG_TO_RAD;
  const elevLimit = (minElevationDeg + PLAN_SAFETY_MARGINS.elevationDeg) * DEG_TO_RAD;
  const strokeLimit = delayLineStrokeM === null ? Infinity : delayLineStrokeM - PLAN_SAFETY_MARGINS.delayLineM;
  const moonMargin = PLAN_SAFETY_MARGINS.moonDeg * DEG_TO_RAD;
  const nB = baselines.count;

  const delayNeed = (haRad: number): number => {
    const sh = Math.sin(haRad);
    const ch = Math.cos(haRad);
    let worst = 0;
    for (let b = 0; b < nB; b++) {
      const w = cd * (ch * baselines.xM[b] - sh * baselines.yM[b]) + sd * baselines.zM[b];
      const need = Math.abs(w + baselines.pathOffsetDiffM[b]);
      if (need > worst) worst = need;
    }
    return worst;
  };

  const evaluate = (sky1: SkyAt): ObjectState => {
    const haRad = sky1.lmstRad - raRad;
    const elevRad = elevationRad(sky.latRad, decRad, haRad);
    const delayNeedM = delayLineStrokeM === null ? 0 : delayNeed(haRad);
    const moonSepRad = angularSeparationRad(raRad, decRad, sky1.moonRaRad, sky1.moonDecRad);
    let bad = 0;
    if (!(sky1.sunAltRad <= sky.sunLimitRad)) bad |= BAD_DARK;
    if (!(elevRad >= elevLimit)) bad |= BAD_ELEVATION;
    if (!(delayNeedM <= strokeLimit)) bad |= BAD_DELAY;
    if (moonMinRad > 0 && !(moonSepRad >= moonMinRad + sky1.moonParallaxRad + moonMargin)) bad |= BAD_MOON;
    return { sky: sky1, haRad, elevRad, delayNeedM, moonSepRad, bad };
  };

  const n = sky.count;
  const [elev, need, moonSep] = float64Arrays(3, n);
  const bad = new Uint8Array(n);
  const badPrefix = new Int32Array(n + 1);
  // The grid, straight from the night's arrays (the same arithmetic as `evaluate`, without objects).
  for (let k = 0; k < n; k++) {
    const haRad = sky.lmstRad[k] - raRad;
    const e = elevationRad(sky.latRad, decRad, haRad);
    const d = delayLineStrokeM === null ? 0 : delayNeed(haRad);
    const m = angularSeparationRad(raRad, decRad, sky.moonRaRad[k], sky.moonDecRad[k]);
    let b = 0;
    if (!(sky.sunAltRad[k] <= sky.sunLimitRad)) b |= BAD_DARK;
    if (!(e >= elevLimit)) b |= BAD_ELEVATION;
    if (!(d <= strokeLimit)) b |= BAD_DELAY;
    if (moonMinRad > 0 && !(m >= moonMinRad + sky.moonParallaxRad[k] + moonMargin)) b |= BAD_MOON;
    elev[k] = e;
    need[k] = d;
    moonSep[k] = m;
    bad[k] = b;
    badPrefix[k + 1] = badPrefix[k] + (b === 0 ? 0 : 1);
  }
  const runEnd = new Int32Array(n).fill(-1);
  for (let k = n - 1; k >= 0; k--) if (bad[k] === 0) runEnd[k] = k + 1 < n && bad[k + 1] === 0 ? runEnd[k + 1] : k;

  const stateAt = (sec: number): ObjectState => {
    const k = sky.gridIndex(sec);
    if (k < 0) return evaluate(sky.at(sec));
    return {
      sky: sky.at(sec),
      haRad: sky.lmstRad[k] - raRad,
      elevRad: elev[k],
      delayNeedM: need[k],
      moonSepRad: moonSep[k],
      bad: bad[k],
    };
  };

  const gridRange = (startSec: number, endSec: number): [number, number] => [
    Math.max(0, Math.ceil((startSec - sky.originSec) / sky.stepSec)),
    Math.min(n - 1, Math.floor((endSec - sky.originSec) / sky.stepSec)),
  ];

  const intervalBad = (startSec: number, endSec: number): number => {
    let bits = stateAt(startSec).bad | stateAt(endSec).bad;
    const [lo, hi] = gridRange(startSec, endSec);
    if (lo <= hi && badPrefix[hi + 1] - badPrefix[lo] > 0) for (let k = lo; k <= hi; k++) bits |= bad[k];
    const gridStart = sky.originSec;
    const gridEnd = sky.originSec + (n - 1) * sky.stepSec;
    // Parts of the block off the grid (before dusk, after the last grid point, or no grid at all).
    for (let t = startSec; t < endSec && (n === 0 || t < gridStart); t += sky.stepSec) bits |= stateAt(t).bad;
    for (let t = endSec; t > startSec && n > 0 && t > gridEnd; t -= sky.stepSec) bits |= stateAt(t).bad;
    return bits;
  };

  const intervalOk = (startSec: number, endSec: number): boolean => {
    if (sky.darkStartSec === null || sky.darkEndSec === null) return false;
    if (startSec < sky.darkStartSec || endSec > sky.darkEndSec || endSec < startSec) return false;
    const [lo, hi] = gridRange(startSec, endSec);
    if (lo <= hi && badPrefix[hi + 1] - badPrefix[lo] > 0) return false;
    return stateAt(startSec).bad === 0 && stateAt(endSec).bad === 0;
  };

  let sunSeparationRad = Math.PI;
  const a = sky.darkStartSec ?? sky.windowStartSec;
  const b = sky.darkEndSec ?? sky.windowEndSec;
  for (const sec of [a, 0.5 * (a + b), b]) {
    const sun = sunPosition(jdeFromJd(jdFromSec(sec)));
    sunSeparationRad = Math.min(sunSeparationRad, angularSeparationRad(raRad, decRad, sun.raRad, sun.decRad));
  }

  return {
    name,
    raRad,
    decRad,
    minElevationRad,
    sunSeparationRad,
    elevRad: elev,
    delayNeedM: need,
    moonSepRad: moonSep,
    bad,
    badPrefix,
    runEnd,
    stateAt,
    intervalBad,
    intervalOk,
  };
}
