import { fileURLToPath } from "node:url";
import { drizzle } from "drizzle-orm/postgres-js";
import { migrate } from "drizzle-orm/postgres-js/migrator";
import postgres from "postgres";

export const MIGRATIONS_FOLDER = fileURLToPath(new URL("../../migrations", import.meta.url));

/** Applies every committed migration in `migrations/` that the database has not seen yet. */
export async function migrateDatabase(url: string, folder = MIGRATIONS_FOLDER): Promise<void> {
  const client = postgres(url, { max: 1, onnotice: () => {} });
  try {
    await migrate(drizzle(client), { migrationsFolder: folder });
  } finally {
    await client.end();
  }
}
