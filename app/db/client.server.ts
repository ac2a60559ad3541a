import { drizzle, type PostgresJsDatabase } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { env } from "~/env.server";
import * as schema from "./schema";

export type Database = PostgresJsDatabase<typeof schema>;
/** The handle inside `db.transaction(async (tx) => …)`. */
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Either: for functions that write alone or as part of a caller's transaction. */
export type DbOrTx = Database | Transaction;

export function createDatabase(url: string, options: { max?: number } = {}) {
  const client = postgres(url, { max: options.max ?? 10, onnotice: () => {} });
  return { db: drizzle(client, { schema, casing: "snake_case" }), client };
}

// One pool per process; kept on globalThis so the dev server's module reloads reuse it.
const globalKey = Symbol.for("fringe-docket.db");
type Holder = { [globalKey]?: ReturnType<typeof createDatabase> };

export function database(): Database {
  const holder = globalThis as Holder;
  holder[globalKey] ??= createDatabase(env().DATABASE_URL);
  return holder[globalKey].db;
}

/** Ends the process-wide pool (tests and scripts call it before exiting). */
export async function closeDatabase(): Promise<void> {
  const holder = globalThis as Holder;
  const current = holder[globalKey];
  holder[globalKey] = undefined;
  if (current) await current.client.end({ timeout: 5 });
}
