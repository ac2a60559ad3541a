/**
 * The cycle form (pure): its values as typed, and the check that turns them into a `CycleInput` or
 * field errors keyed by field name (`nights-<configuration id>` for the nights of one offer).
 */
import * as v from "valibot";
import { type FieldErrors, fieldErrors } from "~/lib/form-errors";
import { toUtcInput } from "~/lib/format";
import {
  type CommitteeFields,
  CycleFormSchema,
  type CycleFormValues,
  type CycleInput,
  MAX_SCALE_STEPS,
  NightsAvailable,
} from "./schemas";

export type { CycleFormValues };

/** A new cycle's form: everything empty, no configuration ticked (the chair picks what is on offer). */
export function blankCycleValues(): CycleFormValues {
  return {
    name: "",
    description: "",
    observingStart: "",
    observingEnd: "",
    submissionDeadline: "",
    reviewDeadline: "",
    decisionDate: "",
    scoreBest: "1",
    scoreWorst: "5",
    offered: [],
    nights: {},
    committee: [],
  };
}

/** Nights from the first to the last night of the cycle, both counted; null for dates not (yet) valid. */
export function periodNights(observingStart: string, observingEnd: string): number | null {
  const a = Date.parse(`${observingStart}T00:00:00Z`);
  const b = Date.parse(`${observingEnd}T00:00:00Z`);
  if (Number.isNaN(a) || Number.isNaN(b) || b < a) return null;
  return Math.round((b - a) / 86_400_000) + 1;
}

/** The nights of the ticked offers against the period: each given, none and not all together above it. */
function checkNights(offers: CycleInput["offers"], period: number | null, errors: FieldErrors) {
  let total = 0;
  for (const o of offers) {
    const key = `nights-${o.configurationId}`;
    if (errors[key]) continue;
    if (o.nightsAvailable === null) {
      errors[key] = "Nights: give the nights this configuration is on offer, or untick it";
      continue;
    }
    total += o.nightsAvailable;
    if (period !== null && o.nightsAvailable > period)
      errors[key] = `Nights: at most ${period}, the nights from the first to the last night of the cycle`;
  }
  if (
    period !== null &&
    total > period &&
    !errors.offered &&
    !offers.some((o) => errors[`nights-${o.configurationId}`])
  )
    errors.offered = `Configurations: ${total} nights in all, more than the ${period} nights of the cycle (one configuration is installed at a time)`;
}

/** A stored cycle as form values: the deadlines as their UTC `datetime-local` values. */
export function valuesOfCycle(cycle: CycleInput): CycleFormValues {
  const nights: Record<string, string> = {};
  for (const o of cycle.offers) nights[o.configurationId] = o.nightsAvailable == null ? "" : String(o.nightsAvailable);
  return {
    name: cycle.name,
    description: cycle.description,
    observingStart: cycle.observingStart,
    observingEnd: cycle.observingEnd,
    submissionDeadline: toUtcInput(cycle.submissionDeadline),
    reviewDeadline: cycle.reviewDeadline ? toUtcInput(cycle.reviewDeadline) : "",
    decisionDate: cycle.decisionDate ?? "",
    scoreBest: String(cycle.scoreBest ?? 1),
    scoreWorst: String(cycle.scoreWorst ?? 5),
    offered: cycle.offers.map((o) => String(o.configurationId)),
    nights,
    committee: (cycle.committee ?? []).map(String),
  };
}

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
    reviewDeadline: str("reviewDeadline"),
    decisionDate: str("decisionDate"),
    scoreBest: str("scoreBest"),
    scoreWorst: str("scoreWorst"),
    offered: form.getAll("offered").filter((x): x is string => typeof x === "string"),
    nights,
    committee: form.getAll("committee").filter((x): x is string => typeof x === "string"),
  };
}

/** The rules between the committee's fields and the cycle's dates; adds to `errors`. */
function checkCommittee(
  out: CommitteeFields & { submissionDeadline: Date; observingStart: string },
  errors: FieldErrors,
) {
  const firstNight = Date.parse(`${out.observingStart}T00:00:00Z`);
  if (out.reviewDeadline) {
    if (out.reviewDeadline.getTime() <= out.submissionDeadline.getTime())
      errors.reviewDeadline = "Review deadline: must come after the submission deadline";
    else if (out.reviewDeadline.getTime() >= firstNight)
      errors.reviewDeadline = "Review deadline: must fall before the first night of the cycle";
  }
  if (out.decisionDate) {
    if (out.reviewDeadline && out.decisionDate < out.reviewDeadline.toISOString().slice(0, 10))
      errors.decisionDate = "Decision date: must not be before the review deadline";
    else if (out.decisionDate > out.observingStart)
      errors.decisionDate = "Decision date: must not be after the first night of the cycle";
  }
  if (out.scoreBest === out.scoreWorst) errors.scoreWorst = "Poorest score: must differ from the best score";
  else if (Math.abs(out.scoreBest - out.scoreWorst) > MAX_SCALE_STEPS)
    errors.scoreWorst = `Poorest score: at most ${MAX_SCALE_STEPS} steps from the best score`;
}

/**
 * Checks the form. `reviewerIds` are the people who may sit on the committee (the reviewer role);
 * committee ids outside it are refused.
 */
export function parseCycleForm(
  values: CycleFormValues,
  configurationIds: number[],
  reviewerIds: readonly number[] = [],
): { ok: true; value: CycleInput & CommitteeFields } | { ok: false; errors: FieldErrors } {
  const parsed = v.safeParse(CycleFormSchema, values);
  const errors = parsed.success ? {} : fieldErrors(parsed.issues, { depth: 1 });
  const offers: CycleInput["offers"] = [];
  for (const raw of values.offered) {
    const id = Number(raw);
    if (!configurationIds.includes(id)) {
      errors.offered = "Configurations: one of the chosen configurations does not exist";
      continue;
    }
    const nights = v.safeParse(NightsAvailable, values.nights[id] ?? "");
    if (!nights.success) errors[`nights-${id}`] = nights.issues[0].message;
    offers.push({ configurationId: id, nightsAvailable: nights.success ? nights.output : null });
  }
  if (offers.length === 0 && !errors.offered) errors.offered = "Configurations: offer at least one configuration";
  checkNights(
    offers,
    parsed.success ? periodNights(parsed.output.observingStart, parsed.output.observingEnd) : null,
    errors,
  );
  const committee = [...new Set(values.committee.map(Number))];
  if (committee.some((id) => !reviewerIds.includes(id)))
    errors.committee = "Committee: only people with the reviewer role can sit on the committee";
  if (parsed.success) {
    checkCommittee({ ...parsed.output, committee }, errors);
    const { observingStart, observingEnd, submissionDeadline } = parsed.output;
    if (observingEnd < observingStart) errors.observingEnd = "Last night: must not be before the first night";
    if (submissionDeadline.getTime() >= Date.parse(`${observingStart}T00:00:00Z`)) {
      errors.submissionDeadline = "Deadline: must fall before the first night of the cycle";
    }
  }
  if (Object.keys(errors).length || !parsed.success) return { ok: false, errors };
  return { ok: true, value: { ...parsed.output, offers, committee } };
}
