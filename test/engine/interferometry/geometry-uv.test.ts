import { rad } from "@test/angles";
import { rng } from "@test/random";
import { describe, expect, it } from "vitest";
import {
  baselineCount,
  baselineIndex,
  buildBaselines,
  computeUvwTracks,
  enuToEquatorial,
  projectBaseline,
  stationsToEquatorial,
} from "~/engine";

describe("ENU → equatorial XYZ", () => {
  it("sends local axes where the frame definition says", () => {
    // Thompson, Moran & Swenson (2017) §4.1: at the equator the zenith points to
    // (H = 0, δ = 0) = X and north to the pole = Z; at the pole the zenith is the pole.
    const eq = enuToEquatorial(0, 0, 1, 0);
    expect([eq.xM, eq.yM, eq.zM].map((x) => Number(x.toFixed(12)))).toEqual([1, 0, 0]);
    const north = enuToEquatorial(0, 1, 0, 0);
    expect([north.xM, north.yM, north.zM].map((x) => Number(x.toFixed(12)))).toEqual([0, 0, 1]);
    const pole = enuToEquatorial(0, 0, 1, rad(90));
    expect(pole.zM).toBeCloseTo(1, 12);
    // East is Y (toward H = −6 h) at any latitude.
    const east = enuToEquatorial(1, 0, 0, rad(-31.4));
    expect([east.xM, east.yM, east.zM]).toEqual([0, 1, 0]);
  });

  it("is a rotation: lengths are preserved", () => {
    const r = rng(7);
    for (let k = 0; k < 20; k++) {
      const [e, n, u] = [r() * 400 - 200, r() * 400 - 200, r() * 10 - 5];
      const p = enuToEquatorial(e, n, u, rad(-31.4));
      expect(Math.hypot(p.xM, p.yM, p.zM)).toBeCloseTo(Math.hypot(e, n, u), 10);
    }
  });
});

describe("baselines", () => {
  it("counts N(N−1)/2 and orders them (0,1), (0,2), …, (1,2), … with j minus i", () => {
    // N(N−1)/2 baselines: Monnier (2003), Rep. Prog. Phys. 66, 789.
    for (const n of [2, 3, 4, 6, 24]) expect(baselineCount(n)).toBe((n * (n - 1)) / 2);
    const stations = [
      { eastM: 0, northM: 0, upM: 0 },
      { eastM: 16, northM: 0, upM: 0 },
      { eastM: 8, northM: 13.86, upM: 0 },
      { eastM: -180, northM: 60, upM: 1.2 },
    ];
    const xyz = stationsToEquatorial(stations, rad(-31.4));
    const set = buildBaselines(xyz, [0, 5, 10, 40]);
    expect(Array.from(set.first)).toEqual([0, 0, 0, 1, 1, 2]);
    expect(Array.from(set.second)).toEqual([1, 2, 3, 2, 3, 3]);
    // Baseline 1 (C01→C05) is station 2 minus station 0: east component = Y = 8 m.
    expect(set.yM[1]).toBeCloseTo(8, 12);
    expect(set.pathOffsetDiffM[4]).toBe(35); // P3 − P1 = 40 − 5
    for (let i = 0; i < 4; i++)
      for (let j = i + 1; j < 4; j++) {
        const b = baselineIndex(4, i, j);
        expect([set.first[b], set.second[b]]).toEqual([i, j]);
      }
  });
});

describe("(u, v, w) — Thompson, Moran & Swenson eq. 4.1", () => {
  it("matches the rotation matrix of eq. 4.1 written out here", () => {
    const r = rng(42);
    for (let k = 0; k < 50; k++) {
      const X = r() * 400 - 200;
      const Y = r() * 400 - 200;
      const Z = r() * 400 - 200;
      const H = r() * 2 * Math.PI - Math.PI;
      const d = r() * Math.PI - Math.PI / 2;
      // TMS (2017) eq. 4.1:
      // [u]   [  sin H          cos H         0     ] [X]
      // [v] = [ −sin δ cos H    sin δ sin H   cos δ ] [Y]
      // [w]   [  cos δ cos H   −cos δ sin H   sin δ ] [Z]
      const M = [
        [Math.sin(H), Math.cos(H), 0],
        [-Math.sin(d) * Math.cos(H), Math.sin(d) * Math.sin(H), Math.cos(d)],
        [Math.cos(d) * Math.cos(H), -Math.cos(d) * Math.sin(H), Math.sin(d)],
      ];
      const expected = M.map((row) => row[0] * X + row[1] * Y + row[2] * Z);
      const got = projectBaseline(X, Y, Z, H, d);
      expect(got.uM).toBeCloseTo(expected[0], 9);
      expect(got.vM).toBeCloseTo(expected[1], 9);
      expect(got.wM).toBeCloseTo(expected[2], 9);
    }
  });

  it("w is the projection on the source direction and (u, v) are perpendicular to it", () => {
    // Source unit vector in (X, Y, Z): (cos δ cos H, −cos δ sin H, sin δ) — TMS §4.1.
    const H = rad(37);
    const d = rad(-23);
    const [X, Y, Z] = [120, -45, 33];
    const s = [Math.cos(d) * Math.cos(H), -Math.cos(d) * Math.sin(H), Math.sin(d)];
    const p = projectBaseline(X, Y, Z, H, d);
    expect(p.wM).toBeCloseTo(s[0] * X + s[1] * Y + s[2] * Z, 10);
    expect(p.uM ** 2 + p.vM ** 2 + p.wM ** 2).toBeCloseTo(X * X + Y * Y + Z * Z, 8);
  });

  it("traces the uv ellipse u² + ((v − Z cos δ)/sin δ)² = X² + Y² over a full track", () => {
    // TMS (2017) §4.2: ellipse centred on v = Z cos δ with semi-axes √(X²+Y²) and √(X²+Y²)|sin δ|.
    const stations = [
      { eastM: 0, northM: 0, upM: 0 },
      { eastM: 150, northM: -230, upM: 3 },
    ];
    const lat = rad(-31.4);
    const set = buildBaselines(stationsToEquatorial(stations, lat), [0, 0]);
    const dec = rad(-47);
    const ha = Float64Array.from({ length: 240 }, (_, i) => (i / 240) * 2 * Math.PI - Math.PI);
    const tr = computeUvwTracks(set, ha, dec);
    const X = set.xM[0];
    const Y = set.yM[0];
    const Z = set.zM[0];
    for (let s = 0; s < ha.length; s++) {
      const u = tr.uM[s];
      const v = tr.vM[s];
      const lhs = u * u + ((v - Z * Math.cos(dec)) / Math.sin(dec)) ** 2;
      expect(lhs).toBeCloseTo(X * X + Y * Y, 6);
    }
    // The track reaches both semi-axes.
    const maxU = Math.max(...tr.uM);
    expect(maxU).toBeCloseTo(Math.hypot(X, Y), 1);
  });
});
