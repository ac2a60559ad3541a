/**
 * Rising, transit and setting above a chosen altitude.
 *
 * Two entry points:
 *  - `riseTransitSetCore`: the general method of Meeus ch. 15 for a body whose
 *    coordinates are tabulated at 0h TD on three consecutive days (planets,
 *    the Moon), iterated to convergence;
 *  - `starWindow`: the closed form for a fixed target (coordinates of date)
 *    around a given instant, used for the observable window of a target above
 *    the site's minimum elevation.
 */
import { clampedAsin, DEG_TO_RAD, TWO_PI, wrapPi } from "../math";
import { lmstRad } from "./sidereal";

/** Ratio of sidereal to solar time rate (Meeus p. 103: 360.985647°/360°). */
export const SIDEREAL_RATE = 360.985647 / 360;

export interface RiseTransitSetCoreInput {
  /** Site latitude φ, radians. */
  latRad: number;
  /** Site longitude, EAST positive, radians (Meeus's L is west positive: L = −lonEast). */
  lonEastRad: number;
  /** Altitude h0 defining rise/set, radians (e.g. −0.5667° for a star or planet with refraction). */
  h0Rad: number;
  /** Apparent sidereal time at Greenwich at 0h UT of the day of interest, radians (Θ0). */
  theta0Rad: number;
  /** ΔT = TT − UT, seconds. */
  deltaTSec: number;
  /** Right ascensions at 0h TD on D − 1, D, D + 1, radians. */
  ra3Rad: readonly [number, number, number];
  /** Declinations at 0h TD on D − 1, D, D + 1, radians. */
  dec3Rad: readonly [number, number, number];
}

export type RiseTransitSetResult =
  | {
      kind: "normal";
      /** Fractions of the UT day D (may fall slightly outside [0, 1) after correction). */
      riseDayFraction: number;
      transitDayFraction: number;
      setDayFraction: number;
    }
  | {
      /** The body stays above h0 all day ("alwaysAbove") or below it ("neverAbove"). */
      kind: "alwaysAbove" | "neverAbove";
      transitDayFraction: number;
    };

/** Three-point interpolation (Meeus 3.3) at interpolating factor n. */
function interpolate3(y1: number, y2: number, y3: number, n: number): number {
  const a = y2 - y1;
  const b = y3 - y2;
  const c = b - a;
  return y2 + (n / 2) * (a + b + n * c);
}

/**
 * Rise, transit and set times (Meeus ch. 15) as fractions of the UT day,
 * with the corrections Δm applied repeatedly until they fall below 1e-8 day
 * (at most 20 passes).
 */
export function riseTransitSetCore(input: RiseTransitSetCoreInput): RiseTransitSetResult {
  const { latRad, h0Rad, theta0Rad, deltaTSec } = input;
  const lonWestRad = -input.lonEastRad;
  // Unwrap the right ascensions around the middle value (a 0h crossing must not jump by 2π).
  const ra2 = input.ra3Rad[1];
  const ra1 = ra2 + wrapPi(input.ra3Rad[0] - ra2);
  const ra3 = ra2 + wrapPi(input.ra3Rad[2] - ra2);
  const [dec1, dec2, dec3] = input.dec3Rad;
  const sinLat = Math.sin(latRad);
  const cosLat = Math.cos(latRad);

  const norm01 = (m: number) => m - Math.floor(m);
  const transit0 = norm01((ra2 + lonWestRad - theta0Rad) / TWO_PI);

  const state = (m: number) => {
    const theta = theta0Rad + SIDEREAL_RATE * TWO_PI * m;
    const n = m + deltaTSec / 86400;
    const ra = interpolate3(ra1, ra2, ra3, n);
    const dec = interpolate3(dec1, dec2, dec3, n);
    const ha = wrapPi(theta - lonWestRad - ra);
    const h = clampedAsin(sinLat * Math.sin(dec) + cosLat * Math.cos(dec) * Math.cos(ha));
    return { ha, dec, h };
  };

  let transit = transit0;
  for (let i = 0; i < 20; i++) {
    const dm = -state(transit).ha / TWO_PI;
    transit += dm;
    if (Math.abs(dm) < 1e-8) break;
  }

  const cosH0 = (Math.sin(h0Rad) - sinLat * Math.sin(dec2)) / (cosLat * Math.cos(dec2));
  if (cosH0 < -1) return { kind: "alwaysAbove", transitDayFraction: transit };
  if (cosH0 > 1) return { kind: "neverAbove", transitDayFraction: transit };
  const h0Hour = Math.acos(cosH0) / TWO_PI;

  const refine = (m0: number) => {
    let m = m0;
    for (let i = 0; i < 20; i++) {
      const s = state(m);
      const dm = (s.h - h0Rad) / (TWO_PI * Math.cos(s.dec) * cosLat * Math.sin(s.ha));
      m += dm;
      if (Math.abs(dm) < 1e-8) break;
    }
    return m;
  };

  return {
    kind: "normal",
    riseDayFraction: refine(norm01(transit0 - h0Hour)),
    transitDayFraction: transit,
    setDayFraction: refine(norm01(transit0 + h0Hour)),
  };
}

export interface StarWindow {
  /** Transit (upper culmination) nearest to the reference instant, Julian day UT. */
  transitJd: number;
  /** Rise above the altitude limit before that transit, Julian day UT; null when always above or never above. */
  riseJd: number | null;
  /** Set below the altitude limit after that transit, Julian day UT; null when always above or never above. */
  setJd: number | null;
  /** True when the target never goes below the limit (circumpolar above it). */
  alwaysAbove: boolean;
  /** True when the target never reaches the limit. */
  neverAbove: boolean;
}

/**
 * Rise/transit/set of a fixed target above an altitude limit around an instant.
 * @param raRad right ascension of date, radians
 * @param decRad declination of date, radians
 * @param latRad site latitude, radians
 * @param lonEastRad site longitude, east positive, radians
 * @param minElevationRad altitude limit, radians (−π/2..π/2)
 * @param nearJd reference instant (e.g. local midnight), Julian day UT; the
 *   transit returned is the one within ±12 sidereal hours of it.
 */
export function starWindow(
  raRad: number,
  decRad: number,
  latRad: number,
  lonEastRad: number,
  minElevationRad: number,
  nearJd: number,
): StarWindow {
  const haNow = wrapPi(lmstRad(nearJd, lonEastRad) - raRad);
  const transitJd = nearJd - haNow / TWO_PI / SIDEREAL_RATE;
  const cosH0 =
    (Math.sin(minElevationRad) - Math.sin(latRad) * Math.sin(decRad)) / (Math.cos(latRad) * Math.cos(decRad));
  if (cosH0 <= -1) return { transitJd, riseJd: null, setJd: null, alwaysAbove: true, neverAbove: false };
  if (cosH0 > 1) return { transitJd, riseJd: null, setJd: null, alwaysAbove: false, neverAbove: true };
  const halfDays = Math.acos(cosH0) / TWO_PI / SIDEREAL_RATE;
  return {
    transitJd,
    riseJd: transitJd - halfDays,
    setJd: transitJd + halfDays,
    alwaysAbove: false,
    neverAbove: false,
  };
}

/** Standard altitude of a star or planet at apparent rise/set (refraction 34′), radians. */
export const STELLAR_H0_RAD = (-34 / 60) * DEG_TO_RAD;
