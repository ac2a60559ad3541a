/**
 * The demo proposals (invented titles, people's requests, targets and abstracts), one list per demo
 * cycle. Positions move with the cycle: a target's right ascension is given as hours from the right
 * ascension on the meridian at local midnight of the cycle's middle night, so every target is up at night
 * in its cycle whenever the demo is loaded; time windows are days after the cycle's first night.
 */
import type { DemoCycleKey } from "./demo-cycles";
import { REVIEW_PROPOSALS } from "./demo-proposals-review";

export type DemoProposalTarget = {
  name: string;
  /** Hours east (+) or west (−) of the right ascension transiting at local midnight of the middle night. */
  raOffsetH: number;
  decDeg: number;
  model: { type: string; [key: string]: unknown };
  magnitudes: Record<string, number>;
  minElevationDeg?: number;
  /** Days after the cycle's first night (00:00 UTC), with a note. */
  timeWindows?: { startDay: number; endDay: number; note?: string }[];
  /** Offsets from the target in degrees. */
  calibrators?: { name: string; dRaDeg: number; dDecDeg: number; diameterMas?: number; magnitude?: number }[];
  notes?: string;
};

/** The committee's outcome of a proposal of the decided cycle. */
export type DemoDecision = {
  kind: "accept" | "waitlist" | "decline";
  /** Hours granted per configuration (accepted ones). */
  hours?: Record<string, number>;
  message: string;
  /** The chair's final grade on the 1 … 5 scale. */
  grade: number;
};

export type DemoProposal = {
  cycle: DemoCycleKey;
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
  /** For everything past draft: days before the cycle's deadline version 1 was submitted. */
  submittedDaysBeforeDeadline?: number;
  /** How good the committee finds it, 1 (best) … 5: the seed's reviewers score around it. */
  quality?: number;
  decision?: DemoDecision;
};

export const INES = "ines.arroyo@valle-alto.example";
export const TOMASZ = "tomasz.wierzbicki@baltic-stellar.example";
export const AMARA = "amara.okafor@harmattan-obs.example";
export const OSKAR = "oskar.lindfors@saltmarsh.example";

const CURRENT: DemoProposal[] = [
  {
    cycle: "current",
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
        raOffsetH: -1.5,
        decDeg: -47.35,
        model: { type: "binary", separationMas: 6, positionAngleDeg: 48, fluxRatio: 0.7 },
        magnitudes: { H: 3.8 },
        calibrators: [{ name: "Cinder Cal B", dRaDeg: 2.2, dDecDeg: 0.45, diameterMas: 0.4 }],
      },
    ],
    pdf: true,
    submittedDaysBeforeDeadline: 10,
    quality: 1.4,
    decision: {
      kind: "accept",
      hours: { "extended-6": 12, "medium-4": 6 },
      grade: 1.3,
      message: "Granted in full. Please plan the three epochs at least three weeks apart.",
    },
  },
  {
    cycle: "current",
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
        raOffsetH: 0.8,
        decDeg: -38.8,
        model: { type: "uniformDisk", diameterMas: 1.6 },
        magnitudes: { H: 2.2 },
      },
    ],
    pdf: true,
    submittedDaysBeforeDeadline: 13,
    quality: 1.9,
    decision: { kind: "accept", hours: { "extended-6": 10 }, grade: 1.8, message: "" },
  },
  {
    cycle: "current",
    title: "Pulsation-phase diameters of Cerro Pulso 6",
    pi: INES,
    coInvestigators: [],
    status: "accepted",
    scienceCategory: "Evolved stars and mass loss",
    abstract:
      "Measuring the diameter of a pulsating giant at four phases gives its distance through the ratio of angular to linear pulsation.",
    instrument: "Brasa",
    band: "K",
    hours: { "medium-4": 8 },
    targets: [
      {
        name: "Cerro Pulso 6",
        raOffsetH: 2.1,
        decDeg: -35.6,
        model: { type: "uniformDisk", diameterMas: 3.4 },
        magnitudes: { K: 1.1, H: 1.6 },
      },
    ],
    pdf: true,
    submittedDaysBeforeDeadline: 4,
    quality: 2.2,
    decision: { kind: "accept", hours: { "medium-4": 8 }, grade: 2.1, message: "Observe the four phases in order." },
  },
  {
    cycle: "current",
    title: "Surface of the supergiant Ventisca Roja 1",
    pi: OSKAR,
    coInvestigators: [],
    status: "accepted",
    scienceCategory: "Stellar surfaces and diameters",
    abstract:
      "Convection cells on a red supergiant are a few tenths of its radius across. Short and long baselines together map their contrast.",
    instrument: "Brasa",
    band: "H",
    hours: { "compact-3": 6, "extended-6": 8 },
    targets: [
      {
        name: "Ventisca Roja 1",
        raOffsetH: -2.6,
        decDeg: -26.4,
        model: { type: "limbDarkenedDisk", diameterMas: 9.5, coefficient: 0.5 },
        magnitudes: { H: -1.2 },
      },
    ],
    pdf: true,
    submittedDaysBeforeDeadline: 2,
    quality: 2.6,
    decision: {
      kind: "accept",
      hours: { "compact-3": 6, "extended-6": 5 },
      grade: 2.5,
      message: "The extended configuration is oversubscribed at this LST: 5 of the 8 h requested could be granted.",
    },
  },
  {
    cycle: "current",
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
        raOffsetH: 1.9,
        decDeg: -29.7,
        model: { type: "gaussian", fwhmMas: 8 },
        magnitudes: { K: 2.3 },
      },
    ],
    pdf: true,
    submittedDaysBeforeDeadline: 6,
    quality: 3.1,
    decision: {
      kind: "waitlist",
      grade: 3.0,
      message: "First on the waiting list for medium-4: you will hear from the schedulers if time frees up.",
    },
  },
  {
    cycle: "current",
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
        raOffsetH: -0.4,
        decDeg: -43.02,
        model: { type: "gaussian", fwhmMas: 0.8 },
        magnitudes: { K: 9.6 },
      },
    ],
    pdf: true,
    submittedDaysBeforeDeadline: 8,
    quality: 4.3,
    decision: {
      kind: "decline",
      grade: 4.2,
      message:
        "The nucleus is fainter than the K-band limit of the combiner; the committee could not see how to fringe-track on it.",
    },
  },
];

