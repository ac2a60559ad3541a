import { migrateDatabase } from "~/db/migrate.server";
import { env } from "~/env.server";

const url = env().DATABASE_URL;
await migrateDatabase(url);
console.log("[db] migrations applied");
