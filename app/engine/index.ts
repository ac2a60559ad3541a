/**
 * The engine's public face: every export the rest of the app, the command line, the benchmarks and the
 * tests may use. Nothing outside app/engine/ imports a file below it directly, and nothing here imports
 * from outside app/engine/ (pure numerical code: no database, HTTP or React).
 *
 * Radians inside; degrees, milliarcseconds and hours only in the request and response objects.
 */

// Wire schemas: JSON validated into the inputs, one-line errors naming the field; the physical
// ranges of the model parameters, shared by the schema and the pages' hints
export type { BudgetFailure, CostEstimate } from "./api/budget";
export {
  coverageBudgetFailure,
  coverageCost,
  MAX_COMPONENT_EVALUATIONS,
  MAX_RANKED_CLOSURE_PHASES,
  MAX_RESPONSE_BYTES,
  trianglesBudgetFailure,
  trianglesCost,
} from "./api/budget";
// Star catalogue: name lookup, estimates from V and B−V, calibrator shortlist (cli resolve, cli calibrators)
export {
  DEFAULT_CALIBRATOR_LIMIT,
  DEFAULT_MAX_DISTANCE_DEG,
  DEFAULT_MIN_VIS2,
  MAX_CALIBRATOR_LIMIT,
  parseCalibratorsRequest,
} from "./api/calibrators";
export {
  DEFAULT_MIN_ELEVATION_DEG,
  longestNightMinutes,
  MAX_CLOSURE_VALUES,
  MAX_SAMPLES,
  MAX_UV_POINTS,
  maxNightSamples,
} from "./api/limits";
export type { ParamRange, RangedParam } from "./api/model-ranges";
export { MODEL_RANGES, rangeFailure, rangeText } from "./api/model-ranges";
export { MAX_MODEL_COMPONENTS, MAX_SUM_DEPTH, modelShape } from "./api/model-shape";
// Imaging preview: simulated data, OIFITS 2 export, image reconstruction, fidelity and verdict
export type { ReconstructRequest } from "./api/reconstruct";
export {
  DEFAULT_IMAGE_GRID,
  DEFAULT_MAX_ITERATIONS,
  DEFAULT_TOLERANCE,
  MAX_RECONSTRUCT_CLOSURE_PHASES,
  MAX_RECONSTRUCT_VIS2,
  parseReconstructRequest,
} from "./api/reconstruct";
export type { CoverageRequest, EphemerisRequest, ParseResult, TrianglesRequest } from "./api/requests";
export {
  MODEL_TYPES,
  parseCoverageRequest,
  parseEphemerisRequest,
  parseTrianglesRequest,
  TargetModelSchema,
} from "./api/requests";
export { MAX_NAME_LENGTH, parseResolveRequest } from "./api/resolve";
export type { SimulateRequest } from "./api/simulate";
export {
  DEFAULT_NOISE,
  DEFAULT_OIFITS,
  MAX_SIMULATED_CLOSURE_PHASES,
  MAX_SIMULATED_VIS2,
  parseSimulateRequest,
} from "./api/simulate";
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
export type { StarCatalogue, StarNames } from "./catalogue/build";
export { buildCatalogue, designationsOf, displayName, VARIABILITY } from "./catalogue/build";
export type { CalibratorsResult } from "./catalogue/calibrators";
export {
  NIGHT_STEP_MIN,
  shortlistCalibrators,
  TARGET_MATCH_ARCSEC,
  uniformDiskVis2,
} from "./catalogue/calibrators";
export type { ColourTable } from "./catalogue/colour-table";
export { DWARF_COLOURS, interpolateColumn } from "./catalogue/colour-table";
export type { Constellation } from "./catalogue/constellations";
export { CONSTELLATIONS, constellationByAbbr } from "./catalogue/constellations";
export { foldText, GREEK_LETTERS, parseDesignation } from "./catalogue/designations";
export type { Band, BandName, Estimate } from "./catalogue/estimates";
export {
  ASSUMED_BV_ERROR_MAG,
  BAND_MAG_ALLOWANCE,
  BANDS,
  BOLOMETRIC_ZERO_POINT_W_M2,
  bandForWavelength,
  DIAMETER_ALLOWANCE,
  ESTIMATE_BV_RANGE,
  estimateBandMagnitude,
  estimateDiameterMas,
  STEFAN_BOLTZMANN,
} from "./catalogue/estimates";
export type { LookupResult } from "./catalogue/lookup";
export { lookupStar, nearNames, suggestStars } from "./catalogue/lookup";
export { describeStar, resolveStar, unknownNameMessage } from "./catalogue/resolve";
export type { ScoreTerms } from "./catalogue/score";
export { calibratorScore, DEFAULT_MAG_SCALE, SCORE_WEIGHTS, SCORING_TEXT } from "./catalogue/score";
export { editDistance, TrigramIndex, trigramSimilarity, trigramsOf } from "./catalogue/trigram";
export type {
  CalibratorEntry,
  CalibratorsInput,
  CalibratorsResponse,
  CalibratorTarget,
  ResolveInput,
  ResolveResponse,
} from "./catalogue/types";
export type { ReconstructionAssessment } from "./imaging/assessment";
export { assessReconstruction } from "./imaging/assessment";
export type { WeightSearch, WeightTrial } from "./imaging/auto-weight";
export { MAX_WEIGHT, MIN_WEIGHT, searchWeight } from "./imaging/auto-weight";
export { DataTerms } from "./imaging/chi2";
export type { PreparedData } from "./imaging/data";
export { prepareData } from "./imaging/data";
export type { GaussianBeam } from "./imaging/fidelity";
export {
  beamTransform,
  cleanBeamAndDirtyImage,
  convolvedModelImage,
  convolveWithBeam,
  fidelity,
  normalizedCrossCorrelation,
} from "./imaging/fidelity";
export type { BinaryColumn, ColumnCode, FitsCard, FitsValue } from "./imaging/fits";
export { binaryTableHdu, concatBytes, formatCard, formatReal, headerBytes, primaryHdu } from "./imaging/fits";
export { enuToEcefOffset, geodeticToEcef, WGS84_A_M, WGS84_INV_F } from "./imaging/geocentric";
export { GridDft } from "./imaging/grid-dft";
export type {
  ClosurePhaseDatum,
  ClosurePhaseTriangles,
  ImageOptions,
  ImagingData,
  NoiseInput,
  OifitsOptions,
  PriorInput,
  ReconstructInput,
  Regularizer,
  SimulateInput,
  StartInput,
  Vis2Datum,
} from "./imaging/inputs";
export { besselI0, KaiserBessel, kaiserBesselBeta } from "./imaging/kaiser-bessel";
export { DEFAULT_KERNEL_WIDTH, ImageTransform } from "./imaging/nufft";
export { ImagingObjective } from "./imaging/objective";
export { oifitsBytes } from "./imaging/oifits";
export type { BoundedOptions, BoundedResult, Objective, StopReason } from "./imaging/projected-lbfgs";
export { minimizeBounded } from "./imaging/projected-lbfgs";
export { Mt19937 } from "./imaging/random";
export type { ProgressCallback, ReconstructionResult } from "./imaging/reconstruct";
export { recentre, reconstructImage } from "./imaging/reconstruct";
export type { FidelityResponse, ReconstructResponse } from "./imaging/reconstruct-response";
export { computeReconstruction, reconstructResponse } from "./imaging/reconstruct-response";
export { RegularizationTerm } from "./imaging/regularizers";
export type {
  SimulatedClosurePhase,
  SimulatedData,
  SimulatedVis2,
  SimulateResponse,
} from "./imaging/simulate";
export { simulateData, simulateResponse } from "./imaging/simulate";
export {
  dirtyAmplitudeImage,
  fitGaussianFwhmRad,
  flatImage,
  gaussianImage,
  perturb,
} from "./imaging/start-image";
export type { BinaryMeasurement, Verdict } from "./imaging/verdict";
export { fitDiskDiameterRad, measureBinary, verdictFor } from "./imaging/verdict";
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
export { baselineCount, baselineIndex, buildBaselines, longestBaselineM } from "./interferometry/baselines";
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

