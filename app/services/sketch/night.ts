/**
 * The night around a sketch, for the elevation panel: the target's and the Moon's altitude across
 * the whole night (twilight included, where the API samples only the dark hours), sidereal-time
 * ticks, air-mass ticks, twilight bands and observable windows. Pure; it reuses the engine's time
 * and sky functions so the curves agree with the API's samples.
 */
import {
  airmassKastenYoung,
  DEG_TO_RAD,
  type EphemerisResponse,
  elevationRad,
  jdeFromJd,
  julianDayFromDate,
  lmstHours,
  lmstRad,
  precessFromJ2000,
  RAD_TO_DEG,
  sunPosition,
} from "~/engine";
import { moonAltitudeAt } from "~/services/nights/sky";

const MS_PER_HOUR = 3_600_000;
/** Sidereal hours per solar hour (Meeus 12.4: 360.98564736629° per day / 360°). */
export const SIDEREAL_PER_SOLAR = 360.98564736629 / 360;

/**
 * The date of the next night at a site: the local mean calendar date now (UTC + longitude/15 h).
 * The night of date D begins on the local evening of D, so this is tonight (or the night now running
 * began yesterday and the next one begins this evening).
 */
export function nextNightDate(now: Date, longitudeDeg: number): string {
  const local = new Date(now.getTime() + (longitudeDeg / 15) * MS_PER_HOUR);
  return local.toISOString().slice(0, 10);
}

/**
 * Right ascension (degrees, J2000 to within precession) that crosses the meridian at local mean
 * midnight of the night of `date` ("YYYY-MM-DD"): the local sidereal time then. A target there is
 * highest in the middle of the night.
 */
export function raTransitingAtMidnight(date: string, longitudeDeg: number): number {
  const [y, m, d] = date.split("-").map(Number);
  const midnightMs = Date.UTC(y, m - 1, d + 1) - (longitudeDeg / 15) * MS_PER_HOUR;
  return lmstHours(julianDayFromDate(new Date(midnightMs)), longitudeDeg * DEG_TO_RAD) * 15;
}

/**
 * Geometric elevation of a position of date at an instant, degrees (sin e = sin φ sin δ + cos φ cos δ cos H,
 * H = local mean sidereal time − α).
 */
export function elevationAtDeg(
  jd: number,
  latDeg: number,
  lonEastDeg: number,
  raOfDateDeg: number,
  decOfDateDeg: number,
): number {
  const ha = lmstRad(jd, lonEastDeg * DEG_TO_RAD) - raOfDateDeg * DEG_TO_RAD;
  return elevationRad(latDeg * DEG_TO_RAD, decOfDateDeg * DEG_TO_RAD, ha) * RAD_TO_DEG;
}

/** Instants from start to end (inclusive) every stepMin minutes, epoch milliseconds. */
export function timeGrid(startMs: number, endMs: number, stepMin: number): number[] {
  const out: number[] = [];
  const step = stepMin * 60_000;
  if (!(step > 0) || !(endMs >= startMs)) return out;
  for (let t = startMs; t <= endMs + 1; t += step) out.push(t);
  return out;
}

export interface AltitudeCurve {
  timesMs: number[];
  elevationDeg: number[];
  /** Kasten & Young air mass; null below the horizon. */
  airmass: (number | null)[];
}

/**
 * The target's elevation across an interval. J2000.0 coordinates are precessed to the middle of the
 * interval, as the API precesses them to local midnight.
 */
export function targetAltitudeCurve(opts: {
  latDeg: number;
  lonDeg: number;
  raDeg: number;
  decDeg: number;
  startMs: number;
  endMs: number;
  stepMin: number;
}): AltitudeCurve {
  const timesMs = timeGrid(opts.startMs, opts.endMs, opts.stepMin);
  const midJd = julianDayFromDate(new Date((opts.startMs + opts.endMs) / 2));
  const ofDate = precessFromJ2000(opts.raDeg * DEG_TO_RAD, opts.decDeg * DEG_TO_RAD, jdeFromJd(midJd));
  const elevationDeg = timesMs.map((t) =>
    elevationAtDeg(
      julianDayFromDate(new Date(t)),
      opts.latDeg,
      opts.lonDeg,
      ofDate.raRad * RAD_TO_DEG,
      ofDate.decRad * RAD_TO_DEG,
    ),
  );
  const airmass = elevationDeg.map((e) => {
    const x = airmassKastenYoung(e);
    return Number.isFinite(x) ? x : null;
  });
  return { timesMs, elevationDeg, airmass };
}

/** Geocentric altitude of the Moon across an interval, degrees (apparent place with apparent sidereal time). */
export function moonAltitudeCurve(opts: {
  latDeg: number;
  lonDeg: number;
  startMs: number;
  endMs: number;
  stepMin: number;
}) {
  const timesMs = timeGrid(opts.startMs, opts.endMs, opts.stepMin);
  const site = { latitudeDeg: opts.latDeg, longitudeDeg: opts.lonDeg, altitudeM: 0 };
  const altitudeDeg = timesMs.map((t) => moonAltitudeAt(julianDayFromDate(new Date(t)), site).altitudeDeg);
  return { timesMs, altitudeDeg };
}

