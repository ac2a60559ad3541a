/**
 * Ranking board benchmark: the board page's loader (guard, database reads, the cycle's darkness from
 * its store, ranking, LST pressure, suggested allocation) for a cycle of 300 proposals × 5 submitted
 * reviews, ~600 target × configuration requests on the demo array's 3 configurations, 180 nights.
 * Target: ≤ 300 ms. Runs against a database of its own on the local PostgreSQL (the test cluster,
 * started when needed and dropped after), with a fixed-seed generator so every run sees the same case.
 *
 * `benchBoard()` returns the markdown section; run alone with `npx tsx bench/board.ts` (add `--write`
 * to put the section into docs/benchmarks.md).
 */
import { readFileSync, writeFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import { fileURLToPath } from "node:url";
import { RouterContextProvider } from "react-router";
import { adminQuery, clusterUrl, dropDatabase, ensureCluster, uniqueName, withDatabase } from "../test/setup/pg";
import { rng as generator } from "../test/support/random";

const N_PROPOSALS = 300;
const N_REVIEWERS = 25;
const REVIEWS_PER_PROPOSAL = 5;
const FIRST_NIGHT = "2027-03-01";
const LAST_NIGHT = "2027-08-27"; // 180 nights
const CATEGORIES = ["Stellar surfaces and diameters", "Binary and multiple stars", "Circumstellar environments"];

const median = (t: number[]) => {
  const s = [...t].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
};

export async function benchBoard(runs = 15): Promise<string> {
  const startedCluster = ensureCluster();
  const name = uniqueName("fd_bench_board");
  await adminQuery((sql) => sql.unsafe(`create database "${name}"`));
  const url = withDatabase(clusterUrl(), name);
  process.env.DATABASE_URL = url;
  const { migrateDatabase } = await import("../app/db/migrate.server");
  await migrateDatabase(url);
  const { database, closeDatabase } = await import("../app/db/client.server");
  const db = database();
  try {
    const schema = await import("../app/db/schema");
    const seed = await import("../app/db/seed/factories.server");
    const scenario = await import("../app/db/seed/scenario");
    const { createCycle } = await import("../app/services/cycles/cycles.server");
    const { createSession } = await import("../app/services/auth/sessions.server");
    const { dbContext } = await import("../app/context");
    const { loader } = await import("../app/routes/board/cycle");
    const { boardPage } = await import("../app/services/committee/board-page.server");

    const site = await seed.ensureSite(db, { ...scenario.DEMO_SITE });
    await seed.ensureStations(db, site.id, scenario.DEMO_STATIONS);
    for (const c of scenario.DEMO_CONFIGURATIONS) await seed.ensureConfiguration(db, site.id, c);
    for (const i of scenario.DEMO_INSTRUMENTS) await seed.ensureInstrument(db, site.id, i);
    const configs = await db.select().from(schema.configurations);
    const chair = await seed.ensureUser(db, { email: "chair@bench.example", name: "Bench Chair", roles: ["chair"] });
    const pi = await seed.ensureUser(db, { email: "pi@bench.example", name: "Bench PI", roles: ["proposer"] });
    const reviewers = [];
    for (let r = 0; r < N_REVIEWERS; r++)
      reviewers.push(
        await seed.ensureUser(db, {
          email: `r${r}@bench.example`,
          name: `Reviewer ${r}`,
          institute: `Inst ${r}`,
          roles: ["reviewer"],
        }),
      );
    const cycle = await createCycle(
      db,
      {
        name: "Bench",
        description: "",
        observingStart: FIRST_NIGHT,
        observingEnd: LAST_NIGHT,
        submissionDeadline: new Date("2027-01-15T12:00:00Z"),
        reviewDeadline: new Date("2027-02-10T12:00:00Z"),
        decisionDate: null,
        state: "deciding",
        offers: configs.map((c) => ({ configurationId: c.id, nightsAvailable: 60 })),
        committee: reviewers.map((r) => r.id),
      },
      null,
    );
    const rnd = generator(11);
    const proposals = await db
      .insert(schema.proposals)
      .values(
        Array.from({ length: N_PROPOSALS }, (_, p) => ({
          cycleId: cycle.id,
          piId: pi.id,
          title: `Bench proposal ${p + 1}`,
          scienceCategory: CATEGORIES[p % CATEGORIES.length],
          status: "under_review" as const,
          currentVersion: 1,
        })),
      )
      .returning({ id: schema.proposals.id });
    const hours: (typeof schema.proposalHours.$inferInsert)[] = [];
    const targets: (typeof schema.proposalTargets.$inferInsert)[] = [];
    const assignments: (typeof schema.reviewAssignments.$inferInsert)[] = [];
    for (const [p, { id }] of proposals.entries()) {
      const nConfigs = 1 + Math.floor(rnd() * 2);
      const first = Math.floor(rnd() * configs.length);
      for (let k = 0; k < nConfigs; k++)
        hours.push({
          proposalId: id,
          configurationId: configs[(first + k) % configs.length].id,
          hours: 2 + Math.round(rnd() * 14),
        });
      const nTargets = 1 + Math.floor(rnd() * 2);
      for (let t = 0; t < nTargets; t++)
        targets.push({
          proposalId: id,
          position: t,
          name: `T${p}-${t}`,
          raDeg: rnd() * 360,
          decDeg: -75 + rnd() * 85,
          model: { type: "point" },
        });
      const start = Math.floor(rnd() * N_REVIEWERS);
      for (let k = 0; k < REVIEWS_PER_PROPOSAL; k++)
        assignments.push({
          cycleId: cycle.id,
          proposalId: id,
          reviewerId: reviewers[(start + 5 * k) % N_REVIEWERS].id,
        });
    }
    await db.insert(schema.proposalHours).values(hours);
    await db.insert(schema.proposalTargets).values(targets);
    const stored = await db.insert(schema.reviewAssignments).values(assignments).returning();
    await db.insert(schema.reviews).values(
      stored.map((a) => ({
        assignmentId: a.id,
        score: 1 + Math.floor(rnd() * 5),
        commentToPi: "x",
        confidence: "medium" as const,
        submittedAt: new Date("2027-02-01T00:00:00Z"),
      })),
    );
    const { token } = await createSession(db, chair.id, { method: "sso" });
    const args = () => {
      const request = new Request(`http://localhost:3000/board/${cycle.id}`, {
        headers: { Cookie: `fd_session=${token}` },
      });
      const context = new RouterContextProvider();
      context.set(dbContext, db);
      return {
        request,
        url: new URL(request.url),
        params: { cycleId: String(cycle.id) },
        context,
        pattern: "",
      } as never;
    };

    const t0 = performance.now();
    const firstPage = (await loader(args())) as Awaited<ReturnType<typeof boardPage>>;
    const firstMs = performance.now() - t0;
    for (let i = 0; i < 2; i++) await loader(args()); // warm-up
    const wall: number[] = [];
    const cpu: number[] = [];
    for (let i = 0; i < runs; i++) {
      const c0 = process.cpuUsage();
      const s = performance.now();
      await loader(args());
      wall.push(performance.now() - s);
      const c = process.cpuUsage(c0);
      cpu.push((c.user + c.system) / 1000);
    }
    const page = firstPage!;
    const json = JSON.stringify(page);
    const j0 = performance.now();
    for (let i = 0; i < 5; i++) JSON.stringify(page);
    const jsonMs = (performance.now() - j0) / 5;
    const requests =
      targets.length === 0
        ? 0
        : hours.reduce((n, h) => n + targets.filter((t) => t.proposalId === h.proposalId).length, 0);
    const over = page.pressure.configurations.map((c) => `${c.name} ${c.oversubscription?.toFixed(2)}×`);
    const accepted = page.rows.filter((r) => r.suggestion.decision === "accept").length;
    const lines = [
      "## Ranking board: the page's loader",
      "",
      `${N_PROPOSALS} proposals × ${REVIEWS_PER_PROPOSAL} submitted reviews (${stored.length} scores, ${N_REVIEWERS} reviewers), ` +
        `${requests} target × configuration requests on the demo array's ${configs.length} configurations (60 nights each), ` +
        `${FIRST_NIGHT} – ${LAST_NIGHT} (180 nights), 24 LST bins. Oversubscription ${over.join(", ")}; ${accepted} suggested for acceptance.`,
      `Machine: ${cpus()[0]?.model ?? "unknown"}, ${cpus().length} cores, load average ${loadavg()[0].toFixed(1)} when run; Node ${process.version}.`,
      "",
      "Timed: the route module's `loader` of `/board/:cycleId` called in-process (session check, the board's reads from PostgreSQL on",
      "loopback, the cycle's darkness read from `cycle_dark_time`, `rankReviews`, `lstPressure`, `suggestAllocation`, the page's data).",
      "",
      "| run | wall median (min) | CPU median | target |",
      "|---|---|---|---|",
      `| first load (darkness of 180 nights computed and stored) | ${firstMs.toFixed(1)} ms | | |`,
      `| **every later load**, ${runs} runs | **${median(wall).toFixed(1)} ms** (${Math.min(...wall).toFixed(1)}) | ${median(cpu).toFixed(1)} ms | ≤ 300 ms |`,
      "",
      `The page's data is ${(json.length / 1024).toFixed(0)} KB as JSON (the LST spread of every proposal for the live allocation chart ` +
        `included); \`JSON.stringify\` of it takes ${jsonMs.toFixed(1)} ms, outside the loader's time.`,
    ];
    return lines.join("\n");
  } finally {
    await closeDatabase();
    await dropDatabase(name);
    if (startedCluster) {
      const { execFileSync } = await import("node:child_process");
      execFileSync("bash", [fileURLToPath(new URL("../docker-less-pg.sh", import.meta.url)), "stop"], {
        stdio: "inherit",
      });
    }
  }
}

/** Replaces (or appends) the section in docs/benchmarks.md. */
function writeSection(section: string) {
  const target = fileURLToPath(new URL("../docs/benchmarks.md", import.meta.url));
  const text = readFileSync(target, "utf8");
  const start = text.indexOf("## Ranking board: the page's loader");
  const before = start === -1 ? `${text.trimEnd()}\n\n` : text.slice(0, start);
  const rest = start === -1 ? "" : text.slice(start + 1);
  const next = rest.indexOf("\n## ");
  const after = next === -1 ? "" : rest.slice(next + 1);
  writeFileSync(target, `${before}${section}\n${after ? `\n${after}` : ""}`);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  benchBoard().then((section) => {
    console.log(section);
    if (process.argv.includes("--write")) writeSection(section);
  });
}
