/**
 * The engine's public face: every export the rest of the app, the command line, the benchmarks and the
 * tests may use. Nothing outside app/engine/ imports a file below it directly, and nothing here imports
 * from outside app/engine/ (pure numerical code: no database, HTTP or React).
 *
 * Radians inside; degrees, milliarcseconds and hours only in the request and response objects.
 */

// Wire schemas: JSON validated into the inputs, one-line errors naming the field; the physical
// ranges of the model parameters, shared by the schema and the pages' hints
export type { ParamRange, RangedParam } from "./api/model-ranges";
export { MODEL_RANGES, rangeFailure, rangeText } from "./api/model-ranges";
export type { CoverageRequest, EphemerisRequest, ParseResult, TrianglesRequest } from "./api/requests";
export {
  DEFAULT_MIN_ELEVATION_DEG,
  MAX_CLOSURE_VALUES,
  MAX_SAMPLES,
  MAX_UV_POINTS,
  MODEL_TYPES,
  maxNightSamples,
  parseCoverageRequest,
  parseEphemerisRequest,
  parseTrianglesRequest,
  TargetModelSchema,
} from "./api/requests";

// Time and sky
export { airmassKastenYoung, airmassSecZ } from "./astro/airmass";
export type { EphemerisResponse, TwilightTimesUtc } from "./astro/ephemeris";
export { computeEphemeris } from "./astro/ephemeris";
export { azimuthRad, elevationRad } from "./astro/horizon";
export type { MoonPosition } from "./astro/moon";
export { moonIlluminatedFraction, moonPosition } from "./astro/moon";
export { precessFromJ2000 } from "./astro/precession";
export type { StarWindow } from "./astro/rise-set";
export { riseTransitSetCore, starWindow } from "./astro/rise-set";
export { gastRad, gmstHours, gmstRad, lmstHours, lmstRad } from "./astro/sidereal";
export type { SunPosition } from "./astro/sun";
export { sunAltitudeRad, sunPosition } from "./astro/sun";
export type { CalendarDate } from "./astro/time";
export {
  dateFromJulianDay,
  deltaTSeconds,
  isoUtcFromJulianDay,
  jdeFromJd,
  julianDay,
  julianDayFromDate,
  parseIsoDate,
} from "./astro/time";
export type { NightEvents } from "./astro/twilight";
export { nightEvents } from "./astro/twilight";

// Inputs of the computations (degrees, mas, hours, metres on this edge)
export type {
  BeamOptions,
  CoverageInput,
  EphemerisInput,
  NightSampling,
  ObservationInput,
  SiteInput,
  StationInput,
  SumComponent,
  TargetInput,
  TargetModel,
  TrianglesInput,
} from "./inputs";

// Interferometry
export { baselineCount, baselineIndex, buildBaselines } from "./interferometry/baselines";
export { besselJ0, besselJ1, sphericalJ1OverX } from "./interferometry/bessel";
export type { BandLike } from "./interferometry/channels";
export { channelWavelengthsM, describeChannels } from "./interferometry/channels";
export {
  closureCube,
  closurePhase,
  independentClosurePhaseCount,
  stationTriangles,
  triangleCount,
} from "./interferometry/closure";
export type {
  CoverageBaseline,
  CoverageBeam,
  CoverageClosure,
  CoverageNight,
  CoverageResponse,
  CoverageSample,
} from "./interferometry/coverage";
export { computeCoverage, computeCoverageArrays } from "./interferometry/coverage";
export type { CoverageFigures } from "./interferometry/coverage-quality";
export { coverageFigures } from "./interferometry/coverage-quality";
export { directDirtyBeam } from "./interferometry/direct-dft";
export type { Weighting } from "./interferometry/dirty-beam";
export { dirtyBeam, dirtyImage, weightPoints } from "./interferometry/dirty-beam";
export { HermitianImager } from "./interferometry/fft2d";
export { compileModel, evaluateVisibilities, visibilityAt } from "./interferometry/models";
export { assessObservability } from "./interferometry/observability";
export type { PreparedObservation } from "./interferometry/observation";
export { prepareObservation } from "./interferometry/observation";
export type { HourAngleSamples } from "./interferometry/sampling";
export { samplesAcrossNight, samplesFromHourAngles } from "./interferometry/sampling";
export { enuToEquatorial, stationsToEquatorial } from "./interferometry/stations";
export type { RankedTriangle } from "./interferometry/triangle-ranking";
export type { TrianglesResponse } from "./interferometry/triangles";
export { rankTriangles } from "./interferometry/triangles";
export { computeUvwTracks, projectBaseline } from "./interferometry/uv-tracks";
export type { VisibilityCube } from "./interferometry/visibilities";
export {
  modelVisibilityCube,
  spatialFrequencies,
  squaredVisibilities,
  visibilityPhases,
} from "./interferometry/visibilities";

// Constants and angle helpers
export {
  clampedAcos,
  clampedAsin,
  DEG_TO_RAD,
  HOUR_TO_RAD,
  MAS_TO_RAD,
  RAD_TO_DEG,
  RAD_TO_HOUR,
  RAD_TO_MAS,
  roundTo,
  TWO_PI,
  wrapDeg180,
  wrapHours12,
  wrapHours24,
  wrapPi,
  wrapTwoPi,
} from "./math";

// Night planning: calibrator–science–calibrator sequences through one night, and their validation

export type { PlanRequest } from "./api/plan";
export {
  MAX_PLAN_BLOCKS,
  MAX_PLAN_CALIBRATORS,
  MAX_PLAN_DELAY_WORK,
  MAX_PLAN_STATIONS,
  MAX_PLAN_TARGETS,
  PlanBlockRefSchema,
  PlanRequestSchema,
  parsePlanBlocks,
  parsePlanRequest,
} from "./api/plan";
export type { PlanBlock } from "./planning/block-fields";
export { describePlanBlocks } from "./planning/block-fields";
export type { PlanContext, PlanTarget } from "./planning/context";
export { buildPlanContext } from "./planning/context";
export type { PlanBlockRef, PlanCalibratorInput, PlanInput, PlanTargetInput } from "./planning/inputs";
export { PLAN_DEFAULTS, PLAN_GRID_STEP_SEC, PLAN_SAFETY_MARGINS } from "./planning/inputs";
export type { PlanNight, PlanResponse, PlanSettings } from "./planning/plan";
export { computePlan, PLAN_SAFETY_WARNING } from "./planning/plan";
export { angularSeparationRad } from "./planning/separation";
export type { UnplacedCode, UnplacedTarget } from "./planning/unplaced";
export type { PlanRule, PlanValidation, PlanViolation, ValidateOptions } from "./planning/validate";
export { validatePlan } from "./planning/validate";
