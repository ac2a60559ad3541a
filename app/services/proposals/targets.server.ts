/**
 * The targets of a proposal: typed in (with constraints and calibrators) or copied from the viewer's
 * own list, renamed, reordered and removed. Names are unique within a proposal, without regard to case.
 */
import { and, asc, eq, sql } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { sites } from "~/db/schema/array";
import { type CalibratorJson, proposalTargets, targets } from "~/db/schema/proposals";
import { bandNames } from "~/services/targets/targets.server";
import { proposalNotFound } from "./access.server";
import { editDraft, type ProposalRef, ProposalRefusal } from "./lock.server";
import { type ObservingPeriod, observingPeriodText, windowInsidePeriod } from "./period";
import { PROPOSAL_LIMITS } from "./schemas";

/**
 * What a proposal says of one target: its own copy of the coordinates, model and magnitudes, and the
 * constraints (the closure triangle is chosen apart, in the Triangle finder: `chooseTriangle`).
 */
export type TargetFields = Omit<
  typeof proposalTargets.$inferSelect,
  "id" | "proposalId" | "position" | "sourceTargetId" | "closureTriangle"
>;

type TargetRef = ProposalRef & { targetId: number };

/** A target of My targets, or of a proposal with its constraints: what a proposal keeps of it. */
type TargetSource = Pick<TargetFields, "name" | "raDeg" | "decDeg" | "model" | "magnitudes" | "notes"> &
  Partial<Pick<TargetFields, "minElevationDeg" | "timeWindows" | "calibrators">>;

/** The fields a proposal keeps of a target (no constraints: none yet). */
export function targetFieldsOf(t: TargetSource): TargetFields {
  return {
    name: t.name,
    raDeg: t.raDeg,
    decDeg: t.decDeg,
    model: t.model,
    magnitudes: t.magnitudes,
    minElevationDeg: t.minElevationDeg ?? null,
    timeWindows: t.timeWindows ?? [],
    calibrators: t.calibrators ?? [],
    notes: t.notes,
  };
}

/** The band names (for the magnitude fields) and the array's elevation limit, for the target form. */
export async function targetFormContext(db: Database) {
  const [bands, [site]] = await Promise.all([
    bandNames(db),
    db.select({ minElevationDeg: sites.minElevationDeg }).from(sites).orderBy(asc(sites.id)).limit(1),
  ]);
  return { bands, siteMinElevationDeg: site?.minElevationDeg ?? 0 };
}

/** One target of the proposal (the caller has checked who may see it), or the 404. */
export async function readProposalTarget(
  db: Database,
  { proposalId, targetId }: { proposalId: number; targetId: number },
) {
  const [row] = await db
    .select()
    .from(proposalTargets)
    .where(and(eq(proposalTargets.id, targetId), eq(proposalTargets.proposalId, proposalId)));
  if (!row) proposalNotFound();
  return row;
}

async function nextPosition(tx: Transaction, proposalId: number) {
  const [row] = await tx
    .select({
      n: sql<number>`coalesce(max(${proposalTargets.position}), -1)::int + 1`,
      count: sql<number>`count(*)::int`,
    })
    .from(proposalTargets)
    .where(eq(proposalTargets.proposalId, proposalId));
  if (row.count >= PROPOSAL_LIMITS.targetsMax)
    throw new ProposalRefusal(400, `Targets: a proposal has at most ${PROPOSAL_LIMITS.targetsMax} targets.`);
  return row.n;
}

async function refuseDuplicateName(tx: Transaction, proposalId: number, name: string, exceptId: number | null) {
  const same = await tx
    .select({ id: proposalTargets.id })
    .from(proposalTargets)
    .where(and(eq(proposalTargets.proposalId, proposalId), sql`lower(${proposalTargets.name}) = lower(${name})`));
  if (same.some((s) => s.id !== exceptId))
    throw new ProposalRefusal(400, `Name: the proposal already has a target called "${name}".`, "name");
}

/** Adds a target at the end of the list, checking the name and the number of targets. Returns the row. */
async function appendTarget(tx: Transaction, proposalId: number, values: TargetFields & { sourceTargetId?: number }) {
  await refuseDuplicateName(tx, proposalId, values.name, null);
  const position = await nextPosition(tx, proposalId);
  const [row] = await tx
    .insert(proposalTargets)
    .values({ proposalId, position, ...values })
    .returning();
  return row;
}

/** Refuses the first time window that does not lie wholly inside the cycle's observing period. */
function refuseWindowsOutside(windows: TargetFields["timeWindows"], cycle: ObservingPeriod & { name: string }) {
  const at = windows.findIndex((w) => !windowInsidePeriod(w, cycle));
  if (at < 0) return;
  throw new ProposalRefusal(
    400,
    `Time window ${at + 1}: must lie inside the ${cycle.name} observing period, ${observingPeriodText(cycle)}.`,
    `window-${at}`,
  );
}

