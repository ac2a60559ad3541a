import { demoSite, demoStations } from "./demo-array";

/** A valid coverage request for the demo site (invented Sierra Lumbre Array). */
export function goodCoverageRequest(): Record<string, any> {
  return {
    site: demoSite(),
    stations: demoStations("C01", "C02", "C05"),
    target: { raDeg: 84.05, decDeg: -1.2, model: { type: "uniformDisk", diameterMas: 3.0 } },
    wavelengthsM: [1.65e-6],
    hourAnglesH: [-3, -2.5, -2],
    minElevationDeg: 30,
    delayLineStrokeM: null,
    beam: { gridSize: 256, weighting: "natural" },
  };
}
