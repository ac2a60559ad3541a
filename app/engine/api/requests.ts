/**
 * Request schemas of the computation API (coverage, ephemeris, triangles),
 * shared by the command line and the HTTP resource routes. Pure: no I/O.
 *
 * Units on the wire follow the project conventions: angles in degrees, angular
 * sizes in milliarcseconds, hour angles in hours, wavelengths and positions in
 * metres, dates as YYYY-MM-DD. Unknown keys are ignored. Every failure is
 * reported as one line naming the failing field, e.g.
 * `target.decDeg: must be between -90 and 90`.
 */
import * as v from "valibot";
import type { CoverageInput, EphemerisInput, TargetModel, TrianglesInput } from "../inputs";
import { isPowerOfTwo } from "../math";
import {
  between,
  countUpTo,
  finiteNumber,
  nonNegative,
  numberMsg,
  type ParseResult,
  parseRequest,
  positive,
  positiveUpTo,
  trimmedName,
  wavelengthUpTo,
} from "./blocks";
import {
  coverageRuleFailure,
  DEFAULT_GRID_SIZE,
  DEFAULT_MAX_TRIANGLES,
  DEFAULT_MIN_ELEVATION_DEG,
  MAX_SAMPLES,
  MAX_STATIONS,
  MAX_WAVELENGTH_M,
  MAX_WAVELENGTHS,
  maxNightSamples,
  samplingRuleFailure,
} from "./limits";
import { withModelRanges } from "./model-ranges";
import { modelShapeFailure } from "./model-shape";

/** A date "YYYY-MM-DD" that exists in the Gregorian calendar, years 1900–2200. */
export const IsoDateSchema = v.pipe(
  v.string("must be a date string YYYY-MM-DD"),
  v.regex(/^\d{4}-\d{2}-\d{2}$/, "must be a date in the form YYYY-MM-DD"),
  v.check((s) => {
    const [y, m, d] = s.split("-").map(Number);
    const t = new Date(Date.UTC(y, m - 1, d));
    return t.getUTCFullYear() === y && t.getUTCMonth() === m - 1 && t.getUTCDate() === d;
  }, "must be a real calendar date"),
  v.check((s) => {
    const y = Number(s.slice(0, 4));
    return y >= 1900 && y <= 2200;
  }, "must be a date between the years 1900 and 2200"),
);

export const SiteSchema = v.object(
  {
    latitudeDeg: between(-90, 90),
    longitudeDeg: between(-180, 180),
    /** Accepted for completeness; the geocentric computations do not use it. */
    altitudeM: v.optional(finiteNumber(), 0),
  },
  "must be an object",
);

export const StationSchema = v.object(
  {
    name: trimmedName(64),
    eastM: finiteNumber(),
    northM: finiteNumber(),
    upM: v.optional(finiteNumber(), 0),
    pathOffsetM: v.optional(finiteNumber(), 0),
  },
  "must be an object",
);

const StationsSchema = v.pipe(
  v.array(StationSchema, "must be an array of stations"),
  v.minLength(2, "needs at least 2 stations"),
  v.maxLength(MAX_STATIONS, `must list at most ${MAX_STATIONS} stations`),
  v.check(
    (list) => new Set(list.map((s) => s.name)).size === list.length,
    (issue) => {
      const list = issue.input as { name: string }[];
      const seen = new Set<string>();
      const dup = list.find((s) => {
        if (seen.has(s.name)) return true;
        seen.add(s.name);
        return false;
      });
      return `station names must be distinct ("${dup?.name ?? "?"}" appears more than once)`;
    },
  ),
);

// ---------------------------------------------------------------- target models

export const MODEL_TYPES = ["point", "uniformDisk", "gaussian", "limbDarkenedDisk", "ring", "binary", "sum"] as const;

const modelTypeMessage = `must be one of ${MODEL_TYPES.join(", ")}`;

/**
 * A target model. Its shape (sum nesting, components in all: ./model-shape.ts) is checked first,
 * without recursion, so a deeply nested model is refused before the recursive checks below run.
 */
export const TargetModelSchema: v.GenericSchema<unknown, TargetModel> = v.pipe(
  v.unknown(),
  v.check(
    (model) => modelShapeFailure(model) === null,
    (issue) => modelShapeFailure(issue.input) ?? "has an unacceptable shape",
  ),
  v.lazy(() => RangedModelSchema),
);

const ModelVariantSchema: v.GenericSchema<unknown, TargetModel> = v.lazy(() =>
  v.variant(
    "type",
    [
      v.object({ type: v.literal("point") }),
      v.object({ type: v.literal("uniformDisk"), diameterMas: positive() }),
      v.object({ type: v.literal("gaussian"), fwhmMas: positive() }),
      v.object({
        type: v.literal("limbDarkenedDisk"),
        diameterMas: positive(),
        coefficient: between(0, 1),
      }),
      v.object({ type: v.literal("ring"), diameterMas: positive() }),
      v.object({
        type: v.literal("binary"),
        separationMas: nonNegative(),
        positionAngleDeg: finiteNumber(),
        fluxRatio: nonNegative(),
      }),
      v.object({
        type: v.literal("sum"),
        components: v.pipe(
          v.array(
            v.object(
              {
                model: TargetModelSchema,
                flux: positive(),
                offsetEastMas: v.optional(finiteNumber(), 0),
                offsetNorthMas: v.optional(finiteNumber(), 0),
              },
              "must be an object",
            ),
            "must be an array of components",
          ),
          v.minLength(1, "must have at least one component"),
          v.maxLength(50, "must have at most 50 components"),
        ),
      }),
    ],
    modelTypeMessage,
  ),
);
/** The variants with the physical ranges of their parameters (./model-ranges.ts). */
const RangedModelSchema = withModelRanges(ModelVariantSchema);

