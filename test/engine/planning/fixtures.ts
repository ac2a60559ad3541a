/** Requests shared by the planning tests: the demo site (invented Sierra Lumbre Array) and simple targets. */
import { type PlanInput, parsePlanRequest } from "~/engine";

export const SITE = { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 };

/** Three stations of the demo array (compact core plus two outriggers), ENU metres. */
export const STATIONS = [
  { name: "C01", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
  { name: "W1", eastM: -182, northM: 64, upM: 1.2, pathOffsetM: 40 },
  { name: "N2", eastM: 35, northM: 228, upM: 2.1, pathOffsetM: 55 },
];

/** A target with one calibrator 2° east and 1° north of it. */
export function target(name: string, raDeg: number, decDeg: number, extra: Record<string, unknown> = {}) {
  return {
    name,
    raDeg,
    decDeg,
    priority: 1,
    hoursOwed: 10,
    minElevationDeg: null,
    calibrators: [{ name: `${name}-K`, raDeg: (raDeg + 2) % 360, decDeg: decDeg + 1 }],
    ...extra,
  };
}

/** `n` targets passing near the zenith of the demo site, evenly spread in right ascension. */
export function zenithTargets(n: number, extra: Record<string, unknown> = {}) {
  return Array.from({ length: n }, (_, i) => target(`Z${i}`, (360 * i) / n, -31.4 + ((i % 3) - 1) * 4, extra));
}

/** A validated request on the night of 2027-03-15 at the demo site (Moon 56 % lit). */
export function planRequest(extra: Record<string, unknown>): PlanInput {
  const parsed = parsePlanRequest({
    site: SITE,
    date: "2027-03-15",
    stations: STATIONS,
    delayLineStrokeM: null,
    minElevationDeg: 30,
    moonMinSeparationDeg: 10,
    scienceBlockMin: 40,
    calibratorBlockMin: 15,
    targets: [],
    ...extra,
  });
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.value;
}

export const sec = (iso: string) => Date.parse(iso) / 1000;
