import { describe, expect, it } from "vitest";
import {
  airmassRange,
  beamEllipse,
  cautions,
  dirtyImageHalfWidthMas,
  imageWindow,
  modelExtentMas,
  modelVis2Curves,
  summariseReasons,
} from "~/services/sketch/figures";

describe("model curves", () => {
  it("puts the first null of a uniform disk at 1.2197 λ/θ", () => {
    // Abramowitz & Stegun Table 9.5: first zero of J1 at 3.8317 → null at r = 3.8317/(π θ) = 1.2197/θ.
    const thetaRad = (2 / 3600 / 1000) * (Math.PI / 180); // 2 mas
    const nullMl = 1.2197 / thetaRad / 1e6;
    const [curve] = modelVis2Curves({ type: "uniformDisk", diameterMas: 2 }, nullMl * 2, undefined, 2001);
    const k = 1000; // r = nullMl exactly (2001 points over 0..2·nullMl)
    expect(curve.positionAngleDeg).toBeNull();
    expect(curve.vis2[0]).toBeCloseTo(1, 12);
    expect(curve.vis2[k]).toBeLessThan(1e-7);
    expect(curve.vis2[k - 100]).toBeGreaterThan(1e-4);
  });

  it("follows V² = exp(−2(πθr)²/(4 ln 2)) for a Gaussian", () => {
    // CONVENTIONS.md: V = exp(−(π θ r)²/(4 ln 2)).
    const thetaRad = (3 / 3600 / 1000) * (Math.PI / 180);
    const [curve] = modelVis2Curves({ type: "gaussian", fwhmMas: 3 }, 100, undefined, 101);
    const r = 50e6;
    expect(curve.vis2[50]).toBeCloseTo(Math.exp((-2 * (Math.PI * thetaRad * r) ** 2) / (4 * Math.LN2)), 10);
  });

  it("draws a binary along several position angles, with the deepest fringe minimum along its separation", () => {
    // V = (1 + f e^{−2πi b·s})/(1 + f): |V|² reaches ((1−f)/(1+f))² at b·s = ½, and stays 1 on the
    // baseline perpendicular to the separation (CONVENTIONS.md binary model).
    const sepRad = (4 / 3600 / 1000) * (Math.PI / 180);
    const rMin = 1 / (2 * sepRad) / 1e6; // Mλ along PA 90°
    const curves = modelVis2Curves(
      { type: "binary", separationMas: 4, positionAngleDeg: 90, fluxRatio: 0.5 },
      rMin * 2,
      [0, 90],
      401,
    );
    expect(curves.map((c) => c.positionAngleDeg)).toEqual([0, 90]);
    expect(curves[1].vis2[200]).toBeCloseTo((0.5 / 1.5) ** 2, 9);
    for (const v of curves[0].vis2) expect(v).toBeCloseTo(1, 9);
  });
});

describe("beam outline", () => {
  it("lays the major axis along the position angle, east of north", () => {
    // Position angles east of north (CONVENTIONS.md): PA 0° points north, PA 90° east.
    const north = beamEllipse(4, 2, 0);
    expect(Math.max(...north.north)).toBeCloseTo(2, 9);
    expect(Math.max(...north.east)).toBeCloseTo(1, 3);
    const east = beamEllipse(4, 2, 90);
    expect(Math.max(...east.east)).toBeCloseTo(2, 9);
    expect(Math.max(...east.north)).toBeCloseTo(1, 3);
  });

  it("traces an ellipse of the given half-widths at any angle", () => {
    // Every point satisfies (x'/a)² + (y'/b)² = 1 in the frame rotated to the major axis.
    const pa = (30 * Math.PI) / 180;
    const e = beamEllipse(6, 2, 30, 37);
    e.east.forEach((x, k) => {
      const y = e.north[k];
      const along = x * Math.sin(pa) + y * Math.cos(pa);
      const across = x * Math.cos(pa) - y * Math.sin(pa);
      expect((along / 3) ** 2 + (across / 1) ** 2).toBeCloseTo(1, 9);
    });
    expect(e.east[0]).toBeCloseTo(e.east[36], 12);
  });
});

describe("image window", () => {
  it("places rows toward north and columns toward east around the phase centre", () => {
    // docs/cli.md: gridSize² values row-major, rows toward north, columns toward east, centre (n/2, n/2).
    const n = 32;
    const img = new Array(n * n).fill(0);
    img[(n / 2) * n + n / 2] = 1;
    img[(n / 2 + 2) * n + (n / 2 - 3)] = 0.5;
    const w = imageWindow(img, n, 0.25, 2);
    const ix = w.x.indexOf(0);
    const iy = w.y.indexOf(0);
    expect(w.z[iy][ix]).toBe(1);
    expect(w.z[w.y.indexOf(0.5)][w.x.indexOf(-0.75)]).toBe(0.5);
    expect(w.x).toHaveLength(17); // at least 8 pixels each side
    expect(imageWindow(img, n, 0.25).x).toHaveLength(n);
  });
});

