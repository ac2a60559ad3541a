/**
 * Properties of the planner over random target sets, sites and dates (fast-check): no plan breaks a
 * rule of the contract in an independent replay every 30 s (replay.ts); the plan validates clean;
 * its twilight times are the engine's ephemeris; a re-plan keeps the executed blocks and still keeps
 * every rule.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { computeEphemeris, computePlan, type PlanInput, parsePlanRequest, validatePlan } from "~/engine";
import { replayPlan } from "./replay";

const station = fc.record({
  eastM: fc.double({ min: -200, max: 200, noNaN: true }),
  northM: fc.double({ min: -200, max: 200, noNaN: true }),
  upM: fc.double({ min: -2, max: 2, noNaN: true }),
  pathOffsetM: fc.double({ min: 0, max: 60, noNaN: true }),
});

/** A calibrator offset from its target's RA (declination offset added later). */
const calibrator = (ra: number) =>
  fc
    .record({
      dRa: fc.double({ min: -10, max: 10, noNaN: true }),
      dDec: fc.double({ min: -8, max: 8, noNaN: true }),
    })
    .map(({ dRa, dDec }) => ({
      raDeg: (((ra + dRa) % 360) + 360) % 360,
      decDeg: dDec,
    }));

/** Targets mostly within 50° of the zenith's declination, so that most nights have work to do. */
const target = fc
  .record({
    raDeg: fc.double({ min: 0, max: 359.999, noNaN: true }),
    dDecDeg: fc.double({ min: -50, max: 50, noNaN: true }),
    anyDecDeg: fc.option(fc.double({ min: -89, max: 89, noNaN: true }), { freq: 6 }),
    priority: fc.integer({ min: 1, max: 3 }),
    hoursOwed: fc.oneof(fc.constant(0), fc.double({ min: 0.1, max: 5, noNaN: true }), fc.integer({ min: 1, max: 4 })),
    minElevationDeg: fc.option(fc.integer({ min: 15, max: 60 }), { nil: null }),
    nCal: fc.oneof(fc.constant(0), fc.integer({ min: 1, max: 3 }), fc.integer({ min: 1, max: 3 })),
  })
  .chain((t) =>
    fc.array(calibrator(t.raDeg), { minLength: t.nCal, maxLength: t.nCal }).map((cals) => ({ ...t, cals })),
  );

/** A random valid request, through the wire schema (so defaults are those of the contract). */
const request = fc
  .record({
    latitudeDeg: fc.double({ min: -60, max: 60, noNaN: true }),
    longitudeDeg: fc.double({ min: -180, max: 180, noNaN: true }),
    dayOffset: fc.integer({ min: 0, max: 365 * 15 }),
    stations: fc.array(station, { minLength: 2, maxLength: 4 }),
    stroke: fc.option(fc.double({ min: 20, max: 300, noNaN: true }), { nil: null }),
    minElevationDeg: fc.integer({ min: 15, max: 50 }),
    moonMinSeparationDeg: fc.integer({ min: 0, max: 40 }),
    sunMinSeparationDeg: fc.integer({ min: 0, max: 60 }),
    scienceBlockMin: fc.oneof(fc.integer({ min: 10, max: 60 }), fc.double({ min: 10, max: 60, noNaN: true })),
    calibratorBlockMin: fc.integer({ min: 5, max: 20 }),
    targets: fc.array(target, { minLength: 1, maxLength: 8 }),
  })
  .map((r): PlanInput => {
    const date = new Date(Date.UTC(2020, 0, 1) + r.dayOffset * 86_400_000).toISOString().slice(0, 10);
    const parsed = parsePlanRequest({
      site: { latitudeDeg: r.latitudeDeg, longitudeDeg: r.longitudeDeg, altitudeM: 2000 },
      date,
      stations: r.stations.map((s, i) => ({ name: `S${i}`, ...s })),
      delayLineStrokeM: r.stroke,
      minElevationDeg: r.minElevationDeg,
      moonMinSeparationDeg: r.moonMinSeparationDeg,
      sunMinSeparationDeg: r.sunMinSeparationDeg,
      scienceBlockMin: r.scienceBlockMin,
      calibratorBlockMin: r.calibratorBlockMin,
      targets: r.targets.map((t, i) => {
        const decDeg = t.anyDecDeg ?? Math.max(-89, Math.min(89, r.latitudeDeg + t.dDecDeg));
        return {
          name: `T${i}`,
          raDeg: t.raDeg,
          decDeg,
          priority: t.priority,
          hoursOwed: t.hoursOwed,
          minElevationDeg: t.minElevationDeg,
          // Calibrators near the target: up to 10° in RA and 8° in declination away.
          calibrators: t.cals.map((c, j) => ({
            name: `T${i}K${j}`,
            raDeg: c.raDeg,
            decDeg: Math.max(-90, Math.min(90, decDeg + c.decDeg)),
          })),
        };
      }),
    });
    if (!parsed.ok) throw new Error(parsed.message);
    return parsed.value;
  });

