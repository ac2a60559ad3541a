import { deg, rad } from "@test/angles";
import { describe, expect, it } from "vitest";
import { moonIlluminatedFraction, moonPosition, precessFromJ2000, sunPosition } from "~/engine";

describe("Sun position", () => {
  it("matches Meeus example 25.a (1992 October 13.0 TD)", () => {
    const sun = sunPosition(2448908.5); // JDE of 1992 Oct 13.0 TD, Meeus ex. 25.a
    // Meeus ex. 25.a: apparent α = 198.38083° (13h13m31.4s), δ = −7.78507° (−7°47′06″), R = 0.99766 AU.
    expect(deg(sun.raRad)).toBeCloseTo(198.38083, 4);
    expect(deg(sun.decRad)).toBeCloseTo(-7.78507, 4);
    expect(sun.distanceAu).toBeCloseTo(0.99766, 5);
  });
});

describe("Moon", () => {
  it("matches Meeus example 47.a (1992 April 12.0 TD)", () => {
    const moon = moonPosition(2448724.5); // Meeus ex. 47.a
    // Meeus ex. 47.a: apparent λ = 133.167265°, β = −3.229126°, Δ = 368409.7 km,
    // α = 134.688470°, δ = +13.768368°.
    expect(deg(moon.eclipticLonRad)).toBeCloseTo(133.167265, 5);
    expect(deg(moon.eclipticLatRad)).toBeCloseTo(-3.229126, 5);
    expect(moon.distanceKm).toBeCloseTo(368409.7, 0);
    expect(deg(moon.raRad)).toBeCloseTo(134.68847, 5);
    expect(deg(moon.decRad)).toBeCloseTo(13.768368, 5);
  });

  it("illuminated fraction matches Meeus example 48.a (k = 0.6786)", () => {
    expect(moonIlluminatedFraction(2448724.5)).toBeCloseTo(0.6786, 3); // Meeus ex. 48.a
  });

  it("is near 0 at a new moon and near 1 at a full moon", () => {
    // New moon 2000-01-06 18:14 UT and full moon 2000-01-21 04:40 UT (from memory; any
    // almanac). 0.5 days from either instant the fraction is still within 0.02 of 0 / 1.
    expect(moonIlluminatedFraction(2451550.26)).toBeLessThan(0.01);
    expect(moonIlluminatedFraction(2451564.69)).toBeGreaterThan(0.99);
  });
});

describe("precession J2000 → date", () => {
  it("matches Meeus example 21.b (θ Persei to 2028 November 13.19 TD)", () => {
    // Meeus ex. 21.b: α0 = 2h44m11.986s, δ0 = +49°13′42.48″ (J2000), proper motion
    // +0.03425 s/yr in α and −0.0895″/yr in δ; result α = 2h46m11.331s, δ = +49°20′54.54″.
    const ra0 = rad((2 + 44 / 60 + 11.986 / 3600) * 15);
    const dec0 = rad(49 + 13 / 60 + 42.48 / 3600);
    const pmRa = rad((0.03425 * 15) / 3600);
    const pmDec = rad(-0.0895 / 3600);
    const out = precessFromJ2000(ra0, dec0, 2462088.69, pmRa, pmDec);
    const raSec = (deg(out.raRad) / 15) * 3600;
    const decArcsec = deg(out.decRad) * 3600;
    expect(raSec).toBeCloseTo(2 * 3600 + 46 * 60 + 11.331, 2); // 0.01 s of time
    expect(decArcsec).toBeCloseTo((49 * 60 + 20) * 60 + 54.54, 1); // 0.1″
  });
});
