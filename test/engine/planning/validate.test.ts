/**
 * The plan validator after edits by hand: every kind of violation is found on the block that has it,
 * with its reason; an untouched plan validates clean.
 */
import { describe, expect, it } from "vitest";
import {
  buildPlanContext,
  computeEphemeris,
  computePlan,
  describePlanBlocks,
  type PlanBlockRef,
  parsePlanBlocks,
  validatePlan,
} from "~/engine";
import { planRequest, SITE, target, zenithTargets } from "./fixtures";

const refs = (blocks: PlanBlockRef[]): PlanBlockRef[] =>
  blocks.map(({ kind, target, object, startUtc, endUtc }) => ({ kind, target, object, startUtc, endUtc }));
const shift = (iso: string, min: number) =>
  new Date(Date.parse(iso) + min * 60_000).toISOString().replace(".000Z", "Z");
const move = (b: PlanBlockRef, min: number): PlanBlockRef => ({
  ...b,
  startUtc: shift(b.startUtc, min),
  endUtc: shift(b.endUtc, min),
});
const rules = (v: ReturnType<typeof validatePlan>, i: number) => v.blocks[i].violations.map((x) => x.rule);

describe("validatePlan", () => {
  const req = planRequest({ targets: zenithTargets(6, { hoursOwed: 3 }) });
  const plan = refs(computePlan(req).blocks);
  const single = planRequest({ targets: [target("A", 150, -31)] });
  const singlePlan = refs(computePlan(single).blocks);

  it("passes the planner's own plan", () => {
    expect(validatePlan(req, plan)).toEqual({ ok: true, blocks: plan.map((_, index) => ({ index, violations: [] })) });
    expect(validatePlan(single, singlePlan).ok).toBe(true);
  });

  it("finds a science block without its calibrator after a removal", () => {
    const edited = plan.slice(1);
    const v = validatePlan(req, edited);
    expect(v.ok).toBe(false);
    expect(v.blocks[0].violations).toEqual([
      { rule: "calibrators", reason: `no calibrator block of ${plan[1].target} immediately before it` },
    ]);
    expect(v.blocks.slice(1).every((b) => b.violations.length === 0)).toBe(true);
  });

  it("finds blocks out of order and overlapping", () => {
    const swapped = [plan[1], plan[0], ...plan.slice(2)];
    const v = validatePlan(req, swapped);
    expect(rules(v, 1)).toContain("order");
    expect(v.blocks[1].violations.find((x) => x.rule === "order")?.reason).toMatch(/out of time order/);
    // Lengthening a science block by 10 minutes runs it into the calibrator after it.
    const longer = [...plan];
    longer[1] = { ...plan[1], endUtc: shift(plan[1].endUtc, 10) };
    const w = validatePlan(req, longer);
    expect(rules(w, 2)).toEqual(["order"]);
    expect(w.blocks[2].violations[0].reason).toMatch(/^overlaps block 2, which ends at \d\d:\d\d:\d\d UTC$/);
    expect(rules(w, 1)).toEqual(["calibrators"]);
  });

  it("finds a sequence moved into twilight", () => {
    const eph = computeEphemeris({ site: SITE, date: "2027-03-15" });
    const early = plan.slice(0, 3).map((b) => move(b, -30));
    const v = validatePlan(req, early);
    expect(rules(v, 0)).toContain("darkness");
    expect(v.blocks[0].violations.find((x) => x.rule === "darkness")?.reason).toMatch(
      /^outside astronomical darkness: Sun at -1\d\.\d\d° at/,
    );
    expect(Date.parse(early[0].startUtc)).toBeLessThan(Date.parse(eph.astronomicalDuskUtc as string));
  });

  it("finds a block below its elevation limit, too near the Moon, out of delay-line range, or inside the Sun angle", () => {
    // Target A transits near LST 10 h (about 03:00 UT); twelve hours earlier it is far below the horizon
    // but a block then is also outside the night.
    const low: PlanBlockRef = {
      kind: "science",
      target: "A",
      object: "A",
      startUtc: "2027-03-16T08:30:00Z",
      endUtc: "2027-03-16T09:10:00Z",
    };
    const v = validatePlan(single, [low]);
    expect(rules(v, 0)).toEqual(expect.arrayContaining(["elevation", "calibrators"]));
    expect(v.blocks[0].violations.find((x) => x.rule === "elevation")?.reason).toMatch(
      /^below the elevation limit: \d+\.\d\d° at 09:10:00 UTC \(limit 30° plus a 0\.05° margin\)$/,
    );

    const moonEph = computeEphemeris({ site: SITE, date: "2027-03-24" });
    const byMoon = planRequest({
      date: "2027-03-24",
      moonMinSeparationDeg: 20,
      targets: [target("M", moonEph.moonRaDeg - 0.35, moonEph.moonDecDeg)],
    });
    const m = validatePlan(byMoon, [
      { kind: "science", target: "M", object: "M", startUtc: "2027-03-25T04:00:00Z", endUtc: "2027-03-25T04:40:00Z" },
    ]);
    expect(m.blocks[0].violations.find((x) => x.rule === "moon")?.reason).toMatch(
      /^too close to the Moon: \d\.\d\d° at/,
    );

    const tight = planRequest({ targets: zenithTargets(6, { hoursOwed: 3 }), delayLineStrokeM: 20 });
    expect(validatePlan(tight, plan).blocks.some((b) => b.violations.some((x) => x.rule === "delayLine"))).toBe(true);

    const sunny = planRequest({ targets: [target("A", 150, -31)], sunMinSeparationDeg: 170 });
    expect(rules(validatePlan(sunny, singlePlan.slice(0, 3)), 1)).toEqual(["sun"]);
  });

  it("finds a calibrator block serving two sequences", () => {
    // [cal sci cal][cal sci cal] of one target: drop the fourth block and move the second sequence up.
    const [c1, s1, c2, , s2, c4] = singlePlan;
    const edited = [c1, s1, c2, move(s2, -15), move(c4, -15)];
    const v = validatePlan(single, edited);
    expect(v.blocks[2].violations).toEqual([
      { rule: "calibratorReused", reason: "serves two sequences: the science blocks before and after it" },
    ]);
    expect(v.blocks.filter((b) => b.violations.length > 0)).toHaveLength(1);
  });

  it("finds science time beyond the hours owed", () => {
    // The target with the most science blocks in the plan, now owed one block only (40 min).
    const counts = new Map<string, number>();
    for (const b of plan) if (b.kind === "science") counts.set(b.target, (counts.get(b.target) ?? 0) + 1);
    const [name, n] = [...counts].sort((a, b) => b[1] - a[1])[0];
    expect(n).toBeGreaterThan(1);
    const owed = planRequest({
      targets: zenithTargets(6, { hoursOwed: 3 }).map((t) => (t.name === name ? { ...t, hoursOwed: 40 / 60 } : t)),
    });
    const v = validatePlan(owed, plan);
    const over = v.blocks.filter((b) => b.violations.some((x) => x.rule === "hoursOwed"));
    expect(over).toHaveLength(n - 1);
    expect(over[0].violations[0].reason).toBe(
      `science time of ${name} reaches 1.33 h in 2 blocks, over the 0.67 h owed (at most 1 block of 40 min)`,
    );
  });

  it("names unknown targets and objects, and bad times", () => {
    const v = validatePlan(single, [
      {
        kind: "science",
        target: "Nope",
        object: "Nope",
        startUtc: singlePlan[1].startUtc,
        endUtc: singlePlan[1].endUtc,
      },
      {
        kind: "calibrator",
        target: "A",
        object: "Stranger",
        startUtc: singlePlan[2].startUtc,
        endUtc: singlePlan[2].endUtc,
      },
      {
        kind: "calibrator",
        target: "A",
        object: "A-K",
        startUtc: singlePlan[3].endUtc,
        endUtc: singlePlan[3].startUtc,
      },
    ]);
    expect(v.blocks[0].violations[0]).toEqual({ rule: "unknown", reason: 'target "Nope" is not in the request' });
    expect(v.blocks[1].violations[0]).toEqual({ rule: "unknown", reason: '"Stranger" is not a calibrator of A' });
    expect(v.blocks[2].violations[0]).toEqual({ rule: "time", reason: "must end after it starts" });
  });

  it("parses a block list from JSON with field paths", () => {
    expect(parsePlanBlocks(singlePlan)).toEqual({ ok: true, value: singlePlan });
    expect(parsePlanBlocks([{ ...singlePlan[0], startUtc: "2027-03-16T01:00:00.5Z" }])).toMatchObject({
      ok: false,
      message: "blocks[0].startUtc: must be a whole second",
    });
  });
});

describe("describePlanBlocks", () => {
  it("gives the planner's own fields for its blocks and null for what cannot be resolved", () => {
    const req = planRequest({ targets: [target("A", 150, -31, { hoursOwed: 1 })] });
    const plan = computePlan(req);
    const again = describePlanBlocks(req, refs(plan.blocks));
    expect(again).toEqual(plan.blocks);
    const ctx = buildPlanContext(req);
    expect(describePlanBlocks(req, [{ ...refs(plan.blocks)[0], object: "Nobody" }], ctx)).toEqual([null]);
  });
});
