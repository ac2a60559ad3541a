/** The demo site (invented Sierra Lumbre Array) and some of its stations, as the computation requests give them. */

export function demoSite() {
  return { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 };
}

/** Three core stations and three outriggers, with their fixed optical path offsets. */
const STATIONS = [
  { name: "C01", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
  { name: "C02", eastM: 16, northM: 0, upM: 0, pathOffsetM: 5 },
  { name: "C05", eastM: 8, northM: 13.86, upM: 0, pathOffsetM: 10 },
  { name: "W1", eastM: -180, northM: 60, upM: 1.2, pathOffsetM: 40 },
  { name: "N2", eastM: 35, northM: 228, upM: 2.1, pathOffsetM: 55 },
  { name: "E3", eastM: 301, northM: -117, upM: -0.9, pathOffsetM: 70 },
];

/** Fresh copies of the named stations, in the order given. */
export function demoStations(...names: string[]) {
  return names.map((n) => {
    const station = STATIONS.find((s) => s.name === n);
    if (!station) throw new Error(`no demo station ${n}`);
    return { ...station };
  });
}

/**
 * A binary (equal-brightness companion at `separationMas`, position angle `positionAngleDeg` east of north)
 * at RA 84.05°, Dec `decDeg`, as the computation requests give a target.
 */
export function binaryTarget(name: string, { decDeg = -1.2, separationMas = 3, positionAngleDeg = 40 } = {}) {
  return { name, raDeg: 84.05, decDeg, model: { type: "binary", separationMas, positionAngleDeg, fluxRatio: 0.5 } };
}
