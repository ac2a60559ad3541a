import { committeeCycle, person, registry, submitted } from "@test/committee-world";
import { createDatabase, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Database } from "~/db/client.server";
import { reviewAssignments, reviews } from "~/db/schema/committee";
import { cycles } from "~/db/schema/proposals";
import { saveReview } from "~/services/committee/reviews.server";

// Two connection pools of their own, as two app processes (or two browser tabs hitting two servers) would be.
let a: { db: Database; client: { end: () => Promise<void> } };
let b: { db: Database; client: { end: () => Promise<void> } };
let cycleId = 0;
const ids: Record<string, number> = {};

const fields = (commentToPi: string, score: number | null = 2) => ({
  score,
  commentToPi,
  commentToCommittee: "",
  confidence: "medium" as const,
});

/**
 * Reviewer `who` saves (or, with `submit`, sends) the review of their assignment through `db`, from
 * `baseVersion`; `by` names another reviewer posting on that assignment.
 */
function saveAs(
  who: "r1" | "r2",
  db: Database,
  baseVersion: number,
  reviewFields: ReturnType<typeof fields>,
  submit = false,
  by: "r1" | "r2" = who,
) {
  return saveReview(db, {
    assignmentId: ids[who],
    reviewerId: ids[`${by}user`],
    baseVersion,
    fields: reviewFields,
    submit,
  });
}

beforeAll(async () => {
  a = createDatabase(process.env.DATABASE_URL!, { max: 2 }) as never;
  b = createDatabase(process.env.DATABASE_URL!, { max: 2 }) as never;
  const w = await registry();
  const pi = await person("pi", { roles: ["proposer"] });
  const r1 = await person("r1");
  const r2 = await person("r2");
  const cycle = await committeeCycle("R-cycle", { members: [r1.id, r2.id], configIds: [w.configId["compact-3"]] });
  cycleId = cycle.id;
  const proposalId = await submitted(cycleId, {
    pi: pi.id,
    title: "Review me",
    hours: { [w.configId["compact-3"]]: 4 },
    bandId: w.bandH.id,
  });
  for (const [k, r] of [
    ["r1", r1],
    ["r2", r2],
  ] as const) {
    const [row] = await testDb()
      .insert(reviewAssignments)
      .values({ cycleId, proposalId, reviewerId: r.id })
      .returning();
    ids[k] = row.id;
    ids[`${k}user`] = r.id;
  }
});

afterAll(async () => {
  await a?.client.end();
  await b?.client.end();
});

describe("saving reviews", () => {
  it("two first saves of one review at the same moment from two connections: one kept, one refused with it", async () => {
    const [x, y] = await Promise.all([
      saveAs("r1", a.db, 0, fields("from tab A")),
      saveAs("r1", b.db, 0, fields("from tab B")),
    ]);
    const outcomes = [x, y];
    const kept = outcomes.filter((o) => o.ok);
    const refused = outcomes.filter((o) => !o.ok);
    expect(kept).toHaveLength(1);
    expect(refused).toHaveLength(1);
    const [stored] = await testDb().select().from(reviews).where(eq(reviews.assignmentId, ids.r1));
    expect(stored.version).toBe(1);
    // The refused save is told the newer text that was kept, not silently overwritten.
    const stale = refused[0] as Extract<(typeof outcomes)[number], { kind: "stale" }>;
    expect(stale.kind).toBe("stale");
    expect(stale.current.commentToPi).toBe(stored.commentToPi);
    expect(["from tab A", "from tab B"]).toContain(stored.commentToPi);
  });

  it("two saves from the same version: the later one is refused with the newer text; saving from it succeeds", async () => {
    const [x, y] = await Promise.all([
      saveAs("r1", a.db, 1, fields("second A")),
      saveAs("r1", b.db, 1, fields("second B")),
    ]);
    const kept = [x, y].filter((o) => o.ok);
    expect(kept).toHaveLength(1);
    const refused = [x, y].find((o) => !o.ok)!;
    expect(refused).toMatchObject({ ok: false, kind: "stale", current: { version: 2 } });
    const [stored] = await testDb().select().from(reviews).where(eq(reviews.assignmentId, ids.r1));
    expect(stored.version).toBe(2);
    expect(refused.ok === false && refused.kind === "stale" && refused.current.commentToPi).toBe(stored.commentToPi);
    // The reviewer merges and saves again from the version shown: accepted.
    const again = await saveAs("r1", a.db, 2, fields("merged text"));
    expect(again).toEqual({ ok: true, version: 3, submitted: false });
  });

  it("two reviewers saving their own reviews at the same moment both keep what they wrote", async () => {
    const [x, y] = await Promise.all([
      saveAs("r1", a.db, 3, fields("r1 text", 1)),
      saveAs("r2", b.db, 0, fields("r2 text", 4)),
    ]);
    expect([x.ok, y.ok]).toEqual([true, true]);
    const rows = await testDb().select().from(reviews);
    expect(rows.map((r) => r.commentToPi).sort()).toEqual(["r1 text", "r2 text"]);
  });

  it("refuses another reviewer's assignment, a score off the scale, and any change after submission", async () => {
    expect(await saveAs("r1", testDb(), 4, fields("x"), false, "r2")).toEqual({
      ok: false,
      kind: "refused",
      message: "Not your assignment.",
    });
    expect(await saveAs("r1", testDb(), 4, fields("x", 9))).toMatchObject({
      ok: false,
      kind: "refused",
      message: "Score: not on the cycle's scale.",
    });
    const sent = await saveAs("r1", testDb(), 4, fields("final"), true);
    expect(sent).toEqual({ ok: true, version: 5, submitted: true });
    expect(await saveAs("r1", testDb(), 5, fields("later"))).toMatchObject({
      ok: false,
      kind: "refused",
      message: /submitted/,
    });
  });

  it("refuses scoring after the review deadline until the chair reopens, and in the deciding state", async () => {
    const past = new Date(Date.now() - 60_000);
    await testDb().update(cycles).set({ reviewDeadline: past }).where(eq(cycles.id, cycleId));
    const late = await saveAs("r2", testDb(), 1, fields("late"));
    expect(late).toEqual({
      ok: false,
      kind: "refused",
      message: "The review deadline has passed; the chair may reopen scoring.",
    });
    await testDb()
      .update(cycles)
      .set({ reviewDeadline: new Date(Date.now() + 86_400_000), state: "deciding" })
      .where(eq(cycles.id, cycleId));
    expect(await saveAs("r2", testDb(), 1, fields("x"))).toMatchObject({ ok: false, message: /review is closed/ });
    await testDb().update(cycles).set({ state: "reviewing" }).where(eq(cycles.id, cycleId));
    expect(await saveAs("r2", testDb(), 1, fields("reopened"))).toEqual({ ok: true, version: 2, submitted: false });
  });
});
