/**
 * Load test: `npm run loadtest`. Starts the production server (the one `npm start` runs) on a free
 * loopback port with a freshly seeded database of its own, gives 50 invented load-test people an API
 * token each, then:
 *  1. times the costliest requests the cost budget accepts, one at a time on the idle server;
 *  2. measures `GET /` on the idle server;
 *  3. runs autocannon with 50 clients (one person each) posting a typical Sketchpad coverage request
 *     for a fixed time, while two probes request `GET /` in turn and time it.
 * Bounded: 20 s of load and at most 20 000 requests; everything it started is stopped and its database
 * dropped at the end. Writes docs/benchmarks-load.md. Needs a production build (made when missing).
 */
import { type ChildProcess, execFileSync } from "node:child_process";
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import { join } from "node:path";
import { fileURLToPath } from "node:url";
import { Worker } from "node:worker_threads";
import { costliestCoverageRequest, costliestTrianglesRequest, typicalCoverageRequest } from "@test/compute-requests";
import autocannon from "autocannon";
import { createDatabase } from "~/db/client.server";
import { migrateDatabase } from "~/db/migrate.server";
import { ensureUser, seedDemoScenario } from "~/db/seed/factories.server";
import { createApiToken } from "~/services/auth/api-tokens.server";
import { startAppServer } from "../e2e/setup/app-server";
import { adminQuery, clusterUrl, dropDatabase, ensureCluster, uniqueName, withDatabase } from "../test/setup/pg";

const CLIENTS = 50;
const LOAD_SECONDS = 20;
const MAX_REQUESTS = 20_000;
const PROBES = 2;
const PROBE_PAUSE_MS = 50;
/** The whole run is stopped after this long, whatever happens. */
const HARD_LIMIT_MS = 6 * 60_000;

const root = fileURLToPath(new URL("..", import.meta.url));
const buildDir = process.env.BUILD_DIR ?? "build";

function percentile(values: number[], p: number): number {
  if (values.length === 0) return Number.NaN;
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}
const ms = (x: number) => `${x.toFixed(0)} ms`;

/**
 * The `GET /` probe, run on a thread of its own so that the load generator's work on this thread does
 * not count in the page's latency: requests the page in turn until told to stop (or `count` times).
 */
const PROBE_SOURCE = `
const { parentPort, workerData } = require("node:worker_threads");
let stop = false;
parentPort.on("message", () => { stop = true; });
(async () => {
  const { url, count, pauseMs } = workerData;
  const latencies = [];
  const failures = [];
  while (!stop && (count === null || latencies.length + failures.length < count)) {
    const t0 = performance.now();
    try {
      const res = await fetch(url);
      await res.arrayBuffer();
      if (res.status === 200) latencies.push(performance.now() - t0);
      else failures.push("status " + res.status);
    } catch (e) {
      failures.push(String(e && e.message));
    }
    await new Promise((r) => setTimeout(r, pauseMs));
  }
  parentPort.postMessage({ latencies, failures });
})();
`;

/** Times `GET /` until `until` resolves (or `count` requests when given); returns latencies and failures. */
async function probeHome(baseUrl: string, opts: { until?: Promise<unknown>; count?: number }) {
  const threads = opts.count === undefined ? PROBES : 1;
  const runs = Array.from({ length: threads }, () => {
    const worker = new Worker(PROBE_SOURCE, {
      eval: true,
      workerData: { url: `${baseUrl}/`, count: opts.count ?? null, pauseMs: PROBE_PAUSE_MS },
    });
    opts.until?.then(() => worker.postMessage("stop"));
    return new Promise<{ latencies: number[]; failures: string[] }>((resolve, reject) => {
      worker.once("message", (m) => {
        resolve(m);
        void worker.terminate();
      });
      worker.once("error", reject);
    });
  });
  const all = await Promise.all(runs);
  return { latencies: all.flatMap((r) => r.latencies), failures: all.flatMap((r) => r.failures) };
}

