/** Writing observing cycles with their offers, each change in one transaction. */
import { eq } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { configurations } from "~/db/schema/array";
import { cycleConfigurations, cycles, proposalHours, proposals } from "~/db/schema/proposals";
import type { CycleInput } from "./schemas";

/** The cycle's own columns of a checked input. */
function cycleColumns({ name, description, observingStart, observingEnd, submissionDeadline }: CycleInput) {
  return { name, description, observingStart, observingEnd, submissionDeadline };
}

async function writeOffers(tx: Transaction, cycleId: number, offers: CycleInput["offers"]) {
  await tx.delete(cycleConfigurations).where(eq(cycleConfigurations.cycleId, cycleId));
  if (offers.length) {
    await tx
      .insert(cycleConfigurations)
      .values(offers.map((o) => ({ cycleId, configurationId: o.configurationId, nightsAvailable: o.nightsAvailable })));
  }
}

/** Creates a cycle with its offers (the chair's form and the seed). */
export async function createCycle(db: Database, input: CycleInput, createdById: number | null) {
  return db.transaction(async (tx) => {
    const [cycle] = await tx
      .insert(cycles)
      .values({ ...cycleColumns(input), createdById })
      .returning();
    await writeOffers(tx, cycle.id, input.offers);
    return cycle;
  });
}

/**
 * Updates a cycle. A configuration that proposals of this cycle already request cannot be withdrawn
 * from the offer; the names of such configurations are returned as `blocked`.
 */
export async function updateCycle(db: Database, { cycleId, input }: { cycleId: number; input: CycleInput }) {
  return db.transaction(async (tx) => {
    const requested = await tx
      .selectDistinct({ configurationId: proposalHours.configurationId, name: configurations.name })
      .from(proposalHours)
      .innerJoin(proposals, eq(proposals.id, proposalHours.proposalId))
      .innerJoin(configurations, eq(configurations.id, proposalHours.configurationId))
      .where(eq(proposals.cycleId, cycleId));
    const offered = new Set(input.offers.map((o) => o.configurationId));
    const blocked = requested.filter((r) => !offered.has(r.configurationId)).map((r) => r.name);
    if (blocked.length) return { ok: false as const, blocked };
    await tx.update(cycles).set(cycleColumns(input)).where(eq(cycles.id, cycleId));
    await writeOffers(tx, cycleId, input.offers);
    return { ok: true as const, blocked: [] };
  });
}
