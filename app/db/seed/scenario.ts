/**
 * The invented demo scenario: the Sierra Lumbre Array, its instruments, the demo people and the three
 * demo cycles laid out around the day the demo is loaded (demo-cycles.ts), with their proposals
 * (demo-proposals.ts). Pure data (no database access) so the seed, the tests and the docs share one source.
 */
import type { Role } from "../schema/users";

export const DEMO_SITE = {
  name: "Sierra Lumbre Array",
  latitudeDeg: -31.4,
  longitudeDeg: -68.9,
  altitudeM: 2450,
  minElevationDeg: 30,
  /**
   * With the stations' fixed path offsets, every configuration then observes a target through the
   * zenith for at least 4 h around transit (extended-6, the tightest, from −2.25 h to +2.08 h; the test
   * test/db/seed/delay-lines.test.ts states it).
   */
  delayLineStrokeM: 200,
  timeZone: "America/Argentina/San_Juan",
} as const;

export type DemoStation = { name: string; eastM: number; northM: number; upM: number; pathOffsetM: number };

/** Grid spacing of the compact core, metres. */
export const CORE_SPACING_M = 16;

/**
 * 18 core stations on a triangular grid of 16 m spacing: rows 0.5·√3·16 m apart, each row shifted
 * by half a spacing from its neighbours; row lengths 2, 4, 5, 4, 3 from south to north.
 */
function coreStations(): DemoStation[] {
  const rowStep = (CORE_SPACING_M * Math.sqrt(3)) / 2;
  const rows: { row: number; east: number[] }[] = [
    { row: -2, east: [-16, 0] },
    { row: -1, east: [-24, -8, 8, 24] },
    { row: 0, east: [-32, -16, 0, 16, 32] },
    { row: 1, east: [-24, -8, 8, 24] },
    { row: 2, east: [-16, 0, 16] },
  ];
  const out: DemoStation[] = [];
  let n = 1;
  for (const { row, east } of rows) {
    for (const e of east) {
      const name = `C${String(n).padStart(2, "0")}`;
      // Small made-up height differences of the pads (metres) and path offsets of the feed optics.
      const upM = Math.round(((n * 37) % 11) * 0.04 * 100) / 100;
      const pathOffsetM = Math.round(((n * 53) % 17) * 0.3 * 100) / 100;
      out.push({ name, eastM: e, northM: Math.round(row * rowStep * 1000) / 1000, upM, pathOffsetM });
      n += 1;
    }
  }
  return out;
}

/** Six outriggers: distance from the core centre (m) and azimuth east of north (deg), made up. */
const OUTRIGGERS: { name: string; distanceM: number; azimuthDeg: number; upM: number; pathOffsetM: number }[] = [
  { name: "X01", distanceM: 110, azimuthDeg: 17, upM: 1.2, pathOffsetM: 14.5 },
  { name: "X02", distanceM: 165, azimuthDeg: 101, upM: -0.8, pathOffsetM: 31.0 },
  { name: "X03", distanceM: 230, azimuthDeg: 158, upM: 2.6, pathOffsetM: 22.75 },
  { name: "X04", distanceM: 330, azimuthDeg: 212, upM: 4.1, pathOffsetM: 58.2 },
  { name: "X05", distanceM: 275, azimuthDeg: 287, upM: -1.9, pathOffsetM: 47.6 },
  { name: "X06", distanceM: 140, azimuthDeg: 331, upM: 0.4, pathOffsetM: 19.3 },
];

export const DEMO_STATIONS: DemoStation[] = [
  ...coreStations(),
  ...OUTRIGGERS.map((o) => {
    const az = (o.azimuthDeg * Math.PI) / 180;
    return {
      name: o.name,
      eastM: Math.round(o.distanceM * Math.sin(az) * 1000) / 1000,
      northM: Math.round(o.distanceM * Math.cos(az) * 1000) / 1000,
      upM: o.upM,
      pathOffsetM: o.pathOffsetM,
    };
  }),
];

