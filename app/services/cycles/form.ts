/**
 * Validation of the cycle form (pure): field errors keyed by field name, the parsed input otherwise.
 * Dates are calendar dates (YYYY-MM-DD); the deadline is given and shown in UTC.
 */
import * as v from "valibot";

const isoDate = (label: string) =>
  v.pipe(
    v.string(),
    v.regex(/^\d{4}-\d{2}-\d{2}$/, `${label}: use the form YYYY-MM-DD`),
    v.check(
      (s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s),
      `${label}: not a real date`,
    ),
  );

const CycleFormSchema = v.object({
  name: v.pipe(
    v.string(),
    v.trim(),
    v.nonEmpty("Name: give the cycle a name, e.g. 2027B"),
    v.maxLength(40, "Name: at most 40 characters"),
  ),
  description: v.pipe(v.string(), v.trim(), v.maxLength(500, "Description: at most 500 characters")),
  observingStart: isoDate("First night"),
  observingEnd: isoDate("Last night"),
  submissionDeadline: v.pipe(
    v.string(),
    v.regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, "Deadline: give a date and time (UTC)"),
    v.transform((s) => new Date(`${s}:00Z`)),
    v.check((d) => !Number.isNaN(d.getTime()), "Deadline: not a real date and time"),
  ),
});

export type CycleFormValues = {
  name: string;
  description: string;
  observingStart: string;
  observingEnd: string;
  submissionDeadline: string;
  offered: string[];
  nights: Record<string, string>;
};

export type ParsedCycleForm = {
  name: string;
  description: string;
  observingStart: string;
  observingEnd: string;
  submissionDeadline: Date;
  offers: { configurationId: number; nightsAvailable: number | null }[];
};

/** Reads the submitted form (FormData-like) into plain values, so they can be shown again on error. */
export function cycleFormValues(
  form: { get(name: string): unknown; getAll(name: string): unknown[] },
  configurationIds: number[],
): CycleFormValues {
  const str = (k: string) => {
    const x = form.get(k);
    return typeof x === "string" ? x : "";
  };
  const nights: Record<string, string> = {};
  for (const id of configurationIds) nights[id] = str(`nights-${id}`);
  return {
    name: str("name"),
    description: str("description"),
    observingStart: str("observingStart"),
    observingEnd: str("observingEnd"),
    submissionDeadline: str("submissionDeadline"),
    offered: form.getAll("offered").filter((x): x is string => typeof x === "string"),
    nights,
  };
}

export function parseCycleForm(
  values: CycleFormValues,
  configurationIds: number[],
): { ok: true; value: ParsedCycleForm } | { ok: false; errors: Record<string, string> } {
  const errors: Record<string, string> = {};
  const parsed = v.safeParse(CycleFormSchema, values);
  if (!parsed.success) {
    for (const issue of parsed.issues) {
      const key = issue.path?.[0]?.key as string | undefined;
      if (key && !errors[key]) errors[key] = issue.message;
    }
  }
  const offers: ParsedCycleForm["offers"] = [];
  for (const raw of values.offered) {
    const id = Number(raw);
    if (!configurationIds.includes(id)) {
      errors.offered = "Configurations: one of the chosen configurations does not exist";
      continue;
    }
    const text = (values.nights[id] ?? "").trim();
    let nightsAvailable: number | null = null;
    if (text !== "") {
      const n = Number(text);
      if (!Number.isFinite(n) || n < 0 || n > 366) errors[`nights-${id}`] = "Nights: a number from 0 to 366";
      else nightsAvailable = n;
    }
    offers.push({ configurationId: id, nightsAvailable });
  }
  if (offers.length === 0 && !errors.offered) errors.offered = "Configurations: offer at least one configuration";
  if (parsed.success) {
    const { observingStart, observingEnd, submissionDeadline } = parsed.output;
    if (observingEnd < observingStart) errors.observingEnd = "Last night: must not be before the first night";
    if (submissionDeadline.getTime() >= Date.parse(`${observingStart}T00:00:00Z`)) {
      errors.submissionDeadline = "Deadline: must fall before the first night of the cycle";
    }
  }
  if (Object.keys(errors).length || !parsed.success) return { ok: false, errors };
  return { ok: true, value: { ...parsed.output, offers } };
}

/** `Date` → the `datetime-local` value in UTC ("2027-01-15T12:00"). */
export function toUtcInput(d: Date): string {
  return d.toISOString().slice(0, 16);
}
