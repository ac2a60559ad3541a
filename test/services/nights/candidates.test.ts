import { nightSettings } from "@test/nights";
import { describe, expect, it } from "vitest";
import { validatePlan } from "~/engine";
import {
  candidateWindows,
  makeCandidates,
  type ProgramTarget,
  planContext,
  planRequest,
} from "~/services/nights/candidates";
import { KIND_COLOURS, timelineFigure } from "~/services/nights/timeline";
import { fixtureTargets } from "./fixture";

const NIGHT = "2025-05-20";
const t = fixtureTargets(NIGHT);
const row = (over: Partial<ProgramTarget>): ProgramTarget => ({
  proposalId: 1,
  proposalTitle: "P",
  piName: "A",
  rank: 1,
  proposalTargetId: 1,
  name: "X",
  raDeg: 0,
  decDeg: -30,
  minElevationDeg: null,
  calibrators: [],
  grantedHours: 2,
  executedHours: 0.5,
  ...over,
});

const setting = {
  site: { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 },
  date: NIGHT,
  stations: [
    { name: "C01", eastM: -16, northM: -27.713, upM: 0, pathOffsetM: 0 },
    { name: "X01", eastM: 32.161, northM: 105.193, upM: 1.2, pathOffsetM: 14.5 },
  ],
  delayLineStrokeM: 90,
  settings: nightSettings(),
};

describe("candidates", () => {
  it("makes request names distinct across programs and keeps only usable calibrators", () => {
    const c = makeCandidates([
      row({ proposalTargetId: 1, name: "Vela 3", calibrators: [{ name: "K", raDeg: 10, decDeg: -30 }] }),
      row({
        proposalId: 2,
        proposalTargetId: 2,
        name: "Vela 3",
        calibrators: [
          { name: "K", raDeg: 10, decDeg: -30 },
          { name: "K", raDeg: 11, decDeg: -30 },
          { name: "Vela 3 [P2-2]", raDeg: 12, decDeg: -30 },
          { name: "Far", raDeg: 400, decDeg: -30 },
          { name: "L", raDeg: 12, decDeg: -31 },
        ],
      }),
    ]);
    expect(c.map((x) => x.key)).toEqual(["Vela 3 [P1-1]", "Vela 3 [P2-2]"]);
    expect(c[1].calibrators.map((k) => k.name)).toEqual(["K", "L"]);
    expect(c[0].owedHours).toBe(1.5);
  });

  it("gives windows the validator agrees with: a science block inside a window breaks no sky rule", () => {
    const candidates = makeCandidates(
      [...t.first, ...t.second].map((x, i) =>
        row({ ...x, proposalTargetId: i + 1, name: x.name, calibrators: x.calibrators }),
      ),
    );
    const input = planRequest(setting, candidates);
    const ctx = planContext(input);
    const windows = candidateWindows(ctx);
    expect(windows).toHaveLength(4);
    const sky = new Set(["darkness", "elevation", "delayLine", "moon", "sun"]);
    for (const w of windows) {
      expect(w.runs.length).toBeGreaterThan(0);
      for (const r of w.runs) {
        const start = Date.parse(r.startUtc);
        const end = Math.min(Date.parse(r.endUtc), start + 40 * 60_000);
        const block = {
          kind: "science" as const,
          target: w.key,
          object: w.key,
          startUtc: r.startUtc,
          endUtc: new Date(end).toISOString().replace(".000Z", "Z"),
        };
        const check = validatePlan(input, [block], { context: ctx });
        expect(check.blocks[0].violations.filter((v) => sky.has(v.rule))).toEqual([]);
        // Ten minutes before a window that opens after dusk, some sky rule fails.
        if (start > ctx.sky.darkStartSec! * 1000 + 15 * 60_000) {
          const early = { ...block, startUtc: new Date(start - 10 * 60_000).toISOString().replace(".000Z", "Z") };
          const bad = validatePlan(input, [early], { context: ctx });
          expect(bad.blocks[0].violations.some((v) => sky.has(v.rule))).toBe(true);
        }
      }
    }
  });

  it("says why a target has no window", () => {
    const low = makeCandidates([row({ name: "North star", raDeg: 200, decDeg: 70, calibrators: [] })]);
    const [w] = candidateWindows(planContext(planRequest(setting, low)));
    expect(w.runs).toEqual([]);
    expect(w.reason).toMatch(/^never above 30° in darkness \(highest -?\d/);
  });
});

describe("the timeline figure", () => {
  const blocks = [
    {
      id: 1,
      position: 1,
      kind: "calibrator" as const,
      target: "A",
      object: "K",
      startUtc: "2025-05-21T00:00:00Z",
      endUtc: "2025-05-21T00:15:00Z",
      outcome: "executed" as const,
      violations: [],
    },
    {
      id: 2,
      position: 2,
      kind: "science" as const,
      target: "A",
      object: "A",
      startUtc: "2025-05-21T00:15:00Z",
      endUtc: "2025-05-21T00:55:00Z",
      outcome: "planned" as const,
      violations: [{ reason: "below" }],
    },
    {
      id: 3,
      position: 3,
      kind: "calibrator" as const,
      target: "B",
      object: "L",
      startUtc: "2025-05-21T01:00:00Z",
      endUtc: "2025-05-21T01:15:00Z",
      outcome: "weather" as const,
      violations: [],
    },
  ];
  const sky = {
    sunsetUtc: "2025-05-20T22:00:00Z",
    civilDuskUtc: "2025-05-20T22:25:00Z",
    nauticalDuskUtc: "2025-05-20T22:55:00Z",
    astronomicalDuskUtc: "2025-05-20T23:25:00Z",
    astronomicalDawnUtc: "2025-05-21T09:50:00Z",
    nauticalDawnUtc: "2025-05-21T10:20:00Z",
    civilDawnUtc: "2025-05-21T10:50:00Z",
    sunriseUtc: "2025-05-21T11:15:00Z",
  };
  it("draws a row per target, a bar per block by kind, twilight and the Moon", () => {
    const f = timelineFigure(blocks, sky, { utc: ["2025-05-21T00:00:00Z"], altitudeDeg: [20] });
    expect(f.rows).toEqual(["A", "B"]);
    const bars = f.data.filter((d) => d.type === "bar");
    expect(bars.map((b) => b.name)).toEqual(["Science", "Executed", "Lost (weather or technical)"]);
    const science = bars[0] as { x: number[]; base: string[]; marker: { color: string; line: { width: number[] } } };
    expect(science.x).toEqual([40 * 60_000]);
    expect(science.base).toEqual(["2025-05-21T00:15:00Z"]);
    expect(science.marker.color).toBe(KIND_COLOURS.science);
    expect(science.marker.line.width).toEqual([3]);
    expect(f.data.find((d) => d.yaxis === "y2")?.name).toBe("Moon altitude (°)");
    expect(f.layout.shapes).toHaveLength(6);
    expect(f.layout.xaxis.title.text).toBe("Time (UTC)");
  });
});