// ---------------------------------------------------------------- committee
// Review normalization and ranking, dark time and LST pressure, suggested allocation, reviewer
// assignment. (This comment stands apart so that import sorting keeps the section at the end.)

export { MAX_RANK_ID_LENGTH, MAX_RANK_REVIEWS, parseRankRequest, RankRequestSchema } from "./api/rank";
export type {
  AllocationResult,
  AllocationSuggestion,
  ConfigurationAllocation,
  ProposalAllocation,
  TargetGrant,
} from "./committee/allocation";
export { DEFAULT_MIN_GRANT_FRACTION, suggestAllocation } from "./committee/allocation";
export type { AssignmentResult, AssignmentShortfall, ReviewerAssignment, ReviewerLoad } from "./committee/assignment";
export { autoAssign, DEFAULT_REVIEWERS_PER_PROPOSAL } from "./committee/assignment";
export type { Conflict, ConflictKind } from "./committee/conflicts";
export { findConflicts } from "./committee/conflicts";
export type { DarkNight, DarkTime } from "./committee/dark-time";
export {
  addDarkIntervalToLst,
  DEFAULT_LST_BINS,
  darkTimeOverPeriod,
  MAX_PERIOD_NIGHTS,
  SIDEREAL_PER_SOLAR,
} from "./committee/dark-time";
export type {
  AllocationCapacity,
  AllocationInput,
  AllocationRequest,
  AssignmentInput,
  AssignmentProposal,
  AssignmentReviewer,
  DarkTimeOptions,
  DeclaredConflict,
  KeptAssignment,
  LstPressureInput,
  PressureConfiguration,
  PressureRequest,
  RankInput,
  ReviewScore,
  ScoreScale,
} from "./committee/inputs";
export { EDGE_SUBSAMPLES } from "./committee/lst-observability";
export type { ConfigurationPressure, LstPressure, RequestPressure } from "./committee/lst-pressure";
export { LST_CELL_MIN, lstPressure } from "./committee/lst-pressure";
export { ConvexFlowNetwork } from "./committee/min-cost-flow";
export type { RankedProposal, RankResult, ReviewerCalibration } from "./committee/rank";
export { RANK_DECIMALS, rankReviews, reviewZScores } from "./committee/rank";
export { meanAndPopulationSd } from "./committee/stats";
export { observabilityMasks } from "./interferometry/observability";
