/**
 * Every wire schema produces the engine's own input type: this list fails to compile when a schema and
 * its type drift apart. Types only; nothing imports this module.
 */
import type * as v from "valibot";
import type { CalibratorsInput, ResolveInput } from "../catalogue/types";
import type { RankInput, ReviewScore, ScoreScale } from "../committee/inputs";
import type {
  ClosurePhaseDatum,
  ImageOptions,
  ImagingData,
  NoiseInput,
  OifitsOptions,
  ReconstructInput,
  SimulateInput,
  Vis2Datum,
} from "../imaging/inputs";
import type {
  BeamOptions,
  CoverageInput,
  EphemerisInput,
  NightSampling,
  SiteInput,
  StationInput,
  TargetInput,
  TargetModel,
  TrianglesInput,
} from "../inputs";
import type { PlanBlockRef, PlanInput, PlanTargetInput } from "../planning/inputs";
import type { CalibratorsRequestSchema } from "./calibrators";
import type { PlanBlockRefSchema, PlanRequestSchema, PlanTargetSchema } from "./plan";
import type { RankRequestSchema, ReviewScoreSchema, ScoreScaleSchema } from "./rank";
import type {
  ClosurePhaseDatumSchema,
  ImageOptionsSchema,
  ImagingDataSchema,
  ReconstructRequestSchema,
  Vis2DatumSchema,
} from "./reconstruct";
import type {
  BeamOptionsSchema,
  CoverageRequestSchema,
  EphemerisRequestSchema,
  NightSamplingSchema,
  SiteSchema,
  StationSchema,
  TargetModelSchema,
  TargetSchema,
  TrianglesRequestSchema,
} from "./requests";
import type { ResolveRequestSchema } from "./resolve";
import type { NoiseSchema, OifitsOptionsSchema, SimulateRequestSchema } from "./simulate";

type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
type Matches<S extends v.GenericSchema, T> = Same<v.InferOutput<S>, T>;

type SchemaChecks = [
  // requests.ts
  Matches<typeof SiteSchema, SiteInput>,
  Matches<typeof StationSchema, StationInput>,
  Matches<typeof TargetSchema, TargetInput>,
  Matches<typeof TargetModelSchema, TargetModel>,
  Matches<typeof BeamOptionsSchema, BeamOptions>,
  Matches<typeof NightSamplingSchema, NightSampling>,
  Matches<typeof CoverageRequestSchema, CoverageInput>,
  Matches<typeof TrianglesRequestSchema, TrianglesInput>,
  Matches<typeof EphemerisRequestSchema, EphemerisInput>,
  // simulate.ts, reconstruct.ts
  Matches<typeof NoiseSchema, NoiseInput>,
  Matches<typeof OifitsOptionsSchema, OifitsOptions>,
  Matches<typeof SimulateRequestSchema, SimulateInput>,
  Matches<typeof Vis2DatumSchema, Vis2Datum>,
  Matches<typeof ClosurePhaseDatumSchema, ClosurePhaseDatum>,
  Matches<typeof ImagingDataSchema, ImagingData>,
  Matches<typeof ImageOptionsSchema, ImageOptions>,
  Matches<typeof ReconstructRequestSchema, ReconstructInput>,
  // plan.ts, rank.ts, calibrators.ts, resolve.ts
  Matches<typeof PlanRequestSchema, PlanInput>,
  Matches<typeof PlanTargetSchema, PlanTargetInput>,
  Matches<typeof PlanBlockRefSchema, PlanBlockRef>,
  Matches<typeof ScoreScaleSchema, ScoreScale>,
  Matches<typeof ReviewScoreSchema, ReviewScore>,
  Matches<typeof RankRequestSchema, RankInput>,
  Matches<typeof CalibratorsRequestSchema, CalibratorsInput>,
  Matches<typeof ResolveRequestSchema, ResolveInput>,
];

/** `true` only when every entry above is `true`. */
export const everySchemaMatchesItsInput: SchemaChecks extends true[] ? true : false = true;
