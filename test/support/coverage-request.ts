/** A valid coverage request for the demo site (invented Sierra Lumbre Array). */
export function goodCoverageRequest(): Record<string, any> {
  return {
    site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 },
    stations: [
      { name: "C01", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
      { name: "C02", eastM: 16, northM: 0, upM: 0, pathOffsetM: 5 },
      { name: "C05", eastM: 8, northM: 13.86, upM: 0, pathOffsetM: 10 },
    ],
    target: { raDeg: 84.05, decDeg: -1.2, model: { type: "uniformDisk", diameterMas: 3.0 } },
    wavelengthsM: [1.65e-6],
    hourAnglesH: [-3, -2.5, -2],
    minElevationDeg: 30,
    delayLineStrokeM: null,
    beam: { gridSize: 256, weighting: "natural" },
  };
}
