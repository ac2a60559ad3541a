import { fileURLToPath } from "node:url";
import { defineConfig } from "vitest/config";

// Separate from vite.config.ts: the React Router plugin is not wanted in tests.
// Three projects: "unit" (*.test.ts) needs nothing running; "integration" (*.db.test.ts) gets a PostgreSQL
// cluster on loopback and a fresh database per test file (see test/setup/); "e2e" drives
// Debian's Chromium against the production build (run `npm run build` first; see e2e/setup/).
const alias = {
  "~": fileURLToPath(new URL("./app", import.meta.url)),
  "@test": fileURLToPath(new URL("./test/support", import.meta.url)),
};

export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: "unit",
          // test/ mirrors app/: pure code in *.test.ts; *.db.test.ts needs PostgreSQL.
          include: ["test/**/*.test.{ts,tsx}"],
          exclude: ["test/**/*.db.test.{ts,tsx}"],
          environment: "node",
          setupFiles: ["test/setup/fail-on-console-error.ts"],
        },
      },
      {
        resolve: { alias },
        test: {
          name: "integration",
          include: ["test/**/*.db.test.{ts,tsx}"],
          environment: "node",
          globalSetup: ["test/setup/global.ts"],
          setupFiles: ["test/setup/fail-on-console-error.ts", "test/setup/database.ts"],
          testTimeout: 30_000,
          hookTimeout: 60_000,
          fileParallelism: true,
        },
      },
      {
        resolve: { alias },
        test: {
          name: "e2e",
          include: ["e2e/**/*.e2e.ts"],
          environment: "node",
          globalSetup: ["e2e/setup/global.ts"],
          setupFiles: ["test/setup/fail-on-console-error.ts"],
          testTimeout: 60_000,
          hookTimeout: 90_000,
          fileParallelism: false,
        },
      },
    ],
  },
});
