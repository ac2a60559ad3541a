import { skyPositionArbitraries } from "@test/random";
import { sum } from "@test/sum";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEMO_CONFIGURATIONS, DEMO_SITE, DEMO_STATIONS } from "~/db/seed/scenario";
import { darkTimeOverPeriod, rankReviews } from "~/engine";
import { boardOrder, computeBoard } from "~/services/committee/board";
import { boardCsv, boardJson } from "~/services/committee/board-export";
import type { BoardRecords } from "~/services/committee/board-records";

const site = {
  latitudeDeg: DEMO_SITE.latitudeDeg,
  longitudeDeg: DEMO_SITE.longitudeDeg,
  altitudeM: DEMO_SITE.altitudeM,
};
const byName = new Map(DEMO_STATIONS.map((s) => [s.name, s]));
const configs: BoardRecords["configurations"] = DEMO_CONFIGURATIONS.map((c, i) => ({
  id: i + 1,
  name: c.name,
  nights: [4, 6, 8][i],
  siteId: 1,
  stations: c.stations.map((n) => ({ ...byName.get(n)!, name: n })),
  delayLineStrokeM: DEMO_SITE.delayLineStrokeM,
  minElevationDeg: DEMO_SITE.minElevationDeg,
}));
// Two weeks of April 2027 (southern autumn) are enough for the board's sums; every night is computed.
const dark = darkTimeOverPeriod(site, "2027-04-01", "2027-04-14");
const darkBySite = new Map([[1, dark]]);

/** The example of docs/cli-rank.md as board records: r1, r2, r3 are users 1–3; P1–P3 proposals 1–3. */
function docsExample(over: Partial<BoardRecords> = {}): BoardRecords {
  const proposal = (id: number, raDeg: number, hours: Record<number, number>) => ({
    id,
    title: `P${id}`,
    pi: `PI ${id}`,
    category: id === 3 ? "Binary and multiple stars" : "Stellar surfaces and diameters",
    status: "under_review",
    hours,
    targets: [{ name: `T${id}`, raDeg, decDeg: -35, minElevationDeg: null }],
    assigned: 2,
    submitted: 2,
  });
  return {
    cycle: {
      id: 1,
      name: "T",
      state: "deciding",
      scale: { best: 1, worst: 5 },
      observingStart: "2027-04-01",
      observingEnd: "2027-04-14",
    },
    settings: { triageAfter: null, disagreementSpread: 1 },
    reviewers: [
      { id: 1, name: "Reviewer One" },
      { id: 2, name: "Reviewer Two" },
      { id: 3, name: "Reviewer Three" },
    ],
    proposals: [proposal(1, 190, { 1: 6 }), proposal(2, 200, { 2: 10, 3: 4 }), proposal(3, 210, { 3: 8 })],
    reviews: [
      { reviewerId: 1, proposalId: 1, score: 1 },
      { reviewerId: 1, proposalId: 2, score: 3 },
      { reviewerId: 1, proposalId: 3, score: 5 },
      { reviewerId: 2, proposalId: 1, score: 2 },
      { reviewerId: 2, proposalId: 2, score: 2 },
      { reviewerId: 3, proposalId: 3, score: 4 },
    ],
    decisions: [],
    configurations: configs,
    ...over,
  };
}

