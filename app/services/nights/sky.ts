/**
 * The sky of one night for the Night builder's pages (pure): the Sun's events in UT, local time and
 * LST, the Moon's phase, rise and set and its altitude through the night. The Sun's events are the
 * engine's ephemeris (`computeEphemeris`); the Moon's place is the engine's (Meeus 1998 ch. 47).
 *
 * Moonrise and moonset: the Moon's centre at geocentric altitude h₀ = 0.7275·π − 0°34′, π the Moon's
 * equatorial horizontal parallax (sin π = 6378.14 km / Δ), as Meeus 1998 ch. 15 gives for the Moon;
 * the altitude is scanned every 10 min from local mean noon of D to local mean noon of D + 1 and each
 * crossing bisected to 1 s.
 */
import {
  computeEphemeris,
  DEG_TO_RAD,
  elevationRad,
  gastRad,
  isoUtcFromJulianDay,
  jdeFromJd,
  julianDayFromDate,
  lmstHours,
  moonIlluminatedFraction,
  moonPosition,
  RAD_TO_DEG,
  roundTo,
  type SiteInput,
} from "~/engine";

const EARTH_RADIUS_KM = 6378.14;
const SCAN_STEP_DAYS = 10 / 1440;
const BISECT_DAYS = 1 / 86_400;

/** The Moon's geocentric altitude (degrees) at a Julian day (UT), and its rise/set altitude h₀ (degrees). */
export function moonAltitudeAt(jd: number, site: SiteInput): { altitudeDeg: number; h0Deg: number } {
  const m = moonPosition(jdeFromJd(jd));
  const lat = site.latitudeDeg * DEG_TO_RAD;
  const ha = gastRad(jd) + site.longitudeDeg * DEG_TO_RAD - m.raRad;
  const parallaxDeg = Math.asin(EARTH_RADIUS_KM / m.distanceKm) * RAD_TO_DEG;
  return { altitudeDeg: elevationRad(lat, m.decRad, ha) * RAD_TO_DEG, h0Deg: 0.7275 * parallaxDeg - 34 / 60 };
}

/** Julian day (UT) of an ISO instant. */
export const jdOfIso = (iso: string) => julianDayFromDate(new Date(iso));

/** Local mean noon of D (Julian day, UT): the start of the night's search window, as the engine's twilight code. */
export function windowStartJd(date: string, longitudeDeg: number): number {
  const midnightOfD = julianDayFromDate(new Date(`${date}T00:00:00Z`));
  return midnightOfD + 0.5 - longitudeDeg / 360;
}

/** Moonrise and moonset between local mean noon of D and of D + 1 (ISO UTC, null when there is none). */
export function moonRiseSet(date: string, site: SiteInput): { riseUtc: string | null; setUtc: string | null } {
  const start = windowStartJd(date, site.longitudeDeg);
  const above = (jd: number) => {
    const a = moonAltitudeAt(jd, site);
    return a.altitudeDeg - a.h0Deg;
  };
  let riseUtc: string | null = null;
  let setUtc: string | null = null;
  let prevJd = start;
  let prev = above(start);
  for (let jd = start + SCAN_STEP_DAYS; jd <= start + 1 + 1e-9; jd += SCAN_STEP_DAYS) {
    const now = above(jd);
    if ((prev <= 0 && now > 0 && !riseUtc) || (prev > 0 && now <= 0 && !setUtc)) {
      const rising = prev <= 0;
      let lo = prevJd;
      let hi = jd;
      while (hi - lo > BISECT_DAYS) {
        const mid = 0.5 * (lo + hi);
        if (above(mid) > 0 === rising) hi = mid;
        else lo = mid;
      }
      const iso = isoUtcFromJulianDay(0.5 * (lo + hi));
      if (rising) riseUtc = iso;
      else setUtc = iso;
    }
    prevJd = jd;
    prev = now;
  }
  return { riseUtc, setUtc };
}

/** "21:14 UTC-3": the wall-clock time of an instant in an IANA zone, with the zone's offset from UTC. */
export function localTime(iso: string, timeZone: string): string {
  const parts = new Intl.DateTimeFormat("en-GB", {
    timeZone,
    hour: "2-digit",
    minute: "2-digit",
    hourCycle: "h23",
    timeZoneName: "shortOffset",
  }).format(new Date(iso));
  return parts
    .replace(",", "")
    .replace(/GMT\+0$|GMT$/, "UTC")
    .replace("GMT", "UTC");
}

/** "00:14:40 UTC" */
export function utcTime(iso: string): string {
  return `${new Date(iso).toISOString().slice(11, 19)} UTC`;
}

/** "7h 12m": hours as sidereal clock text. */
export function lstText(hours: number): string {
  const totalMin = Math.round(hours * 60) % (24 * 60);
  return `${Math.floor(totalMin / 60)}h ${String(totalMin % 60).padStart(2, "0")}m`;
}