/** True when there is no production build or a source is newer than it (as scripts/start.sh decides). */
function buildIsStale(): boolean {
  const stamp = `${root}/${buildDir}/server/index.js`;
  if (!existsSync(stamp)) return true;
  const built = statSync(stamp).mtimeMs;
  const newer = (path: string): boolean =>
    statSync(path).isDirectory()
      ? readdirSync(path).some((name) => newer(join(path, name)))
      : statSync(path).mtimeMs > built;
  return ["app", "public", "react-router.config.ts", "vite.config.ts", "package-lock.json"].some((p) =>
    newer(join(root, p)),
  );
}

/**
 * CPU time used so far by a process's threads, seconds (Linux /proc): its main thread (the event loop
 * that answers pages) and all of them. Null where /proc is not available.
 */
function threadCpu(pid: number): { main: number; all: number } | null {
  const tick = 100; // USER_HZ on Linux
  try {
    let all = 0;
    let main = 0;
    for (const tid of readdirSync(`/proc/${pid}/task`)) {
      const stat = readFileSync(`/proc/${pid}/task/${tid}/stat`, "utf8");
      const fields = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      const seconds = (Number(fields[11]) + Number(fields[12])) / tick;
      all += seconds;
      if (Number(tid) === pid) main = seconds;
    }
    return { main, all };
  } catch {
    return null;
  }
}

/** Posts one request and times it (the whole answer read). */
async function timedPost(baseUrl: string, path: string, token: string, body: unknown) {
  const t0 = performance.now();
  const res = await fetch(`${baseUrl}${path}`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Authorization: `Bearer ${token}` },
    body: JSON.stringify(body),
  });
  const bytes = (await res.arrayBuffer()).byteLength;
  if (res.status !== 200) throw new Error(`${path} answered ${res.status}`);
  return { ms: performance.now() - t0, bytes };
}

