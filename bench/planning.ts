/**
 * Benchmark of the night planner: an automatic plan for 30 candidates with 2 calibrators each on the
 * demo site (latitude −31.4°, longitude −68.9°), the six stations of its extended configuration and a
 * 200 m delay-line stroke; also the validation of the resulting plan. In-process, after warm-up,
 * median and minimum of several runs. Run alone with `npx tsx bench/planning.ts`.
 */
import { fileURLToPath } from "node:url";
import { DEMO_CONFIGURATIONS, DEMO_SITE, DEMO_STATIONS } from "../app/db/seed/scenario";
import { computePlan, type PlanInput, parsePlanRequest, validatePlan } from "../app/engine";
import { machine, type Timing, time } from "./timing";

/** A small deterministic generator (Park & Miller 1988 minimal standard, multiplier 16807). */
function lehmer(seed: number) {
  let s = seed;
  return () => {
    s = (s * 16807) % 2147483647;
    return s / 2147483647;
  };
}

/** The benchmark request: 30 targets south of +20° spread in RA, each with two calibrators within 4°. */
export function planningBenchRequest(): PlanInput {
  const rnd = lehmer(20270315);
  const names = DEMO_CONFIGURATIONS.find((c) => c.name === "extended-6")?.stations ?? [];
  const stations = names.map((n) => {
    const s = DEMO_STATIONS.find((x) => x.name === n);
    if (!s) throw new Error(`no station ${n}`);
    return s;
  });
  const targets = Array.from({ length: 30 }, (_, i) => {
    const raDeg = rnd() * 360;
    const decDeg = -75 + rnd() * 95;
    return {
      name: `B${String(i + 1).padStart(2, "0")}`,
      raDeg,
      decDeg,
      priority: 1 + Math.floor(rnd() * 3),
      hoursOwed: 1 + Math.floor(rnd() * 4),
      minElevationDeg: null,
      calibrators: [0, 1].map((k) => ({
        name: `B${i + 1}-K${k + 1}`,
        raDeg: (raDeg + (rnd() - 0.5) * 6 + 360) % 360,
        decDeg: Math.max(-89, Math.min(89, decDeg + (rnd() - 0.5) * 6)),
      })),
    };
  });
  const parsed = parsePlanRequest({
    site: { latitudeDeg: DEMO_SITE.latitudeDeg, longitudeDeg: DEMO_SITE.longitudeDeg, altitudeM: DEMO_SITE.altitudeM },
    date: "2027-03-15",
    stations,
    delayLineStrokeM: 200,
    minElevationDeg: 30,
    moonMinSeparationDeg: 10,
    scienceBlockMin: 40,
    calibratorBlockMin: 15,
    targets,
  });
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.value;
}

/** Runs the planning benchmark and returns its markdown section. */
export async function benchPlanning(): Promise<string> {
  const req = planningBenchRequest();
  const plan = computePlan(req);
  const tPlan = time(() => computePlan(req), 9);
  const tValidate = time(() => validatePlan(req, plan.blocks), 9);
  const science = plan.blocks.filter((b) => b.kind === "science").length;
  const ms = (t: Timing) => `${t.medianMs.toFixed(1)} ms (${t.minMs.toFixed(1)})`;
  const clean = validatePlan(req, plan.blocks).ok ? "validates clean" : "DOES NOT VALIDATE";
  return [
    "## Night plan: 30 candidates × 2 calibrators",
    "",
    "Demo site (−31.4°, −68.9°), night of 2027-03-15, the six stations of `extended-6` (15 baselines),",
    "200 m delay-line stroke, 30° elevation limit, 10° from the Moon, 40-min science and 15-min calibrator",
    "blocks. Timed: `computePlan` from a validated request (night sky on a 60 s grid, 90 object tracks with",
    "every constraint, greedy sequences, reasons, block fields) and `validatePlan` of its result.",
    `Result: ${plan.blocks.length} blocks (${science} science), ${plan.unplaced.length} targets unplaced; ${clean}.`,
    "",
    "| step | median (min) | runs | goal |",
    "|---|---|---|---|",
    `| computePlan | ${ms(tPlan)} | ${tPlan.runs} | ≤ 500 ms |`,
    `| validatePlan | ${ms(tValidate)} | ${tValidate.runs} | |`,
    "",
    `Machine: ${machine()}.`,
    "",
  ].join("\n");
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  benchPlanning().then((md) => process.stdout.write(md));
}
