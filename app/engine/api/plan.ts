/**
 * Wire schema of the night plan (`cli plan`, `POST /api/plan`): JSON validated into the engine's
 * PlanInput with the defaults filled in. Every failure is one line `field.path: reason`, e.g.
 * `targets[2].calibrators[0].decDeg: must be between -90 and 90`. Unknown keys are ignored.
 */
import * as v from "valibot";
import type { PlanBlockRef, PlanCalibratorInput, PlanInput, PlanTargetInput } from "../planning/inputs";
import { PLAN_DEFAULTS } from "../planning/inputs";
import { between, finiteNumber, type ParseResult, parseRequest, parseValue, positive, trimmedName } from "./blocks";
import { IsoDateSchema, SiteSchema, StationSchema } from "./requests";

/** Most targets in one request. */
export const MAX_PLAN_TARGETS = 300;
/** Most calibrators of one target. */
export const MAX_PLAN_CALIBRATORS = 20;
/** Most executed blocks passed in (and most blocks a validation reads). */
export const MAX_PLAN_BLOCKS = 2000;
/** Most stations of a plan request. */
export const MAX_PLAN_STATIONS = 64;
/** Most (objects × baselines) a request with a delay-line stroke may ask to track. */
export const MAX_PLAN_DELAY_WORK = 200_000;

const name = () => trimmedName(200);

const ISO_INSTANT = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:\d{2})$/;
const isoInstant = (wholeSecond: boolean) =>
  v.pipe(
    v.string("must be an ISO-8601 UTC instant string"),
    v.regex(ISO_INSTANT, "must be an ISO-8601 instant such as 2027-03-16T01:30:00Z"),
    v.check((s) => Number.isFinite(Date.parse(s)), "must be a real instant"),
    v.check((s) => !wholeSecond || Date.parse(s) % 1000 === 0, "must be a whole second"),
  );

export const PlanCalibratorSchema = v.object(
  { name: name(), raDeg: between(0, 360), decDeg: between(-90, 90) },
  "must be an object",
);

export const PlanTargetSchema = v.object(
  {
    name: name(),
    raDeg: between(0, 360),
    decDeg: between(-90, 90),
    priority: finiteNumber(),
    hoursOwed: between(0, 10_000),
    minElevationDeg: v.optional(v.nullable(between(0, 90)), null),
    calibrators: v.optional(
      v.pipe(
        v.array(PlanCalibratorSchema, "must be an array of calibrators"),
        v.maxLength(MAX_PLAN_CALIBRATORS, `must list at most ${MAX_PLAN_CALIBRATORS} calibrators`),
      ),
      [],
    ),
  },
  "must be an object",
);

export const PlanBlockRefSchema = v.object(
  {
    kind: v.picklist(["calibrator", "science"], "must be calibrator or science"),
    target: name(),
    object: name(),
    startUtc: isoInstant(true),
    endUtc: isoInstant(true),
  },
  "must be an object",
);

const BlocksSchema = v.pipe(
  v.array(PlanBlockRefSchema, "must be an array of blocks"),
  v.maxLength(MAX_PLAN_BLOCKS, `must list at most ${MAX_PLAN_BLOCKS} blocks`),
);

export const PlanRequestSchema = v.object(
  {
    site: SiteSchema,
    date: IsoDateSchema,
    stations: v.optional(
      v.pipe(
        v.array(StationSchema, "must be an array of stations"),
        v.maxLength(MAX_PLAN_STATIONS, `must list at most ${MAX_PLAN_STATIONS} stations`),
      ),
      [],
    ),
    delayLineStrokeM: v.optional(v.nullable(positive()), PLAN_DEFAULTS.delayLineStrokeM),
    minElevationDeg: v.optional(between(0, 90), PLAN_DEFAULTS.minElevationDeg),
    moonMinSeparationDeg: v.optional(between(0, 180), PLAN_DEFAULTS.moonMinSeparationDeg),
    sunMinSeparationDeg: v.optional(between(0, 180), PLAN_DEFAULTS.sunMinSeparationDeg),
    scienceBlockMin: v.optional(between(1, 720), PLAN_DEFAULTS.scienceBlockMin),
    calibratorBlockMin: v.optional(between(1, 720), PLAN_DEFAULTS.calibratorBlockMin),
    targets: v.pipe(
      v.array(PlanTargetSchema, "must be an array of targets"),
      v.maxLength(MAX_PLAN_TARGETS, `must list at most ${MAX_PLAN_TARGETS} targets`),
    ),
    notBeforeUtc: v.optional(v.nullable(isoInstant(false)), null),
    executedBlocks: v.optional(BlocksSchema, []),
  },
  "request must be a JSON object",
);

