import { sum } from "@test/sum";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { type AllocationInput, suggestAllocation } from "~/engine";

const req = (
  proposal: string,
  target: string,
  configuration: string,
  spreadHours: number[],
  hours = sum(spreadHours),
) => ({
  proposal,
  target,
  configuration,
  hours,
  spreadHours,
});

// Hand-worked walk, three LST bins. Capacity A = [4, 4, 2], B = [1, 1, 1].
//  P1  T1 on A, spread [2, 2, 0] (4 h): fits whole → grant 4;                   A left [2, 2, 2]
//  P2  T2 on A, spread [0, 3, 3] (6 h): min(3, 2) in bins 1 and 2 → 4 of 6 = 67% ≥ 50% → accept 4;
//                                                                                A left [2, 0, 0]
//  P3  T3 on A, spread [1, 1, 1] (3 h): only bin 0 → 1 of 3 = 33% < 50% → waitlist, the 1 h goes back;
//                                                                                A left [2, 0, 0]
//  P4  T4 on A, spread [1.5, 0, 0]: fits → accept 1.5;                          A left [0.5, 0, 0]
//  P5  T5 on B, spread [0, 2, 0] → 1 (bin 1 holds 1); T6 on A, spread [0.5, 0, 0] → 0.5;
//      1.5 of 2.5 = 60% → accept;                                                A left [0, 0, 0], B [1, 0, 1]
//  P6  an unplaceable target (3 h, no spread) → 0 of 3 → waitlist.
//  P7  in the order but requests nothing → waitlist.  P8 has a request but is not in the order.
const walk: AllocationInput = {
  order: ["P1", "P2", "P3", "P4", "P5", "P6", "P7"],
  capacity: [
    { configuration: "A", hoursPerBin: [4, 4, 2] },
    { configuration: "B", hoursPerBin: [1, 1, 1] },
  ],
  requests: [
    req("P1", "T1", "A", [2, 2, 0]),
    req("P2", "T2", "A", [0, 3, 3]),
    req("P3", "T3", "A", [1, 1, 1]),
    req("P4", "T4", "A", [1.5, 0, 0]),
    req("P5", "T5", "B", [0, 2, 0]),
    req("P5", "T6", "A", [0.5, 0, 0]),
    req("P6", "T7", "A", [0, 0, 0], 3),
    req("P8", "T8", "B", [1, 0, 0]),
  ],
};

describe("suggested allocation: hand-worked walk", () => {
  const res = suggestAllocation(walk);
  const byId = new Map(res.proposals.map((p) => [p.proposal, p]));

  it("grants in rank order bin by bin and waitlists what fits below the threshold", () => {
    expect(res.proposals.map((p) => [p.proposal, p.suggestion, p.grantedHours])).toEqual([
      ["P1", "accept", 4],
      ["P2", "accept", 4],
      ["P3", "waitlist", 0],
      ["P4", "accept", 1.5],
      ["P5", "accept", 1.5],
      ["P6", "waitlist", 0],
      ["P7", "waitlist", 0],
    ]);
    expect(byId.get("P1")!.reason).toBe("all 4.0 h fit");
    expect(byId.get("P2")!.reason).toBe("4.0 of 6.0 h fit (67%)");
    expect(byId.get("P3")!.reason).toBe("only 1.0 of 3.0 h fit (33%, below 50%)");
    expect(byId.get("P3")!.fittingHours).toBe(1);
    expect(byId.get("P6")!.reason).toBe("only 0.0 of 3.0 h fit (0%, below 50%)");
    expect(byId.get("P7")!.reason).toBe("no hours requested");
    expect(byId.get("P5")!.configurations).toEqual([
      { configuration: "B", requestedHours: 2, grantedHours: 1 },
      { configuration: "A", requestedHours: 0.5, grantedHours: 0.5 },
    ]);
    expect(res.notWalked).toEqual(["P8"]);
  });

  it("returns the remaining and granted capacity per bin", () => {
    const [a, b] = res.configurations;
    expect(Array.from(a.remainingHours)).toEqual([0, 0, 0]);
    expect(Array.from(a.grantedHours)).toEqual([4, 4, 2]);
    expect(Array.from(b.remainingHours)).toEqual([1, 0, 1]);
    expect(Array.from(b.grantedHours)).toEqual([0, 1, 0]);
  });

  it("with minGrantFraction = 1 a proposal gets all its hours or none", () => {
    // P1 4 h → A left [2, 2, 2]; P2 4 of 6 → waitlist; P3 [1, 1, 1] fits → A left [1, 1, 1];
    // P4 1 of 1.5 → waitlist; P5 B 1 of 2 + A 0.5 of 0.5 → 1.5 of 2.5 → waitlist.
    const all = suggestAllocation({ ...walk, minGrantFraction: 1 });
    expect(all.proposals.map((p) => [p.proposal, p.suggestion, p.grantedHours]).slice(0, 5)).toEqual([
      ["P1", "accept", 4],
      ["P2", "waitlist", 0],
      ["P3", "accept", 3],
      ["P4", "waitlist", 0],
      ["P5", "waitlist", 0],
    ]);
    expect(Array.from(all.configurations[0].remainingHours)).toEqual([1, 1, 1]);
    expect(Array.from(all.configurations[1].remainingHours)).toEqual([1, 1, 1]);
  });

  it("refuses a repeated proposal in the order and mismatched bins", () => {
    expect(() => suggestAllocation({ ...walk, order: ["P1", "P1"] })).toThrow(/order\[1\]: repeats/);
    expect(() => suggestAllocation({ ...walk, requests: [req("P1", "T", "A", [1, 1])] })).toThrow(/3 bins/);
    expect(() => suggestAllocation({ ...walk, minGrantFraction: 0 })).toThrow(/minGrantFraction/);
  });
});

