import { createDatabase } from "~/db/client.server";
import { migrateDatabase } from "~/db/migrate.server";
import { env } from "~/env.server";
import { loadCatalogueTable } from "~/services/catalogue/table.server";

const url = env().DATABASE_URL;
await migrateDatabase(url);
console.log("[db] migrations applied");

// The star catalogue's reference rows, from the installed package (idempotent: nothing is written
// when this package version is already loaded).
const { db, client } = createDatabase(url, { max: 1 });
try {
  const load = await loadCatalogueTable(db);
  console.log(
    load.written
      ? `[db] star catalogue loaded: ${load.stars} stars (d3-celestial ${load.version})`
      : `[db] star catalogue up to date (d3-celestial ${load.version})`,
  );
} finally {
  await client.end();
}