export const TargetSchema = v.object(
  {
    name: v.optional(v.pipe(v.string("must be a string"), v.maxLength(200, "must be at most 200 characters"))),
    raDeg: between(0, 360),
    decDeg: between(-90, 90),
    model: v.optional(TargetModelSchema, { type: "point" }),
  },
  "must be an object",
);

// ---------------------------------------------------------------- sampling and beam

const WavelengthsSchema = v.pipe(
  v.array(wavelengthUpTo(MAX_WAVELENGTH_M), "must be an array of wavelengths in metres"),
  v.minLength(1, "must list at least one wavelength"),
  v.maxLength(MAX_WAVELENGTHS, `must list at most ${MAX_WAVELENGTHS} wavelengths`),
);

const HourAnglesSchema = v.pipe(
  v.array(between(-12, 12), "must be an array of hour angles in hours"),
  v.minLength(1, "must list at least one hour angle"),
  v.maxLength(MAX_SAMPLES, `must list at most ${MAX_SAMPLES} hour-angle samples`),
);

export const NightSamplingSchema = v.object(
  {
    date: IsoDateSchema,
    stepMin: v.pipe(
      positiveUpTo(720, "must be at most 720 minutes"),
      v.check(
        (step) => maxNightSamples(step) <= MAX_SAMPLES,
        `is too small: a night could need more than ${MAX_SAMPLES} samples (use at least 0.073 minutes)`,
      ),
    ),
  },
  "must be an object",
);

export const BeamOptionsSchema = v.object(
  {
    gridSize: v.optional(
      v.pipe(
        v.number(numberMsg),
        v.check((n) => isPowerOfTwo(n) && n >= 32 && n <= 2048, "must be a power of two from 32 to 2048"),
      ),
      DEFAULT_GRID_SIZE,
    ),
    weighting: v.optional(
      v.picklist(["natural", "uniform", "robust"], "must be natural, uniform or robust"),
      "natural",
    ),
    /** Briggs robustness R for weighting "robust": −2 (near uniform) .. 2 (near natural). */
    robust: v.optional(between(-2, 2), 0),
    /** When true the response carries the beam image and the model's dirty image. */
    includeImages: v.optional(v.boolean("must be true or false"), false),
  },
  "must be an object or null",
);

const commonEntries = {
  site: SiteSchema,
  stations: StationsSchema,
  target: TargetSchema,
  wavelengthsM: WavelengthsSchema,
  hourAnglesH: v.optional(HourAnglesSchema),
  night: v.optional(NightSamplingSchema),
  minElevationDeg: v.optional(between(0, 90), DEFAULT_MIN_ELEVATION_DEG),
  delayLineStrokeM: v.optional(v.nullable(positive()), null),
};

// ---------------------------------------------------------------- requests

/** Coverage request; use parseCoverageRequest, which adds the cross-field rules. */
export const CoverageRequestSchema = v.object(
  {
    ...commonEntries,
    beam: v.optional(v.nullable(BeamOptionsSchema), {}),
  },
  "request must be a JSON object",
);

/** Triangle-finder request; use parseTrianglesRequest, which adds the cross-field rules. */
export const TrianglesRequestSchema = v.object(
  {
    ...commonEntries,
    stations: v.pipe(StationsSchema, v.minLength(3, "needs at least 3 stations to form a triangle")),
    maxTriangles: v.optional(countUpTo(100_000), DEFAULT_MAX_TRIANGLES),
  },
  "request must be a JSON object",
);

export const EphemerisRequestSchema = v.object(
  {
    site: SiteSchema,
    date: IsoDateSchema,
  },
  "request must be a JSON object",
);

export type CoverageRequest = CoverageInput;
export type TrianglesRequest = TrianglesInput;
export type EphemerisRequest = EphemerisInput;

// ---------------------------------------------------------------- parsing

export type { ParseResult };

/** Validates a coverage request (already parsed from JSON). */
export function parseCoverageRequest(json: unknown): ParseResult<CoverageRequest> {
  return parseRequest(CoverageRequestSchema, json, coverageRuleFailure);
}

/** Validates a triangle-finder request (already parsed from JSON). */
export function parseTrianglesRequest(json: unknown): ParseResult<TrianglesRequest> {
  return parseRequest(TrianglesRequestSchema, json, samplingRuleFailure);
}

/** Validates an ephemeris request (already parsed from JSON). */
export function parseEphemerisRequest(json: unknown): ParseResult<EphemerisRequest> {
  return parseRequest(EphemerisRequestSchema, json);
}
