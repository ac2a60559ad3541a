/**
 * Time scales: Julian day (UT), Julian ephemeris day (TT), calendar dates and
 * ISO-8601 strings. Julian days are plain numbers; UT is treated as UTC (the
 * < 0.9 s difference is below every tolerance of the planner).
 */

import { deltaT } from "astronomia/deltat";
import { CalendarGregorianToJD } from "astronomia/julian";
import { JD_UNIX_EPOCH, MS_PER_DAY } from "../math";

/** A Gregorian calendar date. */
export interface CalendarDate {
  year: number;
  /** 1..12 */
  month: number;
  /** 1..31 */
  day: number;
}

/**
 * Julian day of a Gregorian calendar date with a fractional day
 * (Meeus 7.1; e.g. 1957 October 4.81 → 2436116.31).
 */
export function julianDay(year: number, month: number, dayWithFraction: number): number {
  return CalendarGregorianToJD(year, month, dayWithFraction);
}

/** Julian day (UT) of a JavaScript Date; exact to the millisecond. */
export function julianDayFromDate(date: Date): number {
  return date.getTime() / MS_PER_DAY + JD_UNIX_EPOCH;
}

/** JavaScript Date of a Julian day (UT), rounded to the millisecond. */
export function dateFromJulianDay(jd: number): Date {
  return new Date(Math.round((jd - JD_UNIX_EPOCH) * MS_PER_DAY));
}

/**
 * ISO-8601 UTC string of a Julian day rounded to the whole second,
 * e.g. "2027-03-15T23:41:07Z".
 */
export function isoUtcFromJulianDay(jd: number): string {
  const ms = Math.round(((jd - JD_UNIX_EPOCH) * MS_PER_DAY) / 1000) * 1000;
  return new Date(ms).toISOString().replace(".000Z", "Z");
}

/**
 * Parses "YYYY-MM-DD" into a calendar date. Returns null when the text is not
 * in that form or is not a real date (2027-02-30).
 */
export function parseIsoDate(text: string): CalendarDate | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return null;
  const year = Number(m[1]);
  const month = Number(m[2]);
  const day = Number(m[3]);
  const d = new Date(Date.UTC(year, month - 1, day));
  if (d.getUTCFullYear() !== year || d.getUTCMonth() !== month - 1 || d.getUTCDate() !== day) return null;
  return { year, month, day };
}

/** Julian day of 0h UT of a calendar date. */
export function julianDayAt0hUt(date: CalendarDate): number {
  return julianDay(date.year, date.month, date.day);
}

/** Decimal year of a Julian day (Julian years from J2000; good to a day). */
export function decimalYear(jd: number): number {
  return 2000 + (jd - 2451544.5) / 365.25;
}

/** ΔT = TT − UT in seconds at a Julian day (astronomia's tabulation and extrapolation). */
export function deltaTSeconds(jd: number): number {
  return deltaT(decimalYear(jd));
}

/** Julian ephemeris day (TT) for a Julian day in UT. */
export function jdeFromJd(jd: number): number {
  return jd + deltaTSeconds(jd) / 86400;
}
