/**
 * The Night builder's field rules, written once: the forms of the calendar and of a night (one schema
 * per intent, messages naming the field) and the shape of the JSON export.
 */
import * as v from "valibot";
import { BLOCK_OUTCOMES, NIGHT_PLAN_STATES } from "~/db/schema/nights";
import { labelledText } from "~/lib/text-fields";
import { IsoDate } from "~/services/cycles/schemas";
import { MAX_BLOCK_MIN } from "./edits";

export { IsoDate };

/** A number typed in a form field, between `min` and `max`. */
const numberField = (label: string, min: number, max: number, unit: string) =>
  v.pipe(
    v.string(`${label}: give a number`),
    v.trim(),
    v.nonEmpty(`${label}: give a number`),
    v.transform(Number),
    v.check((n) => Number.isFinite(n), `${label}: give a number`),
    v.check((n) => n >= min && n <= max, `${label}: from ${min} to ${max} ${unit}`),
  );

const id = (label: string) =>
  v.pipe(
    v.string(`${label}: missing`),
    v.regex(/^\d{1,9}$/, `${label}: not a number`),
    v.transform(Number),
    v.minValue(1, `${label}: not a number`),
  );

export const NightDate = IsoDate("Night");

/** The calendar form: install a configuration (or none) for a run of nights. */
export const RunFormSchema = v.object({
  cycleId: id("Cycle"),
  firstNight: IsoDate("First night"),
  lastNight: IsoDate("Last night"),
  configurationId: v.union(
    [
      v.pipe(
        v.literal(""),
        v.transform(() => null),
      ),
      id("Configuration"),
    ],
    "Configuration: choose one, or none to clear the nights",
  ),
});
export type RunInput = v.InferOutput<typeof RunFormSchema>;

/** The planner settings a scheduler may change per night. */
export const SettingsFields = {
  minElevationDeg: numberField("Elevation limit", 0, 90, "°"),
  moonMinSeparationDeg: numberField("Moon distance", 0, 180, "°"),
  sunMinSeparationDeg: numberField("Sun avoidance angle", 0, 180, "°"),
  scienceBlockMin: numberField("Science block", 1, MAX_BLOCK_MIN, "min"),
  calibratorBlockMin: numberField("Calibrator block", 1, MAX_BLOCK_MIN, "min"),
};

const lengthMin = numberField("Length", 1, MAX_BLOCK_MIN, "min");

export const NightActionSchema = v.variant(
  "intent",
  [
    v.object({ intent: v.literal("settings"), ...SettingsFields }),
    v.object({ intent: v.literal("auto") }),
    v.object({ intent: v.literal("discard") }),
    v.object({ intent: v.literal("publish") }),
    v.object({
      intent: v.literal("move"),
      blockId: id("Block"),
      to: v.pipe(
        v.string("Position: missing"),
        v.regex(/^(up|down|\d{1,4})$/, "Position: up, down or a place in the plan"),
      ),
    }),
    v.object({ intent: v.literal("remove"), blockId: id("Block") }),
    v.object({ intent: v.literal("resize"), blockId: id("Block"), lengthMin }),
    v.object({
      intent: v.literal("insert"),
      object: v.pipe(
        v.string("What to observe: choose a target or calibrator"),
        v.regex(/^\d{1,9}:(science|cal:\d{1,2})$/, "What to observe: choose a target or calibrator"),
      ),
      after: v.pipe(v.string("Where: missing"), v.regex(/^(start|\d{1,9})$/, "Where: choose a place in the plan")),
      lengthMin,
    }),
    v.object({
      intent: v.literal("mark"),
      blockId: id("Block"),
      outcome: v.picklist(BLOCK_OUTCOMES, "Outcome: executed, weather, technical or planned"),
      note: v.optional(labelledText("Note", 500), ""),
    }),
    v.object({
      intent: v.literal("replan"),
      fromUtc: v.pipe(
        v.string("Re-plan from: give a date and time (UTC)"),
        v.regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/, "Re-plan from: give a date and time (UTC)"),
        v.transform((s) => new Date(`${s}:00Z`)),
        v.check((d) => !Number.isNaN(d.getTime()), "Re-plan from: not a real date and time"),
      ),
    }),
  ],
  "Unknown action",
);
export type NightAction = v.InferOutput<typeof NightActionSchema>;

// ------------------------------------------------------------------ the JSON export

const nullableNumber = v.nullable(v.number());
const isoInstant = v.pipe(v.string(), v.isoTimestamp());

export const ExportBlockSchema = v.strictObject({
  position: v.pipe(v.number(), v.integer(), v.minValue(1)),
  kind: v.picklist(["calibrator", "science"]),
  target: v.string(),
  object: v.string(),
  program: v.nullable(v.strictObject({ proposalId: v.number(), title: v.string(), pi: v.string() })),
  startUtc: isoInstant,
  endUtc: isoInstant,
  startLstH: nullableNumber,
  hourAngleStartH: nullableNumber,
  hourAngleEndH: nullableNumber,
  elevationStartDeg: nullableNumber,
  elevationEndDeg: nullableNumber,
  airmassStart: nullableNumber,
  airmassEnd: nullableNumber,
  moonSeparationDeg: nullableNumber,
  outcome: v.picklist(BLOCK_OUTCOMES),
  note: v.string(),
  violations: v.array(v.strictObject({ rule: v.string(), reason: v.string() })),
});

/** The JSON export of a night plan (`/nights/:date/export/plan.json`, `/api/nights/:date/plan?format=json`). */
export const NightPlanExportSchema = v.strictObject({
  night: v.strictObject({
    date: v.pipe(v.string(), v.isoDate()),
    site: v.strictObject({
      name: v.string(),
      latitudeDeg: v.number(),
      longitudeDeg: v.number(),
      altitudeM: v.number(),
    }),
    configuration: v.string(),
    stations: v.array(v.string()),
    state: v.picklist(NIGHT_PLAN_STATES),
    astronomicalDuskUtc: v.nullable(isoInstant),
    astronomicalDawnUtc: v.nullable(isoInstant),
    moonIlluminatedFraction: v.pipe(v.number(), v.minValue(0), v.maxValue(1)),
  }),
  settings: v.strictObject({
    minElevationDeg: v.number(),
    moonMinSeparationDeg: v.number(),
    sunMinSeparationDeg: v.number(),
    scienceBlockMin: v.number(),
    calibratorBlockMin: v.number(),
    delayLineStrokeM: nullableNumber,
  }),
  /** True when only the blocks of the asker's own programs are listed. */
  filtered: v.boolean(),
  blocks: v.array(ExportBlockSchema),
  caution: v.string(),
  generatedUtc: isoInstant,
});
export type NightPlanExport = v.InferOutput<typeof NightPlanExportSchema>;
export type ExportBlock = v.InferOutput<typeof ExportBlockSchema>;

export const EXPORT_FORMATS = ["csv", "json", "ics"] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];
