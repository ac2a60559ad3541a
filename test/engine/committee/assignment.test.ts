import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { type AssignmentInput, type AssignmentResult, autoAssign, ConvexFlowNetwork, findConflicts } from "~/engine";

const pair = (a: { reviewer: string; proposal: string }) => `${a.reviewer}|${a.proposal}`;

describe("conflicts", () => {
  it("team, same institute (trimmed, case-blind) and declared, each named", () => {
    const c = findConflicts(
      [{ id: "P1", category: "stars", team: ["r1", "u9"], institutes: ["Obs. Alto ", "Uni Sur"] }],
      [
        { id: "r1", institute: "Elsewhere" },
        { id: "r2", institute: " obs. alto" },
        { id: "r3", institute: null },
        { id: "r4", institute: "" },
      ],
      [
        { reviewer: "r3", proposal: "P1", reason: "former student of the PI" },
        { reviewer: "r1", proposal: "P1" },
      ],
    );
    expect(c).toEqual([
      { reviewer: "r1", proposal: "P1", kinds: ["team", "declared"], declaredReason: null },
      { reviewer: "r2", proposal: "P1", kinds: ["institute"], declaredReason: null },
      { reviewer: "r3", proposal: "P1", kinds: ["declared"], declaredReason: "former student of the PI" },
    ]);
  });
});

describe("minimum-cost flow", () => {
  it("solves a small transportation problem by hand", () => {
    // Nodes s = 0, a = 1, b = 2, t = 3. Arcs s→a (cap 2), s→b (cap 1), a→t (cap 1, cost 1),
    // a→b (cap 1, cost 0), b→t (cap 1, cost 3). The arcs into t carry 1 + 1, so the maximum flow is 2,
    // and every maximum flow uses both a→t (1) and b→t (3): cost 4.
    const net = new ConvexFlowNetwork(4);
    net.addArc(0, 1, 2, 0);
    net.addArc(0, 2, 1, 0);
    net.addArc(1, 3, 1, 1);
    net.addArc(1, 2, 1, 0);
    net.addArc(2, 3, 1, 3);
    expect(net.run(0, 3)).toEqual({ flow: 2, cost: 4 });
  });

  it("spreads units over convex arcs: Σ of squares, 5 units on two parallel arcs → 3 + 2", () => {
    // Marginal cost of the (j+1)-th unit 2j + 1 → cost of j units j². 5 units: 3² + 2² = 13 is least.
    const net = new ConvexFlowNetwork(3);
    net.addArc(0, 1, 5, 0);
    const a = net.addArc(1, 2, 10, 1, 2);
    const b = net.addArc(1, 2, 10, 1, 2);
    expect(net.run(0, 2)).toEqual({ flow: 5, cost: 13 });
    expect([net.flowOn(a), net.flowOn(b)].sort()).toEqual([2, 3]);
  });
});

describe("auto-assign: hand-worked cases", () => {
  it("spreads the science categories across reviewers at equal load", () => {
    // 2 reviewers, 4 proposals (2 stars, 2 galaxies), N = 1: loads 2 + 2 whatever the split; the
    // category term Σ count² is 1+1+1+1 = 4 for one star and one galaxy each, against 4+4 = 8.
    const res = autoAssign({
      proposals: [
        { id: "A1", category: "stars", team: [], institutes: [] },
        { id: "A2", category: "stars", team: [], institutes: [] },
        { id: "B1", category: "galaxies", team: [], institutes: [] },
        { id: "B2", category: "galaxies", team: [], institutes: [] },
      ],
      reviewers: [
        { id: "r1", institute: null },
        { id: "r2", institute: null },
      ],
      conflicts: [],
      keep: [],
      reviewersPerProposal: 1,
    });
    for (const l of res.loads)
      expect(l.byCategory).toEqual([
        { category: "galaxies", count: 1 },
        { category: "stars", count: 1 },
      ]);
  });

  it("never picks a conflicted reviewer and says why a proposal is short", () => {
    const res = autoAssign({
      proposals: [
        { id: "P1", category: "stars", team: ["r1"], institutes: ["Y"] },
        { id: "P2", category: "stars", team: [], institutes: [] },
      ],
      reviewers: [
        { id: "r1", institute: "X" },
        { id: "r2", institute: "Y" },
        { id: "r3", institute: "Z" },
        { id: "r4", institute: null },
      ],
      conflicts: [{ reviewer: "r3", proposal: "P1", reason: "collaborator" }],
      keep: [],
    });
    expect(res.assignments.filter((a) => a.proposal === "P1")).toEqual([
      { reviewer: "r4", proposal: "P1", kept: false },
    ]);
    expect(res.shortfalls).toEqual([
      {
        proposal: "P1",
        assigned: 1,
        needed: 3,
        reason:
          "only 1 of 4 committee members are free of conflicts (conflicted: on the team 1, same institute 1, declared 1)",
      },
    ]);
    // P2 takes 3 of the 4; r4 already has P1, so the least-loaded choice leaves r4 out: loads 1,1,1,1.
    expect(res.loads.map((l) => l.total)).toEqual([1, 1, 1, 1]);
  });

  it("keeps what is already scored, even when it has become conflicted, and tops up to N", () => {
    const res = autoAssign({
      proposals: [{ id: "P1", category: "stars", team: [], institutes: [] }],
      reviewers: [
        { id: "r1", institute: null },
        { id: "r2", institute: null },
        { id: "r3", institute: null },
      ],
      conflicts: [{ reviewer: "r2", proposal: "P1" }],
      keep: [
        { reviewer: "r2", proposal: "P1" },
        { reviewer: "nobody", proposal: "P1" },
      ],
      reviewersPerProposal: 2,
    });
    expect(res.assignments).toEqual([
      { reviewer: "r1", proposal: "P1", kept: false },
      { reviewer: "r2", proposal: "P1", kept: true },
    ]);
    expect(res.warnings).toEqual([
      'keep[0]: "r2" is conflicted on "P1" (declared) but the assignment is kept',
      'keep[1]: unknown reviewer "nobody"; ignored',
    ]);
  });
});

