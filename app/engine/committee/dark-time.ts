/**
 * Dark time over an observing period: the astronomical-night hours of each night (Sun below −18°, from
 * the twilight code in astro/) and how they fall on local sidereal time.
 *
 * A night's dark interval [t₀, t₁] (UT) starts at LMST L₀ and covers an LST arc of
 * (t₁ − t₀)·k sidereal hours, k = 360.98564736629/360 = 1.00273790935 sidereal hours per solar hour
 * (the rate of Meeus 1998, eq. 12.4). The arc is cut at the LST bin edges and each piece is credited
 * to its bin in solar hours (its LST length / k), so the bins of a night sum to its dark hours exactly
 * (up to rounding) and no sampling step is involved.
 *
 * Sampling: with `everyNights` = k > 1 the period is cut into consecutive blocks of k nights (the last
 * may be shorter) and only the middle night of each block is computed; it carries the block's length
 * as its weight. Means over the period are weighted means. With k = 1 every night is computed
 * (about 0.5 ms per night on the reference machine, most of it the Sun's altitude scan).
 */
import { lmstHours } from "../astro/sidereal";
import { isoUtcFromJulianDay, parseIsoDate } from "../astro/time";
import { nightEvents } from "../astro/twilight";
import { DEG_TO_RAD } from "../math";
import type { DarkTimeOptions, SiteInput } from "./inputs";

/** Sidereal hours per solar hour: 360.98564736629°/day ÷ 360° (Meeus 1998, eq. 12.4). */
export const SIDEREAL_PER_SOLAR = 360.98564736629 / 360;
/** Most nights a period may span. */
export const MAX_PERIOD_NIGHTS = 1000;
export const DEFAULT_LST_BINS = 24;

export interface DarkNight {
  /** The night that begins on the local evening of this date, YYYY-MM-DD. */
  date: string;
  /** Start and end of astronomical darkness, ISO-8601 UTC to the second; null when it never gets dark. */
  darkStartUtc: string | null;
  darkEndUtc: string | null;
  /** Hours of astronomical darkness (0 when none). */
  darkHours: number;
  /** LMST at the start of darkness, hours [0, 24); null when it never gets dark. */
  lstAtDarkStartH: number | null;
  /** Nights of the period this night stands for (1 when every night is computed). */
  weight: number;
}

export interface DarkTime {
  site: SiteInput;
  firstNight: string;
  lastNight: string;
  /** Nights in the period, first and last included. */
  periodNights: number;
  /** The sampling step k (1 = every night). */
  everyNights: number;
  lstBins: number;
  /** Width of one LST bin, sidereal hours (24 / lstBins). */
  binWidthH: number;
  /** The computed nights, in date order (every night when everyNights = 1). */
  nights: DarkNight[];
  /** Dark hours per LST bin of each computed night, index night·lstBins + bin. */
  hoursPerBin: Float64Array;
  /** Weighted mean over the period of the dark hours per night. */
  meanDarkHoursPerNight: number;
  /** Weighted mean over the period of the dark hours per LST bin per night (Σ = meanDarkHoursPerNight). */
  meanDarkHoursPerBin: Float64Array;
}

/**
 * Adds an interval of darkness to LST cells: `solarHours` of time starting at LMST `lstStartH`, spread
 * over `out.length` cells of equal LST width covering 0–24 h, each credited with its share in solar
 * hours × `scale`. Σ of what is added = solarHours × scale.
 */
export function addDarkIntervalToLst(lstStartH: number, solarHours: number, out: Float64Array, scale = 1): void {
  const n = out.length;
  if (!(solarHours > 0) || n === 0) return;
  const cellH = 24 / n;
  let remaining = solarHours * SIDEREAL_PER_SOLAR;
  let pos = ((lstStartH % 24) + 24) % 24;
  let cell = Math.min(n - 1, Math.floor(pos / cellH));
  while (remaining > 0) {
    const room = (cell + 1) * cellH - pos;
    if (room > 0) {
      const take = Math.min(room, remaining);
      out[cell % n] += (take / SIDEREAL_PER_SOLAR) * scale;
      remaining -= take;
      pos += take;
    }
    cell++;
    if (cell === n) {
      cell = 0;
      pos -= 24;
    }
  }
}

