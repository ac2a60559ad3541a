/**
 * A program's nights, for its proposal page: the blocks of published (and executed) plans that serve
 * the proposal, and per configuration the hours granted, executed and still owed. Drafts are the
 * scheduler's and are not shown. The caller has already checked that the viewer may see the proposal.
 */
import { and, asc, eq, inArray } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { configurations } from "~/db/schema/array";
import { nightPlanBlocks, nightPlans } from "~/db/schema/nights";
import { configurationOf, planOfBlock } from "~/lib/joins.server";
import { grantedHours } from "./programs.server";
import type { BlockFields } from "./timeline";

export type ProgramBlock = BlockFields & { id: number; night: string; configuration: string; note: string };

export type ProgramHours = {
  configuration: string;
  grantedHours: number;
  /** Science in published plans not yet marked. */
  plannedHours: number;
  executedHours: number;
  /** Granted less executed, never below zero. */
  owedHours: number;
};

export type ProgramNights = { blocks: ProgramBlock[]; hours: ProgramHours[] };

const hoursOf = (b: { startUtc: Date; endUtc: Date }) => (b.endUtc.getTime() - b.startUtc.getTime()) / 3_600_000;
const round = (x: number) => Math.round(x * 100) / 100;
/** ISO-8601 UTC, without the milliseconds when there are none. */
const isoSecond = (d: Date) => d.toISOString().replace(".000Z", "Z");

/** The planned and executed blocks of a proposal and its hours per configuration. */
export async function programNights(db: DbOrTx, { proposalId }: { proposalId: number }): Promise<ProgramNights> {
  const rows = await db
    .select({
      id: nightPlanBlocks.id,
      night: nightPlans.nightDate,
      configurationId: nightPlans.configurationId,
      configuration: configurations.name,
      kind: nightPlanBlocks.kind,
      target: nightPlanBlocks.target,
      object: nightPlanBlocks.object,
      startUtc: nightPlanBlocks.startUtc,
      endUtc: nightPlanBlocks.endUtc,
      outcome: nightPlanBlocks.outcome,
      note: nightPlanBlocks.note,
    })
    .from(nightPlanBlocks)
    .innerJoin(nightPlans, planOfBlock)
    .innerJoin(configurations, configurationOf(nightPlans.configurationId))
    .where(and(eq(nightPlanBlocks.proposalId, proposalId), inArray(nightPlans.state, ["published", "executed"])))
    .orderBy(asc(nightPlanBlocks.startUtc));
  const granted = (await grantedHours(db, { proposalIds: [proposalId] })).get(proposalId) ?? new Map<number, number>();
  const configIds = new Set([...granted.keys(), ...rows.map((r) => r.configurationId)]);
  const names = configIds.size
    ? await db
        .select({ id: configurations.id, name: configurations.name })
        .from(configurations)
        .where(inArray(configurations.id, [...configIds]))
    : [];
  const hours: ProgramHours[] = [...configIds]
    .map((id) => {
      const science = rows.filter((r) => r.configurationId === id && r.kind === "science");
      const executed = science.filter((r) => r.outcome === "executed").reduce((h, r) => h + hoursOf(r), 0);
      const planned = science.filter((r) => r.outcome === "planned").reduce((h, r) => h + hoursOf(r), 0);
      const g = granted.get(id) ?? 0;
      return {
        configuration: names.find((n) => n.id === id)?.name ?? `configuration ${id}`,
        grantedHours: round(g),
        plannedHours: round(planned),
        executedHours: round(executed),
        owedHours: round(Math.max(0, g - executed)),
      };
    })
    .sort((a, b) => a.configuration.localeCompare(b.configuration));
  return {
    blocks: rows.map(({ configurationId, startUtc, endUtc, ...block }) => ({
      ...block,
      startUtc: isoSecond(startUtc),
      endUtc: isoSecond(endUtc),
    })),
    hours,
  };
}