// ---------------------------------------------------------------- properties

const N_BINS = 4;
const binsArb = (max: number) =>
  fc.array(fc.double({ min: 0, max, noNaN: true }), { minLength: N_BINS, maxLength: N_BINS });
const caseArb = fc.record({
  capacity: fc.record({ A: binsArb(10), B: binsArb(10) }),
  requests: fc.array(
    fc.record({ p: fc.integer({ min: 0, max: 7 }), configuration: fc.constantFrom("A", "B", "C"), spread: binsArb(5) }),
    { maxLength: 16 },
  ),
  f: fc.constantFrom(0.25, 0.5, 1),
});
type Case = typeof caseArb extends fc.Arbitrary<infer T> ? T : never;
const build = (c: Case): AllocationInput => ({
  order: ["P0", "P1", "P2", "P3", "P4", "P5", "P6", "P7"],
  capacity: [
    { configuration: "A", hoursPerBin: c.capacity.A },
    { configuration: "B", hoursPerBin: c.capacity.B },
  ],
  requests: c.requests.map((r, i) => req(`P${r.p}`, `T${i}`, r.configuration, r.spread)),
  minGrantFraction: c.f,
});

describe("suggested allocation: properties (fast-check)", () => {
  it("never exceeds capacity; granted + remaining = capacity; bins add up to the grants", () => {
    fc.assert(
      fc.property(caseArb, (c) => {
        const input = build(c);
        const res = suggestAllocation(input);
        for (const conf of res.configurations) {
          for (let b = 0; b < N_BINS; b++) {
            expect(conf.remainingHours[b]).toBeGreaterThanOrEqual(0);
            expect(conf.grantedHours[b]).toBeLessThanOrEqual(conf.capacityHours[b] + 1e-12);
            expect(conf.grantedHours[b] + conf.remainingHours[b]).toBeCloseTo(conf.capacityHours[b], 9);
          }
          const granted = res.proposals.flatMap((p) => p.targets).filter((t) => t.configuration === conf.configuration);
          expect(sum(conf.grantedHours)).toBeCloseTo(sum(granted.map((t) => t.grantedHours)), 9);
        }
        for (const p of res.proposals) {
          for (const t of p.targets) expect(t.grantedHours).toBeLessThanOrEqual(t.requestedHours + 1e-9);
          if (p.suggestion === "accept") expect(p.grantedHours).toBeGreaterThanOrEqual(c.f * p.requestedHours - 1e-9);
          else expect(p.grantedHours).toBe(0);
        }
      }),
    );
  });

  it("a proposal's grant does not depend on the proposals ranked below it", () => {
    fc.assert(
      fc.property(caseArb, fc.integer({ min: 1, max: 8 }), (c, k) => {
        const input = build(c);
        const full = suggestAllocation(input).proposals;
        const prefix = suggestAllocation({ ...input, order: input.order.slice(0, k) }).proposals;
        expect(prefix).toEqual(full.slice(0, k));
      }),
    );
  });
});
