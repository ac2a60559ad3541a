/**
 * The programs a night serves: accepted proposals of the cycle (status "accepted" or "scheduled") with
 * hours on the night's configuration, their targets, the hours granted and the science hours already
 * executed. Hours owed = granted − executed, shared evenly among a program's targets.
 */
import { and, asc, eq, inArray, ne, sql } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { nightPlanBlocks, nightPlans } from "~/db/schema/nights";
import { type ProposalStatus, proposalHours, proposals, proposalTargets } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { piOfProposal, planOfBlock } from "~/lib/joins.server";
import type { ProgramTarget } from "./candidates";

/** Proposal statuses whose targets the Night builder plans. */
export const PLANNED_STATUSES: readonly ProposalStatus[] = ["accepted", "scheduled"];

/**
 * Hours granted per proposal and configuration: the one place that decides. Until the committee's
 * allocated hours are stored, the hours the proposal requested for the configuration are granted;
 * when the allocation exists, read it here instead.
 */
export async function grantedHours(
  db: DbOrTx,
  { proposalIds }: { proposalIds: readonly number[] },
): Promise<Map<number, Map<number, number>>> {
  const out = new Map<number, Map<number, number>>();
  if (proposalIds.length === 0) return out;
  const rows = await db
    .select({
      proposalId: proposalHours.proposalId,
      configurationId: proposalHours.configurationId,
      hours: proposalHours.hours,
    })
    .from(proposalHours)
    .where(inArray(proposalHours.proposalId, [...proposalIds]));
  for (const r of rows) {
    if (!out.has(r.proposalId)) out.set(r.proposalId, new Map());
    out.get(r.proposalId)?.set(r.configurationId, r.hours);
  }
  return out;
}

/**
 * Rank of each accepted program of a cycle, 1 first. Until the committee's ranking is stored, the
 * order of submission (earliest first, then proposal number) stands in for it.
 */
export async function programRanks(db: DbOrTx, { cycleId }: { cycleId: number }): Promise<Map<number, number>> {
  const rows = await db
    .select({ id: proposals.id })
    .from(proposals)
    .where(and(eq(proposals.cycleId, cycleId), inArray(proposals.status, [...PLANNED_STATUSES])))
    .orderBy(sql`${proposals.submittedAt} asc nulls last`, asc(proposals.id));
  return new Map(rows.map((r, i) => [r.id, i + 1]));
}

/** Executed science hours per proposal target on a configuration, leaving out one night when asked. */
export async function executedScienceHours(
  db: DbOrTx,
  { configurationId, exceptNight }: { configurationId?: number; exceptNight?: string },
): Promise<Map<number, number>> {
  const conditions = [eq(nightPlanBlocks.kind, "science"), eq(nightPlanBlocks.outcome, "executed")];
  if (configurationId !== undefined) conditions.push(eq(nightPlans.configurationId, configurationId));
  if (exceptNight) conditions.push(ne(nightPlans.nightDate, exceptNight));
  const rows = await db
    .select({
      targetId: nightPlanBlocks.proposalTargetId,
      hours: sql<number>`sum(extract(epoch from (${nightPlanBlocks.endUtc} - ${nightPlanBlocks.startUtc}))) / 3600.0`,
    })
    .from(nightPlanBlocks)
    .innerJoin(nightPlans, planOfBlock)
    .where(and(...conditions))
    .groupBy(nightPlanBlocks.proposalTargetId);
  const out = new Map<number, number>();
  for (const r of rows) if (r.targetId !== null) out.set(r.targetId, Number(r.hours));
  return out;
}

/**
 * Every target of the cycle's accepted programs with hours on `configurationId`, in rank order, with
 * its share of the granted hours and what other nights executed (so: what it is owed at the start of
 * the night `date`).
 */
export async function programTargets(
  db: DbOrTx,
  { cycleId, configurationId, date }: { cycleId: number; configurationId: number; date: string },
): Promise<ProgramTarget[]> {
  const programs = await db
    .select({ id: proposals.id, title: proposals.title, piName: users.name })
    .from(proposals)
    .innerJoin(users, piOfProposal)
    .where(and(eq(proposals.cycleId, cycleId), inArray(proposals.status, [...PLANNED_STATUSES])));
  if (programs.length === 0) return [];
  const ids = programs.map((p) => p.id);
  const [granted, ranks, executed, targets] = await Promise.all([
    grantedHours(db, { proposalIds: ids }),
    programRanks(db, { cycleId }),
    executedScienceHours(db, { configurationId, exceptNight: date }),
    db
      .select()
      .from(proposalTargets)
      .where(inArray(proposalTargets.proposalId, ids))
      .orderBy(asc(proposalTargets.proposalId), asc(proposalTargets.position), asc(proposalTargets.id)),
  ]);
  const out: ProgramTarget[] = [];
  const byRank = [...programs].sort((a, b) => (ranks.get(a.id) ?? 1e9) - (ranks.get(b.id) ?? 1e9));
  for (const p of byRank) {
    const hours = granted.get(p.id)?.get(configurationId) ?? 0;
    const own = targets.filter((t) => t.proposalId === p.id);
    if (!(hours > 0) || own.length === 0) continue;
    for (const t of own) {
      out.push({
        proposalId: p.id,
        proposalTitle: p.title || `Proposal ${p.id}`,
        piName: p.piName,
        rank: ranks.get(p.id) ?? out.length + 1,
        proposalTargetId: t.id,
        name: t.name,
        raDeg: t.raDeg,
        decDeg: t.decDeg,
        minElevationDeg: t.minElevationDeg,
        calibrators: t.calibrators,
        grantedHours: hours / own.length,
        executedHours: executed.get(t.id) ?? 0,
      });
    }
  }
  return out;
}
