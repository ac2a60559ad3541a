/**
 * Public face of the time-and-sky services (wrapping astronomia): Julian
 * dates, sidereal time, precession, Sun, Moon, twilight, rise/set, air mass.
 * Radians and Julian days inside; degrees, hours and ISO strings at the edge.
 */
export * from "./time";
export * from "./sidereal";
export * from "./precession";
export * from "./horizon";
export * from "./sun";
export * from "./moon";
export * from "./twilight";
export * from "./rise-set";
export * from "./airmass";
export { computeEphemeris } from "./ephemeris";
export type { EphemerisResponse } from "./ephemeris";
