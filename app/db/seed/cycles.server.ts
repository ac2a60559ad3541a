/** The demo cycles, written through the same command the chair's form uses; idempotent by name. */
import { eq, inArray, sql } from "drizzle-orm";
import { createCycle, findCycleByName } from "~/services/cycles/cycles.server";
import type { Database } from "../client.server";
import { configurations } from "../schema/array";
import { users } from "../schema/users";
import type { DemoCycle } from "./demo-cycles";

/**
 * Idempotent by name, for the seed and tests: creates the cycle with its offers (configurations by
 * name at the site) and its committee (reviewers by e-mail) when missing.
 */
export async function ensureCycle(
  db: Database,
  input: Omit<DemoCycle, "key" | "reviewDeadline" | "decisionDate" | "state"> &
    Partial<Pick<DemoCycle, "reviewDeadline" | "decisionDate" | "state">> & {
      siteId: number;
      committee?: string[];
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
  const emails = (input.committee ?? []).map((e) => e.toLowerCase());
  const members = emails.length
    ? await db
        .select({ id: users.id })
        .from(users)
        .where(inArray(sql`lower(${users.email})`, emails))
    : [];
  if (members.length !== emails.length) throw new Error(`cycle ${input.name}: a committee member has no account`);
  const { siteId: _site, committee: _committee, offers: _offers, ...fields } = input;
  return createCycle(
    db,
    {
      ...fields,
      offers,
      reviewDeadline: input.reviewDeadline ?? null,
      decisionDate: input.decisionDate ?? null,
      committee: members.map((m) => m.id),
    },
    null,
  );
}
