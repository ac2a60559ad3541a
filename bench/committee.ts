/**
 * Committee benchmark: the engine part of the Ranking board's loader for 300 proposals × 5 reviews,
 * ~2 targets each (600 target × configuration requests), 3 configurations of the demo array, a
 * 180-night cycle — ranking, the darkness of the cycle, LST pressure and the suggested allocation —
 * plus the automatic reviewer assignment for the same committee. In-process, after warm-up; median
 * and minimum of several runs. Inputs come from a fixed-seed generator, so every run sees the same case.
 *
 * `benchCommittee()` returns the markdown section; run alone with `npx tsx bench/committee.ts`.
 */

import { fileURLToPath } from "node:url";
import { DEMO_CONFIGURATIONS, DEMO_SITE, DEMO_STATIONS } from "../app/db/seed/scenario";
import {
  type AllocationInput,
  type AssignmentInput,
  autoAssign,
  darkTimeOverPeriod,
  LST_CELL_MIN,
  type LstPressureInput,
  lstPressure,
  type RankInput,
  rankReviews,
  suggestAllocation,
} from "../app/engine";
import { rng as generator } from "../test/support/random";
import { machine, type Timing, time } from "./timing";

const N_PROPOSALS = 300;
const N_REVIEWERS = 25;
const REVIEWS_PER_PROPOSAL = 5;
const FIRST_NIGHT = "2027-03-01";
const LAST_NIGHT = "2027-08-27"; // 180 nights
const CATEGORIES = ["stars", "circumstellar", "binaries", "exoplanets", "galactic nuclei"];

function buildCase() {
  const rnd = generator(11);
  const pid = (i: number) => `P${String(i + 1).padStart(3, "0")}`;
  const rid = (i: number) => `R${String(i + 1).padStart(2, "0")}`;
  const reviews: RankInput["reviews"] = [];
  for (let p = 0; p < N_PROPOSALS; p++) {
    const quality = 1 + 4 * rnd();
    const start = Math.floor(rnd() * N_REVIEWERS);
    for (let k = 0; k < REVIEWS_PER_PROPOSAL; k++) {
      const r = (start + k * 5) % N_REVIEWERS; // 5 distinct reviewers
      const harshness = (r % 5) * 0.2 - 0.4;
      const score = Math.min(5, Math.max(1, Math.round(quality + harshness + (rnd() - 0.5) * 1.5)));
      reviews.push({ reviewer: rid(r), proposal: pid(p), score });
    }
  }
  const byName = new Map(DEMO_STATIONS.map((s) => [s.name, s]));
  const configurations: LstPressureInput["configurations"] = DEMO_CONFIGURATIONS.map((c) => ({
    id: c.name,
    nights: 60,
    stations: c.stations.map((n) => ({ ...byName.get(n)!, name: n })),
    delayLineStrokeM: DEMO_SITE.delayLineStrokeM,
    minElevationDeg: DEMO_SITE.minElevationDeg,
  }));
  const requests: LstPressureInput["requests"] = [];
  for (let p = 0; p < N_PROPOSALS; p++) {
    const nTargets = 1 + Math.floor(rnd() * 3); // 1–3, mean 2
    for (let t = 0; t < nTargets; t++) {
      requests.push({
        proposal: pid(p),
        target: `${pid(p)}-T${t + 1}`,
        raDeg: rnd() * 360,
        decDeg: -80 + rnd() * 100,
        configuration: configurations[Math.floor(rnd() * configurations.length)].id,
        hours: 1 + Math.round(rnd() * 14) / 2,
      });
    }
  }
  const assignment: AssignmentInput = {
    proposals: Array.from({ length: N_PROPOSALS }, (_, p) => ({
      id: pid(p),
      category: CATEGORIES[Math.floor(rnd() * CATEGORIES.length)],
      team: [`U${p}`, ...(rnd() < 0.1 ? [rid(Math.floor(rnd() * N_REVIEWERS))] : [])],
      institutes: [`Inst ${Math.floor(rnd() * 40)}`],
    })),
    reviewers: Array.from({ length: N_REVIEWERS }, (_, r) => ({ id: rid(r), institute: `Inst ${r}` })),
    conflicts: [],
    keep: [],
    reviewersPerProposal: 3,
  };
  return {
    rank: { scale: { best: 1, worst: 5 }, reviews } as RankInput,
    pressure: { configurations, requests },
    assignment,
  };
}