// ---------------------------------------------------------------- properties

const INSTITUTES = ["I1", "I2", "I3"];
const CATEGORIES = ["stars", "galaxies", "planets"];
const committeeArb = (maxP: number, maxR: number) =>
  fc.record({ nP: fc.integer({ min: 1, max: maxP }), nR: fc.integer({ min: 1, max: maxR }) }).chain(({ nP, nR }) => {
    const rIds = Array.from({ length: nR }, (_, i) => `r${i}`);
    const pIds = Array.from({ length: nP }, (_, i) => `P${i}`);
    const pairArb = fc.record({ reviewer: fc.constantFrom(...rIds), proposal: fc.constantFrom(...pIds) });
    return fc.record({
      proposals: fc.tuple(
        ...pIds.map((id) =>
          fc.record({
            id: fc.constant(id),
            category: fc.constantFrom(...CATEGORIES),
            team: fc.subarray([...rIds, "x1", "x2"], { maxLength: 2 }),
            institutes: fc.subarray(INSTITUTES, { maxLength: 1 }),
          }),
        ),
      ),
      reviewers: fc.tuple(
        ...rIds.map((id) => fc.record({ id: fc.constant(id), institute: fc.constantFrom(...INSTITUTES, null, null) })),
      ),
      conflicts: fc.array(pairArb, { maxLength: 3 }),
      keep: fc.uniqueArray(pairArb, { selector: pair, maxLength: 3 }),
      reviewersPerProposal: fc.integer({ min: 1, max: 3 }),
    }) as fc.Arbitrary<AssignmentInput>;
  });

function combinations<T>(items: T[], k: number): T[][] {
  if (k === 0) return [[]];
  if (items.length < k) return [];
  const [first, ...rest] = items;
  return [...combinations(rest, k - 1).map((c) => [first, ...c]), ...combinations(rest, k)];
}

/**
 * Independent brute force: every way of filling each proposal with as many eligible reviewers as it
 * can take; returns the least load spread (max − min) and the least (Σ load², Σ category load²).
 */
function bruteForce(input: AssignmentInput) {
  const n = input.reviewersPerProposal!;
  const conflicted = new Set(findConflicts(input.proposals, input.reviewers, input.conflicts).map(pair));
  const kept = new Set(input.keep.map(pair));
  const rIds = input.reviewers.map((r) => r.id);
  const options = input.proposals.map((p) => {
    const nKept = rIds.filter((r) => kept.has(`${r}|${p.id}`)).length;
    const free = rIds.filter((r) => !kept.has(`${r}|${p.id}`) && !conflicted.has(`${r}|${p.id}`));
    return combinations(free, Math.min(Math.max(0, n - nKept), free.length));
  });
  const total = options.reduce((s, o) => s * o.length, 1);
  let bestSpread = Infinity;
  let best: [number, number] = [Infinity, Infinity];
  const counts = new Map<string, number>();
  const catCounts = new Map<string, number>();
  const add = (r: string, cat: string, d: number) => {
    counts.set(r, (counts.get(r) ?? 0) + d);
    catCounts.set(`${r}|${cat}`, (catCounts.get(`${r}|${cat}`) ?? 0) + d);
  };
  for (const k of input.keep) add(k.reviewer, input.proposals.find((p) => p.id === k.proposal)!.category, 1);
  const recurse = (i: number) => {
    if (i === options.length) {
      const loads = rIds.map((r) => counts.get(r) ?? 0);
      bestSpread = Math.min(bestSpread, Math.max(...loads) - Math.min(...loads));
      const sq = loads.reduce((s, x) => s + x * x, 0);
      const cat = [...catCounts.values()].reduce((s, x) => s + x * x, 0);
      if (sq < best[0] || (sq === best[0] && cat < best[1])) best = [sq, cat];
      return;
    }
    for (const combo of options[i]) {
      for (const r of combo) add(r, input.proposals[i].category, 1);
      recurse(i + 1);
      for (const r of combo) add(r, input.proposals[i].category, -1);
    }
  };
  if (total <= 20_000) recurse(0);
  return { total, bestSpread, best, fill: options.map((o) => o[0]?.length ?? 0) };
}