describe("planner properties (fast-check)", { timeout: 240_000 }, () => {
  it("never breaks a rule of the contract, validates clean, and reports the engine's twilight", () => {
    let withBlocks = 0;
    fc.assert(
      fc.property(request, (req) => {
        const plan = computePlan(req);
        expect(replayPlan(req, plan)).toEqual([]);
        const check = validatePlan(req, plan.blocks);
        expect(check.blocks.flatMap((b) => b.violations)).toEqual([]);
        const eph = computeEphemeris({ site: req.site, date: req.date });
        expect(plan.night.astronomicalDuskUtc).toBe(eph.astronomicalDuskUtc);
        expect(plan.night.astronomicalDawnUtc).toBe(eph.astronomicalDawnUtc);
        expect(plan.night.moonIlluminatedFraction).toBe(eph.moonIlluminatedFraction);
        if (plan.blocks.length > 0) withBlocks++;
      }),
      { numRuns: Number(process.env.PLAN_RUNS ?? 100), seed: Number(process.env.PLAN_SEED ?? 20270315) },
    );
    // The generator must actually exercise plans, not only empty nights.
    expect(withBlocks).toBeGreaterThan(10);
    if (process.env.PLAN_RUNS) console.log("plans with blocks", withBlocks);
  });

  it("re-plans the rest of a night around executed blocks and still keeps every rule", () => {
    fc.assert(
      fc.property(request, fc.double({ min: 0.1, max: 0.9, noNaN: true }), (req, cut) => {
        const first = computePlan(req);
        fc.pre(first.blocks.length >= 3 && first.night.planStartUtc !== null && first.night.planEndUtc !== null);
        const t0 = Date.parse(first.night.planStartUtc as string);
        const t1 = Date.parse(first.night.planEndUtc as string);
        const cutMs = Math.round((t0 + cut * (t1 - t0)) / 1000) * 1000;
        // The sequences finished before the cut are the executed ones (a plan is whole sequences).
        const done = first.blocks.filter((_, i) => Date.parse(first.blocks[i - (i % 3) + 2].endUtc) <= cutMs);
        const executedBlocks = done.map(({ kind, target, object, startUtc, endUtc }) => ({
          kind,
          target,
          object,
          startUtc,
          endUtc,
        }));
        const again: PlanInput = { ...req, notBeforeUtc: new Date(cutMs).toISOString(), executedBlocks };
        const plan = computePlan(again);
        expect(plan.blocks.slice(0, done.length).map((b) => [b.object, b.startUtc, b.endUtc, b.executed])).toEqual(
          done.map((b) => [b.object, b.startUtc, b.endUtc, true]),
        );
        for (const b of plan.blocks.slice(done.length)) expect(Date.parse(b.startUtc)).toBeGreaterThanOrEqual(cutMs);
        expect(replayPlan(again, plan)).toEqual([]);
        expect(validatePlan(again, plan.blocks).ok).toBe(true);
      }),
      { numRuns: Number(process.env.PLAN_RUNS ?? 50), seed: Number(process.env.PLAN_SEED ?? 7) },
    );
  });
});
