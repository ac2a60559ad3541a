/**
 * The row actions of My targets: "Add to a proposal" copies the target into one of the person's own
 * drafts through the proposal editor's command and refuses anything else; "Remove" and the edit
 * page's removal need the dialog's confirmation.
 */
import { formPost, routeArgs, settle, testDb } from "@test/routes";
import { and, eq, ne } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { proposals, proposalTargets, targets } from "~/db/schema/proposals";
import { seedDemoScenario } from "~/db/seed/factories.server";
import { action as editAction } from "~/routes/targets/edit";
import { action as listAction, loader as listLoader } from "~/routes/targets/index";
import { findUserByEmail } from "~/services/auth/accounts.server";
import { createSession } from "~/services/auth/sessions.server";
import { createTarget } from "~/services/targets/targets.server";

let ines = "";
let inesId = 0;
let draftId = 0;
let submittedId = 0;
let othersDraftId = 0;

const proposalId = async (title: string) =>
  (await testDb().select().from(proposals).where(eq(proposals.title, title)))[0].id;

beforeAll(async () => {
  await seedDemoScenario(testDb());
  const user = (await findUserByEmail(testDb(), "ines.arroyo@valle-alto.example"))!;
  inesId = user.id;
  ines = `fd_session=${(await createSession(testDb(), user.id, { method: "sso" })).token}`;
  draftId = await proposalId("Limb darkening along the giant branch");
  othersDraftId = await proposalId("Periastron passage of Quebrada Twin 9");
  const [submitted] = await testDb()
    .select()
    .from(proposals)
    .where(and(eq(proposals.piId, inesId), ne(proposals.status, "draft")));
  submittedId = submitted.id;
});

const post = (fields: Record<string, string>) =>
  settle(() => listAction(routeArgs("/targets", formPost(fields, { Cookie: ines }))));
/** The confirmed "Add to a proposal" of the target, to Inés's draft. */
const addToDraft = (targetId: number) =>
  post({ intent: "add-to-proposal", confirm: "yes", targetId: String(targetId), proposalId: String(draftId) });
const newTarget = (name: string) =>
  createTarget(testDb(), inesId, {
    name,
    raDeg: 150.25,
    decDeg: -30.5,
    model: { type: "gaussian", fwhmMas: 2.5 },
    magnitudes: { H: 3.1 },
    notes: "from the list",
  });
const copiesIn = (proposal: number, name: string) =>
  testDb()
    .select()
    .from(proposalTargets)
    .where(and(eq(proposalTargets.proposalId, proposal), eq(proposalTargets.name, name)));

describe("My targets' row actions", () => {
  it("list only the person's drafts that may still change, and a Sketchpad link with the target", async () => {
    await newTarget("Brasa Field 3");
    const page = (await listLoader(routeArgs("/targets", { headers: { Cookie: ines } }))) as Awaited<
      ReturnType<typeof listLoader>
    >;
    const ids = page.drafts.map((d) => d.id);
    expect(ids).toContain(draftId);
    expect(ids).not.toContain(submittedId);
    expect(ids).not.toContain(othersDraftId);
    const row = page.targets.find((t) => t.name === "Brasa Field 3")!;
    const link = new URL(row.sketchpadHref, "http://localhost");
    expect(link.pathname).toBe("/sketchpad");
    // 150.25° / 15°/h = 10.0166… h = 10h01m00s (common practice).
    expect(Object.fromEntries(link.searchParams)).toEqual({
      name: "Brasa Field 3",
      ra: "10:01:00.00",
      dec: "-30:30:00.0",
      model: "gaussian",
      fwhm: "2.5",
      from: "targets",
    });
  });

  it("add a target to one of the person's drafts, as the proposal editor's “From my targets” does", async () => {
    const mine = await newTarget("Brasa Field 4");
    const res = await addToDraft(mine.id);
    expect(res.status).toBe(302);
    const [copy] = await copiesIn(draftId, "Brasa Field 4");
    expect(copy).toMatchObject({
      sourceTargetId: mine.id,
      raDeg: 150.25,
      notes: "from the list",
      closureTriangle: null,
    });
    // A second copy of the same name is refused on the proposal's own rule.
    const again = await addToDraft(mine.id);
    expect(again.status).toBe(400);
    expect((await again.json()).rowError).toBe(
      'Proposal: Name: the proposal already has a target called "Brasa Field 4".',
    );
    expect(await copiesIn(draftId, "Brasa Field 4")).toHaveLength(1);
  });

  it("refuse a missing confirmation or proposal, someone else's proposal and a submitted one", async () => {
    const mine = await newTarget("Brasa Field 5");
    const base = { intent: "add-to-proposal", targetId: String(mine.id) };
    const unconfirmed = await post({ ...base, proposalId: String(draftId) });
    expect(unconfirmed.status).toBe(400);
    const none = await post({ ...base, confirm: "yes", proposalId: "" });
    expect(none.status).toBe(400);
    expect((await none.json()).rowError).toBe("Proposal: choose one of your draft proposals.");
    const others = await post({ ...base, confirm: "yes", proposalId: String(othersDraftId) });
    expect(others.status).toBe(404);
    const submitted = await post({ ...base, confirm: "yes", proposalId: String(submittedId) });
    expect(submitted.status).toBe(409);
    const notMine = await post({ ...base, confirm: "yes", targetId: "999999", proposalId: String(draftId) });
    expect(notMine.status).toBe(404);
    for (const p of [draftId, othersDraftId, submittedId]) expect(await copiesIn(p, "Brasa Field 5")).toEqual([]);
  });

  it("remove a target only once confirmed, from the list and from its edit page", async () => {
    const a = await newTarget("Brasa Field 6");
    const b = await newTarget("Brasa Field 7");
    const left = async () =>
      (await testDb().select().from(targets).where(eq(targets.ownerId, inesId))).map((t) => t.id);
    expect((await post({ intent: "remove", targetId: String(a.id) })).status).toBe(400);
    const edit = (fields: Record<string, string>) =>
      settle(() =>
        editAction(
          routeArgs(`/targets/${b.id}`, { ...formPost(fields, { Cookie: ines }), params: { targetId: String(b.id) } }),
        ),
      );
    expect((await edit({ intent: "delete" })).status).toBe(400);
    expect(await left()).toEqual(expect.arrayContaining([a.id, b.id]));

    expect((await post({ intent: "remove", confirm: "yes", targetId: String(a.id) })).status).toBe(302);
    expect((await edit({ intent: "delete", confirm: "yes" })).status).toBe(302);
    expect(await left()).not.toEqual(expect.arrayContaining([a.id]));
    expect(await left()).not.toContain(b.id);
    // Gone already: the row action says so.
    expect((await post({ intent: "remove", confirm: "yes", targetId: String(a.id) })).status).toBe(404);
  });
});
