/**
 * A six-station array for benchmarks and engine tests (invented): three core stations and three
 * outriggers, 15 baselines from 16 m to about 440 m.
 */
export const SIX_STATIONS = [
  { name: "C01", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
  { name: "C02", eastM: 16, northM: 0, upM: 0, pathOffsetM: 2 },
  { name: "C05", eastM: 8, northM: 13.86, upM: 0, pathOffsetM: 4 },
  { name: "W1", eastM: -182, northM: 64, upM: 1.2, pathOffsetM: 40 },
  { name: "N2", eastM: 35, northM: 228, upM: 2.1, pathOffsetM: 55 },
  { name: "E3", eastM: 301, northM: -117, upM: -0.9, pathOffsetM: 70 },
];
