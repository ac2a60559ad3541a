/**
 * Changing one night's plan, each change in one transaction with the plan row locked: the settings,
 * the automatic plan and the re-plan of the rest of a night (both computePlan), edits by hand, the
 * marks after the night, and discarding a draft. Publication is in publish.server.ts.
 *
 * State guards: a draft is built and edited; a published (or executed) plan is marked block by block
 * and may be re-planned from a given time, which makes it a draft again (to be published anew).
 */
import { eq } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { type BlockOutcome, type NightPlanSettingsJson, nightPlanBlocks, nightPlans } from "~/db/schema/nights";
import { computePlan, type PlanBlockRef } from "~/engine";
import { scopeExcept } from "~/lib/conditions.server";
import { planContext, planRequest } from "./candidates";
import { type EditBlock, insertBlock, moveBlock, removeBlock, resizeBlock } from "./edits";
import { defaultSettings, type LoadedNight, loadNight } from "./night.server";
import { type CommandResult, done, type Refusal, refuse } from "./result";
import { candidatesById, isLost, requestRef, toEditBlocks } from "./view";

export type EditOp =
  | { intent: "move"; blockId: number; to: string }
  | { intent: "remove"; blockId: number }
  | { intent: "resize"; blockId: number; lengthMin: number }
  | { intent: "insert"; object: string; after: string; lengthMin: number };

const isoOf = (sec: number) => new Date(sec * 1000).toISOString().replace(".000Z", "Z");
const noInstallation = (date: string) =>
  refuse(409, `No configuration is installed on the night of ${date}: set it in the nights calendar first.`);
const notDraft = (state: string) =>
  refuse(409, `The plan is ${state}: re-plan the rest of the night to change it (the re-plan is a new draft).`);

/** Loads the night inside the transaction, with an installed configuration, and a plan row (created as a draft when asked). */
async function openNight(
  tx: Transaction,
  date: string,
  userId: number | null,
  create: boolean,
): Promise<LoadedNight | Refusal> {
  const night = await loadNight(tx, { date, lock: true });
  if (!night.installation || !night.site || !night.setting) return noInstallation(date);
  if (!night.plan && create) {
    await tx.insert(nightPlans).values({
      nightDate: date,
      cycleId: night.installation.cycleId,
      configurationId: night.installation.configurationId,
      settings: defaultSettings(night.site),
      createdById: userId,
    });
    return loadNight(tx, { date, lock: true });
  }
  return night;
}

const refused = (x: LoadedNight | Refusal): x is Refusal => "ok" in x && x.ok === false;

/** Writes an edited block list: rows not in it deleted, kept rows moved, new rows inserted; positions in order. */
async function writeBlocks(tx: Transaction, planId: number, blocks: readonly EditBlock[]) {
  const keep = blocks.map((b) => b.id).filter((id): id is number => id !== null);
  await tx.delete(nightPlanBlocks).where(scopeExcept(eq(nightPlanBlocks.planId, planId), nightPlanBlocks.id, keep));
  const fresh = [];
  for (const [i, b] of blocks.entries()) {
    const values = { position: i + 1, startUtc: new Date(b.startSec * 1000), endUtc: new Date(b.endSec * 1000) };
    if (b.id !== null) await tx.update(nightPlanBlocks).set(values).where(eq(nightPlanBlocks.id, b.id));
    else {
      fresh.push({
        ...values,
        planId,
        kind: b.kind,
        target: b.target,
        object: b.object,
        proposalId: b.proposalId,
        proposalTargetId: b.proposalTargetId,
      });
    }
  }
  if (fresh.length) await tx.insert(nightPlanBlocks).values(fresh);
  await tx.update(nightPlans).set({ updatedAt: new Date() }).where(eq(nightPlans.id, planId));
}

/** Saves the planner settings of a night (creating its draft plan). */
export async function savePlanSettings(
  db: Database,
  { date, settings, userId }: { date: string; settings: NightPlanSettingsJson; userId: number | null },
): Promise<CommandResult> {
  return db.transaction(async (tx) => {
    const night = await openNight(tx, date, userId, true);
    if (refused(night)) return night;
    const plan = night.plan!;
    if (plan.state !== "draft") return notDraft(plan.state);
    await tx.update(nightPlans).set({ settings }).where(eq(nightPlans.id, plan.id));
    return done("Settings saved; the blocks are checked against them.");
  });
}

/**
 * Plans the night (or its rest from `fromSec`) with computePlan and stores the result. Kept: every block
 * begun by `fromSec`, every block marked executed, and the closing calibrator of a kept science block
 * (so a sequence under way is finished); new blocks start after the last kept one. Kept blocks not lost
 * are passed to the planner as fixed (their science counts against the hours owed). A block lost to
 * weather or a fault that is not kept is refused: re-plan from its end.
 */
