import { existsSync } from "node:fs";
import { fileURLToPath } from "node:url";
import type { TestProject } from "vitest/node";
import { createDatabase } from "../../app/db/client.server";
import { migrateDatabase } from "../../app/db/migrate.server";
import { seedDemoScenario } from "../../app/db/seed/factories.server";
import { loadCatalogueTable } from "../../app/services/catalogue/table.server";
import { adminQuery, clusterUrl, dropDatabase, ensureCluster, uniqueName, withDatabase } from "../../test/setup/pg";
import { startAppServer } from "./app-server";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    databaseUrl: string;
  }
}

const root = fileURLToPath(new URL("../..", import.meta.url));

/**
 * Once per browser-test run: a seeded database of its own, and the production build served on a
 * free loopback port.
 */
export default async function setup(project: TestProject) {
  const buildDir = process.env.BUILD_DIR ?? "build";
  if (!existsSync(`${root}/${buildDir}/server/index.js`)) {
    throw new Error(
      `No production build in ${buildDir}/: run \`npm run build\` before the browser tests (npm test does).`,
    );
  }
  const startedCluster = ensureCluster();
  const name = uniqueName("fd_e2e");
  await adminQuery((sql) => sql.unsafe(`create database "${name}"`));
  const url = withDatabase(clusterUrl(), name);
  await migrateDatabase(url);
  const { db, client } = createDatabase(url, { max: 2 });
  await loadCatalogueTable(db);
  await seedDemoScenario(db);
  await client.end();

  // The same server `npm start` runs, with its local sign-on service and SMTP catcher on free ports.
  const { server, baseUrl } = await startAppServer(url, {
    env: {
      MAIL_SENDER_INTERVAL_MS: "500",
      // Every browser test signs in from this one address, far more often than 30 times in 15 minutes.
      SIGN_IN_ATTEMPTS_PER_ADDRESS: "100000",
    },
  });
  project.provide("baseUrl", baseUrl);
  project.provide("databaseUrl", url);

  return async () => {
    await new Promise<void>((resolve) => {
      if (server.exitCode !== null) return resolve();
      server.once("exit", () => resolve());
      server.kill("SIGTERM");
      setTimeout(() => server.kill("SIGKILL"), 5000).unref();
    });
    await dropDatabase(name);
    if (startedCluster && process.env.KEEP_PG !== "1") {
      const { execFileSync } = await import("node:child_process");
      execFileSync("bash", [`${root}/docker-less-pg.sh`, "stop"], { stdio: "inherit" });
    }
  };
}