/** Creates (targetId null) or updates a target of the proposal. Returns its id. */
export async function saveTarget(
  db: Database,
  { targetId, input, ...ref }: ProposalRef & { targetId: number | null; input: TargetFields },
) {
  return editDraft(db, ref, async ({ tx, proposalId, cycle }) => {
    refuseWindowsOutside(input.timeWindows, cycle);
    if (targetId === null) return (await appendTarget(tx, proposalId, input)).id;
    await refuseDuplicateName(tx, proposalId, input.name, targetId);
    const rows = await tx
      .update(proposalTargets)
      .set(input)
      .where(and(eq(proposalTargets.id, targetId), eq(proposalTargets.proposalId, proposalId)))
      .returning({ id: proposalTargets.id });
    if (rows.length === 0) proposalNotFound();
    return rows[0].id;
  });
}

/** Copies one of the viewer's own targets ("My targets") into the proposal. Returns the new row. */
export async function addTargetFromMine(db: Database, { myTargetId, ...ref }: ProposalRef & { myTargetId: number }) {
  return editDraft(db, ref, async ({ tx, proposalId }) => {
    const [mine] = await tx
      .select()
      .from(targets)
      .where(and(eq(targets.id, myTargetId), eq(targets.ownerId, ref.viewer.user.id)));
    if (!mine) throw new ProposalRefusal(400, "From my targets: choose one of your own targets.", "myTargetId");
    const [already] = await tx
      .select({ id: proposalTargets.id })
      .from(proposalTargets)
      .where(
        and(
          eq(proposalTargets.proposalId, proposalId),
          sql`(${proposalTargets.sourceTargetId} = ${mine.id} or lower(${proposalTargets.name}) = lower(${mine.name}))`,
        ),
      );
    if (already)
      throw new ProposalRefusal(400, `From my targets: ${mine.name} is already on the proposal.`, "myTargetId");
    return appendTarget(tx, proposalId, { sourceTargetId: mine.id, ...targetFieldsOf(mine) });
  });
}

export async function removeTarget(db: Database, { targetId, ...ref }: TargetRef) {
  return editDraft(db, ref, async ({ tx, proposalId }) => {
    const gone = await tx
      .delete(proposalTargets)
      .where(and(eq(proposalTargets.id, targetId), eq(proposalTargets.proposalId, proposalId)))
      .returning();
    if (gone.length === 0) throw new ProposalRefusal(400, "That target is not in the proposal (any more).");
    return gone[0];
  });
}

/** Moves a target one place up or down the list (positions are renumbered 0, 1, 2 …). */
export async function moveTarget(
  db: Database,
  { targetId, direction, ...ref }: TargetRef & { direction: "up" | "down" },
) {
  return editDraft(db, ref, async ({ tx, proposalId }) => {
    const list = await tx
      .select({ id: proposalTargets.id })
      .from(proposalTargets)
      .where(eq(proposalTargets.proposalId, proposalId))
      .orderBy(asc(proposalTargets.position), asc(proposalTargets.id));
    const at = list.findIndex((t) => t.id === targetId);
    if (at < 0) throw new ProposalRefusal(400, "That target is not in the proposal (any more).");
    const to = direction === "up" ? at - 1 : at + 1;
    if (to >= 0 && to < list.length) [list[at], list[to]] = [list[to], list[at]];
    for (let i = 0; i < list.length; i++) {
      await tx.update(proposalTargets).set({ position: i }).where(eq(proposalTargets.id, list[i].id));
    }
  });
}

/**
 * Appends a calibrator to one of the proposal's targets (the Calibrator shortlist's "Add as calibrator"):
 * refused when the target has its most calibrators, or already has this one (same catalogue star or
 * same name). Returns the target's name and its number of calibrators.
 */
export async function addCalibrator(
  db: Database,
  { targetId, calibrator, ...ref }: TargetRef & { calibrator: CalibratorJson },
) {
  return editDraft(db, ref, async ({ tx, proposalId }) => {
    const [row] = await tx
      .select({ name: proposalTargets.name, calibrators: proposalTargets.calibrators })
      .from(proposalTargets)
      .where(and(eq(proposalTargets.id, targetId), eq(proposalTargets.proposalId, proposalId)));
    if (!row) throw new ProposalRefusal(400, "That target is not in the proposal (any more).");
    const max = PROPOSAL_LIMITS.calibratorsMax;
    if (row.calibrators.length >= max) {
      throw new ProposalRefusal(400, `Calibrators: ${row.name} already has ${max}, the most a target may have.`);
    }
    const name = calibrator.name.toLowerCase();
    if (
      row.calibrators.some((c) => (c.hip !== undefined && c.hip === calibrator.hip) || c.name.toLowerCase() === name)
    ) {
      throw new ProposalRefusal(400, `${calibrator.name} is already a calibrator of ${row.name}.`);
    }
    const calibrators = [...row.calibrators, calibrator];
    await tx.update(proposalTargets).set({ calibrators }).where(eq(proposalTargets.id, targetId));
    return { target: row.name, calibrators: calibrators.length };
  });
}
