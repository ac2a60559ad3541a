import { describe, expect, it } from "vitest";
import { closureTrack, mirrored, sampleSpacingH, uvTrack, vis2Track } from "~/services/sketch/tracks";

// Five samples every 0.5 h with the one at 0 h missing (not observable): two pieces per channel.
const points = [
  { hourAngleH: -1, uM: 16, vM: 0, vis2: [0.9, 0.95] },
  { hourAngleH: -0.5, uM: 12, vM: -5, vis2: [0.8, 0.85] },
  { hourAngleH: 0.5, uM: 8, vM: -6, vis2: [0.7, 0.75] },
  { hourAngleH: 1, uM: 4, vM: -7, vis2: [0.6, 0.65] },
];
const LAMBDA = [1.6e-6, 2e-6];

describe("sampled tracks", () => {
  it("finds the usual spacing and breaks the line where a sample is missing", () => {
    expect(sampleSpacingH(points)).toBeCloseTo(0.5, 12);
    const t = uvTrack(points, "m", LAMBDA);
    // Metres: one vertex per sample (the projected baseline does not depend on λ), a null at the gap.
    expect(t.x).toEqual([16, 12, null, 8, 4]);
    expect(t.y).toEqual([0, -5, null, -6, -7]);
    expect(t.custom[3]?.[0]).toBe(0.5);
    expect(t.lone.x).toEqual([]);
  });

  it("gives one line per channel in Mλ, u/λ and v/λ in millions, and the Hermitian twin", () => {
    // u/λ: 16 m at 1.6 µm = 10⁷ wavelengths = 10 Mλ (common practice). V(−u,−v) = V*(u,v) for a
    // real sky (Thompson, Moran & Swenson 2017, §3.1), so (−u, −v) is sampled as well.
    const t = uvTrack(points, "mlambda", LAMBDA);
    expect(t.x).toHaveLength(2 * 2 * 2 + 3); // 2 channels × 2 pieces of 2 samples, a null between pieces
    expect(t.x[0]).toBeCloseTo(10, 12);
    expect(t.x[1]).toBeCloseTo(7.5, 12);
    expect(t.custom[0]?.[0]).toBe(-1);
    expect(t.custom[0]?.[1]).toBeCloseTo(1.6, 12);
    const second = t.x.indexOf(null, t.x.indexOf(null) + 1) + 1; // first vertex of channel 2
    expect(t.x[second]).toBeCloseTo(8, 12);
    expect(t.custom[second]?.[1]).toBeCloseTo(2, 12);
    const twin = mirrored(t);
    expect(twin.x[0]).toBeCloseTo(-10, 12);
    expect(twin.y[1]).toBeCloseTo(2.5 / 0.8, 12);
    expect(twin.x[2]).toBeNull();
  });

  it("puts a sample with no neighbour apart, as a point", () => {
    const alone = [points[0], points[2]]; // 1.5 h apart, spacing 1.5 h: together; add a far one
    const t = uvTrack([...alone, { hourAngleH: 3, uM: 1, vM: 1, vis2: [1, 1] }], "m", LAMBDA);
    // spacing 1.5 h; 0.5 → 3 is 2.5 h > 1.5 × 1.5 h: the last sample stands alone.
    expect(t.x).toEqual([16, 8]);
    expect(t.lone.x).toEqual([1]);
  });

  it("draws V² of each sample across the band's channels at √(u² + v²)/λ", () => {
    // |(12, −5)| = 13 m; 13 m / 2 µm = 6.5 Mλ (common practice).
    const t = vis2Track(points, LAMBDA);
    expect(t.x).toHaveLength(4 * 2 + 3);
    expect(t.x[3]).toBeCloseTo(8.125, 12);
    expect(t.x[4]).toBeCloseTo(6.5, 12);
    expect(t.y.slice(3, 5)).toEqual([0.8, 0.85]);
    expect(t.x[2]).toBeNull();
    const one = vis2Track(points, [2e-6]);
    expect(one.x).toEqual([]);
    expect(one.lone.x[1]).toBeCloseTo(6.5, 12);
  });

  it("breaks a closure-phase line at a wrap across ±180°", () => {
    const cp = [
      { hourAngleH: 0, closurePhaseDeg: [170] },
      { hourAngleH: 0.1, closurePhaseDeg: [178] },
      { hourAngleH: 0.2, closurePhaseDeg: [-175] },
      { hourAngleH: 0.3, closurePhaseDeg: [-168] },
    ];
    const t = closureTrack(cp, 0, 1.65e-6);
    expect(t.y).toEqual([170, 178, null, -175, -168]);
    expect(t.custom[0]?.[0]).toBe(0);
    expect(t.custom[0]?.[1]).toBeCloseTo(1.65, 12);
  });
});