/** Rules across fields: distinct names, executed blocks that name what the request lists, the size limit. */
function planRuleFailure(r: PlanInput): { field: string; message: string } | null {
  const seen = new Set<string>();
  for (let i = 0; i < r.stations.length; i++) {
    if (seen.has(r.stations[i].name)) return { field: `stations[${i}].name`, message: "must be distinct" };
    seen.add(r.stations[i].name);
  }
  if (r.delayLineStrokeM !== null && r.stations.length < 2) {
    return { field: "stations", message: "needs at least 2 stations to check the delay-line stroke" };
  }
  const targets = new Map<string, PlanTargetInput>();
  let objects = 0;
  for (let i = 0; i < r.targets.length; i++) {
    const t = r.targets[i];
    if (targets.has(t.name)) return { field: `targets[${i}].name`, message: `"${t.name}" appears more than once` };
    targets.set(t.name, t);
    const cal = new Set<string>();
    for (let j = 0; j < t.calibrators.length; j++) {
      const c = t.calibrators[j];
      const field = `targets[${i}].calibrators[${j}].name`;
      if (c.name === t.name) return { field, message: "must differ from the target's name" };
      if (cal.has(c.name)) return { field, message: `"${c.name}" appears more than once` };
      cal.add(c.name);
    }
    objects += 1 + t.calibrators.length;
  }
  const nB = (r.stations.length * (r.stations.length - 1)) / 2;
  if (r.delayLineStrokeM !== null && objects * nB > MAX_PLAN_DELAY_WORK) {
    return {
      field: "targets",
      message: `request too large: ${objects} objects × ${nB} baselines = ${objects * nB} (limit ${MAX_PLAN_DELAY_WORK})`,
    };
  }
  for (let i = 0; i < r.executedBlocks.length; i++) {
    const b = r.executedBlocks[i];
    const t = targets.get(b.target);
    if (!t) return { field: `executedBlocks[${i}].target`, message: `"${b.target}" is not among the targets` };
    if (b.kind === "science" && b.object !== t.name) {
      return { field: `executedBlocks[${i}].object`, message: "a science block must point at its target" };
    }
    if (b.kind === "calibrator" && !t.calibrators.some((c: PlanCalibratorInput) => c.name === b.object)) {
      return { field: `executedBlocks[${i}].object`, message: `"${b.object}" is not a calibrator of ${t.name}` };
    }
    if (Date.parse(b.endUtc) <= Date.parse(b.startUtc)) {
      return { field: `executedBlocks[${i}].endUtc`, message: "must be after startUtc" };
    }
  }
  return null;
}

export type PlanRequest = PlanInput;

/** Validates a plan request (already parsed from JSON). */
export function parsePlanRequest(json: unknown): ParseResult<PlanRequest> {
  return parseRequest(PlanRequestSchema, json, planRuleFailure);
}

const BlocksBodySchema = v.object({ blocks: BlocksSchema });

/**
 * Validates a list of blocks for validatePlan; failures read `blocks[2].startUtc: …`. References to
 * targets and calibrators are left to the validator, which reports them per block.
 */
export function parsePlanBlocks(json: unknown): ParseResult<PlanBlockRef[]> {
  const parsed = parseValue(BlocksBodySchema, { blocks: json });
  return parsed.ok ? { ok: true, value: parsed.value.blocks } : parsed;
}
