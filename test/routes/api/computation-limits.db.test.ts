import { costliestTrianglesRequest } from "@test/compute-requests";
import { goodCoverageRequest as good } from "@test/coverage-request";
import { routeArgs, testDb } from "@test/routes";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { action as coverageAction } from "~/routes/api/coverage";
import { action as trianglesAction } from "~/routes/api/triangles";
import { loader as homeLoader } from "~/routes/home";
import { computePool, configureComputePool } from "~/services/api/pool.server";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createApiToken } from "~/services/auth/api-tokens.server";

// Two people with an API token each (a proposer and a reviewer of the demo scenario).
const bearer: Record<"ines" | "tomasz", string> = { ines: "", tomasz: "" };
beforeAll(async () => {
  await seedDemoScenario(testDb());
  for (const [who, email] of [
    ["ines", "ines.arroyo@valle-alto.example"],
    ["tomasz", "tomasz.wierzbicki@baltic-stellar.example"],
  ] as const) {
    const user = await findUserByEmail(testDb(), email);
    bearer[who] = `Bearer ${(await createApiToken(testDb(), user!.id, "tests")).token}`;
  }
});
afterAll(() => configureComputePool(null));

const post = (path: string, body: string, who: keyof typeof bearer = "ines") =>
  routeArgs(path, {
    method: "POST",
    body,
    headers: { "Content-Type": "application/json", Authorization: bearer[who] },
  });
const coverage = (body: unknown, who: keyof typeof bearer = "ines") =>
  coverageAction(post("/api/coverage", typeof body === "string" ? body : JSON.stringify(body), who));
const triangles = (who: keyof typeof bearer = "ines") =>
  trianglesAction(post("/api/triangles", JSON.stringify(costliestTrianglesRequest()), who));

async function until(condition: () => boolean, what: string) {
  const deadline = Date.now() + 20_000;
  while (!condition()) {
    if (Date.now() > deadline) throw new Error(`timed out waiting until ${what}`);
    await new Promise((r) => setTimeout(r, 5));
  }
}

describe("computation limits over HTTP", () => {
  it("answers a sum nested 1000 deep with 400 naming the model, not a 500", async () => {
    const nested = `${'{"type":"sum","components":[{"flux":1,"model":'.repeat(1000)}{"type":"point"}${"}]}".repeat(1000)}`;
    const text = JSON.stringify({ ...good(), target: { raDeg: 84.05, decDeg: -1.2, model: "MODEL" } }).replace(
      '"MODEL"',
      nested,
    );
    const res = await coverage(text);
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({
      error: "target.model: sums nested 1 000 deep (at most 4 levels of sums)",
      field: "target.model",
    });
  });

  it("answers the 2 500-component model with 400 naming the model", async () => {
    const sum = (models: unknown[]) => ({ type: "sum", components: models.map((model) => ({ model, flux: 1 })) });
    const model = sum(Array.from({ length: 50 }, () => sum(Array.from({ length: 50 }, () => ({ type: "point" })))));
    const res = await coverage({ ...good(), target: { raDeg: 84.05, decDeg: -1.2, model } });
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({
      error: "target.model: 2 500 components in all, counting those of nested sums (at most 50)",
      field: "target.model",
    });
  });

  it("answers a request over the cost budget with 422 naming the figure and the limit", async () => {
    const res = await coverage({
      ...good(),
      hourAnglesH: Array.from({ length: 20_000 }, (_, i) => -6 + (12 * i) / 20_000),
      wavelengthsM: Array.from({ length: 50 }, (_, i) => 1.5e-6 + i * 1e-8),
      beam: null,
    });
    expect(res.status).toBe(422);
    expect(await res.json()).toEqual({
      error:
        "hourAnglesH: the response would be about 95.8 MB (3 000 000 uv points and 1 000 000 closure phases from " +
        "20 000 samples) (limit 48 MB); use fewer samples, channels or stations",
      field: "hourAnglesH",
    });
  });
});

describe("the computation pool behind the routes", { timeout: 120_000 }, () => {
  it("answers 503 with Retry-After when every thread is busy and the queue is full", async () => {
    await configureComputePool({ threads: 1, queue: 1, perPerson: 4 });
    const busy = [triangles("ines"), triangles("tomasz")];
    await until(() => computePool().inFlight() === 2, "one computation runs and one waits");
    const res = await coverage(good(), "tomasz");
    expect(res.status).toBe(503);
    expect(Number(res.headers.get("Retry-After"))).toBeGreaterThanOrEqual(1);
    const body = await res.json();
    expect(body.error).toMatch(/^the server is busy: 1 computation running and 1 waiting/);
    for (const r of await Promise.all(busy)) expect(r.status).toBe(200);
    expect((await coverage(good(), "tomasz")).status).toBe(200);
  });

  it("answers 429 with Retry-After beyond a person's share, and serves another person meanwhile", async () => {
    await configureComputePool({ threads: 2, queue: 8, perPerson: 1 });
    const mine = triangles("ines");
    await until(() => computePool().inFlight() === 1, "Inés's computation has started");
    const again = await coverage(good(), "ines");
    expect(again.status).toBe(429);
    expect(Number(again.headers.get("Retry-After"))).toBeGreaterThanOrEqual(1);
    expect((await again.json()).error).toMatch(
      /^you already have 1 computation running or waiting \(at most 1 per person\); try again in \d+ s/,
    );
    const other = await coverage(good(), "tomasz");
    expect(other.status).toBe(200);
    expect(other.headers.get("Content-Type")).toBe("application/json; charset=utf-8");
    expect(Object.keys(await other.json())).toEqual(expect.arrayContaining(["samples", "baselines", "beam"]));
    expect((await mine).status).toBe(200);
  });

  it("answers a public page while the pool is busy: a long computation does not hold it up", async () => {
    await configureComputePool({ threads: 2, queue: 8, perPerson: 4 });
    const settled: string[] = [];
    const busy = [triangles("ines"), triangles("tomasz")].map((p) =>
      p.then((r) => {
        settled.push("computation");
        return r;
      }),
    );
    await until(() => computePool().inFlight() === 2, "both computations have started");
    const page = await homeLoader(routeArgs("/"));
    settled.push("page");
    expect(page.array?.name).toBe("Sierra Lumbre Array");
    // Computed on the event loop, both computations would have finished before the page's queries.
    expect(settled).toEqual(["page"]);
    for (const r of await Promise.all(busy)) expect(r.status).toBe(200);
  });
});
