/**
 * The invented demo scenario: the Sierra Lumbre Array, its instruments and the demo people.
 * Pure data (no database access) so the seed, the tests and the docs share one source.
 */
import type { Role } from "../schema/users";

export const DEMO_SITE = {
  name: "Sierra Lumbre Array",
  latitudeDeg: -31.4,
  longitudeDeg: -68.9,
  altitudeM: 2450,
  minElevationDeg: 30,
  delayLineStrokeM: 90,
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

/** The demo's open cycle (its deadline lies ahead of the demo's "today", 2026-12-01). */
export const DEMO_CYCLE = {
  name: "2027A",
  description: "First semester of 2027: all three configurations on offer.",
  observingStart: "2027-03-01",
  observingEnd: "2027-08-31",
  submissionDeadline: new Date("2027-01-15T12:00:00Z"),
  offers: [
    { configurationName: "compact-3", nightsAvailable: 40 },
    { configurationName: "medium-4", nightsAvailable: 55 },
    { configurationName: "extended-6", nightsAvailable: 35 },
  ],
};

// ---------------------------------------------------------------- demo proposals

/** A target of a demo proposal: invented name, plausible southern-sky position, a model, magnitudes. */
export type DemoProposalTarget = {
  name: string;
  raDeg: number;
  decDeg: number;
  model: { type: string; [key: string]: unknown };
  magnitudes: Record<string, number>;
  minElevationDeg?: number;
  timeWindows?: { startUtc: string; endUtc: string; note?: string }[];
  calibrators?: { name: string; raDeg: number; decDeg: number; diameterMas?: number; magnitude?: number }[];
  notes?: string;
};

export type DemoProposal = {
  title: string;
  /** E-mail of the PI (one of DEMO_PEOPLE). */
  pi: string;
  /** Co-investigators by e-mail (demo people or invited addresses without an account). */
  coInvestigators: string[];
  status: "draft" | "submitted" | "under_review" | "accepted" | "waitlisted" | "declined" | "scheduled" | "withdrawn";
  scienceCategory: string;
  abstract: string;
  instrument: string;
  band: string;
  hours: Record<string, number>;
  targets: DemoProposalTarget[];
  /** Whether a (tiny, generated) science-case PDF is attached. */
  pdf: boolean;
  /** Submission instant of version 1 for everything past draft. */
  submittedAt?: string;
};

const INES = "ines.arroyo@valle-alto.example";
const TOMASZ = "tomasz.wierzbicki@baltic-stellar.example";
const AMARA = "amara.okafor@harmattan-obs.example";

/**
 * A dozen invented proposals for the demo cycle, one or more in every status. Titles, targets and
 * abstracts are made up; coordinates are plausible positions for a site at latitude −31.4°.
 */
export const DEMO_PROPOSALS: DemoProposal[] = [
  {
    title: "Limb darkening along the giant branch",
    pi: INES,
    coInvestigators: [TOMASZ],
    status: "draft",
    scienceCategory: "Stellar surfaces and diameters",
    abstract:
      "We will measure the strength of limb darkening of two red giants of different effective temperature, to test model atmospheres where they disagree most: in the second lobe of the visibility.",
    instrument: "Brasa",
    band: "H",
    hours: { "medium-4": 12 },
    targets: [
      {
        name: "Lumbre Nova 12",
        raDeg: 148.21,
        decDeg: -41.37,
        model: { type: "limbDarkenedDisk", diameterMas: 4.2, coefficient: 0.45 },
        magnitudes: { H: 1.9, K: 1.7 },
      },
      {
        name: "Cerro Ardiente 7",
        raDeg: 171.64,
        decDeg: -28.05,
        model: { type: "limbDarkenedDisk", diameterMas: 3.1, coefficient: 0.38 },
        magnitudes: { H: 2.6, K: 2.4 },
      },
    ],
    pdf: false,
  },
  {
    title: "Periastron passage of Quebrada Twin 9",
    pi: TOMASZ,
    coInvestigators: ["lucia.ferreyra@quebrada-obs.example"],
    status: "draft",
    scienceCategory: "Binary and multiple stars",
    abstract: "",
    instrument: "Brasa",
    band: "K",
    hours: { "extended-6": 8 },
    targets: [
      {
        name: "Quebrada Twin 9",
        raDeg: 203.48,
        decDeg: -52.9,
        model: { type: "binary", separationMas: 3.5, positionAngleDeg: 112, fluxRatio: 0.55 },
        magnitudes: { K: 4.1 },
        timeWindows: [
          { startUtc: "2027-05-02T00:00:00Z", endUtc: "2027-05-06T10:00:00Z", note: "periastron ± 2 days" },
        ],
      },
    ],
    pdf: false,
  },
  {
    title: "A dust ring around Altiplano Halo 5",
    pi: AMARA,
    coInvestigators: [],
    status: "draft",
    scienceCategory: "Circumstellar environments",
    abstract:
      "The mid-infrared excess of Altiplano Halo 5 suggests a ring of warm dust a few astronomical units across. Short baselines at 10 µm can tell a ring from a uniform envelope.",
    instrument: "Ascua",
    band: "N",
    hours: { "compact-3": 10 },
    targets: [
      {
        name: "Altiplano Halo 5",
        raDeg: 236.9,
        decDeg: -34.2,
        model: { type: "ring", diameterMas: 25 },
        magnitudes: { N: 0.8 },
      },
    ],
    pdf: false,
  },
  {
    title: "Diameters of cool dwarfs in the southern sky",
    pi: INES,
    coInvestigators: [AMARA],
    status: "submitted",
    scienceCategory: "Stellar surfaces and diameters",
    abstract:
      "Radii of M dwarfs disagree with evolutionary models by several per cent. We will measure the angular diameters of three nearby cool dwarfs on the longest baselines and combine them with parallaxes.",
    instrument: "Brasa",
    band: "H",
    hours: { "extended-6": 16 },
    targets: [
      {
        name: "Pampa Kite 3",
        raDeg: 164.12,
        decDeg: -45.6,
        model: { type: "uniformDisk", diameterMas: 0.9 },
        magnitudes: { H: 4.8 },
        calibrators: [{ name: "Pampa Cal A", raDeg: 166.03, decDeg: -44.1, diameterMas: 0.25, magnitude: 5.1 }],
      },
      {
        name: "Ojo Lento 16",
        raDeg: 199.5,
        decDeg: -38.22,
        model: { type: "uniformDisk", diameterMas: 1.2 },
        magnitudes: { H: 5.3 },
      },
      {
        name: "Sierra Glint 30",
        raDeg: 221.77,
        decDeg: -60.3,
        model: { type: "uniformDisk", diameterMas: 0.7 },
        magnitudes: { H: 5.9 },
        minElevationDeg: 40,
      },
    ],
    pdf: true,
    submittedAt: "2026-11-18T14:05:00Z",
  },
  {
    title: "Wind-blown envelope of Viento Ember 21",
    pi: TOMASZ,
    coInvestigators: [AMARA, "jonas.ekberg@saltmarsh.example"],
    status: "submitted",
    scienceCategory: "Evolved stars and mass loss",
    abstract:
      "The envelope of Viento Ember 21 changes shape between pulsation phases. Two configurations sample both its size and its departures from symmetry.",
    instrument: "Brasa",
    band: "K",
    hours: { "compact-3": 6, "medium-4": 10 },
    targets: [
      {
        name: "Viento Ember 21",
        raDeg: 256.4,
        decDeg: -24.81,
        model: { type: "gaussian", fwhmMas: 12 },
        magnitudes: { K: 0.9, H: 1.4 },
      },
    ],
    pdf: true,
    submittedAt: "2026-11-22T09:40:00Z",
  },
  {
    title: "Inner disc rims of two young stars",
    pi: AMARA,
    coInvestigators: [INES],
    status: "submitted",
    scienceCategory: "Young stellar objects and discs",
    abstract:
      "Near-infrared emission of young discs comes from their inner rims. We will measure the rim size of two stars of different luminosity to test the dust sublimation law.",
    instrument: "Brasa",
    band: "K",
    hours: { "medium-4": 14 },
    targets: [
      {
        name: "Nido Spark 19",
        raDeg: 246.31,
        decDeg: -24.4,
        model: { type: "gaussian", fwhmMas: 3.5 },
        magnitudes: { K: 6.2 },
      },
      {
        name: "Cumbre Shell 6",
        raDeg: 176.05,
        decDeg: -64.9,
        model: { type: "ring", diameterMas: 5 },
        magnitudes: { K: 6.8 },
      },
    ],
    pdf: true,
    submittedAt: "2026-11-25T17:12:00Z",
  },
  {
    title: "Spotted surface of Salar Veil 44",
    pi: INES,
    coInvestigators: [],
    status: "under_review",
    scienceCategory: "Stellar surfaces and diameters",
    abstract:
      "Closure phases on the extended configuration reveal asymmetric surfaces. We will look for a large cool spot on the active giant Salar Veil 44.",
    instrument: "Brasa",
    band: "H",
    hours: { "extended-6": 20 },
    targets: [
      {
        name: "Salar Veil 44",
        raDeg: 187.92,
        decDeg: -17.6,
        model: { type: "limbDarkenedDisk", diameterMas: 2.4, coefficient: 0.3 },
        magnitudes: { H: 3.2 },
      },
    ],
    pdf: true,
    submittedAt: "2026-11-10T11:00:00Z",
  },
  {
    title: "Dynamical masses of the Cinder Pair 2 system",
    pi: TOMASZ,
    coInvestigators: [INES],
    status: "accepted",
    scienceCategory: "Binary and multiple stars",
    abstract:
      "Resolving the inner pair of Cinder Pair 2 at three epochs fixes its orbit and, with the radial velocities, the masses of both stars to two per cent.",
    instrument: "Brasa",
    band: "H",
    hours: { "extended-6": 12, "medium-4": 6 },
    targets: [
      {
        name: "Cinder Pair 2",
        raDeg: 211.2,
        decDeg: -47.35,
        model: { type: "binary", separationMas: 6, positionAngleDeg: 48, fluxRatio: 0.7 },
        magnitudes: { H: 3.8 },
        calibrators: [{ name: "Cinder Cal B", raDeg: 213.4, decDeg: -46.9, diameterMas: 0.4 }],
      },
    ],
    pdf: true,
    submittedAt: "2026-11-05T08:30:00Z",
  },
  {
    title: "Asymmetries in the envelope of Mesa Drift 11",
    pi: AMARA,
    coInvestigators: [],
    status: "waitlisted",
    scienceCategory: "Evolved stars and mass loss",
    abstract:
      "Mesa Drift 11 ejects dust in episodes. A Gaussian envelope fit and its closure phases will show whether the latest ejection is one-sided.",
    instrument: "Brasa",
    band: "K",
    hours: { "medium-4": 9 },
    targets: [
      {
        name: "Mesa Drift 11",
        raDeg: 272.15,
        decDeg: -29.7,
        model: { type: "gaussian", fwhmMas: 8 },
        magnitudes: { K: 2.3 },
      },
    ],
    pdf: true,
    submittedAt: "2026-11-12T16:45:00Z",
  },
  {
    title: "The hot-dust core of Puna Lantern 8",
    pi: INES,
    coInvestigators: [TOMASZ],
    status: "declined",
    scienceCategory: "Active galactic nuclei",
    abstract:
      "We ask for the longest baselines to resolve the hot dust around the nucleus of the galaxy Puna Lantern 8, expected at about a milliarcsecond.",
    instrument: "Brasa",
    band: "K",
    hours: { "extended-6": 30 },
    targets: [
      {
        name: "Puna Lantern 8",
        raDeg: 201.37,
        decDeg: -43.02,
        model: { type: "gaussian", fwhmMas: 0.8 },
        magnitudes: { K: 9.6 },
      },
    ],
    pdf: true,
    submittedAt: "2026-11-08T13:20:00Z",
  },
  {
    title: "Rotational flattening of Brasa Echo 14",
    pi: TOMASZ,
    coInvestigators: [],
    status: "scheduled",
    scienceCategory: "Stellar surfaces and diameters",
    abstract:
      "A fast rotator looks elongated. Baselines at many position angles measure the ratio of its polar and equatorial diameters.",
    instrument: "Brasa",
    band: "H",
    hours: { "extended-6": 10 },
    targets: [
      {
        name: "Brasa Echo 14",
        raDeg: 219.9,
        decDeg: -60.8,
        model: { type: "uniformDisk", diameterMas: 1.6 },
        magnitudes: { H: 2.2 },
      },
    ],
    pdf: true,
    submittedAt: "2026-11-02T10:10:00Z",
  },
  {
    title: "Cold wind of Ventana Fria 27",
    pi: AMARA,
    coInvestigators: [TOMASZ],
    status: "withdrawn",
    scienceCategory: "Circumstellar environments",
    abstract:
      "A slow, cold wind shows at 10 µm as an extended halo. We withdrew this request to combine it with a later one.",
    instrument: "Ascua",
    band: "N",
    hours: { "compact-3": 8 },
    targets: [
      {
        name: "Ventana Fria 27",
        raDeg: 159.6,
        decDeg: -58.1,
        model: { type: "gaussian", fwhmMas: 30 },
        magnitudes: { N: 1.5 },
      },
    ],
    pdf: true,
    submittedAt: "2026-11-15T15:00:00Z",
  },
];
