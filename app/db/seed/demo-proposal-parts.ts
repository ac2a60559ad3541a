/**
 * The parts of a demo proposal: its types and small builders for
 * targets, source models, calibrators and the committee's decisions. Invented throughout.
 */
import type { DemoCycleKey } from "./demo-cycles";

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

type DemoModel = DemoProposalTarget["model"];
type DemoCalibrator = NonNullable<DemoProposalTarget["calibrators"]>[number];

/** Uniform disk of `diameterMas` milliarcseconds. */
export const disk = (diameterMas: number): DemoModel => ({ type: "uniformDisk", diameterMas });
/** Gaussian of full width at half maximum `fwhmMas` milliarcseconds. */
export const gaussian = (fwhmMas: number): DemoModel => ({ type: "gaussian", fwhmMas });
/** Thin ring of `diameterMas` milliarcseconds. */
export const ring = (diameterMas: number): DemoModel => ({ type: "ring", diameterMas });
/** Limb-darkened disk of `diameterMas` milliarcseconds with a linear coefficient. */
export const limbDarkened = (diameterMas: number, coefficient: number): DemoModel => ({
  type: "limbDarkenedDisk",
  diameterMas,
  coefficient,
});
/** Two point sources `separationMas` apart at `positionAngleDeg` east of north, the companion `fluxRatio` as bright. */
export const binary = (separationMas: number, positionAngleDeg: number, fluxRatio: number): DemoModel => ({
  type: "binary",
  separationMas,
  positionAngleDeg,
  fluxRatio,
});

/** A calibrator `dRaDeg`, `dDecDeg` degrees from its target; diameter (mas) and magnitude when known. */
export function calibrator(
  name: string,
  dRaDeg: number,
  dDecDeg: number,
  diameterMas?: number,
  magnitude?: number,
): DemoCalibrator {
  return {
    name,
    dRaDeg,
    dDecDeg,
    ...(diameterMas === undefined ? {} : { diameterMas }),
    ...(magnitude === undefined ? {} : { magnitude }),
  };
}

/**
 * One target: `raOffsetH` hours from the right ascension on the meridian at local midnight of the middle
 * night, `decDeg` degrees, its model and magnitudes by band; elevation limit, windows, calibrators in `more`.
 */
export function target(
  name: string,
  raOffsetH: number,
  decDeg: number,
  model: DemoModel,
  magnitudes: Record<string, number>,
  more: Pick<DemoProposalTarget, "minElevationDeg" | "timeWindows" | "calibrators" | "notes"> = {},
): DemoProposalTarget {
  return { name, raOffsetH, decDeg, model, magnitudes, ...more };
}

/** The committee accepts with `hours` per configuration and a final grade (1 … 5). */
export const accept = (hours: Record<string, number>, grade: number, message: string): DemoDecision => ({
  kind: "accept",
  hours,
  grade,
  message,
});
/** The committee puts the proposal on the waiting list with a final grade (1 … 5). */
export const waitlist = (grade: number, message: string): DemoDecision => ({ kind: "waitlist", grade, message });
/** The committee declines with a final grade (1 … 5). */
export const decline = (grade: number, message: string): DemoDecision => ({ kind: "decline", grade, message });

/** A demo proposal as written in its cycle's list: the cycle and what its defaults say are left out. */
export type DemoEntry = Omit<DemoProposal, "cycle" | "instrument" | "pdf" | "status"> &
  Partial<Pick<DemoProposal, "instrument" | "pdf" | "status">>;

/** The proposals of one demo cycle: on Brasa unless an entry names another instrument, status and PDF as `defaults`. */
export function inCycle(
  cycle: DemoCycleKey,
  defaults: Pick<DemoProposal, "status" | "pdf">,
  entries: DemoEntry[],
): DemoProposal[] {
  return entries.map((e) => ({ instrument: "Brasa", ...defaults, ...e, cycle }));
}

/** Who writes a demo proposal: its title, PI, co-investigators (e-mails) and science category. */
type Heading = [title: string, pi: string, coInvestigators: string[], scienceCategory: string];
/** What it asks for: the band and the hours per configuration. */
type Ask = [band: string, hours: Record<string, number>];
type Outcome = Partial<Pick<DemoProposal, "instrument" | "pdf" | "status">> &
  Pick<DemoProposal, "submittedDaysBeforeDeadline" | "quality" | "decision">;

/** One entry of a cycle's list: heading, abstract, request, targets, then what differs from the cycle's defaults. */
export function entry(
  [title, pi, coInvestigators, scienceCategory]: Heading,
  abstract: string,
  [band, hours]: Ask,
  targets: DemoProposalTarget[],
  outcome: Outcome = {},
): DemoEntry {
  return { title, pi, coInvestigators, scienceCategory, abstract, band, hours, targets, ...outcome };
}
