/**
 * The computation pool in the production server (`npm start`'s server, built): the worker threads are
 * found and answer exactly what the engine computes in-process, and a public page answers while they
 * are busy.
 */
import { costliestTrianglesRequest, typicalCoverageRequest } from "@test/compute-requests";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { createDatabase } from "~/db/client.server";
import { ensureUser } from "~/db/seed/factories.server";
import { COMPUTATIONS, computeJson } from "~/services/api/computations";
import { createApiToken } from "~/services/auth/api-tokens.server";

const baseUrl = inject("baseUrl");
let token = "";

beforeAll(async () => {
  const { db, client } = createDatabase(inject("databaseUrl"), { max: 1 });
  const user = await ensureUser(db, { email: "pool-check@load-test.example", name: "Pool check", roles: ["proposer"] });
  token = (await createApiToken(db, user.id, "pool e2e")).token;
  await client.end();
});

const post = (path: string, body: unknown) =>
  fetch(`${baseUrl}${path}`, {
    method: "POST",
    headers: { "Content-Type": "application/json", Authorization: `Bearer ${token}` },
    body: JSON.stringify(body),
  });

describe("computations on the production server's worker threads", () => {
  it("answer byte for byte what the engine computes in this process", async () => {
    const res = await post("/api/coverage", typicalCoverageRequest());
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/json; charset=utf-8");
    const bytes = new Uint8Array(await res.arrayBuffer());
    const parsed = COMPUTATIONS.coverage.parse(typicalCoverageRequest());
    if (!parsed.ok) throw new Error(parsed.message);
    const local = computeJson("coverage", parsed.value);
    if (!local.ok) throw new Error(local.refusal);
    expect(Buffer.from(bytes).equals(Buffer.from(local.json))).toBe(true);
  });

  it("leave the pages answering while they run", async () => {
    const settled: string[] = [];
    // Four of the costliest accepted triangle requests: every thread busy, more waiting.
    const busy = Array.from({ length: 4 }, () =>
      post("/api/triangles", costliestTrianglesRequest()).then(async (res) => {
        settled.push("computation");
        await res.arrayBuffer();
        return res.status;
      }),
    );
    await new Promise((r) => setTimeout(r, 300));
    const page = await fetch(`${baseUrl}/`);
    settled.push("page");
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Sierra Lumbre Array");
    expect(settled).toEqual(["page"]);
    expect(await Promise.all(busy)).toEqual([200, 200, 200, 200]);
  });
});
