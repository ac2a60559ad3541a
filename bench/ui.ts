/**
 * Sketchpad responsiveness in Chromium: `npm run bench:ui` (add `-- --no-build` to reuse the current
 * production build, `-- --runs N` for N changes of each kind, default 12).
 *
 * The production build is served with a seeded database of its own exactly as for the browser tests
 * (e2e/setup/global.ts), Debian's Chromium is driven through playwright-core, and a proposer of the
 * demo changes the Sketchpad's inputs the way a person does (a dropdown pick, a checkbox, typing).
 * Each change is timed inside the page: from the input event of the change (for typing: the last
 * keystroke) until the status line says the panels are up to date and the next frame has been
 * painted. The timing does not use the page's own figure; that figure ("drawn … after the change")
 * is read as well and reported beside it. Writes docs/benchmarks-ui.md.
 */
import { execFileSync } from "node:child_process";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import { fileURLToPath } from "node:url";
import type { Page } from "playwright-core";
import type { TestProject } from "vitest/node";
import { launchBrowser } from "../e2e/browser";
import startServer from "../e2e/setup/global";

const root = fileURLToPath(new URL("..", import.meta.url));
const args = process.argv.slice(2);
const RUNS = Number(args[args.indexOf("--runs") + 1]) || 12;
/** The demo proposer the bench signs in as (invented scenario). */
const PERSON = "Inés Arroyo-Vidal";
/** Near the meridian at local midnight in mid-March at the demo site; a binary, so closure phases vary. */
const SKETCH = "name=Bench%20field&ra=11:00:00&dec=-36:00:00&date=2027-03-15&model=binary&sep=4&pa=60&ratio=0.4";
/** Milliseconds between two keystrokes when typing (a brisk typist, about 8 keys a second). */
const KEY_DELAY_MS = 120;

/** Median of a list of numbers (mean of the middle two for an even count). */
export function median(xs: readonly number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

/** The p-th fraction quantile by the nearest rank. */
function quantile(xs: readonly number[], p: number): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil(p * s.length) - 1))];
}

interface Sample {
  /** From the input event of the change to the frame after the status line said "Up to date". */
  ms: number;
  /** The page's own figure, when its status line gives one. */
  pageMs: number | null;
  /** Round trips of the coverage requests answered after the change (the last one). */
  roundTripMs: number | null;
}

/**
 * Installed in the page once: remembers the time of the last input or change event (capture phase, so
 * before React sees it) and offers `__benchSettled()`, which resolves with the timings once the status
 * line has left "Up to date", come back to it, and a frame has been painted.
 */
function installProbe(page: Page) {
  return page.evaluate(() => {
    const w = window as unknown as Record<string, unknown>;
    w.__benchLastInput = 0;
    // The input and change events that follow a checkbox's click belong to that click.
    let clicked: EventTarget | null = null;
    const note = (e: Event) => {
      if (e.type !== "click" && e.target === clicked) {
        if (e.type === "change") clicked = null;
        return;
      }
      w.__benchLastInput = performance.now();
      if (e.type === "click") clicked = e.target;
    };
    // Typing and selects report "input"/"change"; a checkbox or radio changes on "click" (React reacts
    // to that event, before the browser sends "input" and "change").
    document.addEventListener("input", note, true);
    document.addEventListener("change", note, true);
    document.addEventListener(
      "click",
      (e) => {
        const t = e.target as HTMLInputElement | null;
        if (t?.tagName === "INPUT" && (t.type === "checkbox" || t.type === "radio")) note(e);
      },
      true,
    );
    const statusText = () =>
      [...document.querySelectorAll('[role="status"]')]
        .map((e) => e.textContent ?? "")
        .find((t) => /^Up to date/.test(t)) ?? null;
    w.__benchSettled = (sinceMs: number) =>
      new Promise((resolve, reject) => {
        let left = statusText() === null;
        const timer = setTimeout(() => {
          obs.disconnect();
          reject(new Error("the Sketchpad did not settle within 30 s"));
        }, 30_000);
        const check = () => {
          const text = statusText();
          if (text === null) left = true;
          else if (left) {
            obs.disconnect();
            clearTimeout(timer);
            const seenAt = performance.now();
            requestAnimationFrame(() =>
              requestAnimationFrame(() => {
                const t0 = w.__benchLastInput as number;
                const page = /drawn ([\d.]+) s after/.exec(text);
                const trips = (performance.getEntriesByType("resource") as PerformanceResourceTiming[]).filter(
                  (e) => e.name.endsWith("/api/coverage") && e.startTime >= sinceMs,
                );
                const last = trips.at(-1);
                resolve({
                  ms: performance.now() - t0,
                  seenMs: seenAt - t0,
                  pageMs: page ? Number(page[1]) * 1000 : null,
                  roundTripMs: last ? last.responseEnd - last.startTime : null,
                });
              }),
            );
          }
        };
        const obs = new MutationObserver(check);
        obs.observe(document.body, { subtree: true, childList: true, characterData: true });
        check();
      });
  });
}

