// Minimal type declarations for the parts of astronomia 4.2 used by
// app/services/astro. Import subpaths ("astronomia/sidereal"), never the root:
// the root module loads every chapter and starts about four times slower.
// Angles are radians unless stated; "jd" is a Julian day in UT, "jde" a Julian
// ephemeris day (TT = UT + ΔT).

declare module "astronomia/base" {
  /** Astronomical unit in km. */
  export const AU: number;
  export const J2000: number;
  export function J2000Century(jde: number): number;
  export function JDEToJulianYear(jde: number): number;
  /** Illuminated fraction (1 + cos i)/2 for a phase angle i in radians. */
  export function illuminated(phaseAngleRad: number): number;
  export class Coord {
    constructor(ra?: number, dec?: number, range?: number, elongation?: number);
    ra: number;
    dec: number;
    range: number;
    lon: number;
    lat: number;
  }
}

declare module "astronomia/julian" {
  export function CalendarGregorianToJD(year: number, month: number, day: number): number;
  export function JDToCalendarGregorian(jd: number): { year: number; month: number; day: number };
  export function DateToJD(date: Date): number;
  export function JDToDate(jd: number): Date;
  export class Calendar {
    constructor(year?: number | Date, month?: number, day?: number);
    year: number;
    month: number;
    day: number;
    toJD(): number;
    toJDE(): number;
    toDate(): Date;
    toYear(): number;
    midnight(): this;
  }
  export class CalendarGregorian extends Calendar {}
}

declare module "astronomia/sidereal" {
  /** Mean sidereal time at Greenwich, seconds of time in [0, 86400). */
  export function mean(jd: number): number;
  /** Mean sidereal time at Greenwich at 0h UT of the day containing jd, seconds. */
  export function mean0UT(jd: number): number;
  /** Apparent sidereal time at Greenwich, seconds of time in [0, 86400). */
  export function apparent(jd: number): number;
  /** Apparent sidereal time at Greenwich at 0h UT, seconds. */
  export function apparent0UT(jd: number): number;
}

declare module "astronomia/deltat" {
  /** ΔT = TT − UT in seconds for a decimal year. */
  export function deltaT(decimalYear: number): number;
}

declare module "astronomia/nutation" {
  /** [Δψ, Δε] nutation in longitude and obliquity, radians. */
  export function nutation(jde: number): [number, number];
  /** Mean obliquity of the ecliptic ε0, radians (IAU 1980, Meeus 22.2). */
  export function meanObliquity(jde: number): number;
  /** Nutation in right ascension (equation of the equinoxes), radians. */
  export function nutationInRA(jde: number): number;
}

declare module "astronomia/solar" {
  import type { Coord } from "astronomia/base";
  /** Apparent right ascension and declination of the Sun (Meeus ch. 25, low accuracy). */
  export function apparentEquatorial(jde: number): Coord;
  /** True geometric longitude and true anomaly, radians; T in Julian centuries from J2000. */
  export function trueLongitude(T: number): { lon: number; ano: number };
  /** Apparent longitude of the Sun, radians; T in Julian centuries from J2000. */
  export function apparentLongitude(T: number): number;
  /** Sun–Earth distance in AU; T in Julian centuries from J2000. */
  export function radius(T: number): number;
}

declare module "astronomia/moonposition" {
  import type { Coord } from "astronomia/base";
  /** Geocentric ecliptic lon/lat (mean equinox of date, no nutation) and range in km. */
  export function position(jde: number): Coord;
  /** Equatorial horizontal parallax in radians for a distance in km. */
  export function parallax(distanceKm: number): number;
}

declare module "astronomia/moonillum" {
  import type { Coord } from "astronomia/base";
  /** Phase angle of the Moon, radians; both ranges in the same unit. */
  export function phaseAngleEquatorial(moon: Coord, sun: Coord): number;
}

declare module "astronomia/precess" {
  /** Precesses {ra, dec} (radians) between Julian epochs, with annual proper motions in radians. */
  export function position(
    eqFrom: { ra: number; dec: number },
    epochFrom: number,
    epochTo: number,
    mRa: number,
    mDec: number,
  ): { ra: number; dec: number };
}

declare module "astronomia/sunrise" {
  import type { Calendar } from "astronomia/julian";
  /** Rise and set of the Sun; lat/lon in degrees, lon positive WEST. */
  export class Sunrise {
    constructor(date: Calendar, latDeg: number, lonWestDeg: number, refraction?: number);
    rise(): Calendar | undefined;
    set(): Calendar | undefined;
    dusk(): Calendar | undefined;
    dawn(): Calendar | undefined;
    nauticalDusk(): Calendar | undefined;
    nauticalDawn(): Calendar | undefined;
    nightStart(): Calendar | undefined;
    nightEnd(): Calendar | undefined;
  }
}
