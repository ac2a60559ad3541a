/**
 * Computation requests of known cost on the demo array (invented Sierra Lumbre Array): what the
 * Sketchpad typically asks, and the costliest requests the cost budget accepts (docs/cli.md, "Cost
 * budget"). Shared by the pool tests, the browser tests and the load test (bench/loadtest.ts).
 */
import { DEMO_CONFIGURATIONS, DEMO_INSTRUMENTS, DEMO_SITE, DEMO_STATIONS } from "~/db/seed/scenario";
import { channelWavelengthsM } from "~/engine";

const site = {
  latitudeDeg: DEMO_SITE.latitudeDeg,
  longitudeDeg: DEMO_SITE.longitudeDeg,
  altitudeM: DEMO_SITE.altitudeM,
};

function stations(names: string[]) {
  return names.map((name) => {
    const s = DEMO_STATIONS.find((x) => x.name === name);
    if (!s) throw new Error(`no demo station ${name}`);
    return { name, eastM: s.eastM, northM: s.northM, upM: s.upM, pathOffsetM: s.pathOffsetM };
  });
}

const extended6 = () => stations(DEMO_CONFIGURATIONS.find((c) => c.name === "extended-6")!.stations);
const hBand = DEMO_INSTRUMENTS[0].bands[0];

/** Evenly spaced values from..to, `n` of them. */
const spaced = (from: number, to: number, n: number) =>
  Array.from({ length: n }, (_, i) => from + ((to - from) * i) / Math.max(1, n - 1));

/** A sum of `n` offset limb-darkened disks (the dearest model to evaluate). */
function manyDisks(n: number) {
  return {
    type: "sum",
    components: Array.from({ length: n }, (_, i) => ({
      model: { type: "limbDarkenedDisk", diameterMas: 0.8 + 0.1 * i, coefficient: 0.3 },
      flux: 1 + i,
      offsetEastMas: 0.7 * i,
      offsetNorthMas: -0.4 * i,
    })),
  };
}

/**
 * What the Sketchpad asks by default: the extended-6 configuration, the H band's 6 channels, one night
 * every 10 minutes, a disk with a faint companion, the 256² beam with its images.
 */
export function typicalCoverageRequest(): Record<string, any> {
  return {
    site,
    stations: extended6(),
    target: {
      name: "Puna Lantern 8",
      raDeg: 201.37,
      decDeg: -30.2,
      model: {
        type: "sum",
        components: [
          { model: { type: "uniformDisk", diameterMas: 1.5 }, flux: 1, offsetEastMas: 0, offsetNorthMas: 0 },
          { model: { type: "gaussian", fwhmMas: 8 }, flux: 0.2, offsetEastMas: 4, offsetNorthMas: 2 },
        ],
      },
    },
    wavelengthsM: channelWavelengthsM(hBand.centralWavelengthM, hBand.bandwidthM, hBand.channels),
    night: { date: "2027-03-15", stepMin: 10 },
    minElevationDeg: 30,
    delayLineStrokeM: null,
    beam: { gridSize: 256, weighting: "natural", includeImages: true },
  };
}

/**
 * The costliest kind of coverage request the budget accepts: 6 stations × 600 hour angles × 100
 * channels (about 38 MB of response estimated), 11 limb-darkened disks (9 900 000 component evaluations)
 * and a 2048² uniformly weighted beam.
 */
export function costliestCoverageRequest(): Record<string, any> {
  return {
    site,
    stations: extended6(),
    target: { raDeg: 201.37, decDeg: -30.2, model: manyDisks(11) },
    wavelengthsM: spaced(1.5e-6, 2.4e-6, 100),
    hourAnglesH: spaced(-4, 4, 600),
    minElevationDeg: 0,
    delayLineStrokeM: null,
    beam: { gridSize: 2048, weighting: "uniform" },
  };
}

/**
 * The costliest kind of triangle-finder request the budget accepts: all 24 demo stations (2 024
 * triangles) × 247 hour angles × 8 channels = 3 999 424 closure phases to rank, 18 limb-darkened disks
 * (9 818 784 component evaluations).
 */
export function costliestTrianglesRequest(): Record<string, any> {
  return {
    site,
    stations: stations(DEMO_STATIONS.map((s) => s.name)),
    target: { raDeg: 201.37, decDeg: -30.2, model: manyDisks(18) },
    wavelengthsM: spaced(2.0e-6, 2.4e-6, 8),
    hourAnglesH: spaced(-4, 4, 247),
    minElevationDeg: 0,
    delayLineStrokeM: null,
    maxTriangles: 50,
  };
}