function loadsOf(res: AssignmentResult, input: AssignmentInput) {
  const loads = res.loads.map((l) => l.total);
  const cat = new Map<string, number>();
  for (const a of res.assignments) {
    const key = `${a.reviewer}|${input.proposals.find((p) => p.id === a.proposal)!.category}`;
    cat.set(key, (cat.get(key) ?? 0) + 1);
  }
  return {
    spread: Math.max(...loads) - Math.min(...loads),
    sq: loads.reduce((s, x) => s + x * x, 0),
    cat: [...cat.values()].reduce((s, x) => s + x * x, 0),
  };
}

describe("auto-assign: properties over random committees (fast-check)", () => {
  it("never conflicted, kept kept, filled as far as conflicts allow, loads as balanced as brute force finds", () => {
    fc.assert(
      fc.property(committeeArb(5, 5), (input) => {
        const bf = bruteForce(input);
        fc.pre(bf.total <= 20_000);
        const res = autoAssign(input);
        const conflicted = new Set(findConflicts(input.proposals, input.reviewers, input.conflicts).map(pair));
        const kept = new Set(input.keep.map(pair));
        const chosen = new Set(res.assignments.map(pair));
        expect(chosen.size).toBe(res.assignments.length);
        for (const a of res.assignments) {
          if (!a.kept) expect(conflicted.has(pair(a))).toBe(false);
          expect(a.kept).toBe(kept.has(pair(a)));
        }
        for (const k of kept) expect(chosen.has(k)).toBe(true);
        input.proposals.forEach((p, i) => {
          const nNew = res.assignments.filter((a) => a.proposal === p.id && !a.kept).length;
          expect(nNew).toBe(bf.fill[i]);
        });
        const mine = loadsOf(res, input);
        // Balanced whenever balance is feasible: the spread equals the least any full assignment has.
        expect(mine.spread).toBe(bf.bestSpread);
        if (bf.bestSpread <= 1) expect(mine.spread).toBeLessThanOrEqual(1);
        expect([mine.sq, mine.cat]).toEqual(bf.best);
      }),
      { numRuns: 150 },
    );
  });

  it("larger committees: never conflicted, kept kept, max − min ≤ 1 without conflicts or kept work", () => {
    fc.assert(
      fc.property(committeeArb(40, 9), fc.boolean(), (input, clean) => {
        const i2 = clean
          ? {
              ...input,
              proposals: input.proposals.map((p) => ({ ...p, team: [], institutes: [] })),
              conflicts: [],
              keep: [],
            }
          : input;
        const res = autoAssign(i2);
        const conflicted = new Set(findConflicts(i2.proposals, i2.reviewers, i2.conflicts).map(pair));
        for (const a of res.assignments) if (!a.kept) expect(conflicted.has(pair(a))).toBe(false);
        const chosen = new Set(res.assignments.map(pair));
        for (const k of i2.keep) expect(chosen.has(pair(k))).toBe(true);
        if (clean) expect(loadsOf(res, i2).spread).toBeLessThanOrEqual(1);
      }),
      { numRuns: 40 },
    );
  });

  it("is deterministic: the same committee in any list order gives the same assignment", () => {
    fc.assert(
      fc.property(committeeArb(12, 6), fc.integer(), (input, seed) => {
        const shuffle = <T>(a: T[]) =>
          a
            .map((x, i) => ({ x, k: Math.sin(seed + i * 12.9898) }))
            .sort((p, q) => p.k - q.k)
            .map((p) => p.x);
        const a = autoAssign(input);
        const b = autoAssign({ ...input, proposals: shuffle(input.proposals), reviewers: shuffle(input.reviewers) });
        expect(b.assignments).toEqual(a.assignments);
        expect(autoAssign(input)).toEqual(a);
      }),
      { numRuns: 40 },
    );
  });
});