describe("samples", () => {
  // Reasons as docs/cli.md prints them.
  const samples = [
    {
      hourAngleH: -5,
      elevationDeg: 13.4,
      observable: false,
      airmass: 4.2,
      reason:
        "elevation 13.4° below minimum 30.0°; delay line out of range on 3 baselines (worst C02–W1 needs 231.6 m, stroke 90 m)",
    },
    {
      hourAngleH: -4,
      elevationDeg: 25,
      observable: false,
      airmass: 2.3,
      reason: "elevation 25.0° below minimum 30.0°",
    },
    {
      hourAngleH: 2,
      elevationDeg: 48.6,
      observable: false,
      airmass: 1.3321,
      reason: "delay line out of range on 3 baselines (worst C02–W1 needs 162.6 m, stroke 90 m)",
    },
    { hourAngleH: 3, elevationDeg: 40, observable: false, airmass: 1.5, reason: "Sun at -12.0°, above -18°" },
    { hourAngleH: -3, elevationDeg: 37.9, observable: true, airmass: 1.6251, reason: null },
    { hourAngleH: 0, elevationDeg: 60, observable: true, airmass: 1.1542, reason: null },
  ];

  it("summarises why samples are unobservable, by rule", () => {
    expect(summariseReasons(samples)).toEqual([
      "2 samples below 30.0° elevation",
      "1 sample with the Sun above −18°",
      "2 samples out of delay-line range (worst C02–W1 needs 231.6 m, stroke 90 m)",
    ]);
    expect(summariseReasons(samples.filter((s) => s.observable))).toEqual([]);
  });

  it("gives the air-mass range of the observable samples", () => {
    expect(airmassRange(samples)).toEqual({ min: 1.1542, max: 1.6251 });
    expect(airmassRange([])).toBeNull();
  });

  it("cautions near the Sun and at the edges of the dark hours, deferring to the observatory's rules", () => {
    const dusk = Date.parse("2027-03-16T00:14:25Z");
    const c = cautions({
      sunSeparationDeg: 20,
      hourAngleSampling: false,
      windows: [{ startMs: dusk - 5 * 60_000, endMs: dusk + 3.6e6 }],
      duskMs: dusk,
      dawnMs: null,
      stepMin: 10,
    });
    expect(c).toHaveLength(2);
    expect(c[0]).toMatch(/20° from the Sun/);
    for (const line of c) expect(line).toMatch(/observatory's operating rules/);
    expect(
      cautions({
        sunSeparationDeg: 120,
        hourAngleSampling: false,
        windows: [],
        duskMs: dusk,
        dawnMs: null,
        stepMin: 10,
      }),
    ).toEqual([]);
  });
});

describe("dirty image window", () => {
  it("reaches three times the model's extent and at least eight beam widths", () => {
    // Extents by definition: a disk's radius, a Gaussian's FWHM, a binary's separation; a sum's
    // farthest component is its offset √(3² + 4²) = 5 mas plus its own radius 1 mas (common practice).
    expect(modelExtentMas({ type: "point" })).toBe(0);
    expect(modelExtentMas({ type: "uniformDisk", diameterMas: 3 })).toBe(1.5);
    expect(modelExtentMas({ type: "gaussian", fwhmMas: 2 })).toBe(2);
    expect(modelExtentMas({ type: "binary", separationMas: 4, positionAngleDeg: 60, fluxRatio: 0.4 })).toBe(4);
    const sum = {
      type: "sum" as const,
      components: [
        { model: { type: "point" as const }, flux: 1, offsetEastMas: 0, offsetNorthMas: 0 },
        { model: { type: "ring" as const, diameterMas: 2 }, flux: 0.5, offsetEastMas: 3, offsetNorthMas: 4 },
      ],
    };
    expect(modelExtentMas(sum)).toBeCloseTo(6, 12);
    expect(dirtyImageHalfWidthMas(sum, 0.5)).toBeCloseTo(18, 12);
    expect(dirtyImageHalfWidthMas({ type: "point" }, 0.5)).toBe(4);
    expect(dirtyImageHalfWidthMas(sum, null)).toBe(Infinity);
  });
});
