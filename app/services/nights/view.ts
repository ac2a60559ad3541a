/**
 * A stored plan seen through the planner (pure): every block with its response fields (UT, LST, hour
 * angle, elevation, air mass, Moon distance) and the violations validatePlan finds, in list order.
 * Blocks lost to weather or a technical fault are shown but not validated (they were not observed).
 */

import type { BlockOutcome } from "~/db/schema/nights";
import {
  DEG_TO_RAD,
  describePlanBlocks,
  julianDayFromDate,
  lmstHours,
  type PlanBlock,
  type PlanBlockRef,
  type PlanContext,
  type PlanInput,
  type PlanViolation,
  roundTo,
  validatePlan,
} from "~/engine";
import type { Candidate } from "./candidates";
import type { EditBlock } from "./edits";

/** What a block is in the plan, stored or shown: its place, what it serves, what became of it. */
type BlockBase = {
  id: number;
  position: number;
  kind: "calibrator" | "science";
  target: string;
  object: string;
  proposalId: number | null;
  proposalTargetId: number | null;
  outcome: BlockOutcome;
  note: string;
};

/** A block row as stored. */
export type StoredBlock = BlockBase & { startUtc: Date; endUtc: Date };

export type BlockView = BlockBase & {
  /** The request name of the target served (the candidate's key when it is still a candidate). */
  target: string;
  /** ISO-8601 UTC instants. */
  startUtc: string;
  endUtc: string;
  /** The planner's fields of the block; null when its target or object is no longer known. */
  fields: PlanBlock | null;
  /** Local mean sidereal time at the end, hours [0, 24). */
  endLstH: number;
  violations: PlanViolation[];
  /** Marked blocks cannot be moved or removed. */
  locked: boolean;
};

export const isLost = (o: BlockOutcome) => o === "weather" || o === "technical";
const iso = (d: Date) => d.toISOString().replace(".000Z", "Z");

/** The request name a stored block refers to: its candidate's current key, else the name it was stored with. */
export function requestRef(b: StoredBlock, byTargetId: ReadonlyMap<number, Candidate>): PlanBlockRef {
  const c = b.proposalTargetId === null ? undefined : byTargetId.get(b.proposalTargetId);
  const target = c?.key ?? b.target;
  const object = b.kind === "science" ? target : b.object;
  return { kind: b.kind, target, object, startUtc: iso(b.startUtc), endUtc: iso(b.endUtc) };
}

/** Candidates by proposal target id. */
export const candidatesById = (candidates: readonly Candidate[]) =>
  new Map(candidates.map((c) => [c.proposalTargetId, c]));

/** Validates and describes the stored blocks against a request built for the night. */
export function viewBlocks(
  input: PlanInput,
  ctx: PlanContext,
  blocks: readonly StoredBlock[],
  candidates: readonly Candidate[],
): { blocks: BlockView[]; ok: boolean } {
  const byId = candidatesById(candidates);
  const refs = blocks.map((b) => requestRef(b, byId));
  const fields = describePlanBlocks(input, refs, ctx);
  const checked = blocks.map((b, i) => ({ b, i })).filter(({ b }) => !isLost(b.outcome));
  const validation = validatePlan(
    input,
    checked.map(({ i }) => refs[i]),
    { context: ctx },
  );
  const violations = new Map<number, PlanViolation[]>();
  for (const [k, v] of validation.blocks.entries()) violations.set(checked[k].i, v.violations);
  const out = blocks.map(
    (b, i): BlockView => ({
      id: b.id,
      position: i + 1,
      kind: b.kind,
      target: refs[i].target,
      object: refs[i].object,
      proposalId: b.proposalId,
      proposalTargetId: b.proposalTargetId,
      startUtc: refs[i].startUtc,
      endUtc: refs[i].endUtc,
      outcome: b.outcome,
      note: b.note,
      fields: fields[i],
      endLstH: roundTo(lmstHours(julianDayFromDate(b.endUtc), input.site.longitudeDeg * DEG_TO_RAD), 4),
      violations: violations.get(i) ?? [],
      locked: b.outcome !== "planned",
    }),
  );
  return { blocks: out, ok: validation.ok };
}

/** Stored blocks as the editor works on them. */
export function toEditBlocks(blocks: readonly StoredBlock[]): EditBlock[] {
  return blocks.map((b) => ({
    id: b.id,
    kind: b.kind,
    target: b.target,
    object: b.object,
    proposalId: b.proposalId,
    proposalTargetId: b.proposalTargetId,
    startSec: b.startUtc.getTime() / 1000,
    endSec: b.endUtc.getTime() / 1000,
    locked: b.outcome !== "planned",
  }));
}
