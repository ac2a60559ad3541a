/**
 * The catalogue pages' inputs, written once (pure): the suggestion query, the shortlist settings (a GET
 * form, so a shortlist is shareable by its address) and the "Add as calibrator" post. Messages start
 * with the field's label, as every form's do.
 */
import * as v from "valibot";
import { MAX_NAME_LENGTH } from "~/engine";
import { fieldErrors } from "~/lib/form-errors";

/** `?q=…&limit=…` of `GET /api/stars`. */
const SuggestionQuerySchema = v.object({
  q: v.pipe(
    v.optional(v.string(), ""),
    v.trim(),
    v.maxLength(MAX_NAME_LENGTH, `must be at most ${MAX_NAME_LENGTH} characters`),
  ),
  limit: v.pipe(
    v.optional(v.string(), "8"),
    v.regex(/^\d{1,2}$/, "must be a whole number from 1 to 20"),
    v.transform(Number),
    v.minValue(1, "must be a whole number from 1 to 20"),
    v.maxValue(20, "must be a whole number from 1 to 20"),
  ),
});

export function parseSuggestionQuery(
  params: URLSearchParams,
): { ok: true; value: { q: string; limit: number } } | { ok: false; field: string; message: string } {
  const result = v.safeParse(SuggestionQuerySchema, {
    q: params.get("q") ?? undefined,
    limit: params.get("limit") ?? undefined,
  });
  if (result.success) return { ok: true, value: result.output };
  const [field, message] = Object.entries(fieldErrors(result.issues))[0];
  return { ok: false, field, message: `${field}: ${message}` };
}

/** A decimal field: "" is null when `optional`, else required; the range is checked with its words. */
function decimal(
  label: string,
  rule: { min?: number; max?: number; above?: number; words: string; optional?: boolean },
) {
  const inRange = (x: number) =>
    (rule.min === undefined || x >= rule.min) &&
    (rule.max === undefined || x <= rule.max) &&
    (rule.above === undefined || x > rule.above);
  return v.pipe(
    v.string(),
    v.trim(),
    v.check((s) => rule.optional || s !== "", `${label}: required (${rule.words})`),
    v.transform((s) => (s === "" ? null : Number(s.replace(/\u2212/g, "-")))),
    v.check((x) => x === null || Number.isFinite(x), `${label}: not a number (${rule.words})`),
    v.check((x) => x === null || inRange(x), `${label}: ${rule.words}`),
  );
}

/** A registry id picked from a list, or "" for none. */
const pickedId = (label: string) =>
  v.pipe(
    v.string(),
    v.trim(),
    v.check((s) => s === "" || /^\d{1,9}$/.test(s), `${label}: pick one from the list`),
    v.transform((s) => (s === "" ? null : Number(s))),
  );

/** A calendar date that exists, in the years the ephemerides are meant for. */
const NightDate = v.pipe(
  v.string(),
  v.trim(),
  v.regex(/^\d{4}-\d{2}-\d{2}$/, "Night of: use the form YYYY-MM-DD"),
  v.check((s) => {
    const d = new Date(`${s}T00:00:00Z`);
    return !Number.isNaN(d.getTime()) && d.toISOString().startsWith(s);
  }, "Night of: not a real date"),
  v.check((s) => s >= "1900-01-01" && s <= "2199-12-31", "Night of: a date from 1900 to 2199"),
);

/** The shortlist's settings as the form sends them (every field a string; the target is read apart). */
export const ShortlistSettingsSchema = v.object({
  target: v.pipe(v.string(), v.trim(), v.maxLength(MAX_NAME_LENGTH, `Target: at most ${MAX_NAME_LENGTH} characters`)),
  ra: v.pipe(v.string(), v.trim()),
  dec: v.pipe(v.string(), v.trim()),
  band: pickedId("Band"),
  config: pickedId("Configuration"),
  baseline: decimal("Longest baseline", {
    above: 0,
    max: 100_000,
    words: "metres, above 0 and up to 100000",
    optional: true,
  }),
  date: NightDate,
  minElevation: decimal("Elevation limit", { min: 0, max: 90, words: "degrees from 0 to 90" }),
  maxDistance: decimal("Within", { above: 0, max: 90, words: "degrees, above 0 and up to 90" }),
  minVis2: decimal("Smallest V²", { min: 0, max: 1, words: "from 0 to 1" }),
  maxMagDiff: decimal("Magnitude range", {
    above: 0,
    max: 30,
    words: "magnitudes above 0 (or empty for no limit)",
    optional: true,
  }),
  bandLimit: decimal("Band limit", { min: -30, max: 30, words: "magnitudes from -30 to 30", optional: true }),
  targetMag: decimal("Target's band magnitude", { min: -30, max: 30, words: "from -30 to 30", optional: true }),
  limit: v.pipe(
    v.string(),
    v.trim(),
    v.regex(/^\d{1,3}$/, "Entries: a whole number from 1 to 100"),
    v.transform(Number),
    v.minValue(1, "Entries: a whole number from 1 to 100"),
    v.maxValue(100, "Entries: a whole number from 1 to 100"),
  ),
});

export type ShortlistField = keyof v.InferInput<typeof ShortlistSettingsSchema>;
export const SHORTLIST_FIELDS = Object.keys(ShortlistSettingsSchema.entries) as ShortlistField[];
export type ShortlistValues = Record<ShortlistField, string>;
export type ShortlistSettings = v.InferOutput<typeof ShortlistSettingsSchema>;

/** The settings as typed: each field from the address, else its default. */
export function shortlistValues(params: URLSearchParams, defaults: ShortlistValues): ShortlistValues {
  const out = { ...defaults };
  for (const f of SHORTLIST_FIELDS) {
    const x = params.get(f);
    if (x !== null) out[f] = x.slice(0, 200);
  }
  return out;
}

/** Checks the settings: the values, or messages keyed by field. */
export function readShortlistSettings(
  values: ShortlistValues,
): { ok: true; settings: ShortlistSettings } | { ok: false; errors: Record<string, string> } {
  const result = v.safeParse(ShortlistSettingsSchema, values);
  if (result.success) return { ok: true, settings: result.output };
  return { ok: false, errors: fieldErrors(result.issues, { depth: 1 }) };
}

/** The "Add as calibrator" post: which star. */
const AddCalibratorSchema = v.object({
  hip: v.pipe(
    v.string("Star: pick one from the shortlist"),
    v.regex(/^\d{1,7}$/, "Star: pick one from the shortlist"),
    v.transform(Number),
  ),
});

export function readAddCalibrator(form: FormData): { ok: true; hip: number } | { ok: false; message: string } {
  const result = v.safeParse(AddCalibratorSchema, { hip: form.get("hip") ?? undefined });
  return result.success ? { ok: true, hip: result.output.hip } : { ok: false, message: result.issues[0].message };
}