async function now(page: Page): Promise<number> {
  return page.evaluate(() => performance.now());
}

/** Runs `act` and waits for the Sketchpad to settle on its result. */
async function timed(page: Page, act: () => Promise<void>): Promise<Sample> {
  const since = await now(page);
  const settled = page.evaluate(
    (t) => (window as unknown as { __benchSettled: (t: number) => Promise<Sample> }).__benchSettled(t),
    since,
  );
  await act();
  return settled;
}

async function signIn(page: Page, baseUrl: string) {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByRole("link", { name: /Continue with/ }).click();
  await page.getByRole("button", { name: new RegExp(PERSON) }).click();
  await page.waitForURL(`${baseUrl}/`);
}

type Kind = { name: string; goalMs?: number; run: (page: Page, i: number) => Promise<Sample> };

const CONFIGS = ["medium-4", "extended-6", "compact-3"];
const KINDS: Kind[] = [
  {
    name: "Configuration dropdown (compact-3 → medium-4 → extended-6 …)",
    goalMs: 350,
    run: (page, i) =>
      timed(page, () =>
        page
          .getByLabel("Configuration", { exact: true })
          .selectOption(CONFIGS[i % CONFIGS.length])
          .then(() => {}),
      ),
  },
  {
    name: "Beam weighting dropdown (natural ↔ uniform)",
    goalMs: 350,
    run: (page, i) =>
      timed(page, () =>
        page
          .getByLabel("Beam weighting")
          .selectOption(i % 2 ? "natural" : "uniform")
          .then(() => {}),
      ),
  },
  {
    name: "Instrument band dropdown (H ↔ K)",
    goalMs: 350,
    run: (page, i) =>
      timed(page, async () => {
        const select = page.getByLabel("Instrument band");
        const options = await select
          .locator("option")
          .evaluateAll((els) =>
            els
              .map((e) => (e as HTMLOptionElement).value)
              .filter((v) => v.startsWith("Brasa") && (v.endsWith("H") || v.endsWith("K"))),
          );
        await select.selectOption(options[i % 2 ? 0 : 1]);
      }),
  },
  {
    name: "Delay-line checkbox (off ↔ on)",
    run: (page) => timed(page, () => page.getByRole("checkbox", { name: /Check the delay lines/ }).click()),
  },
  {
    name: `Typing a separation (4 keystrokes, ${KEY_DELAY_MS} ms apart; timed from the last one)`,
    goalMs: 500,
    run: async (page, i) => {
      const field = page.getByRole("textbox", { name: /^Separation/ });
      await field.click();
      await field.press("Control+a");
      return timed(page, () => page.keyboard.type(i % 2 ? "4.25" : "3.75", { delay: KEY_DELAY_MS }));
    },
  },
];

async function main() {
  const buildDir = process.env.BUILD_DIR ?? "build";
  if (!args.includes("--no-build")) {
    console.log(`Building the production bundle into ${buildDir}/ …`);
    execFileSync("npx", ["react-router", "build"], { cwd: root, stdio: "ignore", env: process.env });
  }
  const provided: Record<string, string> = {};
  const stop = await startServer({ provide: (k: string, v: string) => (provided[k] = v) } as unknown as TestProject);
  const baseUrl = provided.baseUrl;
  const { browser, close } = await launchBrowser();
  const load: number[][] = [loadavg()];
  const results: { kind: Kind; samples: Sample[] }[] = [];
  try {
    const context = await browser.newContext({ viewport: { width: 1366, height: 900 } });
    // tsx keeps function names with a helper (__name) that the page does not have.
    await context.addInitScript({ content: "window.__name = (f) => f;" });
    const page = await context.newPage();
    page.on("pageerror", (e) => console.error(`page error: ${e.message}`));
    await signIn(page, baseUrl);
    await page.goto(`${baseUrl}/sketchpad?config=compact-3&${SKETCH}`);
    await page.getByText(/^Up to date/).waitFor({ timeout: 60_000 });
    await installProbe(page);
    // Warm-up: one change of each kind (code paths compiled, caches filled), not counted.
    for (const kind of KINDS) await kind.run(page, 0);
    for (const kind of KINDS) {
      const samples: Sample[] = [];
      for (let i = 1; i <= RUNS; i++) samples.push(await kind.run(page, i));
      load.push(loadavg());
      results.push({ kind, samples });
      const m = median(samples.map((s) => s.ms));
      console.log(`${kind.name}: median ${m.toFixed(0)} ms over ${samples.length}`);
      if (args.includes("--verbose")) console.log(JSON.stringify(samples));
    }
    await context.close();
  } finally {
    await close();
    await stop();
  }
  writeReport(results, load);
}

