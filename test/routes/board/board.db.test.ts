import type { CommitteeWorld, Who } from "@test/committee-world";
import { answer, committeeCycle, person, registry, submitted, submittedReview } from "@test/committee-world";
import { rankRequest } from "@test/rank-request";
import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { outboxMessages } from "~/db/schema/mail";
import { cycles } from "~/db/schema/proposals";
import { loader as boardApi } from "~/routes/api/cycle-board";
import { action as rankAction } from "~/routes/api/rank";
import { action as boardAction, loader as boardLoader } from "~/routes/board/cycle";
import { loader as boardsLoader } from "~/routes/board/index";
import { createApiToken } from "~/services/auth/api-tokens.server";

const w = {} as CommitteeWorld & { ids: number[]; compact: number; chairToken: string; reviewerToken: string };

beforeAll(async () => {
  const r = await registry();
  w.compact = r.configId["compact-3"];
  w.chair = await person("Board Chair", { roles: ["chair"] });
  const pi = await person("Board PI", { roles: ["proposer"], institute: "Elsewhere" });
  w.r1 = await person("B1");
  w.r2 = await person("B2");
  const cycle = await committeeCycle("B-cycle", { members: [w.r1.id, w.r2.id], configIds: [w.compact] });
  w.cycleId = cycle.id;
  w.ids = [];
  for (const [i, title] of ["One", "Two", "Three"].entries()) {
    const id = await submitted(cycle.id, {
      pi: pi.id,
      title,
      hours: { [w.compact]: 4 + i },
      bandId: r.bandH.id,
      raDeg: 140 + 20 * i,
    });
    w.ids.push(id);
    for (const [k, who] of [w.r1, w.r2].entries()) {
      await submittedReview(cycle.id, id, who.id, { score: 1 + i + k, commentToPi: `To PI ${i}${k}` });
    }
  }
  w.chairToken = (await createApiToken(testDb(), w.chair.id, "board")).token;
  w.reviewerToken = (await createApiToken(testDb(), w.r1.id, "board")).token;
});

const params = () => ({ cycleId: String(w.cycleId) });
const page = (who: Who) =>
  answer(() => boardLoader(routeArgs(`/board/${w.cycleId}`, { headers: { Cookie: who.cookie }, params: params() })));
const act = (who: Who, fields: Record<string, string>) =>
  settle(() =>
    boardAction(routeArgs(`/board/${w.cycleId}`, { ...formPost(fields, { Cookie: who.cookie }), params: params() })),
  );

describe("the Ranking board", () => {
  it("is the chair's: every score, the ranking, demand and LST pressure, with the cycle's scale", async () => {
    const res = await page(w.chair);
    expect(res.status).toBe(200);
    const d = await res.json();
    expect(d.rows.map((r: { title: string; rank: number }) => [r.title, r.rank])).toEqual([
      ["One", 1],
      ["Two", 2],
      ["Three", 3],
    ]);
    expect(d.rows[0].scores).toEqual([
      { label: "R1", reviewerId: w.r1.id, score: 1 },
      { label: "R2", reviewerId: w.r2.id, score: 2 },
    ]);
    expect(d.cycle.scaleText).toBe("1 = best … 5 = poorest");
    const compact = d.pressure.configurations[0];
    expect(compact.requestedTotalH).toBe(15);
    expect((await page(w.r1)).status).toBe(403);
    const list = (await boardsLoader(routeArgs("/board", { headers: { Cookie: w.chair.cookie } }))) as {
      cycles: { name: string; proposals: number }[];
    };
    expect(list.cycles.find((c) => c.name === "B-cycle")?.proposals).toBe(3);
  });

  it("places the triage line, naming a bad position", async () => {
    const bad = await act(w.chair, { intent: "settings", triageAfter: "abc", disagreementSpread: "1" });
    expect(bad.status).toBe(400);
    expect((await bad.json()).errors.triageAfter).toBe("Triage line: a position on the board, or empty for none");
    const far = await act(w.chair, { intent: "settings", triageAfter: "9", disagreementSpread: "1" });
    expect((await far.json()).errors.triageAfter).toBe("Triage line: a position from 1 to 3, or empty for none");
    const spread = await act(w.chair, { intent: "settings", triageAfter: "", disagreementSpread: "-2" });
    expect((await spread.json()).errors.disagreementSpread).toMatch(/^Disagreement/);
    expect((await act(w.chair, { intent: "settings", triageAfter: "2", disagreementSpread: "0.4" })).status).toBe(302);
    const d = await (await page(w.chair)).json();
    expect(d.rows.map((r: { belowTriage: boolean; disagreement: boolean }) => [r.belowTriage, r.disagreement])).toEqual(
      [
        [false, true],
        [false, true],
        [true, true],
      ],
    );
    expect((await act(w.r1, { intent: "settings", triageAfter: "1", disagreementSpread: "1" })).status).toBe(403);
  });

  it("records decisions only while deciding, with field errors, then releases them after confirmation", async () => {
    const decisions = {
      intent: "save-decisions",
      [`decision-${w.ids[0]}`]: "accept",
      [`hours-${w.ids[0]}-${w.compact}`]: "4",
      [`grade-${w.ids[0]}`]: "1",
      [`message-${w.ids[0]}`]: "Welcome aboard.",
      [`decision-${w.ids[1]}`]: "waitlist",
      [`decision-${w.ids[2]}`]: "decline",
    };
    const early = await act(w.chair, decisions);
    expect(early.status).toBe(409);
    expect((await early.json()).errors.form).toMatch(/only while the cycle is “Decisions in progress”/);
    await testDb().update(cycles).set({ state: "deciding" }).where(eq(cycles.id, w.cycleId));
    const tooMuch = await act(w.chair, { ...decisions, [`hours-${w.ids[0]}-${w.compact}`]: "40" });
    expect(tooMuch.status).toBe(400);
    expect((await tooMuch.json()).errors[`hours-${w.ids[0]}-${w.compact}`]).toBe(
      "Hours of “One” on compact-3: at most the 4 h requested",
    );
    expect((await act(w.chair, { intent: "release" })).status).toBe(400);
    expect((await act(w.chair, decisions)).status).toBe(302);
    const d = await (await page(w.chair)).json();
    expect(d.abilities.release).toBe(true);
    const mails0 = (await testDb().select().from(outboxMessages)).length;
    expect((await act(w.chair, { intent: "release", confirm: "yes" })).status).toBe(302);
    const mails = await testDb().select().from(outboxMessages).where(eq(outboxMessages.kind, "decision"));
    expect(mails.length).toBe(3);
    expect(mails0).toBe(0);
    const [c] = await testDb().select().from(cycles).where(eq(cycles.id, w.cycleId));
    expect(c.state).toBe("closed");
    expect((await act(w.chair, decisions)).status).toBe(409);
  });
});