export type SkyEvent = {
  key: string;
  label: string;
  utc: string | null;
  /** Wall-clock time at the site, with its offset from UTC. */
  local: string | null;
  /** Local mean sidereal time, hours [0, 24). */
  lstH: number | null;
};

export type NightSkySummary = {
  date: string;
  timeZone: string;
  events: SkyEvent[];
  /** Hours with the Sun below −18°. */
  darkHours: number;
  astronomicalDuskUtc: string | null;
  astronomicalDawnUtc: string | null;
  sunsetUtc: string | null;
  sunriseUtc: string | null;
  civilDuskUtc: string | null;
  nauticalDuskUtc: string | null;
  nauticalDawnUtc: string | null;
  civilDawnUtc: string | null;
  moon: {
    /** At local mean midnight, 0..1. */
    illuminatedFraction: number;
    waxing: boolean;
    riseUtc: string | null;
    setUtc: string | null;
    riseLocal: string | null;
    setLocal: string | null;
    /** Apparent geocentric place at local mean midnight, degrees. */
    raDeg: number;
    decDeg: number;
  };
};

const EVENT_LABELS: [keyof ReturnType<typeof computeEphemeris>, string][] = [
  ["sunsetUtc", "Sunset"],
  ["civilDuskUtc", "Civil dusk (Sun −6°)"],
  ["nauticalDuskUtc", "Nautical dusk (Sun −12°)"],
  ["astronomicalDuskUtc", "Astronomical dusk (Sun −18°)"],
  ["localMidnightUtc", "Local mean midnight"],
  ["astronomicalDawnUtc", "Astronomical dawn (Sun −18°)"],
  ["nauticalDawnUtc", "Nautical dawn (Sun −12°)"],
  ["civilDawnUtc", "Civil dawn (Sun −6°)"],
  ["sunriseUtc", "Sunrise"],
];

/** The night of `date` at `site`, for the night page. */
export function nightSkySummary(date: string, site: SiteInput, timeZone: string): NightSkySummary {
  const eph = computeEphemeris({ site, date });
  const lonRad = site.longitudeDeg * DEG_TO_RAD;
  const events: SkyEvent[] = EVENT_LABELS.map(([key, label]) => {
    const utc = eph[key] as string | null;
    return {
      key,
      label,
      utc,
      local: utc ? localTime(utc, timeZone) : null,
      lstH: utc ? roundTo(lmstHours(jdOfIso(utc), lonRad), 4) : null,
    };
  });
  const midnight = jdOfIso(eph.localMidnightUtc);
  const waxing = moonIlluminatedFraction(jdeFromJd(midnight + 1)) > eph.moonIlluminatedFraction;
  const rs = moonRiseSet(date, site);
  return {
    date,
    timeZone,
    events,
    darkHours: eph.darkHours,
    astronomicalDuskUtc: eph.astronomicalDuskUtc,
    astronomicalDawnUtc: eph.astronomicalDawnUtc,
    sunsetUtc: eph.sunsetUtc,
    sunriseUtc: eph.sunriseUtc,
    civilDuskUtc: eph.civilDuskUtc,
    nauticalDuskUtc: eph.nauticalDuskUtc,
    nauticalDawnUtc: eph.nauticalDawnUtc,
    civilDawnUtc: eph.civilDawnUtc,
    moon: {
      illuminatedFraction: eph.moonIlluminatedFraction,
      waxing,
      riseUtc: rs.riseUtc,
      setUtc: rs.setUtc,
      riseLocal: rs.riseUtc ? localTime(rs.riseUtc, timeZone) : null,
      setLocal: rs.setUtc ? localTime(rs.setUtc, timeZone) : null,
      raDeg: eph.moonRaDeg,
      decDeg: eph.moonDecDeg,
    },
  };
}

/** The Moon's altitude every `stepMin` minutes from sunset to sunrise (or across the window), for the timeline. */
export function moonAltitudeCurve(
  fromUtc: string,
  toUtc: string,
  site: SiteInput,
  stepMin = 10,
): { utc: string[]; altitudeDeg: number[] } {
  const a = jdOfIso(fromUtc);
  const b = jdOfIso(toUtc);
  const utc: string[] = [];
  const altitudeDeg: number[] = [];
  for (let jd = a; jd <= b + 1e-9; jd += stepMin / 1440) {
    utc.push(isoUtcFromJulianDay(jd));
    altitudeDeg.push(roundTo(moonAltitudeAt(jd, site).altitudeDeg, 2));
  }
  return { utc, altitudeDeg };
}

/** Moon phase words for an illuminated fraction and its trend. */
export function moonPhaseText(fraction: number, waxing: boolean): string {
  const pct = Math.round(fraction * 100);
  if (pct <= 2) return "new Moon";
  if (pct >= 98) return "full Moon";
  const trend = waxing ? "waxing" : "waning";
  if (pct < 45) return `${trend} crescent, ${pct} % lit`;
  if (pct <= 55) return `${waxing ? "first" : "last"} quarter, ${pct} % lit`;
  return `${trend} gibbous, ${pct} % lit`;
}
