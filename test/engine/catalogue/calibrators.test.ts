import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  type CalibratorsInput,
  type CalibratorsResponse,
  DEG_TO_RAD,
  elevationRad,
  jdeFromJd,
  lmstRad,
  nightEvents,
  parseCalibratorsRequest,
  precessFromJ2000,
  RAD_TO_DEG,
  shortlistCalibrators,
  uniformDiskVis2,
} from "~/engine";
import { catalogue } from "./data";

const cat = catalogue();
const SITE = { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 };

function request(overrides: Record<string, unknown>): CalibratorsInput {
  const parsed = parseCalibratorsRequest({
    target: { raDeg: 88.79, decDeg: 7.41 },
    wavelengthM: 1.65e-6,
    longestBaselineM: 160,
    site: SITE,
    date: "2027-01-10",
    minElevationDeg: 30,
    ...overrides,
  });
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.value;
}

function shortlist(overrides: Record<string, unknown>): CalibratorsResponse {
  const r = shortlistCalibrators(cat, request(overrides));
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

/** Great-circle distance, degrees (haversine, written here independently of the engine). */
function haversineDeg(ra1: number, dec1: number, ra2: number, dec2: number): number {
  const [a1, d1, a2, d2] = [ra1, dec1, ra2, dec2].map((x) => x * DEG_TO_RAD);
  const h = Math.sin((d2 - d1) / 2) ** 2 + Math.cos(d1) * Math.cos(d2) * Math.sin((a2 - a1) / 2) ** 2;
  return 2 * Math.asin(Math.sqrt(h)) * RAD_TO_DEG;
}

/** Hours when both positions are above minEl in the dark, 10-min steps (independent re-count). */
function hoursTogether(date: string, a: [number, number], b: [number, number], minElDeg: number): number {
  const [y, m, d] = date.split("-").map(Number);
  const lat = SITE.latitudeDeg * DEG_TO_RAD;
  const lon = SITE.longitudeDeg * DEG_TO_RAD;
  const night = nightEvents({ year: y, month: m, day: d }, lat, lon);
  if (night.darkStartJd === null || night.darkEndJd === null) return 0;
  const jde = jdeFromJd(night.localMidnightJd);
  const pa = precessFromJ2000(a[0] * DEG_TO_RAD, a[1] * DEG_TO_RAD, jde);
  const pb = precessFromJ2000(b[0] * DEG_TO_RAD, b[1] * DEG_TO_RAD, jde);
  const jd0 = Date.UTC(y, m - 1, d) / 86400000 + 2440587.5;
  let n = 0;
  for (let k = Math.ceil(((night.darkStartJd - jd0) * 1440) / 10); k * 10 <= (night.darkEndJd - jd0) * 1440; k++) {
    const t = jd0 + (k * 10) / 1440;
    const up = (p: { raRad: number; decRad: number }) =>
      elevationRad(lat, p.decRad, lmstRad(t, lon) - p.raRad) >= minElDeg * DEG_TO_RAD;
    if (up(pa) && up(pb)) n++;
  }
  return n / 6;
}

/** The documented score, written out: weights 0.4, 0.2, 0.25, 0.15 (docs/cli.md, "The star catalogue"). */
function documentedScore(
  c: CalibratorsResponse["calibrators"][number],
  res: CalibratorsResponse,
  req: CalibratorsInput,
) {
  const clamp = (x: number) => Math.min(1, Math.max(0, x));
  const dm = c.bandMag !== null && res.target.bandMag !== null ? Math.abs(c.bandMag - res.target.bandMag) : null;
  return (
    100 *
    (1 -
      0.4 * clamp(c.distanceDeg / req.maxDistanceDeg) -
      0.2 * clamp((1 - c.vis2) / (1 - req.minVis2)) -
      0.25 * clamp(1 - c.observableHours / res.target.observableHours) -
      0.15 * (dm === null ? 0 : clamp(dm / (req.maxMagDifference ?? 2))))
  );
}

describe("calibrator shortlist", () => {
  it("answers the contract's example: never Betelgeuse itself, every entry inside the rules", () => {
    const res = shortlist({});
    // The example's coordinates are Betelgeuse's (HIP 27989, 88.7929 +7.4071) rounded to 0.01°.
    expect(res.target).toMatchObject({ hip: 27989, name: "Betelgeuse", bandMagSource: "estimate" });
    expect(res.band.name).toBe("H");
    expect(res.calibrators.length).toBe(20);
    expect(res.calibrators.map((c) => c.hip)).not.toContain(27989);
    for (const c of res.calibrators) {
      expect(Object.keys(c)).toEqual(
        expect.arrayContaining(["name", "hip", "raDeg", "decDeg", "distanceDeg", "vMag", "bv", "bandMag"]),
      );
      expect(c.distanceDeg).toBeLessThanOrEqual(10);
      expect(c.vis2).toBeGreaterThanOrEqual(0.8);
      expect(c.observableHours).toBeGreaterThan(0);
      expect(c.reasons.join(" ")).toMatch(/estimate/);
    }
  });

  it("orders by the documented score, best first", () => {
    const req = request({ target: { raDeg: 88.79, decDeg: 7.41, bandMag: 6 }, limit: 100, maxMagDifference: 3 });
    const res = shortlistCalibrators(cat, req);
    if (!res.ok) throw new Error(res.message);
    const list = res.value.calibrators;
    expect(list.length).toBeGreaterThan(20);
    for (let i = 1; i < list.length; i++) expect(list[i].score).toBeLessThanOrEqual(list[i - 1].score);
    for (const c of list) expect(c.score).toBeCloseTo(documentedScore(c, res.value, req), 0);
  });

  it("flags variable stars and applies the magnitude rules", () => {
    const res = shortlist({ target: { name: "Sirius", bandMag: 2 }, limit: 500, maxDistanceDeg: 15 });
    expect(res.target.bandMagSource).toBe("request");
    const flagged = res.calibrators.filter((c) => c.reasons.some((r) => /variable/.test(r)));
    for (const c of flagged) {
      const row = cat.rowOfHip(c.hip);
      expect(cat.variability[row]).toBeGreaterThan(0);
    }
    const limited = shortlist({
      target: { name: "Sirius", bandMag: 2 },
      limit: 500,
      bandLimitMag: 6,
      maxMagDifference: 3,
    });
    for (const c of limited.calibrators) {
      expect(c.bandMag).not.toBeNull();
      expect(c.bandMag as number).toBeLessThanOrEqual(6);
      expect(Math.abs((c.bandMag as number) - 2)).toBeLessThanOrEqual(3);
    }
    expect(limited.excluded.magnitude).toBeGreaterThan(0);
  });

  it("returns nothing, with a warning, when the target never rises above the limit that night", () => {
    const res = shortlist({ target: { raDeg: 0, decDeg: 80 } });
    expect(res.calibrators).toEqual([]);
    expect(res.warnings.join(" ")).toMatch(/never above 30°/);
  });

  it("names an unknown target star in the field message", () => {
    const r = shortlistCalibrators(cat, request({ target: { name: "Betelgoosey" } }));
    expect(r).toMatchObject({ ok: false, field: "target.name", message: expect.stringMatching(/^no star called/) });
  });

  it("property: every listed star is within the radius, unresolved enough, and up together with the target", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 359.99, noNaN: true }),
        fc.double({ min: -80, max: 40, noNaN: true }),
        fc.double({ min: 2, max: 15, noNaN: true }),
        fc.constantFrom("2027-01-10", "2027-05-20", "2027-09-01"),
        (raDeg, decDeg, maxDistanceDeg, date) => {
          const req = request({ target: { raDeg, decDeg }, maxDistanceDeg, date, limit: 8, longestBaselineM: 300 });
          const res = shortlistCalibrators(cat, req);
          if (!res.ok) throw new Error(res.message);
          for (const c of res.value.calibrators) {
            expect(haversineDeg(raDeg, decDeg, c.raDeg, c.decDeg)).toBeLessThanOrEqual(maxDistanceDeg + 1e-3);
            expect(uniformDiskVis2(c.diameterMas, 300, 1.65e-6)).toBeGreaterThanOrEqual(0.8 - 1e-3);
            const h = hoursTogether(date, [raDeg, decDeg], [c.raDeg, c.decDeg], 30);
            expect(h).toBeGreaterThan(0);
            expect(Math.abs(h - c.observableHours)).toBeLessThanOrEqual(1 / 6 + 1e-9);
          }
        },
      ),
      { numRuns: 25, seed: 12 },
    );
  });

  it("property: the target is never its own calibrator, by name or by rounded coordinates", () => {
    const named = Array.from(cat.names.keys()).filter((row) => {
      const b = cat.bv[row];
      return b > 0 && b < 1.2 && cat.decRad[row] < 30 * DEG_TO_RAD;
    });
    fc.assert(
      fc.property(fc.constantFrom(...named), fc.double({ min: -20, max: 20, noNaN: true }), (row, offsetArcsec) => {
        const hip = cat.hip[row];
        const byName = shortlist({ target: { name: `HIP ${hip}` }, limit: 500, longestBaselineM: 20 });
        expect(byName.calibrators.map((c) => c.hip)).not.toContain(hip);
        const ra = (cat.raRad[row] * RAD_TO_DEG + offsetArcsec / 3600 + 360) % 360;
        const dec = cat.decRad[row] * RAD_TO_DEG + offsetArcsec / 3600;
        const byPosition = shortlist({ target: { raDeg: ra, decDeg: dec }, limit: 500, longestBaselineM: 20 });
        expect(byPosition.calibrators.map((c) => c.hip)).not.toContain(hip);
        expect(byPosition.target.hip).toBe(hip);
      }),
      { numRuns: 20, seed: 7 },
    );
  });
});
