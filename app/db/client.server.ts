import { drizzle, type PostgresJsDatabase } from "drizzle-orm/postgres-js";
import postgres from "postgres";
import { env } from "~/env.server";
import * as schema from "./schema";

export type Database = PostgresJsDatabase<typeof schema>;
/** The handle inside `db.transaction(async (tx) => …)`. */
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Either: for functions that write alone or as part of a caller's transaction. */
export type DbOrTx = Database | Transaction;

export type PoolOptions = {
  max?: number;
  /** Seconds to wait for a connection before the query fails (postgres.js waits 30 s by default). */
  connectTimeoutS?: number;
  /** Milliseconds a statement may run before PostgreSQL cancels it (none by default). */
  statementTimeoutMs?: number;
};

export function createDatabase(url: string, options: PoolOptions = {}) {
  const client = postgres(url, {
    max: options.max ?? 10,
    onnotice: () => {},
    ...(options.connectTimeoutS ? { connect_timeout: options.connectTimeoutS } : {}),
    // Idle connections are closed after a while, so a restarted database is met with fresh ones.
    idle_timeout: 60,
    ...(options.statementTimeoutMs
      ? {
          connection: {
            statement_timeout: options.statementTimeoutMs,
            idle_in_transaction_session_timeout: options.statementTimeoutMs * 3,
          },
        }
      : {}),
  });
  return { db: drizzle(client, { schema, casing: "snake_case" }), client };
}

// One pool per process; kept on globalThis so the dev server's module reloads reuse it.
const globalKey = Symbol.for("fringe-docket.db");
type Holder = { [globalKey]?: ReturnType<typeof createDatabase> };

/**
 * The app's pool: connections and statements time out after DB_CONNECT_TIMEOUT_S and
 * DB_STATEMENT_TIMEOUT_MS, so a database that is down or stuck gets the person a prompt 503 (the root
 * middleware) instead of a hanging page; the next request after it is back reconnects by itself.
 */
export function database(): Database {
  const holder = globalThis as Holder;
  const config = env();
  holder[globalKey] ??= createDatabase(config.DATABASE_URL, {
    connectTimeoutS: config.DB_CONNECT_TIMEOUT_S,
    statementTimeoutMs: config.DB_STATEMENT_TIMEOUT_MS,
  });
  return holder[globalKey].db;
}

/** Ends the process-wide pool (tests and scripts call it before exiting). */
export async function closeDatabase(): Promise<void> {
  const holder = globalThis as Holder;
  const current = holder[globalKey];
  holder[globalKey] = undefined;
  if (current) await current.client.end({ timeout: 5 });
}
