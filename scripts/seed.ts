import { createDatabase } from "~/db/client.server";
import { isEmpty, seedDemoScenario } from "~/db/seed/factories.server";
import { env } from "~/env.server";

// `npm run db:seed` loads the demo scenario (idempotent); `--if-empty` seeds only a fresh database.
const onlyIfEmpty = process.argv.includes("--if-empty");
const { db, client } = createDatabase(env().DATABASE_URL, { max: 2 });
try {
  if (onlyIfEmpty && !(await isEmpty(db))) {
    console.log("[db] demo data already present");
  } else {
    const result = await seedDemoScenario(db);
    console.log(`[db] demo scenario loaded: ${result.site.name}, ${result.stations} stations`);
  }
} finally {
  await client.end();
}