/** Date n days after `date` (YYYY-MM-DD), UTC calendar arithmetic. */
export function addDays(date: string, days: number): string {
  const d = new Date(`${date}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + days);
  return d.toISOString().slice(0, 10);
}

/** Nights from `first` to `last`, both included (0 when last precedes first). */
export function nightsBetween(first: string, last: string): number {
  const ms = Date.parse(`${last}T00:00:00Z`) - Date.parse(`${first}T00:00:00Z`);
  return Math.max(0, Math.round(ms / 86_400_000) + 1);
}

/**
 * The darkness of the nights `firstNight` … `lastNight` (YYYY-MM-DD, both included) at `site`.
 * Throws a RangeError for an invalid date, a last night before the first, a period over
 * {@link MAX_PERIOD_NIGHTS} nights, or options out of range.
 */
export function darkTimeOverPeriod(
  site: SiteInput,
  firstNight: string,
  lastNight: string,
  options: DarkTimeOptions = {},
): DarkTime {
  const lstBins = options.lstBins ?? DEFAULT_LST_BINS;
  const everyNights = options.everyNights ?? 1;
  if (!Number.isInteger(lstBins) || lstBins < 1 || lstBins > 288)
    throw new RangeError("lstBins: must be a whole number from 1 to 288");
  if (!Number.isInteger(everyNights) || everyNights < 1 || everyNights > 366)
    throw new RangeError("everyNights: must be a whole number from 1 to 366");
  if (!parseIsoDate(firstNight)) throw new RangeError(`firstNight: not a date YYYY-MM-DD: ${firstNight}`);
  if (!parseIsoDate(lastNight)) throw new RangeError(`lastNight: not a date YYYY-MM-DD: ${lastNight}`);
  const periodNights = nightsBetween(firstNight, lastNight);
  if (periodNights < 1) throw new RangeError("lastNight: must not be before firstNight");
  if (periodNights > MAX_PERIOD_NIGHTS)
    throw new RangeError(`lastNight: the period exceeds ${MAX_PERIOD_NIGHTS} nights`);

  const latRad = site.latitudeDeg * DEG_TO_RAD;
  const lonEastRad = site.longitudeDeg * DEG_TO_RAD;
  const nights: DarkNight[] = [];
  const rows: Float64Array[] = [];
  for (let start = 0; start < periodNights; start += everyNights) {
    const weight = Math.min(everyNights, periodNights - start);
    const date = addDays(firstNight, start + Math.floor((weight - 1) / 2));
    const ev = nightEvents(parseIsoDate(date)!, latRad, lonEastRad);
    const row = new Float64Array(lstBins);
    let night: DarkNight = {
      date,
      darkStartUtc: null,
      darkEndUtc: null,
      darkHours: 0,
      lstAtDarkStartH: null,
      weight,
    };
    if (ev.darkStartJd !== null && ev.darkEndJd !== null) {
      const darkHours = (ev.darkEndJd - ev.darkStartJd) * 24;
      const lstAtDarkStartH = lmstHours(ev.darkStartJd, lonEastRad);
      addDarkIntervalToLst(lstAtDarkStartH, darkHours, row);
      night = {
        ...night,
        darkStartUtc: isoUtcFromJulianDay(ev.darkStartJd),
        darkEndUtc: isoUtcFromJulianDay(ev.darkEndJd),
        darkHours,
        lstAtDarkStartH,
      };
    }
    nights.push(night);
    rows.push(row);
  }

  const hoursPerBin = new Float64Array(nights.length * lstBins);
  const meanDarkHoursPerBin = new Float64Array(lstBins);
  let meanDarkHoursPerNight = 0;
  for (let i = 0; i < nights.length; i++) {
    hoursPerBin.set(rows[i], i * lstBins);
    const w = nights[i].weight / periodNights;
    meanDarkHoursPerNight += w * nights[i].darkHours;
    for (let b = 0; b < lstBins; b++) meanDarkHoursPerBin[b] += w * rows[i][b];
  }
  return {
    site: { ...site },
    firstNight,
    lastNight,
    periodNights,
    everyNights,
    lstBins,
    binWidthH: 24 / lstBins,
    nights,
    hoursPerBin,
    meanDarkHoursPerNight,
    meanDarkHoursPerBin,
  };
}
