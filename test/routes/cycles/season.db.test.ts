import { committeeCycle, person, registry, submitted } from "@test/committee-world";
import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { auditLog } from "~/db/schema/auth";
import { reviewAssignments, reviews } from "~/db/schema/committee";
import { outboxMessages } from "~/db/schema/mail";
import { cycles, proposals } from "~/db/schema/proposals";
import { darkTimeOverPeriod } from "~/engine";
import { action as assignAction, loader as assignLoader } from "~/routes/cycles/assignments";
import { action as cycleAction, loader as cycleLoader } from "~/routes/cycles/cycle";
import { action as editAction, loader as editLoader } from "~/routes/cycles/edit";

const w = {
  chair: "",
  reviewer: "",
  proposer: "",
  cycleId: 0,
  members: [] as number[],
  p: [] as number[],
  site: null as never,
};
const DAY = 86_400_000;

beforeAll(async () => {
  const r = await registry();
  w.site = r.site as never;
  const chair = await person("chair", { roles: ["chair"] });
  const pi = await person("pi", { roles: ["proposer"], institute: "Far" });
  const r1 = await person("r1", { institute: "One" });
  const r2 = await person("r2", { institute: "Two" });
  const r3 = await person("r3", { institute: "Far" });
  w.chair = chair.cookie;
  w.reviewer = r1.cookie;
  w.proposer = pi.cookie;
  w.members = [r1.id, r2.id, r3.id];
  // Open, its deadline one minute ahead: the review cannot start yet.
  const cycle = await committeeCycle("S-cycle", {
    state: "open",
    members: w.members,
    configIds: [r.configId["compact-3"], r.configId["extended-6"]],
    deadlineDays: 1 / 1440,
  });
  w.cycleId = cycle.id;
  for (const title of ["First", "Second"])
    w.p.push(
      await submitted(cycle.id, {
        pi: pi.id,
        title,
        hours: { [r.configId["compact-3"]]: 5 },
        bandId: r.bandH.id,
        status: "submitted",
      }),
    );
});

const at = (path: string, cookie: string, form?: Record<string, string | string[]>) =>
  routeArgs(path, {
    ...(form ? formPost(form, { Cookie: cookie }) : { headers: { Cookie: cookie } }),
    params: { cycleId: String(w.cycleId) },
  });
const path = () => `/cycles/${w.cycleId}`;