async function main() {
  const timer = setTimeout(() => {
    console.error("load test: hard time limit reached, stopping");
    process.exit(1);
  }, HARD_LIMIT_MS);
  timer.unref();

  if (buildIsStale()) {
    console.log(`[build] building the production bundle in ${buildDir}/`);
    execFileSync("npx", ["react-router", "build"], { cwd: root, stdio: ["ignore", "ignore", "inherit"] });
  }

  const startedCluster = ensureCluster();
  const name = uniqueName("fd_load");
  await adminQuery((sql) => sql.unsafe(`create database "${name}"`));
  const databaseUrl = withDatabase(clusterUrl(), name);
  let server: ChildProcess | null = null;
  try {
    await migrateDatabase(databaseUrl);
    const { db, client } = createDatabase(databaseUrl, { max: 2 });
    await seedDemoScenario(db);
    const tokens: string[] = [];
    for (let i = 1; i <= CLIENTS; i++) {
      const n = String(i).padStart(2, "0");
      const user = await ensureUser(db, {
        email: `load-client-${n}@load-test.example`,
        name: `Load client ${n}`,
        roles: ["proposer"],
      });
      tokens.push((await createApiToken(db, user.id, "load test")).token);
    }
    await client.end();

    const started = await startAppServer(databaseUrl, { timeoutMs: 60_000 });
    server = started.server;
    const { baseUrl } = started;
    console.log(`[load] production server on ${baseUrl}`);

    // Warm up: the worker threads start, the page is rendered once.
    const typical = typicalCoverageRequest();
    for (let i = 0; i < 4; i++) await timedPost(baseUrl, "/api/coverage", tokens[i], typical);
    await probeHome(baseUrl, { count: 5 });

    // 1. The costliest accepted requests, one at a time.
    const costliest: Record<string, { times: number[]; bytes: number }> = {};
    for (const [label, path, body] of [
      ["coverage", "/api/coverage", costliestCoverageRequest()],
      ["triangles", "/api/triangles", costliestTrianglesRequest()],
    ] as const) {
      const times: number[] = [];
      let bytes = 0;
      for (let i = 0; i < 3; i++) {
        const r = await timedPost(baseUrl, path, tokens[0], body);
        times.push(r.ms);
        bytes = r.bytes;
      }
      costliest[label] = { times, bytes };
      console.log(`[load] costliest ${label}: ${times.map(ms).join(", ")} (${(bytes / 1e6).toFixed(1)} MB)`);
    }
    const typicalAlone = await timedPost(baseUrl, "/api/coverage", tokens[0], typical);

    // 2. GET / on the idle server.
    const idle = await probeHome(baseUrl, { count: 40 });
    console.log(
      `[load] GET / idle: p50 ${ms(percentile(idle.latencies, 50))}, p95 ${ms(percentile(idle.latencies, 95))}`,
    );

    // 3. Load.
    const load = loadavg()[0];
    const cpuBefore = threadCpu(server.pid ?? 0);
    const coverageTimes: number[] = [];
    const statuses: Record<string, number> = {};
    let nextToken = 0;
    const instance = autocannon({
      url: `${baseUrl}/api/coverage`,
      method: "POST",
      connections: CLIENTS,
      duration: LOAD_SECONDS,
      maxOverallRequests: MAX_REQUESTS,
      timeout: 30,
      headers: { "Content-Type": "application/json" },
      body: JSON.stringify(typical),
      setupClient(c) {
        const token = tokens[nextToken++ % tokens.length];
        c.setHeaders({ "Content-Type": "application/json", Authorization: `Bearer ${token}` });
      },
    });
    instance.on("response", (_client: unknown, statusCode: number, _bytes: number, responseTime: number) => {
      statuses[statusCode] = (statusCode in statuses ? statuses[statusCode] : 0) + 1;
      if (statusCode === 200) coverageTimes.push(responseTime);
    });
    const finished = new Promise<autocannon.Result>((resolve) => instance.on("done", resolve));
    const [result, underLoad] = await Promise.all([finished, probeHome(baseUrl, { until: finished })]);
    const cpuAfter = threadCpu(server.pid ?? 0);
    const loadAfter = loadavg()[0];
    const cpuShare = (which: "main" | "all") =>
      cpuBefore && cpuAfter ? (100 * (cpuAfter[which] - cpuBefore[which])) / result.duration : Number.NaN;

    const ok = statuses[200] ?? 0;
    const figures = {
      idleP50: percentile(idle.latencies, 50),
      idleP95: percentile(idle.latencies, 95),
      homeP50: percentile(underLoad.latencies, 50),
      homeP95: percentile(underLoad.latencies, 95),
      homeMax: Math.max(...underLoad.latencies),
      homeCount: underLoad.latencies.length,
      homeFailures: underLoad.failures.length,
      covP50: percentile(coverageTimes, 50),
      covP95: percentile(coverageTimes, 95),
      covP99: percentile(coverageTimes, 99),
      throughput: ok / result.duration,
      ok,
      errors: result.errors,
      timeouts: result.timeouts,
      non2xx: result.non2xx,
      mainCpuPercent: cpuShare("main"),
      serverCpuPercent: cpuShare("all"),
    };
    console.log("[load]", JSON.stringify({ ...figures, statuses }));
    writeReport({
      figures,
      statuses,
      costliest,
      typicalAloneMs: typicalAlone.ms,
      typicalBytes: typicalAlone.bytes,
      load,
      loadAfter,
      duration: result.duration,
    });
  } finally {
    if (server && server.exitCode === null) {
      const s = server;
      await new Promise<void>((resolve) => {
        s.once("exit", () => resolve());
        s.kill("SIGTERM");
        setTimeout(() => s.kill("SIGKILL"), 5000).unref();
      });
    }
    await dropDatabase(name);
    if (startedCluster) execFileSync("bash", [`${root}/docker-less-pg.sh`, "stop"], { stdio: "inherit" });
  }
}

