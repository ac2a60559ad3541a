/**
 * The automatic plan's choices (priority, then the target that sets soonest), its limits (hours
 * owed in whole blocks) and the reason given for every target that gets no time.
 */
import { describe, expect, it } from "vitest";
import { computeEphemeris, computePlan } from "~/engine";
import { planRequest, SITE, sec, target, zenithTargets } from "./fixtures";
import { replayPlan } from "./replay";

/** One 40-minute science block, in hours. */
const ONE_BLOCK = 40 / 60;

const science = (plan: ReturnType<typeof computePlan>, name?: string) =>
  plan.blocks.filter((b) => b.kind === "science" && (name === undefined || b.target === name));

describe("choosing the next sequence", () => {
  it("takes the best priority (lowest number) first", () => {
    // Two targets near the zenith at dusk (LST at dusk 7.2 h): both observable for hours.
    const req = planRequest({
      targets: [
        target("Second", 110, -31, { priority: 2, hoursOwed: ONE_BLOCK }),
        target("First", 112, -31, { priority: 1, hoursOwed: ONE_BLOCK }),
      ],
    });
    const plan = computePlan(req);
    expect(plan.blocks.map((b) => `${b.kind}:${b.object}`)).toEqual([
      "calibrator:First-K",
      "science:First",
      "calibrator:First-K",
      "calibrator:Second-K",
      "science:Second",
      "calibrator:Second-K",
    ]);
    expect(replayPlan(req, plan)).toEqual([]);
  });

  it("between equal priorities, takes the one that sets soonest", () => {
    // At dusk (LST 7.2 h) the target at RA 5 h is west of the meridian and sets first; the one at
    // RA 9 h is still rising.
    const req = planRequest({
      targets: [
        target("Rising", 135, -30, { hoursOwed: ONE_BLOCK }),
        target("Setting", 75, -30, { hoursOwed: ONE_BLOCK }),
      ],
    });
    const plan = computePlan(req);
    expect(science(plan).map((b) => b.target)).toEqual(["Setting", "Rising"]);
  });

  it("gives at most hoursOwed rounded up to whole science blocks", () => {
    // 0.7 h owed with 40-min blocks: ceil(42 / 40) = 2 blocks.
    const plan = computePlan(planRequest({ targets: [target("A", 150, -31, { hoursOwed: 0.7 })] }));
    expect(science(plan, "A")).toHaveLength(2);
    expect(plan.warnings.filter((w) => w.startsWith("A:"))).toEqual([]);
    // Exactly two blocks' worth is not rounded up to three.
    const exact = computePlan(planRequest({ targets: [target("A", 150, -31, { hoursOwed: 80 / 60 })] }));
    expect(science(exact, "A")).toHaveLength(2);
  });

  it("uses the first listed calibrator that is observable", () => {
    const t = target("A", 150, -31, { hoursOwed: 0.5 });
    t.calibrators = [
      { name: "Never", raDeg: 150, decDeg: 80 },
      { name: "Good", raDeg: 152, decDeg: -30 },
      { name: "AlsoGood", raDeg: 148, decDeg: -32 },
    ];
    const plan = computePlan(planRequest({ targets: [t] }));
    expect(plan.blocks.map((b) => b.object)).toEqual(["Good", "A", "Good"]);
  });

  it("reports a target that got part of its time in the warnings", () => {
    // Dec +28.4° culminates near 30.4° from the demo site: above 30° for little more than an hour.
    const short = target("Short", 180, 28.4, { hoursOwed: 3, calibrators: [{ name: "K", raDeg: 182, decDeg: 20 }] });
    const plan = computePlan(planRequest({ targets: [short] }));
    expect(science(plan, "Short").length).toBeGreaterThan(0);
    expect(plan.warnings).toContain(`Short: ${science(plan, "Short").length} of 5 science blocks planned (3 h owed).`);
  });
});

