/**
 * The engine's public face: every export the rest of the app, the command line, the benchmarks and the
 * tests may use. Nothing outside app/engine/ imports a file below it directly, and nothing here imports
 * from outside app/engine/ (pure numerical code: no database, HTTP or React).
 *
 * Radians inside; degrees, milliarcseconds and hours only in the request and response objects.
 */

export type { CoverageRequest, EphemerisRequest, ParseResult, TrianglesRequest } from "./api/requests";
export {
  BeamOptionsSchema,
  CoverageRequestSchema,
  coverageRuleFailure,
  DEFAULT_GRID_SIZE,
  DEFAULT_MAX_TRIANGLES,
  DEFAULT_MIN_ELEVATION_DEG,
  EphemerisRequestSchema,
  formatIssues,
  IsoDateSchema,
  issuePath,
  MAX_CLOSURE_VALUES,
  MAX_IMAGE_GRID,
  MAX_SAMPLES,
  MAX_STATIONS,
  MAX_UV_POINTS,
  MAX_WAVELENGTH_M,
  MAX_WAVELENGTHS,
  MODEL_TYPES,
  maxNightSamples,
  NightSamplingSchema,
  parseCoverageRequest,
  parseEphemerisRequest,
  parseTrianglesRequest,
  SiteSchema,
  StationSchema,
  sampleCountBound,
  samplingRuleFailure,
  TargetModelSchema,
  TargetSchema,
  TrianglesRequestSchema,
} from "./api/requests";
export { airmassKastenYoung, airmassSecZ } from "./astro/airmass";
export type { EphemerisResponse } from "./astro/ephemeris";
export { computeEphemeris } from "./astro/ephemeris";
export { azimuthRad, elevationRad } from "./astro/horizon";
export type { MoonPosition } from "./astro/moon";
export { moonIlluminatedFraction, moonPosition } from "./astro/moon";
export type { EquatorialRad } from "./astro/precession";
export { precessFromJ2000 } from "./astro/precession";
export type { RiseTransitSetCoreInput, RiseTransitSetResult, StarWindow } from "./astro/rise-set";
export { riseTransitSetCore, SIDEREAL_RATE, STELLAR_H0_RAD, starWindow } from "./astro/rise-set";
export { gastRad, gmstHours, gmstRad, lmstHours, lmstRad } from "./astro/sidereal";
export type { SunPosition } from "./astro/sun";
export { sunAltitudeRad, sunPosition } from "./astro/sun";
export type { CalendarDate } from "./astro/time";
export {
  dateFromJulianDay,
  decimalYear,
  deltaTSeconds,
  isoUtcFromJulianDay,
  jdeFromJd,
  julianDay,
  julianDayAt0hUt,
  julianDayFromDate,
  parseIsoDate,
} from "./astro/time";
export type { NightEvents } from "./astro/twilight";
export { nightEvents, SUN_ALTITUDE_DEG } from "./astro/twilight";
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
export type { BaselineSet } from "./interferometry/baselines";
export { baselineCount, baselineIndex, buildBaselines } from "./interferometry/baselines";
export type { BeamFit } from "./interferometry/beam-fit";
export { fitBeam, sampleBicubic } from "./interferometry/beam-fit";
export { besselJ0, besselJ1, besselJ1OverX, sphericalJ1OverX } from "./interferometry/bessel";
export type { BandLike } from "./interferometry/channels";
export { channelWavelengthsM, describeChannels, micrometres } from "./interferometry/channels";
export type { ClosureCube, TriangleSet } from "./interferometry/closure";
export {
  closureCube,
  closurePhase,
  independentClosurePhaseCount,
  stationTriangles,
  triangleCount,
} from "./interferometry/closure";
export type {
  CoverageArrays,
  CoverageBaseline,
  CoverageBeam,
  CoverageClosure,
  CoverageNight,
  CoverageResponse,
  CoverageSample,
} from "./interferometry/coverage";
export { computeCoverage, computeCoverageArrays } from "./interferometry/coverage";
export type { CoverageFigures } from "./interferometry/coverage-quality";
export { binFilling, coverageFigures, POSITION_ANGLE_BINS, RADIAL_BINS } from "./interferometry/coverage-quality";
export { directDirtyBeam } from "./interferometry/direct-dft";
export type {
  DirtyBeamResult,
  DirtyImageResult,
  ImagingOptions,
  WeightedPoints,
  Weighting,
} from "./interferometry/dirty-beam";
export {
  autoPixelRad,
  dirtyBeam,
  dirtyImage,
  maxUvRadius,
  PIXELS_PER_RESOLUTION,
  weightPoints,
} from "./interferometry/dirty-beam";
export { HermitianImager } from "./interferometry/fft2d";
export type { CompiledModel } from "./interferometry/models";
export { compileModel, evaluateVisibilities, visibilityAt } from "./interferometry/models";
export type { Observability, ObservabilityInput } from "./interferometry/observability";
export { assessObservability, SUN_DARK_LIMIT_DEG } from "./interferometry/observability";
export type { PreparedObservation } from "./interferometry/observation";
export { prepareObservation } from "./interferometry/observation";
export type { HourAngleSamples } from "./interferometry/sampling";
export { samplesAcrossNight, samplesFromHourAngles } from "./interferometry/sampling";
export type { EnuStation, EquatorialVector } from "./interferometry/stations";
export { enuToEquatorial, stationsToEquatorial } from "./interferometry/stations";
export type { RankedTriangle, TriangleRankingInput } from "./interferometry/triangle-ranking";
export { rankTriangleSet, SCORE_WEIGHTS } from "./interferometry/triangle-ranking";
export type { TrianglesResponse } from "./interferometry/triangles";
export { rankTriangles } from "./interferometry/triangles";
export type { UvwTracks } from "./interferometry/uv-tracks";
export { computeUvwTracks, projectBaseline } from "./interferometry/uv-tracks";
export type { VisibilityCube } from "./interferometry/visibilities";
export {
  modelVisibilityCube,
  spatialFrequencies,
  squaredVisibilities,
  visibilityPhases,
} from "./interferometry/visibilities";
export {
  clampedAcos,
  clampedAsin,
  DEG_TO_RAD,
  HALF_PI,
  HOUR_TO_RAD,
  isPowerOfTwo,
  JD_J2000,
  JD_UNIX_EPOCH,
  LN2,
  MAS_TO_RAD,
  MS_PER_DAY,
  median,
  PI,
  RAD_TO_DEG,
  RAD_TO_HOUR,
  RAD_TO_MAS,
  roundTo,
  SECONDS_PER_DAY,
  TWO_PI,
  wrapDeg180,
  wrapHours12,
  wrapHours24,
  wrapPi,
  wrapTwoPi,
} from "./math";