async function planAndStore(tx: Transaction, night: LoadedNight, fromSec: number | null) {
  const plan = night.plan!;
  const setting = night.setting!;
  const sec = (d: Date) => d.getTime() / 1000;
  const keep = new Set<number>();
  for (const [i, b] of night.blocks.entries()) {
    if ((fromSec !== null && sec(b.startUtc) < fromSec) || b.outcome === "executed") keep.add(i);
  }
  for (const i of [...keep]) {
    const b = night.blocks[i];
    const next = night.blocks[i + 1];
    if (b.kind === "science" && next?.kind === "calibrator" && next.target === b.target && +next.startUtc === +b.endUtc)
      keep.add(i + 1);
  }
  const kept = night.blocks.filter((_, i) => keep.has(i));
  const lostAfter = night.blocks.find((b, i) => isLost(b.outcome) && !keep.has(i));
  if (lostAfter) {
    return refuse(
      409,
      `A block marked lost (${lostAfter.object}, ${isoOf(sec(lostAfter.endUtc))}) lies after the time to plan from: plan from its end or later.`,
      "fromUtc",
    );
  }
  const lastKept = Math.max(fromSec ?? -Infinity, ...kept.map((b) => sec(b.endUtc)));
  fromSec = Number.isFinite(lastKept) ? lastKept : null;
  const byId = candidatesById(night.candidates);
  const fixed = kept.filter((b) => !isLost(b.outcome));
  const fixedRefs: PlanBlockRef[] = fixed.map((b) => requestRef(b, byId));
  const fixedKeys = new Set(fixedRefs.map((r) => r.target));
  const candidates = night.candidates.filter((c) => c.owedHours > 0 || fixedKeys.has(c.key));
  const known = new Set(candidates.map((c) => c.key));
  const request = planRequest(setting, candidates, {
    notBeforeUtc: fromSec === null ? null : isoOf(fromSec),
    executedBlocks: fixedRefs.filter((r) => known.has(r.target)),
  });
  const result = computePlan(request);
  const byKey = new Map(candidates.map((c) => [c.key, c]));
  const fresh: EditBlock[] = result.blocks
    .filter((b) => !b.executed)
    .map((b) => {
      const c = byKey.get(b.target);
      return {
        id: null,
        kind: b.kind,
        target: b.target,
        object: b.object,
        proposalId: c?.proposalId ?? null,
        proposalTargetId: c?.proposalTargetId ?? null,
        startSec: Date.parse(b.startUtc) / 1000,
        endSec: Date.parse(b.endUtc) / 1000,
        locked: false,
      };
    });
  const all = [...toEditBlocks(kept), ...fresh].sort((a, b) => a.startSec - b.startSec);
  await writeBlocks(tx, plan.id, all);
  await tx
    .update(nightPlans)
    .set({ report: { unplaced: result.unplaced, warnings: result.warnings }, state: "draft" })
    .where(eq(nightPlans.id, plan.id));
  const placed = new Set(fresh.filter((b) => b.kind === "science").map((b) => b.target)).size;
  return done(
    `${fresh.length} block${fresh.length === 1 ? "" : "s"} planned for ${placed} target${placed === 1 ? "" : "s"}; ${result.unplaced.length} without time.`,
  );
}

/** The automatic plan of a draft night: everything after its last marked block is planned afresh. */
export async function autoPlan(
  db: Database,
  { date, userId }: { date: string; userId: number | null },
): Promise<CommandResult> {
  return db.transaction(async (tx) => {
    const night = await openNight(tx, date, userId, true);
    if (refused(night)) return night;
    if (night.plan!.state !== "draft") return notDraft(night.plan!.state);
    const marked = night.blocks.filter((b) => b.outcome !== "planned").map((b) => b.endUtc.getTime() / 1000);
    return planAndStore(tx, night, marked.length ? Math.max(...marked) : null);
  });
}

/** Re-plans the rest of the night from `from` (UTC); the plan becomes a draft to publish again. */
export async function replanRest(db: Database, { date, from }: { date: string; from: Date }): Promise<CommandResult> {
  return db.transaction(async (tx) => {
    const night = await openNight(tx, date, null, false);
    if (refused(night)) return night;
    if (!night.plan) return refuse(404, `There is no plan for the night of ${date} yet.`);
    const out = await planAndStore(tx, night, Math.floor(from.getTime() / 1000));
    return out.ok
      ? done(`Re-planned from ${isoOf(from.getTime() / 1000)}: ${out.message} The plan is a draft again.`)
      : out;
  });
}

