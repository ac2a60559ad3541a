import type { CommitteeWorld, Who } from "@test/committee-world";
import { answer, committeeCycle, person, registry, submitted } from "@test/committee-world";
import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { and, eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { reviewAssignments, reviews } from "~/db/schema/committee";
import { proposals } from "~/db/schema/proposals";
import { action as conflictsAction, loader as conflictsLoader } from "~/routes/review/conflicts";
import { loader as deskLoader } from "~/routes/review/index";
import { action as proposalAction, loader as proposalLoader } from "~/routes/review/proposal";
import { loader as pdfLoader } from "~/routes/review/science-case";

const w = {} as CommitteeWorld & { pi: Who; outsider: Who; near: Who; P: number; Q: number; draft: number };

beforeAll(async () => {
  const r = await registry();
  w.chair = await person("Chair Person", { roles: ["chair"] });
  w.pi = await person("Pia Proposer", { roles: ["proposer"], institute: "Far Institute" });
  w.r1 = await person("Rita Reviewer", { institute: "One" });
  w.r2 = await person("Rolf Reviewer", { institute: "Two" });
  w.outsider = await person("Otto Outsider", { institute: "Three" });
  w.near = await person("Nia Neighbour", { institute: " far institute " });
  const cycle = await committeeCycle("Rev-cycle", {
    members: [w.r1.id, w.r2.id, w.near.id],
    configIds: [r.configId["compact-3"]],
  });
  w.cycleId = cycle.id;
  const hours = { [r.configId["compact-3"]]: 5 };
  w.P = await submitted(cycle.id, { pi: w.pi.id, title: "Proposal P", hours, bandId: r.bandH.id, pdf: true });
  w.Q = await submitted(cycle.id, { pi: w.pi.id, title: "Proposal Q", hours, bandId: r.bandH.id });
  const [d] = await testDb()
    .insert(proposals)
    .values({ cycleId: cycle.id, piId: w.pi.id, title: "A draft" })
    .returning();
  w.draft = d.id;
  // Rita and Rolf review P; Rita also Q; Nia was assigned P before her institute matched (a conflict now).
  for (const [pid, who] of [
    [w.P, w.r1],
    [w.P, w.r2],
    [w.Q, w.r1],
    [w.P, w.near],
  ] as const)
    await testDb().insert(reviewAssignments).values({ cycleId: cycle.id, proposalId: pid, reviewerId: who.id });
});

const get = (path: string, who: Who | null, params: Record<string, string>) =>
  routeArgs(path, { headers: who ? { Cookie: who.cookie } : {}, params });
const post = (path: string, who: Who, fields: Record<string, string>, params: Record<string, string>) =>
  routeArgs(path, { ...formPost(fields, { Cookie: who.cookie }), params });
const open = (id: number, who: Who | null) =>
  answer(() => proposalLoader(get(`/review/proposals/${id}`, who, { proposalId: String(id) })));
const save = (id: number, who: Who, fields: Record<string, string>) =>
  settle(() => proposalAction(post(`/review/proposals/${id}`, who, fields, { proposalId: String(id) })));
const review = (over: Record<string, string> = {}) => ({
  intent: "save",
  score: "2",
  commentToPi: "Sound case.",
  commentToCommittee: "Solid.",
  confidence: "medium",
  version: "0",
  ...over,
});

describe("the Review desk", () => {
  it("lists a reviewer's assignments with the due date and progress; not for proposers", async () => {
    const desk = (await deskLoader(get("/review", w.r1, {}))) as {
      seats: {
        cycle: { name: string; reviewDeadline: string };
        total: number;
        assignments: { title: string; progress: string }[];
      }[];
    };
    expect(desk.seats).toHaveLength(1);
    expect(desk.seats[0].cycle.reviewDeadline).toMatch(/ UTC$/);
    expect(desk.seats[0].assignments.map((a) => [a.title, a.progress])).toEqual([
      ["Proposal P", "not started"],
      ["Proposal Q", "not started"],
    ]);
    expect(((await deskLoader(get("/review", w.outsider, {}))) as { seats: unknown[] }).seats).toEqual([]);
    expect((await settle(() => deskLoader(get("/review", w.pi, {})))).status).toBe(403);
    expect((await settle(() => deskLoader(get("/review", null, {})))).status).toBe(302);
  });

  it("opens a proposal to its assigned reviewers and the chair only, never a draft", async () => {
    const asR1 = await open(w.P, w.r1);
    expect(asR1.status).toBe(200);
    const page = await asR1.json();
    expect(page.mode).toBe("reviewer");
    expect(page.frozen.title).toBe("Proposal P");
    expect(page.frozen.feasibility.cells.length).toBe(1);
    expect(page.frozen.targets[0].links?.[0].href).toMatch(/^\/sketchpad\?.*config=compact-3/);
    expect(page.scale.text).toBe("1 = best … 5 = poorest");
    expect((await open(w.P, w.outsider)).status).toBe(404);
    expect((await open(w.P, w.near)).status).toBe(404); // conflicted: same institute as the PI
    expect((await open(w.P, w.pi)).status).toBe(403);
    const chair = await (await open(w.P, w.chair)).json();
    expect(chair.mode).toBe("chair");
    expect(chair.all.map((r: { reviewer: string }) => r.reviewer)).toEqual([
      "Rita Reviewer",
      "Rolf Reviewer",
      "Nia Neighbour",
    ]);
    expect((await open(w.draft, w.chair)).status).toBe(404);
    expect((await open(999999, w.chair)).status).toBe(404);
    expect((await settle(() => proposalLoader(get("/review/proposals/x", w.chair, { proposalId: "x" })))).status).toBe(
      404,
    );
  });

  it("gives the frozen science case to the reviewer, and nobody else", async () => {
    const pdf = await settle(() =>
      pdfLoader(get(`/review/proposals/${w.P}/science-case`, w.r1, { proposalId: String(w.P) })),
    );
    expect(pdf.status).toBe(200);
    expect(pdf.headers.get("Content-Type")).toBe("application/pdf");
    const none = await settle(() =>
      pdfLoader(get(`/review/proposals/${w.Q}/science-case`, w.r1, { proposalId: String(w.Q) })),
    );
    expect(none.status).toBe(404);
    const stranger = await settle(() =>
      pdfLoader(get(`/review/proposals/${w.P}/science-case`, w.outsider, { proposalId: String(w.P) })),
    );
    expect(stranger.status).toBe(404);
  });

  it("saves a draft, refuses a stale save with the newer text, names bad fields and keeps what was typed", async () => {
    expect((await save(w.P, w.r1, review())).status).toBe(302);
    const stale = await save(w.P, w.r1, review({ commentToPi: "Typed in another tab" }));
    expect(stale.status).toBe(409);
    const body = await stale.json();
    expect(body.stale).toMatchObject({ version: 1, commentToPi: "Sound case." });
    expect(body.values.commentToPi).toBe("Typed in another tab");
    const bad = await save(w.P, w.r1, review({ score: "9", version: "1" }));
    expect(bad.status).toBe(400);
    expect(await bad.json()).toMatchObject({
      errors: { score: "Score: a number on the cycle's scale, 1 = best … 5 = poorest" },
      values: { score: "9" },
    });
    const incomplete = await save(w.P, w.r1, review({ intent: "submit", commentToPi: "", version: "1" }));
    expect(incomplete.status).toBe(400);
    expect((await incomplete.json()).errors.commentToPi).toMatch(/Comment to the PI/);
    // The chair reads but never scores.
    expect((await save(w.P, w.chair, review())).status).toBe(403);
  });

  it("after submitting, shows the other reviewers' scores and committee comments without their names", async () => {
    expect((await save(w.P, w.r1, review({ intent: "submit", score: "1", version: "1" }))).status).toBe(302);
    let page = await (await open(w.P, w.r1)).json();
    expect(page.review.submittedAt).not.toBeNull();
    expect(page.others).toEqual([]);
    expect(
      (await save(w.P, w.r2, review({ intent: "submit", score: "4", commentToCommittee: "Too ambitious." }))).status,
    ).toBe(302);
    page = await (await open(w.P, w.r1)).json();
    expect(page.others).toEqual([
      { label: "Reviewer A", score: 4, confidence: "medium", commentToCommittee: "Too ambitious." },
    ]);
    const text = JSON.stringify(page);
    for (const name of ["Rolf Reviewer", "Nia Neighbour", w.r2.email]) expect(text).not.toContain(name);
    expect((await save(w.P, w.r1, review({ version: "2" }))).status).toBe(409);
  });

  it("lets a reviewer decline with a reason", async () => {
    const empty = await save(w.Q, w.r1, { intent: "decline", reason: " " });
    expect(empty.status).toBe(400);
    expect((await empty.json()).error).toBe("Reason for declining: say in a few words why");
    const ok = await save(w.Q, w.r1, { intent: "decline", reason: "Not my field at all." });
    expect(ok.status).toBe(302);
    expect(ok.headers.get("Location")).toBe("/review");
    const [a] = await testDb()
      .select()
      .from(reviewAssignments)
      .where(and(eq(reviewAssignments.proposalId, w.Q), eq(reviewAssignments.reviewerId, w.r1.id)));
    expect([a.status, a.declineReason]).toEqual(["declined", "Not my field at all."]);
    expect((await open(w.Q, w.r1)).status).toBe(404);
  });
});

describe("declaring conflicts", () => {
  const list = (who: Who) =>
    answer(() => conflictsLoader(get(`/review/cycles/${w.cycleId}/conflicts`, who, { cycleId: String(w.cycleId) })));
  const declare = (who: Who, fields: Record<string, string>) =>
    settle(() =>
      conflictsAction(post(`/review/cycles/${w.cycleId}/conflicts`, who, fields, { cycleId: String(w.cycleId) })),
    );

  it("shows the members the cycle's submitted proposals by title and abstract only", async () => {
    const res = await list(w.r2);
    expect(res.status).toBe(200);
    const page = await res.json();
    expect(page.proposals.map((p: { title: string }) => p.title)).toEqual(["Proposal P", "Proposal Q"]);
    expect(Object.keys(page.proposals[0]).sort()).toEqual([
      "abstract",
      "assignment",
      "automatic",
      "category",
      "conflict",
      "declared",
      "id",
      "title",
    ]);
    expect(JSON.stringify(page)).not.toContain("Pia Proposer");
    const near = await (await list(w.near)).json();
    expect(near.proposals[0].conflict).toBe("same institute as the team");
    expect((await list(w.outsider)).status).toBe(404);
  });

  it("needs a reason; a declaration on an assigned proposal declines the assignment", async () => {
    const bad = await declare(w.r2, { intent: "declare", proposalId: String(w.Q), reason: "" });
    expect(bad.status).toBe(400);
    expect((await bad.json()).errors.reason).toBe("Reason: say in a few words why");
    await testDb().insert(reviewAssignments).values({ cycleId: w.cycleId, proposalId: w.Q, reviewerId: w.r2.id });
    const ok = await declare(w.r2, {
      intent: "declare",
      proposalId: String(w.Q),
      reason: "I co-wrote the target's discovery paper.",
    });
    expect(ok.status).toBe(302);
    const [a] = await testDb()
      .select()
      .from(reviewAssignments)
      .where(and(eq(reviewAssignments.proposalId, w.Q), eq(reviewAssignments.reviewerId, w.r2.id)));
    expect(a.status).toBe("declined");
    expect(a.declineReason).toMatch(/^Conflict declared: I co-wrote/);
    // Submitted already: the declaration is refused (the chair is told instead).
    const late = await declare(w.r2, { intent: "declare", proposalId: String(w.P), reason: "Just noticed." });
    expect(late.status).toBe(409);
    const withdraw = await declare(w.r2, { intent: "withdraw", proposalId: String(w.Q) });
    expect(withdraw.status).toBe(302);
    expect((await declare(w.r2, { intent: "withdraw", proposalId: String(w.Q) })).status).toBe(409);
    const reviewsOfQ = await testDb()
      .select()
      .from(reviews)
      .innerJoin(reviewAssignments, eq(reviewAssignments.id, reviews.assignmentId))
      .where(eq(reviewAssignments.proposalId, w.Q));
    expect(reviewsOfQ).toEqual([]);
  });
});