export const DEMO_CONFIGURATIONS: { name: string; description: string; stations: string[] }[] = [
  {
    name: "compact-3",
    description: "Three core stations, 28–42 m baselines: large stars and extended envelopes.",
    stations: ["C04", "C10", "C17"],
  },
  {
    name: "medium-4",
    description: "Two core-edge stations and the two nearest outriggers, 64–158 m: diameters and limb darkening.",
    stations: ["C07", "C11", "X01", "X06"],
  },
  {
    name: "extended-6",
    description: "One core station and five outriggers, 137–456 m: imaging and close binaries.",
    stations: ["C02", "X01", "X02", "X03", "X04", "X05"],
  },
];

export type DemoBand = {
  name: string;
  centralWavelengthM: number;
  channels: number;
  bandwidthM: number;
  limitingMagnitude: number;
};

export const DEMO_INSTRUMENTS: { name: string; description: string; maxTelescopes: number; bands: DemoBand[] }[] = [
  {
    name: "Brasa",
    description: "Near-infrared beam combiner for up to six telescopes.",
    maxTelescopes: 6,
    bands: [
      { name: "H", centralWavelengthM: 1.65e-6, channels: 6, bandwidthM: 0.3e-6, limitingMagnitude: 7.5 },
      { name: "K", centralWavelengthM: 2.2e-6, channels: 8, bandwidthM: 0.4e-6, limitingMagnitude: 7.0 },
    ],
  },
  {
    name: "Ascua",
    description: "Mid-infrared combiner for up to four telescopes.",
    maxTelescopes: 4,
    bands: [{ name: "N", centralWavelengthM: 10e-6, channels: 30, bandwidthM: 5e-6, limitingMagnitude: 3.0 }],
  },
];

export type DemoPerson = { email: string; name: string; institute: string; roles: Role[] };

/** Invented people and institutes; e-mail addresses use reserved example domains. */
export const DEMO_PEOPLE: DemoPerson[] = [
  {
    email: "ines.arroyo@valle-alto.example",
    name: "Inés Arroyo-Vidal",
    institute: "Instituto de Astrofísica del Valle Alto",
    roles: ["proposer"],
  },
  {
    email: "tomasz.wierzbicki@baltic-stellar.example",
    name: "Tomasz Wierzbicki",
    institute: "Baltic Institute for Stellar Physics",
    roles: ["proposer"],
  },
  {
    email: "amara.okafor@harmattan-obs.example",
    name: "Amara Okafor",
    institute: "Harmattan Observatory",
    roles: ["reviewer", "proposer"],
  },
  {
    email: "kenji.morrow@tidewater.example",
    name: "Kenji Morrow",
    institute: "Tidewater College of Astronomy",
    roles: ["reviewer"],
  },
  {
    email: "henrik.solberg@fjellvik.example",
    name: "Henrik Solberg",
    institute: "Fjellvik Space Science Centre",
    roles: ["chair", "reviewer"],
  },
  {
    email: "dario.petrescu@baltic-stellar.example",
    name: "Dario Petrescu",
    institute: "Baltic Institute for Stellar Physics",
    roles: ["reviewer"],
  },
  {
    email: "yusuf.karaca@meseta-roja.example",
    name: "Yusuf Karaca",
    institute: "Meseta Roja Observatory",
    roles: ["reviewer"],
  },
  {
    email: "mirela.voinea@carpathian-stellar.example",
    name: "Mirela Voinea",
    institute: "Carpathian Institute of Stellar Physics",
    roles: ["reviewer"],
  },
  {
    email: "oskar.lindfors@saltmarsh.example",
    name: "Oskar Lindfors",
    institute: "Saltmarsh Institute for Astronomy",
    roles: ["proposer"],
  },
  {
    email: "mei.chao@sierra-lumbre.example",
    name: "Mei-Lin Chao",
    institute: "Sierra Lumbre Array Operations",
    roles: ["scheduler"],
  },
  {
    email: "rafael.quispe@sierra-lumbre.example",
    name: "Rafael Quispe",
    institute: "Sierra Lumbre Array Operations",
    roles: ["admin"],
  },
];

export {
  DEMO_CHAIR,
  DEMO_COMMITTEE,
  type DemoCycle,
  type DemoCycleKey,
  demoCycles,
} from "./demo-cycles";
export {
  DEMO_PROPOSALS,
  type DemoDecision,
  type DemoProposal,
  type DemoProposalTarget,
} from "./demo-proposals";
