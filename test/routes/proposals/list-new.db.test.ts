/** Starting a proposal (the new page) and the list of my proposals. */
import { testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { proposals } from "~/db/schema/proposals";
import { loader as listLoader } from "~/routes/proposals/list";
import { action as newAction } from "~/routes/proposals/new";
import * as fx from "./fixture";

fx.useProposalWorld();

describe("starting a proposal", () => {
  it("creates a draft in an open cycle and lists it under My proposals", async () => {
    const id = await fx.newDraft("ines", "Limb darkening of Lumbre Nova 12");
    const row = await fx.proposalRow(id);
    expect(row).toMatchObject({
      status: "draft",
      piId: fx.userId.ines,
      cycleId: fx.world.openCycleId,
      title: "Limb darkening of Lumbre Nova 12",
    });
    const list = await fx.run(() => listLoader(fx.get("/proposals", "ines")));
    const mine = list.data.proposals.find((p: { id: number }) => p.id === id);
    expect(mine).toMatchObject({ role: "PI", statusLabel: "Draft", cycleName: "T-open" });
    expect(mine.countdown).toMatch(/days left/);
  });

  it("names the missing fields, keeps what was typed and writes nothing", async () => {
    const before = (await testDb().select().from(proposals)).length;
    const out = await fx.run(() =>
      newAction(fx.post("/proposals/new", "ines", { cycleId: String(fx.world.openCycleId), title: "   " }, {})),
    );
    expect(out.status).toBe(400);
    expect(out.data.errors.title).toMatch(/^Title:/);
    expect(out.data.values.cycleId).toBe(String(fx.world.openCycleId));
    const bad = await fx.run(() =>
      newAction(fx.post("/proposals/new", "ines", { cycleId: "abc", title: "x".repeat(201) }, {})),
    );
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.data.errors).sort()).toEqual(["cycleId", "title"]);
    expect((await testDb().select().from(proposals)).length).toBe(before);
  });

  it("refuses a cycle whose deadline has passed, naming the deadline", async () => {
    const out = await fx.run(() =>
      newAction(fx.post("/proposals/new", "ines", { cycleId: String(fx.world.closedCycleId), title: "Too late" }, {})),
    );
    expect(out.status).toBe(409);
    expect(out.data.errors.cycleId).toMatch(/T-closed deadline \(\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC\) has passed/);
    expect(await testDb().select().from(proposals).where(eq(proposals.title, "Too late"))).toEqual([]);
  });

  it("keeps other roles out (403) and anonymous visitors at the sign-in page", async () => {
    expect((await fx.run(() => listLoader(fx.get("/proposals", "mei")))).status).toBe(403);
    expect(
      (
        await fx.run(() =>
          newAction(fx.post("/proposals/new", "mei", { cycleId: String(fx.world.openCycleId), title: "x" }, {})),
        )
      ).status,
    ).toBe(403);
    const anon = await fx.run(() => listLoader(fx.get("/proposals", null)));
    expect(anon.status).toBe(302);
    expect(anon.location).toMatch(/^\/sign-in\?next=/);
  });
});