/** One edit by hand of a draft; the result is stored whatever the validator will say of it. */
export async function editPlan(
  db: Database,
  { date, op, userId = null }: { date: string; op: EditOp; userId?: number | null },
): Promise<CommandResult> {
  return db.transaction(async (tx) => {
    const night = await openNight(tx, date, userId, op.intent === "insert");
    if (refused(night)) return night;
    if (!night.plan) return refuse(404, `There is no plan for the night of ${date} yet.`);
    if (night.plan.state !== "draft") return notDraft(night.plan.state);
    const blocks = toEditBlocks(night.blocks);
    const indexOf = (id: number) => blocks.findIndex((b) => b.id === id);
    let result: ReturnType<typeof moveBlock>;
    let message: string;
    if (op.intent === "insert") {
      const [targetId, what, calIndex] = op.object.split(":");
      const c = night.candidates.find((x) => x.proposalTargetId === Number(targetId));
      const cal = what === "cal" ? c?.calibrators[Number(calIndex)] : undefined;
      if (!c || (what === "cal" && !cal))
        return refuse(400, "What to observe: not a candidate of this night.", "object");
      const after = op.after === "start" ? -1 : indexOf(Number(op.after));
      if (op.after !== "start" && after < 0) return refuse(400, "Where: there is no such block in the plan.", "after");
      const ctx = planContext(planRequest(night.setting!, night.candidates));
      if (ctx.sky.darkStartSec === null) return refuse(409, "This night has no astronomical darkness to plan in.");
      const kind = cal ? "calibrator" : "science";
      const object = cal ? cal.name : c.key;
      result = insertBlock(
        blocks,
        after,
        { kind, target: c.key, object, proposalId: c.proposalId, proposalTargetId: c.proposalTargetId },
        Math.round(op.lengthMin * 60),
        ctx.sky.darkStartSec,
      );
      message = `Inserted a ${kind} block on ${object}.`;
    } else {
      const i = indexOf(op.blockId);
      if (i < 0) return refuse(404, "There is no such block in this plan.", "blockId");
      const b = blocks[i];
      if (op.intent === "remove") {
        result = removeBlock(blocks, i);
        message = `Removed the ${b.kind} block on ${b.object}.`;
      } else if (op.intent === "resize") {
        result = resizeBlock(blocks, i, Math.round(op.lengthMin * 60));
        message = `The ${b.kind} block on ${b.object} now lasts ${op.lengthMin} min.`;
      } else {
        const to = op.to === "up" ? i - 1 : op.to === "down" ? i + 1 : Number(op.to) - 1;
        result = moveBlock(blocks, i, to);
        message = `Moved the ${b.kind} block on ${b.object} to place ${to + 1}.`;
      }
    }
    if (!result.ok) return refuse(409, result.error);
    await writeBlocks(tx, night.plan.id, result.blocks);
    return done(message);
  });
}

/**
 * Marks a block of a published plan executed, lost to the weather or to a technical fault (or back to
 * planned), with a note. A block can be marked once it has begun. The plan is executed once every
 * block is marked, published otherwise.
 */
export async function markBlock(
  db: Database,
  input: { date: string; blockId: number; outcome: BlockOutcome; note: string; userId: number | null; now?: Date },
): Promise<CommandResult> {
  const now = input.now ?? new Date();
  return db.transaction(async (tx) => {
    const night = await openNight(tx, input.date, null, false);
    if (refused(night)) return night;
    const plan = night.plan;
    if (!plan) return refuse(404, `There is no plan for the night of ${input.date} yet.`);
    if (plan.state === "draft") return refuse(409, "Blocks are marked after the plan is published.");
    const block = night.blocks.find((b) => b.id === input.blockId);
    if (!block) return refuse(404, "There is no such block in this plan.", "blockId");
    if (input.outcome !== "planned" && block.startUtc > now) {
      return refuse(
        409,
        `This block has not begun yet (it starts ${isoOf(block.startUtc.getTime() / 1000)}).`,
        "blockId",
      );
    }
    await tx
      .update(nightPlanBlocks)
      .set({
        outcome: input.outcome,
        note: input.note,
        markedAt: input.outcome === "planned" ? null : now,
        markedById: input.outcome === "planned" ? null : input.userId,
      })
      .where(eq(nightPlanBlocks.id, block.id));
    const outcomes = night.blocks.map((b) => (b.id === block.id ? input.outcome : b.outcome));
    const state = outcomes.every((o) => o !== "planned") ? "executed" : "published";
    await tx.update(nightPlans).set({ state }).where(eq(nightPlans.id, plan.id));
    return done(`The ${block.kind} block on ${block.object} is marked ${input.outcome}.`);
  });
}

/** Deletes a draft plan with its blocks (a published plan stays). */
export async function discardDraft(db: Database, { date }: { date: string }): Promise<CommandResult> {
  return db.transaction(async (tx) => {
    const [plan] = await tx.select().from(nightPlans).where(eq(nightPlans.nightDate, date)).for("update");
    if (!plan) return refuse(404, `There is no plan for the night of ${date}.`);
    if (plan.state !== "draft")
      return refuse(409, `The plan is ${plan.state} and stays; only a draft can be discarded.`);
    await tx.delete(nightPlans).where(eq(nightPlans.id, plan.id));
    return done(`The draft plan of ${date} was discarded.`);
  });
}
