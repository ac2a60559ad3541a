import { asc, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { configurationStations, configurations } from "~/db/schema/array";

/** Every configuration of every site with its station count, for pickers. */
export async function configurationChoices(db: Database) {
  return db
    .select({
      id: configurations.id,
      name: configurations.name,
      description: configurations.description,
      stations: sql<number>`(select count(*)::int from ${configurationStations} where ${configurationStations.configurationId} = ${configurations.id})`,
    })
    .from(configurations)
    .orderBy(asc(configurations.name));
}

export type ConfigurationChoice = Awaited<ReturnType<typeof configurationChoices>>[number];
