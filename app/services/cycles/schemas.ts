/**
 * The fields of a cycle, written once: valibot rules per field, composed into the form schema, and
 * the shapes of the form's values and of the checked input. Dates are calendar dates (YYYY-MM-DD);
 * the deadline is given and shown in UTC.
 */
import * as v from "valibot";

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

export const CycleName = v.pipe(
  v.string(),
  v.trim(),
  v.nonEmpty("Name: give the cycle a name, e.g. 2027B"),
  v.maxLength(40, "Name: at most 40 characters"),
);

export const CycleDescription = v.pipe(v.string(), v.trim(), v.maxLength(500, "Description: at most 500 characters"));

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

export const CycleFormSchema = v.object({
  name: CycleName,
  description: CycleDescription,
  observingStart: IsoDate("First night"),
  observingEnd: IsoDate("Last night"),
  submissionDeadline: SubmissionDeadline,
});

/** The form as typed (shown again on error): `offered` configuration ids, `nights` by configuration id. */
export type CycleFormValues = {
  name: string;
  description: string;
  observingStart: string;
  observingEnd: string;
  submissionDeadline: string;
  offered: string[];
  nights: Record<string, string>;
};

/** A checked cycle, as the chair's form and the seed write it. */
export type CycleInput = v.InferOutput<typeof CycleFormSchema> & {
  offers: { configurationId: number; nightsAvailable: number | null }[];
};
