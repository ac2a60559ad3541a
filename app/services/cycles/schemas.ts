/**
 * The fields of a cycle, written once: valibot rules per field, composed into the form schema, and
 * the shapes of the form's values and of the checked input. Dates are calendar dates (YYYY-MM-DD);
 * the deadline is given and shown in UTC.
 */
import * as v from "valibot";
import { labelledText, requiredText } from "~/lib/text-fields";

/** A calendar date that exists ("2027-02-30" does not). */
export const IsoDate = (label: string) =>
  v.pipe(
    v.string(),
    v.regex(/^\d{4}-\d{2}-\d{2}$/, `${label}: use the form YYYY-MM-DD`),
    v.check(
      (s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s),
      `${label}: not a real date`,
    ),
  );

export const CycleName = requiredText(40, {
  empty: "Name: give the cycle a name, e.g. 2027B",
  tooLong: "Name: at most 40 characters",
});

export const CycleDescription = labelledText("Description", 500);

/** The `datetime-local` value of the deadline, read as UTC. */
export const SubmissionDeadline = v.pipe(
  v.string(),
  v.regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, "Deadline: give a date and time (UTC)"),
  v.transform((s) => new Date(`${s}:00Z`)),
  v.check((d) => !Number.isNaN(d.getTime()), "Deadline: not a real date and time"),
);

/** Nights a configuration is on offer: empty for "not fixed", else 0 … 366. */
export const NightsAvailable = v.pipe(
  v.string(),
  v.trim(),
  v.transform((s) => (s === "" ? null : Number(s))),
  v.check((n) => n === null || (Number.isFinite(n) && n >= 0 && n <= 366), "Nights: a number from 0 to 366"),
);

/** The review deadline's `datetime-local` value, read as UTC; empty for "not set yet". */
export const ReviewDeadline = v.pipe(
  v.string(),
  v.trim(),
  v.check((s) => s === "" || /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/.test(s), "Review deadline: give a date and time (UTC)"),
  v.transform((s) => (s === "" ? null : new Date(`${s}:00Z`))),
  v.check((d) => d === null || !Number.isNaN(d.getTime()), "Review deadline: not a real date and time"),
);

/** The decision date; empty for "not set yet". */
export const DecisionDate = v.pipe(
  v.string(),
  v.trim(),
  v.check(
    (s) =>
      s === "" ||
      (/^\d{4}-\d{2}-\d{2}$/.test(s) &&
        !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) &&
        new Date(`${s}T00:00:00Z`).toISOString().startsWith(s)),
    "Decision date: use the form YYYY-MM-DD",
  ),
  v.transform((s) => (s === "" ? null : s)),
);

/** Widest score scale the forms offer: at most this many steps between its ends. */
export const MAX_SCALE_STEPS = 20;

/** One end of the score scale: a whole number 0 … 100. */
export const ScoreEnd = (label: string) =>
  v.pipe(
    v.string(),
    v.trim(),
    v.check((s) => /^\d{1,3}$/.test(s) && Number(s) <= 100, `${label}: a whole number from 0 to 100`),
    v.transform(Number),
  );

export const CycleFormSchema = v.object({
  name: CycleName,
  description: CycleDescription,
  observingStart: IsoDate("First night"),
  observingEnd: IsoDate("Last night"),
  submissionDeadline: SubmissionDeadline,
  reviewDeadline: ReviewDeadline,
  decisionDate: DecisionDate,
  scoreBest: ScoreEnd("Best score"),
  scoreWorst: ScoreEnd("Poorest score"),
});

/** The form as typed (shown again on error): `offered` configuration ids, `nights` by configuration id. */
export type CycleFormValues = {
  name: string;
  description: string;
  observingStart: string;
  observingEnd: string;
  submissionDeadline: string;
  reviewDeadline: string;
  decisionDate: string;
  scoreBest: string;
  scoreWorst: string;
  offered: string[];
  nights: Record<string, string>;
  /** User ids of the committee's members. */
  committee: string[];
};

/** The committee's part of a cycle: dates of the review, the score scale and the members. */
export type CommitteeFields = {
  reviewDeadline: Date | null;
  decisionDate: string | null;
  scoreBest: number;
  scoreWorst: number;
  /** User ids of the committee's members. */
  committee: number[];
};

/**
 * A checked cycle, as the chair's form and the seed write it. The committee's fields may be left out
 * by writers that know nothing of the committee (they keep their defaults: no deadlines, scale 1 … 5,
 * no members; on update, what is stored).
 */
export type CycleInput = Omit<v.InferOutput<typeof CycleFormSchema>, keyof CommitteeFields> &
  Partial<CommitteeFields> & {
    offers: { configurationId: number; nightsAvailable: number | null }[];
  };