describe("GET /api/cycles/:id/board", () => {
  const call = (query: string, auth: string | null, id = String(w.cycleId)) => {
    const request = new Request(`http://localhost/api/cycles/${id}/board${query}`, {
      headers: auth ? { Authorization: `Bearer ${auth}` } : {},
    });
    return settle(() =>
      boardApi({
        request,
        url: new URL(request.url),
        params: { cycleId: id },
        context: (routeArgs("/") as { context: unknown }).context,
      } as never),
    );
  };

  it("answers the chair's token in JSON and CSV, with units", async () => {
    const json = await call("?format=json", w.chairToken);
    expect(json.status).toBe(200);
    const body = await json.json();
    expect(body.proposals.map((p: { title: string; decision: string }) => [p.title, p.decision])).toEqual([
      ["One", "accept"],
      ["Two", "waitlist"],
      ["Three", "decline"],
    ]);
    expect(body.proposals[0].allocatedHours).toEqual({ "compact-3": 4 });
    expect(body.reviewers.map((r: { label: string; name: string }) => r.label)).toEqual(["R1", "R2"]);
    const csv = await call("?format=csv", w.chairToken);
    expect(csv.headers.get("Content-Type")).toBe("text/csv; charset=utf-8");
    const text = await csv.text();
    expect(text.split(/\r?\n/)[0]).toMatch(
      /^Position,Proposal id,Title,PI,Category,Configurations,Hours requested \(h\),/,
    );
    expect(text.split(/\r?\n/)).toHaveLength(4);
  });

  it("refuses a reviewer's token (403), nobody (401), a bad format (400) and an unknown cycle (404)", async () => {
    expect((await call("", w.reviewerToken)).status).toBe(403);
    expect((await call("", null)).status).toBe(401);
    const bad = await call("?format=xml", w.chairToken);
    expect(bad.status).toBe(400);
    expect(await bad.json()).toEqual({ error: "format: must be json or csv", field: "format" });
    expect((await call("", w.chairToken, "99999")).status).toBe(404);
  });
});

describe("POST /api/rank", () => {
  const post = (body: unknown) =>
    settle(() =>
      rankAction({
        request: new Request("http://localhost/api/rank", {
          method: "POST",
          headers: { Authorization: `Bearer ${w.reviewerToken}`, "Content-Type": "application/json" },
          body: JSON.stringify(body),
        }),
        params: {},
        context: {},
      } as never),
    );

  it("answers the example of docs/cli-rank.md exactly as the command line does", async () => {
    const res = await post(rankRequest({ r1: { P1: 1, P2: 3, P3: 5 }, r2: { P1: 2, P2: 2 }, r3: { P3: 4 } }));
    expect(res.status).toBe(200);
    // docs/cli-rank.md, the response printed by `npm run -s cli -- rank --input /tmp/rank.json`.
    expect(await res.json()).toEqual({
      proposals: [
        { proposal: "P1", reviews: 2, meanScore: 1.5, spread: 0.5, normalizedScore: -0.6123724357, rank: 1 },
        { proposal: "P2", reviews: 2, meanScore: 2.5, spread: 0.5, normalizedScore: 0, rank: 2 },
        { proposal: "P3", reviews: 2, meanScore: 4.5, spread: 0.5, normalizedScore: 0.6123724357, rank: 3 },
      ],
      reviewers: [
        { reviewer: "r1", reviews: 3, meanScore: 3, sdScore: 1.6329931619 },
        { reviewer: "r2", reviews: 2, meanScore: 2, sdScore: 0 },
        { reviewer: "r3", reviews: 1, meanScore: 4, sdScore: 0 },
      ],
    });
  });

  it("names the field of a bad request", async () => {
    const res = await post({ scale: { best: 1, worst: 5 }, reviews: [{ reviewer: "r1", proposal: "P1", score: 7 }] });
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({
      error: "reviews[0].score: must lie within the scale 1–5",
      field: "reviews[0].score",
    });
    const none = await post({ reviews: [] });
    expect((await none.json()).field).toBe("scale");
  });
});
