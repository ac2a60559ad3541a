/**
 * Wire schema of `cli calibrators` / `POST /api/calibrators`. The contract's fields
 * (target {raDeg, decDeg} or {name}, wavelengthM, longestBaselineM, site, date, minElevationDeg,
 * maxDistanceDeg = 10, minVis2 = 0.8, limit = 20) plus three optional ones: target.bandMag (the target's
 * magnitude in the band, when known), maxMagDifference and bandLimitMag (null for no limit).
 */
import * as v from "valibot";
import type { CalibratorsInput, CalibratorTarget } from "../catalogue/types";
import { DEFAULT_MIN_ELEVATION_DEG, formatIssues, IsoDateSchema, type ParseResult, SiteSchema } from "./requests";
import { StarNameSchema } from "./resolve";

export const DEFAULT_MAX_DISTANCE_DEG = 10;
export const DEFAULT_MIN_VIS2 = 0.8;
export const DEFAULT_CALIBRATOR_LIMIT = 20;
/** Most calibrators one request may ask for. */
export const MAX_CALIBRATOR_LIMIT = 500;

const numberMsg = "must be a number";
const between = (min: number, max: number) =>
  v.pipe(
    v.number(numberMsg),
    v.finite("must be a finite number"),
    v.minValue(min, `must be between ${min} and ${max}`),
    v.maxValue(max, `must be between ${min} and ${max}`),
  );
const magnitude = () => v.optional(v.nullable(between(-30, 30)), null);

const TargetSchema = v.pipe(
  v.object(
    {
      name: v.optional(StarNameSchema),
      raDeg: v.optional(between(0, 360)),
      decDeg: v.optional(between(-90, 90)),
      bandMag: magnitude(),
    },
    "must be an object {raDeg, decDeg} or {name}",
  ),
  v.check(
    (t) => t.name !== undefined || (t.raDeg !== undefined && t.decDeg !== undefined),
    "needs a name, or both raDeg and decDeg",
  ),
  v.check(
    (t) => t.name === undefined || (t.raDeg === undefined && t.decDeg === undefined),
    "give either a name or raDeg and decDeg, not both",
  ),
  v.transform(
    (t): CalibratorTarget =>
      t.name !== undefined
        ? { name: t.name, bandMag: t.bandMag }
        : { raDeg: t.raDeg as number, decDeg: t.decDeg as number, bandMag: t.bandMag },
  ),
);

export const CalibratorsRequestSchema = v.object(
  {
    target: TargetSchema,
    wavelengthM: v.pipe(
      v.number(numberMsg),
      v.finite("must be a finite number"),
      v.gtValue(0, "must be positive"),
      v.maxValue(1e-3, "must be at most 0.001 (wavelengths are in metres)"),
    ),
    longestBaselineM: v.pipe(
      v.number(numberMsg),
      v.finite("must be a finite number"),
      v.gtValue(0, "must be positive"),
      v.maxValue(100_000, "must be at most 100000 (metres)"),
    ),
    site: SiteSchema,
    date: IsoDateSchema,
    minElevationDeg: v.optional(between(0, 90), DEFAULT_MIN_ELEVATION_DEG),
    maxDistanceDeg: v.optional(
      v.pipe(
        v.number(numberMsg),
        v.finite("must be a finite number"),
        v.gtValue(0, "must be positive"),
        v.maxValue(90, "must be at most 90"),
      ),
      DEFAULT_MAX_DISTANCE_DEG,
    ),
    minVis2: v.optional(between(0, 1), DEFAULT_MIN_VIS2),
    limit: v.optional(
      v.pipe(
        v.number(numberMsg),
        v.integer("must be a whole number"),
        v.minValue(1, "must be at least 1"),
        v.maxValue(MAX_CALIBRATOR_LIMIT, `must be at most ${MAX_CALIBRATOR_LIMIT}`),
      ),
      DEFAULT_CALIBRATOR_LIMIT,
    ),
    maxMagDifference: v.optional(
      v.nullable(v.pipe(v.number(numberMsg), v.finite("must be a finite number"), v.gtValue(0, "must be positive"))),
      null,
    ),
    bandLimitMag: magnitude(),
  },
  "request must be a JSON object",
);

type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const schemaMatchesInput: Same<v.InferOutput<typeof CalibratorsRequestSchema>, CalibratorsInput> = true;
void schemaMatchesInput;

/** Validates a calibrators request (already parsed from JSON). */
export function parseCalibratorsRequest(json: unknown): ParseResult<CalibratorsInput> {
  if (typeof json !== "object" || json === null || Array.isArray(json)) {
    return { ok: false, message: "request must be a JSON object", field: null };
  }
  const result = v.safeParse(CalibratorsRequestSchema, json);
  return result.success ? { ok: true, value: result.output } : { ok: false, ...formatIssues(result.issues) };
}
