import { goodCoverageRequest } from "@test/coverage-request";
import { demoStations } from "@test/demo-array";
import { describe, expect, it } from "vitest";
import { assessObservability, computeCoverage, parseCoverageRequest } from "~/engine";
import { blockKinds, primaryBlock, reasonLines } from "~/services/sketch/reasons";

/** The reasons the engine gives for a 190 m baseline over ±8 h with a 50 m delay-line stroke. */
function engineReasons() {
  const r = goodCoverageRequest();
  r.stations = demoStations("C01", "W1");
  r.hourAnglesH = Array.from({ length: 65 }, (_, i) => -8 + i * 0.25);
  r.delayLineStrokeM = 50;
  const parsed = parseCoverageRequest(r);
  if (!parsed.ok) throw new Error(parsed.message);
  return computeCoverage(parsed.value).samples;
}

describe("why a sample is not observable", () => {
  it("sorts the engine's own reasons into elevation and delay line", () => {
    const samples = engineReasons();
    const kinds = samples.map((s) => blockKinds(s.reason));
    // Every sample the engine calls unobservable names at least one rule; observable ones none.
    for (const [i, s] of samples.entries()) expect(kinds[i].length > 0).toBe(!s.observable);
    // Far from the meridian (8 h) the target is low; elevation comes first where both fail.
    expect(primaryBlock(samples[0].reason)).toBe("elevation");
    // Near the meridian the elevation is fine (δ = −1.2°, φ = −31.4°: 60° at transit) and only the
    // 50 m stroke can fail, on a 190 m baseline (|w| grows as cos δ sin H · B; common practice).
    const nearMeridian = samples.filter((s) => Math.abs(s.hourAngleH) <= 2 && !s.observable);
    expect(nearMeridian.length).toBeGreaterThan(0);
    for (const s of nearMeridian) expect(primaryBlock(s.reason)).toBe("delayLine");
  });

  it("recognises the Sun rule and keeps every failed rule for the hover", () => {
    // The engine's sentence for a sample in twilight (app/engine/interferometry/observability.ts).
    const out = assessObservability({
      elevationRad: new Float64Array([0.1]),
      minElevationRad: 0.5,
      sunAltitudeRad: new Float64Array([-0.1]),
      tracks: { nSamples: 1, nBaselines: 0, wM: new Float64Array(0) },
      baselines: { pathOffsetDiffM: new Float64Array(0), first: new Int32Array(0), second: new Int32Array(0) },
      stationNames: [],
      delayLineStrokeM: null,
    } as never);
    const reason = out.reasons[0];
    expect(blockKinds(reason)).toEqual(["elevation", "sun"]);
    expect(primaryBlock(reason)).toBe("elevation");
    expect(reasonLines(reason)).toMatch(/^Elevation 5\.7° below minimum 28\.6°<br>Sun at -5\.7°, above -18°$/);
    expect(blockKinds(null)).toEqual([]);
    expect(primaryBlock("something else")).toBe("other");
  });
});
