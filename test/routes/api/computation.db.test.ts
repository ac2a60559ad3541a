import { goodCoverageRequest as good } from "@test/coverage-request";
import { demoSite } from "@test/demo-array";
import { settle, testDb } from "@test/routes";
import { beforeAll, describe, expect, it } from "vitest";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { MAX_BODY_BYTES, readJsonBody } from "~/lib/json.server";
import { action as coverageAction, loader as coverageLoader } from "~/routes/api/coverage";
import { action as ephemerisAction } from "~/routes/api/ephemeris";
import { action as trianglesAction } from "~/routes/api/triangles";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createApiToken } from "~/services/auth/api-tokens.server";

// The computation APIs answer signed-in people and API tokens only; these tests use a proposer's token.
let bearer = "";
beforeAll(async () => {
  await seedDemoScenario(testDb());
  const user = await findUserByEmail(testDb(), "ines.arroyo@valle-alto.example");
  bearer = `Bearer ${(await createApiToken(testDb(), user!.id, "tests")).token}`;
});

describe("JSON resource routes", () => {
  const post = (body: string | Uint8Array<ArrayBuffer>, headers: Record<string, string> = {}) =>
    new Request("http://localhost/api/coverage", {
      method: "POST",
      body,
      headers: { "Content-Type": "application/json", Authorization: bearer, ...headers },
    });
  const args = (request: Request) => {
    if (!request.headers.has("Authorization")) request.headers.set("Authorization", bearer);
    return { request, params: {}, context: {} } as never;
  };

  it("answers 401 JSON without a session or token", async () => {
    const res = await settle(() =>
      coverageAction({
        request: new Request("http://localhost/api/coverage", { method: "POST", body: "{}" }),
        params: {},
        context: {},
      } as never),
    );
    expect(res.status).toBe(401);
    expect((await res.json()).error).toMatch(/API token/);
  });

  it("answers a good request with 200 and the contract fields", async () => {
    const res = await coverageAction(args(post(JSON.stringify(good()))));
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(Object.keys(body)).toEqual(expect.arrayContaining(["samples", "baselines", "closurePhases", "beam"]));
  });

  it("answers a validation failure with 400 {error, field}", async () => {
    const r = good();
    r.target.decDeg = 100;
    const res = await coverageAction(args(post(JSON.stringify(r))));
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({ error: "target.decDeg: must be between -90 and 90", field: "target.decDeg" });
  });

  it("answers bad JSON and an empty body with 400", async () => {
    const res = await coverageAction(args(post("{not json")));
    expect(res.status).toBe(400);
    const body = await res.json();
    expect(body.field).toBeNull();
    expect(body.error).toMatch(/^request body is not valid JSON/);
    const empty = await ephemerisAction(args(new Request("http://localhost/api/ephemeris", { method: "POST" })));
    expect(empty.status).toBe(400);
  });

  it("answers a body over 2 MB with 413, by header or while streaming", async () => {
    const big = new Uint8Array(MAX_BODY_BYTES + 10).fill(32);
    const res = await coverageAction(args(post(big)));
    expect(res.status).toBe(413);
    // A body sent without Content-Length (streamed) is cut off as well.
    const stream = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let i = 0; i < 3; i++) controller.enqueue(new Uint8Array(MAX_BODY_BYTES / 2).fill(32));
        controller.close();
      },
    });
    const streamed = new Request("http://localhost/api/coverage", {
      method: "POST",
      body: stream,
      duplex: "half",
    } as RequestInit);
    const read = await readJsonBody(streamed);
    expect(read.ok).toBe(false);
    if (!read.ok) expect(read.response.status).toBe(413);
  });

  it("answers other methods with 405", async () => {
    const res = await coverageLoader(args(new Request("http://localhost/api/coverage")));
    expect(res.status).toBe(405);
    expect(res.headers.get("Allow")).toBe("POST");
    const put = await trianglesAction(
      args(new Request("http://localhost/api/triangles", { method: "PUT", body: "{}" })),
    );
    expect(put.status).toBe(405);
  });

  it("serves the ephemeris and triangle computations", async () => {
    const eph = await ephemerisAction(
      args(
        new Request("http://localhost/api/ephemeris", {
          method: "POST",
          body: JSON.stringify({
            site: demoSite(),
            date: "2027-03-15",
          }),
        }),
      ),
    );
    expect(eph.status).toBe(200);
    expect(Object.keys(await eph.json())).toEqual(
      expect.arrayContaining(["sunsetUtc", "astronomicalDuskUtc", "astronomicalDawnUtc", "sunriseUtc", "lstAtDuskH"]),
    );
    const tri = await trianglesAction(
      args(new Request("http://localhost/api/triangles", { method: "POST", body: JSON.stringify(good()) })),
    );
    expect(tri.status).toBe(200);
    expect((await tri.json()).triangles).toHaveLength(1);
  });
});
