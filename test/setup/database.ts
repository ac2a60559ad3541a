import { afterAll, inject } from "vitest";
import { clusterUrl, createDatabaseFrom, dropDatabase, uniqueName, withDatabase } from "./pg";

// Each integration test file gets its own fresh copy of the migrated template, so files run in
// parallel without seeing each other's rows. The app's database() reads DATABASE_URL lazily.
const name = uniqueName("fd_test");
await createDatabaseFrom(inject("templateDatabase"), name);
process.env.DATABASE_URL = withDatabase(clusterUrl(), name);

afterAll(async () => {
  const { closeDatabase } = await import("../../app/db/client.server");
  await closeDatabase();
  await dropDatabase(name);
});
