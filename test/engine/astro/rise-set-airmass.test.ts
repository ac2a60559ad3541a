import { rad } from "@test/angles";
import { describe, expect, it } from "vitest";
import { airmassKastenYoung, airmassSecZ, riseTransitSetCore, starWindow } from "~/engine";

describe("rising, transit and setting (Meeus ch. 15)", () => {
  it("reproduces Meeus example 15.a: Venus at Boston, 1988 March 20", () => {
    // Inputs of Meeus ex. 15.a: L = +71.0833° (west), φ = +42.3333°, Θ0 = 177.74208°,
    // ΔT = 56 s, h0 = −0.5667°, α/δ of Venus at 0h TD on March 19, 20, 21.
    const r = riseTransitSetCore({
      latRad: rad(42.3333),
      lonEastRad: rad(-71.0833),
      h0Rad: rad(-0.5667),
      theta0Rad: rad(177.74208),
      deltaTSec: 56,
      ra3Rad: [rad(40.68021), rad(41.73129), rad(42.78204)],
      dec3Rad: [rad(18.04761), rad(18.44092), rad(18.82742)],
    });
    expect(r.kind).toBe("normal");
    if (r.kind !== "normal") return;
    // Meeus ex. 15.a results: transit m0 = 0.81980 (19h40m UT), rise m1 = 0.51766 (12h25m),
    // set m2 = 0.12130 (2h55m); quoted to 1e-5 day.
    expect(r.transitDayFraction).toBeCloseTo(0.8198, 4);
    expect(r.riseDayFraction).toBeCloseTo(0.51766, 4);
    expect(r.setDayFraction).toBeCloseTo(0.1213, 4);
  });

  it("reports circumpolar and never-rising cases", () => {
    const base = {
      latRad: rad(-31.4),
      lonEastRad: rad(-68.9),
      h0Rad: rad(30),
      theta0Rad: 0,
      deltaTSec: 69,
    } as const;
    const south = riseTransitSetCore({ ...base, ra3Rad: [1, 1, 1], dec3Rad: [rad(-89.5), rad(-89.5), rad(-89.5)] });
    // Lower culmination |φ| − (90° − |δ|) = 31.4° − 0.5° = 30.9° > 30°: always above.
    expect(south.kind).toBe("alwaysAbove");
    const near = riseTransitSetCore({ ...base, ra3Rad: [1, 1, 1], dec3Rad: [rad(-85), rad(-85), rad(-85)] });
    expect(near.kind).toBe("normal"); // lower culmination 26.4° < 30°
    const north = riseTransitSetCore({ ...base, ra3Rad: [1, 1, 1], dec3Rad: [rad(40), rad(40), rad(40)] });
    expect(north.kind).toBe("neverAbove"); // culminates at 90° − 71.4° = 18.6° < 30°
  });

  it("star window: the target sits exactly at the limit at rise and set", () => {
    const lat = rad(-31.4);
    const lonEast = rad(-68.9);
    const ra = rad(84.05);
    const dec = rad(-1.2);
    const nearJd = 2461481.19; // 2027-03-16 around 04:34 UT
    const w = starWindow(ra, dec, lat, lonEast, rad(30), nearJd);
    expect(w.riseJd).not.toBeNull();
    // Independent GMST (Meeus 12.4, IAU 1982) and elevation formula written out here.
    const gmstDeg = (jd: number) => {
      const t = (jd - 2451545) / 36525;
      return 280.46061837 + 360.98564736629 * (jd - 2451545) + 0.000387933 * t * t - (t * t * t) / 38710000;
    };
    const elevDeg = (jd: number) => {
      const h = rad(gmstDeg(jd)) + lonEast - ra;
      return (Math.asin(Math.sin(lat) * Math.sin(dec) + Math.cos(lat) * Math.cos(dec) * Math.cos(h)) * 180) / Math.PI;
    };
    expect(elevDeg(w.riseJd as number)).toBeCloseTo(30, 3);
    expect(elevDeg(w.setJd as number)).toBeCloseTo(30, 3);
    expect(elevDeg(w.transitJd)).toBeCloseTo(90 - Math.abs(-31.4 - -1.2), 3); // culmination 90° − |φ − δ|
    expect(Math.abs(w.transitJd - nearJd)).toBeLessThanOrEqual(0.5);
  });
});

describe("air mass", () => {
  it("is close to sec z at moderate elevation", () => {
    // sec z = 1/sin(60°) = 1.1547 (plane-parallel atmosphere: common practice).
    expect(airmassSecZ(60)).toBeCloseTo(1 / Math.sin(rad(60)), 12);
    expect(Math.abs(airmassKastenYoung(60) / (1 / Math.sin(rad(60))) - 1)).toBeLessThan(1e-3);
  });

  it("is about 38 at the horizon (Kasten & Young 1989)", () => {
    // Kasten & Young (1989), Appl. Opt. 28, 4735: tabulated air mass 38.0868 at zenith
    // angle 90° (value from memory); their fitted formula gives 37.92 there.
    expect(airmassKastenYoung(0)).toBeCloseTo(37.92, 1);
    expect(Math.abs(airmassKastenYoung(0) - 38.0868)).toBeLessThan(0.2);
  });

  it("is infinite below the horizon and 1 at the zenith", () => {
    expect(airmassKastenYoung(-1)).toBe(Number.POSITIVE_INFINITY);
    expect(airmassKastenYoung(90)).toBeCloseTo(1, 3); // common practice: X(zenith) = 1
  });
});