export async function benchCommittee(): Promise<string> {
  const c = buildCase();
  const site = {
    latitudeDeg: DEMO_SITE.latitudeDeg,
    longitudeDeg: DEMO_SITE.longitudeDeg,
    altitudeM: DEMO_SITE.altitudeM,
  };

  const allocationInput = (
    ranking: ReturnType<typeof rankReviews>,
    pressure: ReturnType<typeof lstPressure>,
  ): AllocationInput => ({
    order: ranking.proposals.map((p) => p.proposal),
    capacity: pressure.configurations.map((k) => ({ configuration: k.configuration, hoursPerBin: k.capacityHours })),
    requests: pressure.requests.map((r) => ({
      proposal: r.proposal,
      target: r.target,
      configuration: r.configuration,
      hours: r.hoursRequested,
      spreadHours: r.spreadHours,
    })),
  });
  const boardWith = (dark: ReturnType<typeof darkTimeOverPeriod>) => {
    const ranking = rankReviews(c.rank);
    const pressure = lstPressure(dark, c.pressure);
    const input = allocationInput(ranking, pressure);
    return { ranking, dark, pressure, input, allocation: suggestAllocation(input) };
  };
  const board = (everyNights: number) => boardWith(darkTimeOverPeriod(site, FIRST_NIGHT, LAST_NIGHT, { everyNights }));

  const probe = board(7);
  const darkEvery = darkTimeOverPeriod(site, FIRST_NIGHT, LAST_NIGHT);
  const accepted = probe.allocation.proposals.filter((p) => p.suggestion === "accept").length;
  const unplaceable = probe.pressure.requests.filter((r) => r.unplaceableHours > 0).length;
  const over = probe.pressure.configurations.map((k) => `${k.configuration} ${k.oversubscription!.toFixed(2)}`);

  const tRank = time(() => rankReviews(c.rank), 21);
  const tDark7 = time(() => darkTimeOverPeriod(site, FIRST_NIGHT, LAST_NIGHT, { everyNights: 7 }), 9);
  const tDark1 = time(() => darkTimeOverPeriod(site, FIRST_NIGHT, LAST_NIGHT), 5, 1);
  const tPressure = time(() => lstPressure(probe.dark, c.pressure), 11);
  const tAlloc = time(() => suggestAllocation(probe.input), 21);
  const tBoard7 = time(() => board(7), 9);
  const tBoard1 = time(() => board(1), 5, 1);
  const tBoardCached = time(() => boardWith(darkEvery), 9);
  const tAssign = time(() => autoAssign(c.assignment), 5, 1);

  const ms = (t: Timing) => `${t.medianMs.toFixed(1)} ms (${t.minMs.toFixed(1)}) | ${t.cpuMedianMs.toFixed(1)} ms`;
  const lines: string[] = [];
  const log = (s = "") => lines.push(s);
  log("## Committee: ranking, LST pressure and suggested allocation");
  log("");
  log(
    `${N_PROPOSALS} proposals × ${REVIEWS_PER_PROPOSAL} reviews (${c.rank.reviews.length} scores, ${N_REVIEWERS} reviewers), ` +
      `${c.pressure.requests.length} target × configuration requests on the demo array's ${c.pressure.configurations.length} configurations ` +
      `(60 nights each), cycle ${FIRST_NIGHT} – ${LAST_NIGHT} (180 nights), 24 LST bins of 1 h. ` +
      `Oversubscription ${over.join(", ")}; ${accepted} proposals suggested for acceptance, ${unplaceable} requests unplaceable.`,
  );
  log(`Machine: ${machine()} when run.`);
  log("");
  log("| step | wall median (min) | CPU median |");
  log("|---|---|---|");
  log(`| \`rankReviews\` (z-scores, means, spreads, ranks) | ${ms(tRank)} |`);
  log(`| \`darkTimeOverPeriod\`, one night per week (26 nights) | ${ms(tDark7)} |`);
  log(`| \`darkTimeOverPeriod\`, every night (180) | ${ms(tDark1)} |`);
  log(`| \`lstPressure\` (${c.pressure.requests.length} requests, ${LST_CELL_MIN}-min LST cells) | ${ms(tPressure)} |`);
  log(`| \`suggestAllocation\` | ${ms(tAlloc)} |`);
  log(`| **board, weekly darkness**: rank + darkness + pressure + allocation | **${ms(tBoard7)}** |`);
  log(`| board, darkness of every night | ${ms(tBoard1)} |`);
  log(`| board with the cycle's darkness already computed (stored with the cycle) | ${ms(tBoardCached)} |`);
  log(
    `| \`autoAssign\`, ${N_PROPOSALS} proposals × 3 reviewers from ${N_REVIEWERS} (not part of the board) | ${ms(tAssign)} |`,
  );
  log("");
  log(
    "Target for the whole board loader (database reads included): ≤ 300 ms. The darkness of a cycle does not change " +
      "with the proposals: computed once (every night) and stored with the cycle, the board pays only the last row but one.",
  );
  return lines.join("\n");
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  benchCommittee().then((s) => console.log(s));
}
