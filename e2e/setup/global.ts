import { type ChildProcess, spawn } from "node:child_process";
import { existsSync } from "node:fs";
import { createServer } from "node:net";
import { fileURLToPath } from "node:url";
import type { TestProject } from "vitest/node";
import { createDatabase } from "../../app/db/client.server";
import { migrateDatabase } from "../../app/db/migrate.server";
import { seedDemoScenario } from "../../app/db/seed/factories.server";
import { loadCatalogueTable } from "../../app/services/catalogue/table.server";
import { adminQuery, clusterUrl, dropDatabase, ensureCluster, uniqueName, withDatabase } from "../../test/setup/pg";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    databaseUrl: string;
  }
}

const root = fileURLToPath(new URL("../..", import.meta.url));

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const address = srv.address();
      const port = typeof address === "object" && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

async function waitForHttp(url: string, server: ChildProcess, timeoutMs = 30_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`the app server exited with code ${server.exitCode}`);
    try {
      const res = await fetch(url);
      if (res.status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the app server did not answer at ${url} within ${timeoutMs} ms`);
}

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

  const [port, idpPort, smtpPort] = [await freePort(), await freePort(), await freePort()];
  const baseUrl = `http://127.0.0.1:${port}`;
  // The same server `npm start` runs, with its local sign-on service and SMTP catcher on free ports.
  const serverEnv: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    DATABASE_URL: url,
    PORT: String(port),
    HOST: "127.0.0.1",
    APP_ORIGIN: baseUrl,
    FAKE_IDP_PORT: String(idpPort),
    SMTP_PORT: String(smtpPort),
    MAIL_SENDER_INTERVAL_MS: "500",
    DEMO_MODE: "1",
    // Every browser test signs in from this one address, far more often than 30 times in 15 minutes.
    SIGN_IN_ATTEMPTS_PER_ADDRESS: "100000",
  };
  delete serverEnv.OIDC_ISSUER;
  delete serverEnv.SMTP_HOST;
  const server = spawn(process.execPath, ["--import", "tsx", "scripts/serve.ts"], {
    cwd: root,
    env: serverEnv,
    stdio: ["ignore", "pipe", "pipe"],
  });
  const log: string[] = [];
  server.stdout?.on("data", (d) => log.push(String(d)));
  server.stderr?.on("data", (d) => log.push(String(d)));
  try {
    await waitForHttp(baseUrl, server);
  } catch (e) {
    server.kill("SIGTERM");
    throw new Error(`${(e as Error).message}\n${log.join("")}`);
  }
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
