/**
 * The demo cycle under review: thirteen submitted proposals (and one withdrawn) that the committee is
 * reading, several with a reviewer on the team or from the same institute. Invented throughout.
 */
import type { DemoProposal } from "./demo-proposals";

const INES = "ines.arroyo@valle-alto.example";
const TOMASZ = "tomasz.wierzbicki@baltic-stellar.example";
const AMARA = "amara.okafor@harmattan-obs.example";
const OSKAR = "oskar.lindfors@saltmarsh.example";

type Entry = Omit<DemoProposal, "cycle" | "instrument" | "pdf" | "status"> &
  Partial<Pick<DemoProposal, "instrument" | "status">>;

const ENTRIES: Entry[] = [
  {
    title: "Diameters of cool dwarfs in the southern sky",
    pi: INES,
    coInvestigators: [AMARA],
    scienceCategory: "Stellar surfaces and diameters",
    abstract:
      "Radii of M dwarfs disagree with evolutionary models by several per cent. We will measure the angular diameters of three nearby cool dwarfs on the longest baselines and combine them with parallaxes.",
    band: "H",
    hours: { "extended-6": 16 },
    targets: [
      {
        name: "Pampa Kite 3",
        raOffsetH: -2.2,
        decDeg: -45.6,
        model: { type: "uniformDisk", diameterMas: 0.9 },
        magnitudes: { H: 4.8 },
        calibrators: [{ name: "Pampa Cal A", dRaDeg: 1.9, dDecDeg: 1.5, diameterMas: 0.25, magnitude: 5.1 }],
      },
      {
        name: "Ojo Lento 16",
        raOffsetH: 0.1,
        decDeg: -38.22,
        model: { type: "uniformDisk", diameterMas: 1.2 },
        magnitudes: { H: 5.3 },
      },
      {
        name: "Sierra Glint 30",
        raOffsetH: 1.6,
        decDeg: -42.3,
        model: { type: "uniformDisk", diameterMas: 0.7 },
        magnitudes: { H: 5.9 },
        minElevationDeg: 40,
      },
    ],
    submittedDaysBeforeDeadline: 12,
    quality: 1.8,
  },
  {
    title: "Wind-blown envelope of Viento Ember 21",
    pi: TOMASZ,
    coInvestigators: [AMARA, "jonas.ekberg@saltmarsh.example"],
    scienceCategory: "Evolved stars and mass loss",
    abstract:
      "The envelope of Viento Ember 21 changes shape between pulsation phases. Two configurations sample both its size and its departures from symmetry.",
    band: "K",
    hours: { "compact-3": 6, "medium-4": 10 },
    targets: [
      {
        name: "Viento Ember 21",
        raOffsetH: 2.3,
        decDeg: -24.81,
        model: { type: "gaussian", fwhmMas: 12 },
        magnitudes: { K: 0.9, H: 1.4 },
      },
    ],
    submittedDaysBeforeDeadline: 6,
    quality: 2.4,
  },
  {
    title: "Inner disc rims of two young stars",
    pi: AMARA,
    coInvestigators: [INES],
    scienceCategory: "Young stellar objects and discs",
    abstract:
      "Near-infrared emission of young discs comes from their inner rims. We will measure the rim size of two stars of different luminosity to test the dust sublimation law.",
    band: "K",
    hours: { "medium-4": 14 },
    targets: [
      {
        name: "Nido Spark 19",
        raOffsetH: 1.2,
        decDeg: -24.4,
        model: { type: "gaussian", fwhmMas: 3.5 },
        magnitudes: { K: 6.2 },
      },
      {
        name: "Cumbre Shell 6",
        raOffsetH: -3.1,
        decDeg: -64.9,
        model: { type: "ring", diameterMas: 5 },
        magnitudes: { K: 6.8 },
      },
    ],
    submittedDaysBeforeDeadline: 3,
    quality: 2.0,
  },
  {
    title: "Spotted surface of Salar Veil 44",
    pi: INES,
    coInvestigators: [],
    scienceCategory: "Stellar surfaces and diameters",
    abstract:
      "Closure phases on the extended configuration reveal asymmetric surfaces. We will look for a large cool spot on the active giant Salar Veil 44.",
    band: "H",
    hours: { "extended-6": 20 },
    targets: [
      {
        name: "Salar Veil 44",
        raOffsetH: -0.6,
        decDeg: -17.6,
        model: { type: "limbDarkenedDisk", diameterMas: 2.4, coefficient: 0.3 },
        magnitudes: { H: 3.2 },
      },
    ],
    submittedDaysBeforeDeadline: 20,
    quality: 2.9,
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
        raOffsetH: -2.8,
        decDeg: -58.1,
        model: { type: "gaussian", fwhmMas: 30 },
        magnitudes: { N: 1.5 },
      },
    ],
    submittedDaysBeforeDeadline: 15,
  },
  {
    title: "Mass loss of the carbon star Hollín 3",
    pi: TOMASZ,
    coInvestigators: [],
    scienceCategory: "Evolved stars and mass loss",
    abstract:
      "The dust shell of a carbon star grows between cycles; its size in K against H gives the condensation radius.",
    band: "K",
    hours: { "medium-4": 8 },
    targets: [
      {
        name: "Hollín 3",
        raOffsetH: 0.9,
        decDeg: -33.1,
        model: { type: "gaussian", fwhmMas: 6.5 },
        magnitudes: { K: 1.8 },
      },
    ],
    submittedDaysBeforeDeadline: 2,
    quality: 3.3,
  },
  {
    title: "A close companion to Faro Azul 17",
    pi: OSKAR,
    coInvestigators: [],
    scienceCategory: "Binary and multiple stars",
    abstract:
      "Lunar-occultation hints of a companion at 4 mas. The extended configuration can confirm it and measure its flux ratio.",
    band: "H",
    hours: { "extended-6": 12 },
    targets: [
      {
        name: "Faro Azul 17",
        raOffsetH: -1.4,
        decDeg: -20.3,
        model: { type: "binary", separationMas: 4, positionAngleDeg: 210, fluxRatio: 0.2 },
        magnitudes: { H: 4.4 },
      },
    ],
    submittedDaysBeforeDeadline: 9,
    quality: 2.2,
  },
  {
    title: "Limb-darkening law of Arena Clara 2",
    pi: INES,
    coInvestigators: [OSKAR],
    scienceCategory: "Stellar surfaces and diameters",
    abstract: "A bright dwarf measured in the second visibility lobe separates linear from power-law limb darkening.",
    band: "H",
    hours: { "medium-4": 10 },
    targets: [
      {
        name: "Arena Clara 2",
        raOffsetH: 3.0,
        decDeg: -41.0,
        model: { type: "limbDarkenedDisk", diameterMas: 2.9, coefficient: 0.35 },
        magnitudes: { H: 1.5 },
      },
    ],
    submittedDaysBeforeDeadline: 1,
    quality: 3.6,
  },
  {
    title: "Dust shells of two Mira variables",
    pi: AMARA,
    coInvestigators: [],
    scienceCategory: "Evolved stars and mass loss",
    abstract: "Two Miras at opposite phases: their shells at 10 µm against their photospheres in K.",
    band: "K",
    hours: { "compact-3": 10, "medium-4": 6 },
    targets: [
      {
        name: "Niebla Larga 5",
        raOffsetH: -0.2,
        decDeg: -49.5,
        model: { type: "gaussian", fwhmMas: 14 },
        magnitudes: { K: 0.2 },
      },
      {
        name: "Niebla Corta 8",
        raOffsetH: 2.7,
        decDeg: -30.8,
        model: { type: "gaussian", fwhmMas: 10 },
        magnitudes: { K: 0.6 },
      },
    ],
    submittedDaysBeforeDeadline: 5,
    quality: 3.0,
  },
  {
    title: "Imaging the spots of Brasero 9",
    pi: OSKAR,
    coInvestigators: [INES],
    scienceCategory: "Stellar surfaces and diameters",
    abstract:
      "An image of a spotted giant needs many baselines and triangles: we ask for six nights on the extended configuration to reconstruct its surface.",
    band: "H",
    hours: { "extended-6": 24 },
    targets: [
      {
        name: "Brasero 9",
        raOffsetH: 0.4,
        decDeg: -44.2,
        model: { type: "limbDarkenedDisk", diameterMas: 3.8, coefficient: 0.4 },
        magnitudes: { H: 2.0 },
      },
    ],
    submittedDaysBeforeDeadline: 4,
    quality: 1.6,
  },
  {
    title: "Orbit of the triple Tres Lomas 5",
    pi: TOMASZ,
    coInvestigators: [OSKAR],
    scienceCategory: "Binary and multiple stars",
    abstract:
      "The outer pair of a hierarchical triple at two epochs, the inner pair resolved on the longest baselines.",
    band: "H",
    hours: { "extended-6": 14, "medium-4": 4 },
    targets: [
      {
        name: "Tres Lomas 5",
        raOffsetH: -1.9,
        decDeg: -46.4,
        model: { type: "binary", separationMas: 8, positionAngleDeg: 75, fluxRatio: 0.45 },
        magnitudes: { H: 3.9 },
      },
    ],
    submittedDaysBeforeDeadline: 7,
    quality: 2.5,
  },
  {
    title: "Gas disc of the Be star Alba Fria 22",
    pi: INES,
    coInvestigators: [],
    scienceCategory: "Circumstellar environments",
    abstract:
      "The decretion disc of a Be star is elongated; its extent in K across position angles gives its inclination.",
    band: "K",
    hours: { "medium-4": 12, "compact-3": 4 },
    targets: [
      {
        name: "Alba Fria 22",
        raOffsetH: 1.7,
        decDeg: -27.9,
        model: { type: "gaussian", fwhmMas: 2.8 },
        magnitudes: { K: 3.7 },
      },
    ],
    submittedDaysBeforeDeadline: 10,
    quality: 2.8,
  },
  {
    title: "Angular diameters of hot subdwarfs",
    pi: OSKAR,
    coInvestigators: [],
    scienceCategory: "Stellar surfaces and diameters",
    abstract:
      "Two hot subdwarfs are at the edge of what the longest baselines resolve; even upper limits constrain their radii.",
    band: "H",
    hours: { "extended-6": 8 },
    targets: [
      {
        name: "Chispa Blanca 1",
        raOffsetH: -3.3,
        decDeg: -36.7,
        model: { type: "uniformDisk", diameterMas: 0.35 },
        magnitudes: { H: 6.9 },
      },
    ],
    submittedDaysBeforeDeadline: 3,
    quality: 4.1,
  },
  {
    title: "The ring of the young star Cuna Helada 13",
    pi: AMARA,
    coInvestigators: [OSKAR],
    scienceCategory: "Young stellar objects and discs",
    abstract: "A transition disc with a cleared cavity: short baselines at 10 µm see the ring, K band the inner rim.",
    instrument: "Ascua",
    band: "N",
    hours: { "compact-3": 8, "medium-4": 6 },
    targets: [
      {
        name: "Cuna Helada 13",
        raOffsetH: 2.0,
        decDeg: -52.0,
        model: { type: "ring", diameterMas: 18 },
        magnitudes: { N: 1.2 },
      },
    ],
    submittedDaysBeforeDeadline: 8,
    quality: 2.6,
  },
];

export const REVIEW_PROPOSALS: DemoProposal[] = ENTRIES.map((e) => ({
  instrument: "Brasa",
  status: "under_review",
  pdf: true,
  ...e,
  cycle: "review",
}));
