/**
 * The cycle form (pure): its values as typed, and the check that turns them into a `CycleInput` or
 * field errors keyed by field name (`nights-<configuration id>` for the nights of one offer).
 */
import * as v from "valibot";
import { type FieldErrors, fieldErrors } from "~/lib/form-errors";
import { toUtcInput } from "~/lib/format";
import { CycleFormSchema, type CycleFormValues, type CycleInput, NightsAvailable } from "./schemas";

export type { CycleFormValues };

/** A new cycle's form: everything empty, every configuration on offer. */
export function blankCycleValues(configurationIds: number[]): CycleFormValues {
  return {
    name: "",
    description: "",
    observingStart: "",
    observingEnd: "",
    submissionDeadline: "",
    offered: configurationIds.map(String),
    nights: {},
  };
}

/** A stored cycle as form values: the deadline as its UTC `datetime-local` value. */
export function valuesOfCycle(cycle: CycleInput): CycleFormValues {
  const nights: Record<string, string> = {};
  for (const o of cycle.offers) nights[o.configurationId] = o.nightsAvailable == null ? "" : String(o.nightsAvailable);
  return {
    name: cycle.name,
    description: cycle.description,
    observingStart: cycle.observingStart,
    observingEnd: cycle.observingEnd,
    submissionDeadline: toUtcInput(cycle.submissionDeadline),
    offered: cycle.offers.map((o) => String(o.configurationId)),
    nights,
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
    offered: form.getAll("offered").filter((x): x is string => typeof x === "string"),
    nights,
  };
}

export function parseCycleForm(
  values: CycleFormValues,
  configurationIds: number[],
): { ok: true; value: CycleInput } | { ok: false; errors: FieldErrors } {
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
