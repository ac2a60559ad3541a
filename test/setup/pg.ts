/**
 * Test databases on the private PostgreSQL cluster of docker-less-pg.sh: one migrated template per
 * test run, one fresh copy per test file.
 */
import { execFileSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { fileURLToPath } from "node:url";
import postgres from "postgres";

const root = fileURLToPath(new URL("../..", import.meta.url));

export function clusterUrl(): string {
  return execFileSync("bash", [`${root}/docker-less-pg.sh`, "url"], { encoding: "utf8" }).trim();
}

/** Starts the cluster when it is not running; returns true when this call started it. */
export function ensureCluster(): boolean {
  let running = true;
  try {
    execFileSync("bash", [`${root}/docker-less-pg.sh`, "status"], { stdio: "ignore" });
  } catch {
    running = false;
  }
  if (!running) execFileSync("bash", [`${root}/docker-less-pg.sh`, "start"], { stdio: "inherit" });
  return !running;
}

export function withDatabase(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

export function uniqueName(prefix: string): string {
  return `${prefix}_${process.pid}_${randomBytes(4).toString("hex")}`;
}

export async function adminQuery<T>(fn: (sql: postgres.Sql) => Promise<T>): Promise<T> {
  const sql = postgres(withDatabase(clusterUrl(), "postgres"), { max: 1, onnotice: () => {} });
  try {
    return await fn(sql);
  } finally {
    await sql.end({ timeout: 5 });
  }
}

export async function createDatabaseFrom(template: string, name: string) {
  await adminQuery((sql) => sql.unsafe(`create database "${name}" template "${template}"`));
}

/**
 * Drops a test database and whoever is still connected to it. An autovacuum worker busy on it at that
 * moment cannot be ended by the app's role (PostgreSQL answers 42501, insufficient privilege): it
 * finishes within moments, so the drop is tried again a few times.
 */
export async function dropDatabase(name: string) {
  for (let attempt = 1; ; attempt++) {
    try {
      await adminQuery((sql) => sql.unsafe(`drop database if exists "${name}" with (force)`));
      return;
    } catch (e) {
      if ((e as { code?: string }).code !== "42501" || attempt >= 20) throw e;
      await new Promise((r) => setTimeout(r, 250));
    }
  }
}