/** Great-circle separation of two positions, degrees (haversine form, stable for small angles). */
export function angularSeparationDeg(ra1Deg: number, dec1Deg: number, ra2Deg: number, dec2Deg: number): number {
  const d1 = dec1Deg * DEG_TO_RAD;
  const d2 = dec2Deg * DEG_TO_RAD;
  const dRa = (ra2Deg - ra1Deg) * DEG_TO_RAD;
  const h = Math.sin((d2 - d1) / 2) ** 2 + Math.cos(d1) * Math.cos(d2) * Math.sin(dRa / 2) ** 2;
  return 2 * Math.asin(Math.min(1, Math.sqrt(h))) * RAD_TO_DEG;
}

/** Angular distance from the Sun to a J2000.0 position at an instant, degrees (precession applied). */
export function sunSeparationDeg(raDeg: number, decDeg: number, atMs: number): number {
  const jde = jdeFromJd(julianDayFromDate(new Date(atMs)));
  const sun = sunPosition(jde);
  const ofDate = precessFromJ2000(raDeg * DEG_TO_RAD, decDeg * DEG_TO_RAD, jde);
  return angularSeparationDeg(
    ofDate.raRad * RAD_TO_DEG,
    ofDate.decRad * RAD_TO_DEG,
    sun.raRad * RAD_TO_DEG,
    sun.decRad * RAD_TO_DEG,
  );
}

/**
 * Instants where the local mean sidereal time is a whole multiple of `everyH` hours, within
 * [startMs, endMs], with labels such as "LST 7h".
 */
export function lstTicks(
  startMs: number,
  endMs: number,
  lonDeg: number,
  everyH = 1,
): { timesMs: number[]; labels: string[] } {
  const lst0 = lmstHours(julianDayFromDate(new Date(startMs)), lonDeg * DEG_TO_RAD);
  const first = Math.ceil(lst0 / everyH - 1e-9) * everyH;
  const timesMs: number[] = [];
  const labels: string[] = [];
  for (let lst = first; ; lst += everyH) {
    const t = startMs + ((lst - lst0) / SIDEREAL_PER_SOLAR) * MS_PER_HOUR;
    if (t > endMs) break;
    timesMs.push(t);
    labels.push(`${((lst % 24) + 24) % 24}h`);
  }
  return { timesMs, labels };
}

/** The elevation (degrees) at which the Kasten & Young air mass equals `airmass` (≥ 1), by bisection. */
export function elevationForAirmass(airmass: number): number {
  if (!(airmass > 1)) return 90;
  let lo = 0;
  let hi = 90;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (airmassKastenYoung(mid) > airmass) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** The Sun events of a night, as the ephemeris answers them (null when an event does not happen). */
export type NightTimes = Pick<
  EphemerisResponse,
  | "sunsetUtc"
  | "civilDuskUtc"
  | "nauticalDuskUtc"
  | "astronomicalDuskUtc"
  | "astronomicalDawnUtc"
  | "nauticalDawnUtc"
  | "civilDawnUtc"
  | "sunriseUtc"
>;

export type TwilightKind = "day" | "civil" | "nautical" | "astronomical";
export interface TwilightBand {
  kind: TwilightKind;
  startMs: number;
  endMs: number;
}

/**
 * Shaded bands of a night between startMs and endMs: daylight before sunset and after sunrise, then
 * civil (Sun 0°50′–6° below the horizon), nautical (6°–12°) and astronomical (12°–18°) twilight on
 * either side of the dark hours. Events that do not happen (null) leave their band out.
 */
export function twilightBands(n: NightTimes, startMs: number, endMs: number): TwilightBand[] {
  const t = (iso: string | null) => (iso ? Date.parse(iso) : null);
  const pairs: [TwilightKind, number | null, number | null][] = [
    ["day", startMs, t(n.sunsetUtc)],
    ["civil", t(n.sunsetUtc), t(n.civilDuskUtc)],
    ["nautical", t(n.civilDuskUtc), t(n.nauticalDuskUtc)],
    ["astronomical", t(n.nauticalDuskUtc), t(n.astronomicalDuskUtc)],
    ["astronomical", t(n.astronomicalDawnUtc), t(n.nauticalDawnUtc)],
    ["nautical", t(n.nauticalDawnUtc), t(n.civilDawnUtc)],
    ["civil", t(n.civilDawnUtc), t(n.sunriseUtc)],
    ["day", t(n.sunriseUtc), endMs],
  ];
  const out: TwilightBand[] = [];
  for (const [kind, a, b] of pairs) {
    if (a === null || b === null) continue;
    const s = Math.max(a, startMs);
    const e = Math.min(b, endMs);
    if (e > s) out.push({ kind, startMs: s, endMs: e });
  }
  return out;
}

/**
 * Runs of consecutive observable samples as time windows. Each sample stands for one step centred
 * on it, so a run from t₁ to t₂ covers [t₁ − step/2, t₂ + step/2] and its length is samples × step.
 */
export function observableWindows(
  samples: readonly { utc?: string; observable: boolean }[],
  stepMin: number,
): { startMs: number; endMs: number }[] {
  const half = (stepMin * 60_000) / 2;
  const out: { startMs: number; endMs: number }[] = [];
  let run: { first: number; last: number } | null = null;
  for (const s of samples) {
    const t = s.utc ? Date.parse(s.utc) : NaN;
    if (!Number.isFinite(t)) continue;
    if (s.observable && run && t - run.last <= stepMin * 60_000 * 1.01) run.last = t;
    else if (s.observable) {
      if (run) out.push({ startMs: run.first - half, endMs: run.last + half });
      run = { first: t, last: t };
    } else if (run) {
      out.push({ startMs: run.first - half, endMs: run.last + half });
      run = null;
    }
  }
  if (run) out.push({ startMs: run.first - half, endMs: run.last + half });
  return out;
}
