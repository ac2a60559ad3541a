/**
 * Wire schema of `cli calibrators` / `POST /api/calibrators`. The contract's fields
 * (target {raDeg, decDeg} or {name}, wavelengthM, longestBaselineM, site, date, minElevationDeg,
 * maxDistanceDeg = 10, minVis2 = 0.8, limit = 20) plus three optional ones: target.bandMag (the target's
 * magnitude in the band, when known), maxMagDifference and bandLimitMag (null for no limit).
 */
import * as v from "valibot";
import type { CalibratorsInput, CalibratorTarget } from "../catalogue/types";
import { between, countUpTo, type ParseResult, parseRequest, positive, positiveUpTo, wavelengthUpTo } from "./blocks";
import { DEFAULT_MIN_ELEVATION_DEG, MAX_WAVELENGTH_M } from "./limits";
import { IsoDateSchema, SiteSchema } from "./requests";
import { StarNameSchema } from "./resolve";

export const DEFAULT_MAX_DISTANCE_DEG = 10;
export const DEFAULT_MIN_VIS2 = 0.8;
export const DEFAULT_CALIBRATOR_LIMIT = 20;
/** Most calibrators one request may ask for. */
export const MAX_CALIBRATOR_LIMIT = 500;

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
    wavelengthM: wavelengthUpTo(MAX_WAVELENGTH_M),
    longestBaselineM: positiveUpTo(100_000, "must be at most 100000 (metres)"),
    site: SiteSchema,
    date: IsoDateSchema,
    minElevationDeg: v.optional(between(0, 90), DEFAULT_MIN_ELEVATION_DEG),
    maxDistanceDeg: v.optional(positiveUpTo(90), DEFAULT_MAX_DISTANCE_DEG),
    minVis2: v.optional(between(0, 1), DEFAULT_MIN_VIS2),
    limit: v.optional(countUpTo(MAX_CALIBRATOR_LIMIT), DEFAULT_CALIBRATOR_LIMIT),
    maxMagDifference: v.optional(v.nullable(positive()), null),
    bandLimitMag: magnitude(),
  },
  "request must be a JSON object",
);

/** Validates a calibrators request (already parsed from JSON). */
export function parseCalibratorsRequest(json: unknown): ParseResult<CalibratorsInput> {
  return parseRequest(CalibratorsRequestSchema, json);
}