describe("reasons for targets that get no time", () => {
  const reason = (extra: Record<string, unknown>, t: ReturnType<typeof target>) => {
    const req = planRequest({ ...extra, targets: [...((extra.targets as unknown[]) ?? []), t] });
    const plan = computePlan(req);
    expect(replayPlan(req, plan)).toEqual([]);
    return plan.unplaced.find((u) => u.target === t.name);
  };

  it("never above its elevation limit in darkness", () => {
    // Dec +80° culminates at 90° − |−31.4° − 80°| < 0 from the demo site.
    expect(reason({}, target("North", 200, 80))).toMatchObject({
      code: "elevation",
      reason: expect.stringMatching(/^never above its 30° elevation limit in darkness \(highest -\d/),
    });
    // Its own limit is used when given.
    expect(reason({}, target("Low", 180, 28.4, { minElevationDeg: 40 }))?.reason).toMatch(
      /never above its 40° elevation limit/,
    );
  });

  it("delay lines out of range", () => {
    // A 300 m east–west baseline with a 500 m fixed path offset: |w + ΔP| ≥ 200 m > 50 m stroke.
    const stations = [
      { name: "A", eastM: 0, northM: 0, upM: 0, pathOffsetM: 0 },
      { name: "B", eastM: 300, northM: 0, upM: 0, pathOffsetM: 500 },
    ];
    expect(reason({ stations, delayLineStrokeM: 50 }, target("Z", 150, -31))).toMatchObject({
      code: "delayLine",
      reason: expect.stringMatching(
        /^delay lines out of range whenever it is above 30° in darkness \(needs at least 2\d\d\.\d m, stroke 50 m\)$/,
      ),
    });
  });

  it("too close to the Moon", () => {
    // 2027-03-24: the Moon (91 % lit) at RA 214.9°, Dec −19.3° at local midnight (engine's ephemeris).
    const eph = computeEphemeris({ site: SITE, date: "2027-03-24" });
    const t = target("ByMoon", eph.moonRaDeg - 0.35, eph.moonDecDeg);
    expect(reason({ date: "2027-03-24", moonMinSeparationDeg: 20 }, t)).toMatchObject({
      code: "moon",
      reason: expect.stringMatching(/^too close to the Moon/),
    });
    // Without a Moon limit the same target is planned.
    const plan = computePlan(planRequest({ date: "2027-03-24", moonMinSeparationDeg: 0, targets: [t] }));
    expect(science(plan).length).toBeGreaterThan(0);
  });

  it("never observable for as long as a science block", () => {
    // Dec +28.6°: culminates about 30.2° high, above 30° for less than 40 minutes.
    expect(reason({}, target("Brief", 180, 28.6))?.code).toBe("window");
  });

  it("no calibrators, or none observable", () => {
    expect(reason({}, target("Alone", 150, -31, { calibrators: [] }))).toMatchObject({
      code: "noCalibrators",
      reason: "no calibrators given",
    });
    const far = target("Far", 150, -31, { calibrators: [{ name: "Polaris-ish", raDeg: 40, decDeg: 89 }] });
    expect(reason({}, far)).toMatchObject({
      code: "calibrator",
      reason: expect.stringMatching(/^no observable calibrator .*below the elevation limit/),
    });
  });

  it("night full", () => {
    const busy = zenithTargets(12, { priority: 1, hoursOwed: 20 });
    expect(reason({ targets: busy }, target("Late", 150, -31, { priority: 5 }))).toMatchObject({
      code: "nightFull",
      reason: expect.stringMatching(/^night full/),
    });
  });

  it("no hours owed", () => {
    expect(reason({}, target("Done", 150, -31, { hoursOwed: 0 }))).toEqual({
      target: "Done",
      code: "noHours",
      reason: "no hours owed",
    });
  });
});

describe("re-planning the rest of a night", () => {
  it("keeps the executed blocks, starts new ones at notBeforeUtc and counts executed science against hoursOwed", () => {
    const targets = zenithTargets(6, { hoursOwed: 2 });
    const first = computePlan(planRequest({ targets }));
    const executed = first.blocks
      .slice(0, 6)
      .map(({ kind, target, object, startUtc, endUtc }) => ({ kind, target, object, startUtc, endUtc }));
    const notBeforeUtc = "2027-03-16T03:00:30Z";
    const req = planRequest({ targets, executedBlocks: executed, notBeforeUtc });
    const plan = computePlan(req);
    expect(
      plan.blocks.slice(0, 6).map(({ object, startUtc, endUtc, executed }) => ({ object, startUtc, endUtc, executed })),
    ).toEqual(executed.map(({ object, startUtc, endUtc }) => ({ object, startUtc, endUtc, executed: true })));
    const fresh = plan.blocks.slice(6);
    expect(fresh.length).toBeGreaterThan(0);
    expect(sec(fresh[0].startUtc)).toBeGreaterThanOrEqual(sec(notBeforeUtc));
    expect(sec(fresh[0].startUtc) - sec(notBeforeUtc)).toBeLessThan(60);
    expect(plan.night.planStartUtc).toBe(notBeforeUtc);
    expect(replayPlan(req, plan)).toEqual([]);
    // A target's executed and new science together stay within 2 h (3 blocks of 40 min).
    for (const t of targets) expect(science(plan, t.name).length).toBeLessThanOrEqual(3);
  });

  it("warns about an executed block that breaks a rule and plans nothing after dawn", () => {
    const t = target("A", 150, -31);
    const req = planRequest({
      targets: [t],
      notBeforeUtc: "2027-03-16T09:30:00Z",
      executedBlocks: [
        { kind: "science", target: "A", object: "A", startUtc: "2027-03-16T01:00:00Z", endUtc: "2027-03-16T01:40:00Z" },
      ],
    });
    const plan = computePlan(req);
    expect(plan.blocks).toHaveLength(1);
    expect(plan.warnings).toContain(
      "Executed block science A for A at 2027-03-16T01:00:00Z: no calibrator block of A immediately before it.",
    );
    expect(plan.warnings.some((w) => w.startsWith("Too little astronomical darkness is left"))).toBe(true);
    expect(plan.unplaced).toEqual([]);
  });
});
