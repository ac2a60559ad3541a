import { costliestTrianglesRequest, typicalCoverageRequest } from "@test/compute-requests";
import { goodCoverageRequest as good } from "@test/coverage-request";
import { demoSite } from "@test/demo-array";
import { afterAll, describe, expect, it } from "vitest";
import { computeCoverage, computeEphemeris, rankTriangles } from "~/engine";
import { COMPUTATIONS, type ComputationName, computeJson } from "~/services/api/computations";
import { ComputePool } from "~/services/api/pool.server";

const pool = new ComputePool({ threads: 1, queue: 1, perPerson: 2, niceIncrement: 0 });
afterAll(() => pool.close());

function validated(name: ComputationName, body: unknown) {
  const out = COMPUTATIONS[name].parse(body);
  if (!out.ok) throw new Error(out.message);
  return out.value;
}

const text = (bytes: Uint8Array) => new TextDecoder().decode(bytes);

describe("the computation pool", { timeout: 60_000 }, () => {
  it("answers byte for byte what the computation answers in this process", async () => {
    const cases: [ComputationName, unknown, (value: never) => unknown][] = [
      ["coverage", validated("coverage", typicalCoverageRequest()), computeCoverage],
      ["coverage", validated("coverage", { ...good(), beam: { gridSize: 64, includeImages: true } }), computeCoverage],
      ["triangles", validated("triangles", { ...good(), maxTriangles: 5 }), rankTriangles],
      ["ephemeris", validated("ephemeris", { site: demoSite(), date: "2027-03-15" }), computeEphemeris],
    ];
    for (const [name, value, compute] of cases) {
      const answer = await pool.run(name, value, 1);
      expect(answer.kind).toBe("done");
      if (answer.kind !== "done") continue;
      const inProcess = computeJson(name, value);
      expect(inProcess.ok).toBe(true);
      if (inProcess.ok) expect(Buffer.from(answer.json).equals(Buffer.from(inProcess.json))).toBe(true);
      // And the same text the engine's result gives through JSON.stringify, as the CLI prints it.
      expect(text(answer.json)).toBe(JSON.stringify(compute(value as never)));
    }
    expect(pool.inFlight()).toBe(0);
  });

  it("passes a computation's refusal (a RangeError) back as a refusal, not a fault", async () => {
    // Past the schema on purpose: the ephemeris refuses a date that does not exist.
    const answer = await pool.run("ephemeris", { site: demoSite(), date: "2027-02-30" }, 1);
    expect(answer).toEqual({ kind: "refused", message: "invalid date 2027-02-30" });
  });

  it("refuses with Retry-After once every thread is busy and the queue is full", async () => {
    const value = validated("triangles", costliestTrianglesRequest());
    // run() counts a computation before it first waits: the third call sees one running and one waiting.
    const running = pool.run("triangles", value, 1);
    const waiting = pool.run("triangles", value, 2);
    expect(pool.inFlight()).toBe(2);
    const refused = await pool.run("triangles", value, 3);
    expect(refused.kind).toBe("busy");
    if (refused.kind === "busy") {
      expect(refused.retryAfterS).toBeGreaterThanOrEqual(1);
      expect(refused.message).toMatch(
        /^the server is busy: 1 computation running and 1 waiting, the most it takes; try again in \d+ s$/,
      );
    }
    expect((await running).kind).toBe("done");
    expect((await waiting).kind).toBe("done");
    expect(pool.inFlight()).toBe(0);
  });

  it("refuses a person's computation beyond their share, and takes another person's", async () => {
    const wide = new ComputePool({ threads: 1, queue: 10, perPerson: 2, niceIncrement: 0 });
    try {
      const value = validated("coverage", good());
      const mine = [wide.run("coverage", value, 7), wide.run("coverage", value, 7)];
      expect(wide.inFlight(7)).toBe(2);
      const third = await wide.run("coverage", value, 7);
      expect(third.kind).toBe("too-many");
      if (third.kind === "too-many") {
        expect(third.message).toMatch(
          /^you already have 2 computations running or waiting \(at most 2 per person\); try again in \d+ s, once one has finished$/,
        );
        expect(third.retryAfterS).toBeGreaterThanOrEqual(1);
      }
      expect((await wide.run("coverage", value, 8)).kind).toBe("done");
      for (const a of await Promise.all(mine)) expect(a.kind).toBe("done");
      expect(wide.inFlight(7)).toBe(0);
      expect((await wide.run("coverage", value, 7)).kind).toBe("done");
    } finally {
      await wide.close();
    }
  });

  it("gives up a computation whose client went away, and keeps serving", async () => {
    const value = validated("triangles", costliestTrianglesRequest());
    const controller = new AbortController();
    const pending = pool.run("triangles", value, 1, controller.signal);
    setTimeout(() => controller.abort(), 50);
    expect(await pending).toEqual({ kind: "cancelled" });
    expect(pool.inFlight()).toBe(0);
    expect((await pool.run("coverage", validated("coverage", good()), 1)).kind).toBe("done");
  });
});
