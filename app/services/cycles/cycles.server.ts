/** Observing cycles: their period, deadline and the configurations on offer (with nights available). */
import { asc, desc, eq, gt, inArray } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { configurations } from "~/db/schema/array";
import { cycleConfigurations, cycles, proposalHours, proposals } from "~/db/schema/proposals";

type Tx = Transaction;
type Db = Database | Tx;

export type CycleInput = {
  name: string;
  description: string;
  observingStart: string;
  observingEnd: string;
  submissionDeadline: Date;
  offers: { configurationId: number; nightsAvailable: number | null }[];
};

export async function listCycles(db: Db) {
  const rows = await db.select().from(cycles).orderBy(desc(cycles.observingStart));
  const offers = rows.length
    ? await db
        .select({
          cycleId: cycleConfigurations.cycleId,
          configurationId: cycleConfigurations.configurationId,
          nightsAvailable: cycleConfigurations.nightsAvailable,
          name: configurations.name,
        })
        .from(cycleConfigurations)
        .innerJoin(configurations, eq(configurations.id, cycleConfigurations.configurationId))
        .where(
          inArray(
            cycleConfigurations.cycleId,
            rows.map((c) => c.id),
          ),
        )
        .orderBy(asc(configurations.name))
    : [];
  return rows.map((c) => ({ ...c, offers: offers.filter((o) => o.cycleId === c.id) }));
}

export async function getCycle(db: Db, id: number) {
  const [cycle] = await db.select().from(cycles).where(eq(cycles.id, id));
  if (!cycle) return null;
  const offers = await db
    .select({
      configurationId: cycleConfigurations.configurationId,
      nightsAvailable: cycleConfigurations.nightsAvailable,
      name: configurations.name,
    })
    .from(cycleConfigurations)
    .innerJoin(configurations, eq(configurations.id, cycleConfigurations.configurationId))
    .where(eq(cycleConfigurations.cycleId, id))
    .orderBy(asc(configurations.name));
  return { ...cycle, offers };
}

/** Cycles still taking proposals at `now` (deadline in the future), soonest deadline first. */
export async function openCycles(db: Db, now = new Date()) {
  return db
    .select()
    .from(cycles)
    .where(gt(cycles.submissionDeadline, now))
    .orderBy(asc(cycles.submissionDeadline), asc(cycles.name));
}

export async function findCycleByName(db: Db, name: string) {
  const [row] = await db.select().from(cycles).where(eq(cycles.name, name));
  return row ?? null;
}

async function writeOffers(tx: Db, cycleId: number, offers: CycleInput["offers"]) {
  await tx.delete(cycleConfigurations).where(eq(cycleConfigurations.cycleId, cycleId));
  if (offers.length) {
    await tx
      .insert(cycleConfigurations)
      .values(offers.map((o) => ({ cycleId, configurationId: o.configurationId, nightsAvailable: o.nightsAvailable })));
  }
}

export async function createCycle(db: Database, input: CycleInput, createdById: number | null) {
  return db.transaction(async (tx) => {
    const [cycle] = await tx
      .insert(cycles)
      .values({
        name: input.name,
        description: input.description,
        observingStart: input.observingStart,
        observingEnd: input.observingEnd,
        submissionDeadline: input.submissionDeadline,
        createdById,
      })
      .returning();
    await writeOffers(tx, cycle.id, input.offers);
    return cycle;
  });
}

/**
 * Updates a cycle. A configuration that proposals of this cycle already request cannot be withdrawn
 * from the offer; the names of such configurations are returned as `blocked`.
 */
export async function updateCycle(db: Database, id: number, input: CycleInput) {
  return db.transaction(async (tx) => {
    const requested = await tx
      .selectDistinct({ configurationId: proposalHours.configurationId, name: configurations.name })
      .from(proposalHours)
      .innerJoin(proposals, eq(proposals.id, proposalHours.proposalId))
      .innerJoin(configurations, eq(configurations.id, proposalHours.configurationId))
      .where(eq(proposals.cycleId, id));
    const offered = new Set(input.offers.map((o) => o.configurationId));
    const blocked = requested.filter((r) => !offered.has(r.configurationId)).map((r) => r.name);
    if (blocked.length) return { ok: false as const, blocked };
    await tx
      .update(cycles)
      .set({
        name: input.name,
        description: input.description,
        observingStart: input.observingStart,
        observingEnd: input.observingEnd,
        submissionDeadline: input.submissionDeadline,
      })
      .where(eq(cycles.id, id));
    await writeOffers(tx, id, input.offers);
    return { ok: true as const, blocked: [] };
  });
}

export function cyclePhase(
  cycle: { submissionDeadline: Date; observingStart: string; observingEnd: string },
  now = new Date(),
) {
  if (now < cycle.submissionDeadline) return "open" as const;
  const today = now.toISOString().slice(0, 10);
  if (today < cycle.observingStart) return "in review" as const;
  if (today <= cycle.observingEnd) return "observing" as const;
  return "finished" as const;
}

/** For each configuration id, the names of the cycles that offer it, latest cycle first. */
export async function cyclesOfferingConfigurations(db: Db): Promise<Record<number, string[]>> {
  const rows = await db
    .select({ configurationId: cycleConfigurations.configurationId, name: cycles.name })
    .from(cycleConfigurations)
    .innerJoin(cycles, eq(cycles.id, cycleConfigurations.cycleId))
    .orderBy(desc(cycles.observingStart));
  const out: Record<number, string[]> = {};
  for (const r of rows) (out[r.configurationId] ??= []).push(r.name);
  return out;
}
