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
import { screenshot, signInAs, useBrowser, watchPage } from "./browser";

const baseUrl = inject("baseUrl");
const browser = useBrowser();
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
    // Three of the costliest accepted triangle requests: every thread busy, one waiting.
    const busy = Array.from({ length: 3 }, () =>
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
    expect(await Promise.all(busy)).toEqual([200, 200, 200]);
  });
});

describe("the Sketchpad asks for nothing over the API's budget", () => {
  // The page bounds every request well under the API's cost budget (app/engine/api/budget.ts): at most
  // the instrument's telescopes, steps of 1–120 min or 2000 hour angles. Its largest request, 6
  // stations every minute through the longest night in the K band's 8 channels, is about 6 MB of
  // answer, an eighth of the 48 MB budget. A finer step from a shared link is refused beside its input.
  it("shows a time step it would not ask for beside the input, and computes once it is changed", async () => {
    for (const [width, name] of [
      [1366, "sketchpad-step-refused"],
      [360, "sketchpad-step-refused-narrow"],
    ] as const) {
      const context = await browser.newContext({ viewport: { width, height: 900 } });
      const page = await context.newPage();
      const seen = watchPage(page);
      await signInAs(page, "Inés Arroyo-Vidal");
      await page.goto(
        `${baseUrl}/sketchpad?config=extended-6&inst=Brasa&band=K&ra=11:00:00&dec=-36:00:00&date=2027-03-15&step=0.1`,
      );
      const message = page.getByText(/^Time step: must be from 1 to 120 min \(got 0\.1 min\)/);
      await message.waitFor({ timeout: 30_000 });
      await message.scrollIntoViewIfNeeded();
      await screenshot(page, name);
      await page.getByLabel(/^Time step/).selectOption("10");
      await page.getByText(/^Up to date/).waitFor({ timeout: 30_000 });
      expect(await message.count()).toBe(0);
      expect(seen.errors).toEqual([]);
      expect(seen.clientErrors).toEqual([]);
      await context.close();
    }
  });
});