function writeReport(r: {
  figures: Record<string, number>;
  statuses: Record<string, number>;
  costliest: Record<string, { times: number[]; bytes: number }>;
  typicalAloneMs: number;
  typicalBytes: number;
  load: number;
  loadAfter: number;
  duration: number;
}) {
  const f = r.figures;
  let cpuModel = cpus()[0]?.model ?? "unknown";
  try {
    cpuModel = /model name\s*:\s*(.+)/.exec(readFileSync("/proc/cpuinfo", "utf8"))?.[1].trim() ?? cpuModel;
  } catch {
    // keep the model os reports
  }
  const median = (xs: number[]) => percentile(xs, 50);
  const pass = (ok: boolean) => (ok ? "met" : "**not met**");
  const lines = [
    "# Load test",
    "",
    "Produced by `npm run loadtest` (bench/loadtest.ts): the production server on loopback with a seeded",
    `database of its own; ${CLIENTS} autocannon clients, each an invented load-test person with an API token,`,
    `post a typical Sketchpad coverage request for ${LOAD_SECONDS} s while two probes request \`GET /\` in turn.`,
    "Default pool settings (one worker thread per core, 64 waiting, 4 per person; docs/cli.md).",
    "",
    `- Machine: ${cpuModel}, ${cpus().length} cores, shared with other work: 1-minute load average ${r.load.toFixed(1)} when the load began, ${r.loadAfter.toFixed(1)} when it ended`,
    `- Node ${process.version}, ${new Date().toISOString().slice(0, 10)}`,
    `- Typical request: extended-6 (6 stations), H band (6 channels), a night every 10 min, disk + companion,`,
    `  256² beam with images: ${(r.typicalBytes / 1e6).toFixed(2)} MB of answer, ${ms(r.typicalAloneMs)} alone on the idle server`,
    "",
    "## During the load",
    "",
    "| figure | value | goal |",
    "|---|---|---|",
    `| \`GET /\` p50 / p95 / max (${f.homeCount} requests) | ${ms(f.homeP50)} / ${ms(f.homeP95)} / ${ms(f.homeMax)} | p95 ≤ 150 ms: ${pass(f.homeP95 <= 150)} |`,
    `| \`GET /\` failures | ${f.homeFailures} | 0: ${pass(f.homeFailures === 0)} |`,
    `| \`GET /\` on the idle server, p50 / p95 | ${ms(f.idleP50)} / ${ms(f.idleP95)} | |`,
    `| coverage answers 200 | ${f.ok} in ${r.duration.toFixed(1)} s = ${f.throughput.toFixed(1)} per second | |`,
    `| coverage latency p50 / p95 / p99 | ${ms(f.covP50)} / ${ms(f.covP95)} / ${ms(f.covP99)} | recorded |`,
    `| coverage connection errors / timeouts | ${f.errors} / ${f.timeouts} | 0: ${pass(f.errors === 0)} |`,
    `| coverage answers other than 200 | ${f.non2xx} (${JSON.stringify(r.statuses)}) | 0: ${pass(f.non2xx === 0)} |`,
    `| server CPU: event-loop thread / whole process (share of one core) | ${f.mainCpuPercent.toFixed(0)} % / ${f.serverCpuPercent.toFixed(0)} % | |`,
    "",
    "## The costliest accepted requests, alone",
    "",
    "The costliest requests the cost budget accepts, each posted 3 times on the idle server (whole answer read).",
    "",
    "| request | times | median | answer |",
    "|---|---|---|---|",
    `| coverage: 6 stations × 600 hour angles × 100 channels, 11 limb-darkened disks, 2048² uniform beam | ${r.costliest.coverage.times.map(ms).join(", ")} | ${ms(median(r.costliest.coverage.times))} | ${(r.costliest.coverage.bytes / 1e6).toFixed(1)} MB |`,
    `| triangles: 24 stations (2 024 triangles) × 247 hour angles × 8 channels, 18 limb-darkened disks | ${r.costliest.triangles.times.map(ms).join(", ")} | ${ms(median(r.costliest.triangles.times))} | ${(r.costliest.triangles.bytes / 1e3).toFixed(0)} kB |`,
    "",
  ];
  const target = fileURLToPath(new URL("../docs/benchmarks-load.md", import.meta.url));
  writeFileSync(target, `${lines.join("\n")}\n`);
  // Tables aligned as the linter wants them (docs are checked by Biome).
  execFileSync("npx", ["biome", "format", "--write", target], { cwd: root, stdio: "ignore" });
  console.log(`\nwrote ${target}`);
}

main().then(
  () => process.exit(0),
  (e) => {
    console.error(e);
    process.exit(1);
  },
);