const OPEN: DemoProposal[] = [
  {
    cycle: "open",
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
        raOffsetH: -1.2,
        decDeg: -41.37,
        model: { type: "limbDarkenedDisk", diameterMas: 4.2, coefficient: 0.45 },
        magnitudes: { H: 1.9, K: 1.7 },
      },
      {
        name: "Cerro Ardiente 7",
        raOffsetH: 0.4,
        decDeg: -28.05,
        model: { type: "limbDarkenedDisk", diameterMas: 3.1, coefficient: 0.38 },
        magnitudes: { H: 2.6, K: 2.4 },
      },
    ],
    pdf: false,
  },
  {
    cycle: "open",
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
        raOffsetH: 1.1,
        decDeg: -42.9,
        model: { type: "binary", separationMas: 3.5, positionAngleDeg: 112, fluxRatio: 0.55 },
        magnitudes: { K: 4.1 },
        timeWindows: [{ startDay: 61, endDay: 65, note: "periastron ± 2 days" }],
      },
    ],
    pdf: false,
  },
  {
    cycle: "open",
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
        raOffsetH: 2.4,
        decDeg: -34.2,
        model: { type: "ring", diameterMas: 25 },
        magnitudes: { N: 0.8 },
      },
    ],
    pdf: false,
  },
  {
    cycle: "open",
    title: "Starspots of the young Sol Naciente 2",
    pi: OSKAR,
    coInvestigators: [],
    status: "submitted",
    scienceCategory: "Young stellar objects and discs",
    abstract:
      "A young, active star rotates in under three days. Closure phases on consecutive nights follow its spots around.",
    instrument: "Brasa",
    band: "H",
    hours: { "extended-6": 10 },
    targets: [
      {
        name: "Sol Naciente 2",
        raOffsetH: -0.7,
        decDeg: -38.9,
        model: { type: "uniformDisk", diameterMas: 0.9 },
        magnitudes: { H: 5.6 },
      },
    ],
    pdf: true,
    submittedDaysBeforeDeadline: 20,
  },
];

/** Every demo proposal: the decided cycle's, the cycle under review's, the open cycle's. */
export const DEMO_PROPOSALS: DemoProposal[] = [...CURRENT, ...REVIEW_PROPOSALS, ...OPEN];
