/** The demo cycles, written through the same command the chair's form uses; idempotent by name. */
import { eq } from "drizzle-orm";
import { type CycleInput, createCycle, findCycleByName } from "~/services/cycles/cycles.server";
import type { Database } from "../client.server";
import { configurations } from "../schema/array";

/** Idempotent by name, for the seed and tests: creates the cycle with its offers when missing. */
export async function ensureCycle(
  db: Database,
  input: Omit<CycleInput, "offers"> & {
    offers: { configurationName: string; nightsAvailable: number | null }[];
    siteId: number;
  },
) {
  const existing = await findCycleByName(db, input.name);
  if (existing) return existing;
  const configs = await db.select().from(configurations).where(eq(configurations.siteId, input.siteId));
  const offers = input.offers.map((o) => {
    const config = configs.find((c) => c.name === o.configurationName);
    if (!config) throw new Error(`cycle ${input.name}: no configuration named ${o.configurationName}`);
    return { configurationId: config.id, nightsAvailable: o.nightsAvailable };
  });
  return createCycle(db, { ...input, offers }, null);
}