const RUNS_MARK = "<!-- every run (bench:ui adds a row at the top) -->";
const NOTES_MARK = "<!-- notes (kept as they are by bench:ui) -->";

/** The measured commit: short hash, with "+" when the work tree has changes. */
function commitOf(): string {
  try {
    const hash = execFileSync("git", ["rev-parse", "--short", "HEAD"], { cwd: root, encoding: "utf8" }).trim();
    const dirty = execFileSync("git", ["status", "--porcelain", "--untracked-files=no"], {
      cwd: root,
      encoding: "utf8",
    });
    return dirty.trim() === "" ? hash : `${hash}+`;
  } catch {
    return "?";
  }
}

function writeReport(results: { kind: Kind; samples: Sample[] }[], load: number[][]) {
  const fmt = (x: number | null) => (x === null || Number.isNaN(x) ? "—" : x.toFixed(0));
  const one = load.map((l) => l[0]);
  const when = `${new Date().toISOString().slice(0, 16).replace("T", " ")} UTC`;
  const loadText = `${Math.min(...one).toFixed(1)}–${Math.max(...one).toFixed(1)}`;
  const target = fileURLToPath(new URL("../docs/benchmarks-ui.md", import.meta.url));
  const before = existsSync(target) ? readFileSync(target, "utf8") : "";
  const runsAt = before.indexOf(RUNS_MARK);
  const notesAt = before.indexOf(NOTES_MARK);
  const oldRows =
    runsAt < 0
      ? []
      : before
          .slice(runsAt + RUNS_MARK.length, notesAt < 0 ? undefined : notesAt)
          .split("\n")
          .filter((l) => /^\| \d{4}-/.test(l));
  const notes = notesAt < 0 ? "" : before.slice(notesAt + NOTES_MARK.length).trim();
  const lines = [
    "# Sketchpad responsiveness (`npm run bench:ui`)",
    "",
    "Chromium (Debian's, headless, through playwright-core) against the production build with a seeded",
    "database (the browser tests' setup), 1366 × 900 px, signed in as a demo proposer, on",
    `\`/sketchpad?config=compact-3&${SKETCH}\`.`,
    "Each change is timed inside the page from its input event (typing: the last keystroke) to the",
    'frame painted after the status line says "Up to date" (every panel drawn). "Page says" is the',
    'status line\'s own figure; "round trip" the last coverage request after the change. The machine is',
    "shared: the load average says how busy it was, and the figures move with it.",
    "",
    "## Latest run",
    "",
    `- Run: ${when}, commit ${commitOf()}, ${RUNS} changes of each kind after one of warm-up`,
    `- Machine: ${cpus()[0]?.model ?? "unknown"}, ${cpus().length} cores, shared with other users`,
    `- Load average (1 min) during the run: ${loadText} (readings ${one.map((x) => x.toFixed(1)).join(", ")})`,
    "",
    "| change | goal | median | p90 | min | max | page says (median) | round trip (median) |",
    "| --- | --- | --- | --- | --- | --- | --- | --- |",
  ];
  for (const { kind, samples } of results) {
    const ms = samples.map((s) => s.ms);
    const page = samples.map((s) => s.pageMs).filter((x): x is number => x !== null);
    const trips = samples.map((s) => s.roundTripMs).filter((x): x is number => x !== null);
    const m = median(ms);
    const goal = kind.goalMs ? `≤ ${kind.goalMs} ms ${m <= kind.goalMs ? "(met)" : "(missed)"}` : "—";
    lines.push(
      `| ${kind.name} | ${goal} | ${fmt(m)} ms | ${fmt(quantile(ms, 0.9))} ms | ${fmt(Math.min(...ms))} ms | ` +
        `${fmt(Math.max(...ms))} ms | ${page.length ? `${fmt(median(page))} ms` : "—"} | ` +
        `${trips.length ? `${fmt(median(trips))} ms` : "—"} |`,
    );
  }
  const row = `| ${when} | ${commitOf()} | ${loadText} | ${results.map((r) => `${fmt(median(r.samples.map((s) => s.ms)))} ms`).join(" | ")} |`;
  lines.push(
    "",
    "## Every run (medians)",
    "",
    RUNS_MARK,
    "",
    "| run | commit | load (1 min) | configuration | weighting | band | delay lines | typing |",
    "| --- | --- | --- | --- | --- | --- | --- | --- |",
    row,
    ...oldRows.slice(0, 19),
    "",
    NOTES_MARK,
    "",
    notes,
  );
  writeFileSync(target, `${lines.join("\n").trimEnd()}\n`);
  console.log(`\n${lines.join("\n")}\nWritten to docs/benchmarks-ui.md`);
}

main().catch((e) => {
  console.error(e);
  process.exit(1);
});
