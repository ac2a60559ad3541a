import type { TestProject } from "vitest/node";
import { createDatabase } from "../../app/db/client.server";
import { migrateDatabase } from "../../app/db/migrate.server";
import { loadCatalogueTable } from "../../app/services/catalogue/table.server";
import { adminQuery, clusterUrl, dropDatabase, ensureCluster, uniqueName, withDatabase } from "./pg";

declare module "vitest" {
  export interface ProvidedContext {
    templateDatabase: string;
  }
}

/**
 * Once per run: make sure PostgreSQL runs on loopback, then migrate a template database that every
 * test file copies (test/setup/database.ts).
 */
export default async function setup(project: TestProject) {
  const startedHere = ensureCluster();
  const template = uniqueName("fd_template");
  await adminQuery((sql) => sql.unsafe(`create database "${template}"`));
  await migrateDatabase(withDatabase(clusterUrl(), template));
  // The star catalogue's reference rows, as `npm run db:migrate` loads them.
  const { db, client } = createDatabase(withDatabase(clusterUrl(), template), { max: 1 });
  await loadCatalogueTable(db).finally(() => client.end());
  project.provide("templateDatabase", template);

  return async () => {
    await dropDatabase(template);
    if (startedHere && process.env.KEEP_PG !== "1") {
      const { execFileSync } = await import("node:child_process");
      const { fileURLToPath } = await import("node:url");
      execFileSync("bash", [fileURLToPath(new URL("../../docker-less-pg.sh", import.meta.url)), "stop"], {
        stdio: "inherit",
      });
    }
  };
}