describe("the Ranking board", () => {
  it("ranks with the `rank` computation: the hand-worked example of docs/cli-rank.md", () => {
    const board = computeBoard(docsExample(), darkBySite);
    // docs/cli-rank.md: r1's σ = √(8/3), z = ∓√(3/2); P1 = (−√(3/2) + 0)/2 = −0.6123724357, P2 = 0, P3 = +0.6123724357.
    expect(board.rows.map((r) => [r.title, r.rank, r.normalizedScore, r.meanScore, r.spread])).toEqual([
      ["P1", 1, -0.6123724357, 1.5, 0.5],
      ["P2", 2, 0, 2.5, 0.5],
      ["P3", 3, 0.6123724357, 4.5, 0.5],
    ]);
    // Reviewers are R1, R2, R3 in committee order; each score carries its label.
    expect(board.rows[0].scores.map((s) => `${s.label}=${s.score}`)).toEqual(["R1=1", "R2=2"]);
    // Calibration: r1 mean 3, σ √(8/3) = 1.6329931619; the committee's 6 scores: mean 17/6, population SD by hand.
    expect(board.calibration.reviewers.map((r) => [r.label, r.meanScore, r.sdScore])).toEqual([
      ["R1", 3, 1.6329931619],
      ["R2", 2, 0],
      ["R3", 4, 0],
    ]);
    const mean = 17 / 6;
    const sd = Math.sqrt([1, 3, 5, 2, 2, 4].reduce((s, x) => s + (x - mean) ** 2, 0) / 6);
    expect(board.calibration.committee.meanScore).toBeCloseTo(mean, 12);
    expect(board.calibration.committee.sdScore).toBeCloseTo(sd, 12);
  });

  it("gives the same numbers as rankReviews on the same reviews (what POST /api/rank and cli rank print)", () => {
    const records = docsExample();
    const direct = rankReviews({
      scale: { best: 1, worst: 5 },
      reviews: records.reviews.map((r) => ({
        reviewer: `r${r.reviewerId}`,
        proposal: `P${r.proposalId}`,
        score: r.score,
      })),
    });
    const board = computeBoard(records, darkBySite);
    for (const p of direct.proposals) {
      const row = board.rows.find((r) => r.title === p.proposal)!;
      expect([row.rank, row.meanScore, row.spread, row.normalizedScore]).toEqual([
        p.rank,
        p.meanScore,
        p.spread,
        p.normalizedScore,
      ]);
    }
  });

  it("flags a disagreement when the spread exceeds the chair's threshold", () => {
    const records = docsExample({ settings: { triageAfter: null, disagreementSpread: 0.4 } });
    expect(computeBoard(records, darkBySite).rows.map((r) => r.disagreement)).toEqual([true, true, true]);
    records.settings.disagreementSpread = 0.5;
    // A spread equal to the threshold is not above it.
    expect(computeBoard(records, darkBySite).rows.map((r) => r.disagreement)).toEqual([false, false, false]);
  });

  it("orders by final grade first, then rank; below the triage line nothing is walked", () => {
    const records = docsExample({
      settings: { triageAfter: 2, disagreementSpread: 1 },
      decisions: [
        { proposalId: 3, finalGrade: 1.2, decision: null, message: "", releasedAt: null, hours: {} },
        { proposalId: 1, finalGrade: 2, decision: null, message: "", releasedAt: null, hours: {} },
      ],
    });
    const board = computeBoard(records, darkBySite);
    expect(board.rows.map((r) => [r.title, r.position, r.belowTriage])).toEqual([
      ["P3", 1, false],
      ["P1", 2, false],
      ["P2", 3, true],
    ]);
    expect(board.rows[2].suggestion).toEqual({
      decision: "decline",
      hoursByConfig: {},
      reason: "below the triage line: not discussed",
    });
    // The same order with the scale reversed (10 best … 1 poorest): higher grades first.
    expect(
      boardOrder(
        [
          { id: 1, finalGrade: 3, rank: 1 },
          { id: 2, finalGrade: 8, rank: 2 },
          { id: 3, finalGrade: null, rank: 3 },
        ],
        { best: 10, worst: 1 },
      ),
    ).toEqual([2, 1, 3]);
  });

  it("suggests hours within the capacity of every LST bin", () => {
    const board = computeBoard(docsExample(), darkBySite);
    for (const c of board.pressure.configurations)
      c.suggested.forEach((h, b) => {
        expect(h).toBeLessThanOrEqual(c.capacity[b] + 1e-3);
      });
    // P1 asks 6 h on compact-3 (4 nights ≈ 4 × 10 h in April): it all fits.
    expect(board.rows[0].suggestion).toMatchObject({
      decision: "accept",
      hoursByConfig: { 1: 6 },
      reason: "all 6.0 h fit",
    });
  });

  it("LST pressure: Σ bins + unplaceable = the hours requested, Σ capacity = nights × dark hours (random proposals)", () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            ...skyPositionArbitraries(),
            config: fc.integer({ min: 1, max: 3 }),
            hours: fc.integer({ min: 1, max: 40 }),
            targets: fc.integer({ min: 1, max: 3 }),
          }),
          { minLength: 1, maxLength: 8 },
        ),
        (list) => {
          const records = docsExample({
            proposals: list.map((p, i) => ({
              id: i + 1,
              title: `R${i + 1}`,
              pi: "x",
              category: "Other",
              status: "under_review",
              hours: { [p.config]: p.hours },
              targets: Array.from({ length: p.targets }, (_, k) => ({
                name: `t${k}`,
                raDeg: (p.raDeg + 40 * k) % 360,
                decDeg: p.decDeg,
                minElevationDeg: null,
              })),
              assigned: 0,
              submitted: 0,
            })),
            reviews: [],
          });
          const board = computeBoard(records, darkBySite);
          for (const c of board.pressure.configurations) {
            const asked = list.filter((p) => p.config === c.configurationId).reduce((s, p) => s + p.hours, 0);
            expect(c.requestedTotalH).toBeCloseTo(asked, 3);
            // Numbers leave the board rounded to 1e-4 h, so 24 bins agree within 24 × 5e-5 h.
            expect(Math.abs(sum(c.requested) + c.unplaceableH - asked)).toBeLessThan(3e-3);
            expect(Math.abs(sum(c.capacity) - (c.nights ?? 0) * dark.meanDarkHoursPerNight)).toBeLessThan(3e-3);
            expect(c.capacityTotalH).toBeCloseTo((c.nights ?? 0) * dark.meanDarkHoursPerNight, 3);
          }
        },
      ),
      { numRuns: 12 },
    );
  });

  it("exports the board as CSV with units in the column names, and as JSON with reviewers as labels", () => {
    const board = computeBoard(docsExample(), darkBySite);
    const [header, first] = boardCsv(board).split(/\r?\n/);
    expect(header).toContain("Hours requested (h)");
    expect(header).toContain("Mean score (1 = best … 5 = poorest)");
    expect(header).toContain("Allocated extended-6 (h)");
    expect(header).toContain("Normalized score (z, lower is better)");
    expect(first).toContain("R1=1 R2=2");
    const json = boardJson(board);
    expect(json.proposals[0].scores).toEqual([
      { reviewer: "R1", score: 1 },
      { reviewer: "R2", score: 2 },
    ]);
    expect(json.demand.map((d) => d.configuration)).toEqual(["compact-3", "medium-4", "extended-6"]);
  });
});