describe("the cycle's page", () => {
  it("shows the state, the transitions with their guards, and the hours the nights give", async () => {
    const page = await cycleLoader(at(path(), w.chair));
    expect(page.cycle.state).toBe("open");
    expect(
      page.transitions.map((t: { transition: string; refusal: string | null }) => [t.transition, t.refusal]),
    ).toEqual([["start-review", "The submission deadline has not passed yet: proposers may still submit."]]);
    // The engine's darkness over the same period (every night, Sun below −18°): nights × mean dark hours.
    const [c] = await testDb().select().from(cycles).where(eq(cycles.id, w.cycleId));
    const dark = darkTimeOverPeriod(
      { latitudeDeg: -31.4, longitudeDeg: -68.9, altitudeM: 2450 },
      c.observingStart,
      c.observingEnd,
    );
    const compact = page.darkness.offers.find((o: { name: string }) => o.name === "compact-3")!;
    expect(compact.darkHoursPerNight).toBeCloseTo(dark.meanDarkHoursPerNight, 9);
    expect(compact.hoursOffered).toBeCloseTo(3 * dark.meanDarkHoursPerNight, 9);
  });

  it("is the chair's alone", async () => {
    expect((await settle(() => cycleLoader(at(path(), w.reviewer)))).status).toBe(403);
    expect(
      (await settle(() => cycleAction(at(path(), w.proposer, { intent: "start-review", confirm: "yes" })))).status,
    ).toBe(403);
    expect((await settle(() => assignLoader(at(`${path()}/assignments`, w.reviewer)))).status).toBe(403);
  });

  it("asks for confirmation and refuses a transition its guard forbids, changing nothing", async () => {
    const unconfirmed = await settle(() => cycleAction(at(path(), w.chair, { intent: "start-review" })));
    expect(unconfirmed.status).toBe(400);
    expect(await unconfirmed.json()).toEqual({ error: "Confirm the change in the dialog." });
    const early = await settle(() => cycleAction(at(path(), w.chair, { intent: "start-review", confirm: "yes" })));
    expect(early.status).toBe(409);
    expect((await early.json()).error).toMatch(/not passed yet/);
    const wrong = await settle(() => cycleAction(at(path(), w.chair, { intent: "close-review", confirm: "yes" })));
    expect(wrong.status).toBe(409);
    const unknown = await settle(() => cycleAction(at(path(), w.chair, { intent: "explode", confirm: "yes" })));
    expect(unknown.status).toBe(400);
    const [c] = await testDb().select().from(cycles).where(eq(cycles.id, w.cycleId));
    expect(c.state).toBe("open");
  });

  it("starts the review after the deadline: the submitted proposals go under review, in the audit log", async () => {
    await testDb()
      .update(cycles)
      .set({ submissionDeadline: new Date(Date.now() - 1000) })
      .where(eq(cycles.id, w.cycleId));
    const res = await settle(() => cycleAction(at(path(), w.chair, { intent: "start-review", confirm: "yes" })));
    expect(res.status).toBe(302);
    const rows = await testDb().select().from(proposals).where(eq(proposals.cycleId, w.cycleId));
    expect(rows.map((r) => r.status)).toEqual(["under_review", "under_review"]);
    const [entry] = await testDb().select().from(auditLog).where(eq(auditLog.action, "cycle.start-review"));
    expect(entry.detail).toMatchObject({ cycleId: w.cycleId, from: "open", to: "reviewing", proposalsUnderReview: 2 });
    const page = await cycleLoader(at(path(), w.chair));
    expect(page.log[0].action).toBe("cycle.start-review");
  });

  it("previews auto-assign without writing, saves it with notices, assigns by hand and sends reminders", async () => {
    const preview = (await assignAction(
      at(`${path()}/assignments`, w.chair, { intent: "preview", perProposal: "2" }),
    )) as {
      preview: { added: { proposalId: number; reviewerId: number }[] };
    };
    // r3 shares the PI's institute ("Far"): only r1 and r2 are free, 2 each.
    expect(preview.preview.added).toHaveLength(4);
    expect(preview.preview.added.every((a) => a.reviewerId !== w.members[2])).toBe(true);
    expect(await testDb().select().from(reviewAssignments)).toEqual([]);
    const bad = await settle(() =>
      assignAction(at(`${path()}/assignments`, w.chair, { intent: "preview", perProposal: "0" })),
    );
    expect(bad.status).toBe(400);
    expect((await bad.json()).error).toBe("Reviewers per proposal: at least 1");
    const pairs = preview.preview.added.slice(0, 3).map((a) => `${a.proposalId}:${a.reviewerId}`);
    const saved = await settle(() =>
      assignAction(at(`${path()}/assignments`, w.chair, { intent: "save-auto", pair: pairs })),
    );
    expect(saved.status).toBe(302);
    const missing = preview.preview.added[3];
    const conflicted = await settle(() =>
      assignAction(
        at(`${path()}/assignments`, w.chair, {
          intent: "assign",
          proposalId: String(missing.proposalId),
          reviewerId: String(w.members[2]),
        }),
      ),
    );
    expect(conflicted.status).toBe(409);
    expect((await conflicted.json()).error).toMatch(/conflict.*same institute/);
    const byHand = await settle(() =>
      assignAction(
        at(`${path()}/assignments`, w.chair, {
          intent: "assign",
          proposalId: String(missing.proposalId),
          reviewerId: String(missing.reviewerId),
        }),
      ),
    );
    expect(byHand.status).toBe(302);
    const garbage = await settle(() =>
      assignAction(at(`${path()}/assignments`, w.chair, { intent: "save-auto", pair: ["1:x"] })),
    );
    expect(garbage.status).toBe(400);
    const page = await assignLoader(at(`${path()}/assignments`, w.chair));
    expect(page.proposals.map((p: { active: number }) => p.active)).toEqual([2, 2]);
    const notices = await testDb().select().from(outboxMessages).where(eq(outboxMessages.kind, "assignment"));
    expect(notices.length).toBe(3); // r1 and r2 for the auto run, one for the assignment by hand
    expect((await settle(() => assignAction(at(`${path()}/assignments`, w.chair, { intent: "remind" })))).status).toBe(
      400,
    );
    expect(
      (await settle(() => assignAction(at(`${path()}/assignments`, w.chair, { intent: "remind", confirm: "yes" }))))
        .status,
    ).toBe(302);
    expect(await testDb().select().from(outboxMessages).where(eq(outboxMessages.kind, "reminder"))).toHaveLength(2);
  });

  it("keeps the scale once a review has a score, and a member with assignments on the committee", async () => {
    const [a] = await testDb().select().from(reviewAssignments).limit(1);
    await testDb().insert(reviews).values({ assignmentId: a.id, score: 2 });
    const page = await editLoader(at(`${path()}/edit`, w.chair));
    expect(page.values.committee.sort()).toEqual(w.members.map(String).sort());
    const fields = (over: Record<string, string | string[]>) => {
      const out: Record<string, string | string[]> = {};
      for (const [k, val] of Object.entries({ ...page.values, ...over }))
        if (k !== "nights") out[k] = val as string | string[];
      // The nights as the form posts them, one field per configuration.
      for (const [id, nights] of Object.entries(page.values.nights)) out[`nights-${id}`] = nights;
      return out;
    };
    const scale = (await editAction(at(`${path()}/edit`, w.chair, fields({ scoreBest: "1", scoreWorst: "10" })))) as {
      init: { status: number };
      data: { errors: Record<string, string> };
    };
    expect(scale.init.status).toBe(400);
    expect(scale.data.errors.scoreWorst).toMatch(/1 review has a score on the current scale/);
    const leave = (await editAction(at(`${path()}/edit`, w.chair, fields({ committee: [String(w.members[2])] })))) as {
      data: { errors: Record<string, string> };
    };
    expect(leave.data.errors.committee).toMatch(/^Committee: r1, r2 still have assignments/);
    // The review has started: the submission deadline cannot reopen submissions.
    const later = new Date(Date.now() + 5 * DAY).toISOString().slice(0, 16);
    const reopen = (await editAction(at(`${path()}/edit`, w.chair, fields({ submissionDeadline: later })))) as {
      data: { errors: Record<string, string> };
    };
    expect(reopen.data.errors.submissionDeadline).toBe(
      "Deadline: the review has started; the submission deadline can no longer move ahead",
    );
  });

  it("closes the review and reopens scoring with a new deadline ahead", async () => {
    expect(
      (await settle(() => cycleAction(at(path(), w.chair, { intent: "close-review", confirm: "yes" })))).status,
    ).toBe(302);
    const none = await settle(() => cycleAction(at(path(), w.chair, { intent: "reopen-scoring", confirm: "yes" })));
    expect(none.status).toBe(400);
    const past = await settle(() =>
      cycleAction(
        at(path(), w.chair, { intent: "reopen-scoring", confirm: "yes", reviewDeadline: "2020-01-01T00:00" }),
      ),
    );
    expect(past.status).toBe(409);
    const ahead = new Date(Date.now() + 3 * DAY).toISOString().slice(0, 16);
    const ok = await settle(() =>
      cycleAction(at(path(), w.chair, { intent: "reopen-scoring", confirm: "yes", reviewDeadline: ahead })),
    );
    expect(ok.status).toBe(302);
    const [c] = await testDb().select().from(cycles).where(eq(cycles.id, w.cycleId));
    expect([c.state, c.reviewDeadline?.toISOString().slice(0, 16)]).toEqual(["reviewing", ahead]);
  });
});
