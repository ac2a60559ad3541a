/**
 * The editor's checks of what is typed: time windows inside the cycle's observing period, a target of
 * my own copied only once, a refused co-investigator address kept as typed.
 */
import { testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { proposalMembers, proposalTargets, targets } from "~/db/schema/proposals";
import { loader as editorLoader } from "~/routes/proposals/editor/route";
import { action as targetAction } from "~/routes/proposals/target";
import * as fx from "./fixture";

fx.useProposalWorld();

/** A point target with one time window (UTC `datetime-local` values). */
const withWindow = (name: string, start: string, end: string) => ({
  name,
  ra: "12:00:00",
  dec: "-30:00:00",
  model: "point",
  windowStart: [start],
  windowEnd: [end],
  windowNote: [""],
});

describe("checks of the proposal editor", () => {
  it("refuses a time window outside the cycle's observing period, naming the period in UTC", async () => {
    const id = await fx.newDraft("ines", "Windows");
    // T-open observes the nights 2027-03-01 to 2027-08-31: 2027-03-01 12:00 UTC to 2027-09-01 18:00 UTC.
    const period = "the T-open observing period, 2027-03-01 12:00 UTC to 2027-09-01 18:00 UTC.";
    const before = await fx.addTarget(id, "ines", withWindow("Early", "2027-02-20T00:00", "2027-02-22T00:00"));
    expect(before.status).toBe(400);
    expect(before.data.errors["window-0"]).toBe(`Time window 1: must lie inside ${period}`);
    expect(before.data.windows).toEqual([{ start: "2027-02-20T00:00", end: "2027-02-22T00:00", note: "" }]);
    expect(before.data.values.name).toBe("Early");
    // Partly outside is outside too.
    const straddles = await fx.addTarget(id, "ines", withWindow("Late", "2027-08-31T20:00", "2027-09-02T06:00"));
    expect(straddles.status).toBe(400);
    expect(straddles.data.errors["window-0"]).toBe(`Time window 1: must lie inside ${period}`);
    expect(await testDb().select().from(proposalTargets).where(eq(proposalTargets.proposalId, id))).toEqual([]);

    // The period's own edges are inside.
    const edges = await fx.addTarget(id, "ines", withWindow("Edges", "2027-03-01T12:00", "2027-09-01T18:00"));
    expect(edges.status).toBe(302);
    const [saved] = await testDb().select().from(proposalTargets).where(eq(proposalTargets.proposalId, id));
    expect(saved.timeWindows).toEqual([{ startUtc: "2027-03-01T12:00:00Z", endUtc: "2027-09-01T18:00:00Z" }]);

    // An edit that moves the window out is refused as well, and the stored window stays.
    const params = { proposalId: String(id), targetId: String(saved.id) };
    const moved = withWindow("Edges", "2027-03-01T12:00", "2027-09-03T00:00");
    const edit = await fx.run(() =>
      targetAction(fx.post(`/proposals/${id}/targets/${saved.id}`, "ines", moved, params)),
    );
    expect(edit.status).toBe(400);
    expect(edit.data.errors["window-0"]).toBe(`Time window 1: must lie inside ${period}`);
    const [kept] = await testDb().select().from(proposalTargets).where(eq(proposalTargets.id, saved.id));
    expect(kept.timeWindows).toEqual(saved.timeWindows);
  });

  it("marks my targets already on the proposal and refuses to copy one twice", async () => {
    const db = testDb();
    const id = await fx.newDraft("ines", "Copy once");
    const [kite, lamp] = await db
      .insert(targets)
      .values([
        { ownerId: fx.userId.ines, name: "Copy Kite 5", raDeg: 164.1, decDeg: -45.6, model: { type: "point" } },
        { ownerId: fx.userId.ines, name: "Copy Lamp 6", raDeg: 150.2, decDeg: -40.1, model: { type: "point" } },
      ])
      .returning();
    const mine = async () => {
      const page = await fx.run(() => editorLoader(fx.get(`/proposals/${id}`, "ines", { proposalId: String(id) })));
      return (page.data.targets.myTargets as { id: number; added: boolean }[]).filter((t) =>
        [kite.id, lamp.id].includes(t.id),
      );
    };
    expect(await mine()).toEqual([
      { id: kite.id, name: "Copy Kite 5", added: false },
      { id: lamp.id, name: "Copy Lamp 6", added: false },
    ]);
    expect((await fx.editor(id, "ines", { intent: "add-my-target", myTargetId: String(kite.id) })).status).toBe(302);
    // A target typed in under the same name counts as added too.
    expect(
      (await fx.addTarget(id, "ines", { name: "copy lamp 6", ra: "10:00:00", dec: "-40", model: "point" })).status,
    ).toBe(302);
    expect(await mine()).toEqual([
      { id: kite.id, name: "Copy Kite 5", added: true },
      { id: lamp.id, name: "Copy Lamp 6", added: true },
    ]);
    const again = await fx.editor(id, "ines", { intent: "add-my-target", myTargetId: String(kite.id) });
    expect(again.status).toBe(400);
    expect(again.data.errors.myTargetId).toBe("From my targets: Copy Kite 5 is already on the proposal.");
    expect(await db.select().from(proposalTargets).where(eq(proposalTargets.proposalId, id))).toHaveLength(2);
  });

  it("keeps a refused co-investigator address as typed and adds a good one", async () => {
    const id = await fx.newDraft("ines", "Team form");
    const bad = await fx.editor(id, "ines", { intent: "add-member", email: "not-an-address" });
    expect(bad.status).toBe(400);
    expect(bad.data.values.email).toBe("not-an-address");
    expect(bad.data.errors.email).toBe("Co-investigator e-mail: not an e-mail address.");
    const own = await fx.editor(id, "ines", { intent: "add-member", email: fx.people.ines });
    expect(own.status).toBe(400);
    expect(own.data.values.email).toBe(fx.people.ines);
    expect((await fx.editor(id, "ines", { intent: "add-member", email: fx.people.amara })).status).toBe(302);
    const team = await testDb().select().from(proposalMembers).where(eq(proposalMembers.proposalId, id));
    expect(team.map((m) => m.email)).toEqual([fx.people.amara]);
  });
});
