/**
 * The planner's night against the engine's ephemeris and an independent sunrise module; the Sun
 * avoidance rule; nights without darkness.
 */
import { CalendarGregorian } from "astronomia/julian";
import { Sunrise } from "astronomia/sunrise";
import { describe, expect, it } from "vitest";
import { computeEphemeris, computePlan, julianDayFromDate, PLAN_SAFETY_WARNING, sunAltitudeRad } from "~/engine";
import { planRequest, SITE, sec, target, zenithTargets } from "./fixtures";
import { replayPlan } from "./replay";

const D = Math.PI / 180;
const sunAltDeg = (iso: string) =>
  sunAltitudeRad(julianDayFromDate(new Date(iso)), SITE.latitudeDeg * D, SITE.longitudeDeg * D) / D;

describe("the night of 2027-03-15 at the demo site", () => {
  const req = planRequest({ targets: zenithTargets(12) });
  const plan = computePlan(req);
  const eph = computeEphemeris({ site: SITE, date: "2027-03-15" });

  it("has the engine's twilight times and Moon phase", () => {
    expect(plan.night).toMatchObject({
      date: "2027-03-15",
      astronomicalDuskUtc: eph.astronomicalDuskUtc,
      astronomicalDawnUtc: eph.astronomicalDawnUtc,
      moonIlluminatedFraction: eph.moonIlluminatedFraction,
    });
    // Hand check: the values the ephemeris command prints for this night.
    expect(plan.night.astronomicalDuskUtc).toBe("2027-03-16T00:14:25Z");
    expect(plan.night.astronomicalDawnUtc).toBe("2027-03-16T09:14:44Z");
  });

  it("agrees with astronomia's equation-of-time sunrise module within a minute", () => {
    // Second opinion (astronomia/sunrise: longitude positive WEST, UT calendar days).
    const evening = new Sunrise(new CalendarGregorian(2027, 3, 15), -31.4, 68.9).nightStart();
    const morning = new Sunrise(new CalendarGregorian(2027, 3, 16), -31.4, 68.9).nightEnd();
    expect(
      Math.abs(sec(plan.night.astronomicalDuskUtc as string) - (evening?.toDate().getTime() ?? 0) / 1000),
    ).toBeLessThan(60);
    expect(
      Math.abs(sec(plan.night.astronomicalDawnUtc as string) - (morning?.toDate().getTime() ?? 0) / 1000),
    ).toBeLessThan(60);
  });

  it("plans only in darkness, with a margin of seconds at both ends", () => {
    const first = plan.blocks[0];
    const last = plan.blocks[plan.blocks.length - 1];
    const dusk = sec(eph.astronomicalDuskUtc as string);
    const dawn = sec(eph.astronomicalDawnUtc as string);
    expect(sec(first.startUtc) - dusk).toBeGreaterThan(0);
    expect(sec(first.startUtc) - dusk).toBeLessThan(60);
    expect(sunAltDeg(first.startUtc)).toBeLessThan(-18.04);
    expect(dawn - sec(last.endUtc)).toBeGreaterThan(0);
    expect(sunAltDeg(last.endUtc)).toBeLessThan(-18.04);
  });

  it("fills an easy night (targets near the zenith) to within one sequence of dawn, without gaps", () => {
    const seqSec = (2 * 15 + 40) * 60;
    const dawn = sec(eph.astronomicalDawnUtc as string);
    const last = plan.blocks[plan.blocks.length - 1];
    expect(dawn - sec(last.endUtc)).toBeLessThan(seqSec);
    for (let i = 1; i < plan.blocks.length; i++) expect(plan.blocks[i].startUtc).toBe(plan.blocks[i - 1].endUtc);
    expect(plan.blocks).toHaveLength(3 * Math.floor((dawn - sec(plan.blocks[0].startUtc)) / seqSec));
    expect(replayPlan(req, plan)).toEqual([]);
  });

  it("reports hour angle, LST, elevation and air mass consistently", () => {
    for (const b of plan.blocks) {
      expect(b.startLstH).toBeGreaterThanOrEqual(0);
      expect(b.startLstH).toBeLessThan(24);
      // Air mass from Kasten & Young (1989) is close to sec z above 30° (within 0.5 %).
      expect(b.airmassStart).toBeCloseTo(1 / Math.sin(b.elevationStartDeg * D), 2);
      // The hour angle advances at the sidereal rate, 360.985647° per day of UT (Meeus 1998 p. 103).
      const hours = (sec(b.endUtc) - sec(b.startUtc)) / 3600;
      const dHa = (((b.hourAngleEndH - b.hourAngleStartH) % 24) + 24) % 24;
      expect(dHa).toBeCloseTo((hours * 360.985647) / 360, 3);
    }
    expect(plan.warnings[0]).toBe(PLAN_SAFETY_WARNING);
    expect(plan.warnings[0]).toMatch(/wind, humidity, Sun/);
  });
});

describe("Sun avoidance", () => {
  // On 2027-03-16 at local midnight the Sun is at RA 355.7°, Dec −1.8° (engine's solar position);
  // a target 50° east of it is still low in the west after dusk.
  const evening = (sunMinSeparationDeg: number) =>
    planRequest({
      sunMinSeparationDeg,
      minElevationDeg: 5,
      scienceBlockMin: 20,
      calibratorBlockMin: 5,
      targets: [target("W", 45.7, 5, { hoursOwed: 1 })],
    });

  it("never plans a target inside the avoidance angle and says why", () => {
    const plan = computePlan(evening(55));
    expect(plan.blocks).toEqual([]);
    expect(plan.unplaced).toEqual([
      {
        target: "W",
        code: "sun",
        reason: expect.stringMatching(/^Sun avoidance: 50\.\d° from the Sun, inside the 55° avoidance angle$/),
      },
    ]);
    expect(plan.warnings.some((w) => w.startsWith("W is not planned. Sun avoidance"))).toBe(true);
  });

  it("plans the same target with a smaller angle", () => {
    const req = evening(45);
    const plan = computePlan(req);
    expect(plan.blocks.filter((b) => b.kind === "science").length).toBeGreaterThan(0);
    expect(replayPlan(req, plan)).toEqual([]);
  });

  it("defaults to 45°", () => {
    const req = planRequest({ targets: [] });
    expect(req.sunMinSeparationDeg).toBe(45);
  });
});

describe("nights without darkness", () => {
  it("plans nothing at 60° N at midsummer and lists every target", () => {
    const req = planRequest({
      site: { latitudeDeg: 60, longitudeDeg: 10, altitudeM: 0 },
      date: "2027-06-21",
      targets: [target("A", 270, 60)],
    });
    const plan = computePlan(req);
    expect(plan.night.astronomicalDuskUtc).toBeNull();
    expect(plan.night.planStartUtc).toBeNull();
    expect(plan.blocks).toEqual([]);
    expect(plan.unplaced[0]).toMatchObject({ target: "A", code: "noDarkness" });
    expect(plan.warnings.some((w) => w.startsWith("No astronomical darkness"))).toBe(true);
  });
});
