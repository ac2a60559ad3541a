/** Who may see a proposal, and its team. */
import { testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { outboxMessages } from "~/db/schema/mail";
import { proposalMembers } from "~/db/schema/proposals";
import { loader as editorLoader } from "~/routes/proposals/editor/route";
import { loader as feasibilityLoader } from "~/routes/proposals/feasibility";
import { loader as listLoader } from "~/routes/proposals/list";
import { loader as documentLoader } from "~/routes/proposals/science-case";
import { loader as targetLoader } from "~/routes/proposals/target";
import { makeTinyPdf } from "~/services/proposals/pdf";
import * as fx from "./fixture";

fx.useProposalWorld();

describe("who may see a proposal", () => {
  it("answers 404 to another proposer, for the page, every action and the download", async () => {
    const id = await fx.newDraft("ines", "Private draft");
    const p = { proposalId: String(id) };
    expect((await fx.run(() => editorLoader(fx.get(`/proposals/${id}`, "amara", p)))).status).toBe(404);
    expect((await fx.saveText(id, "amara", { title: "Mine now" })).status).toBe(404);
    expect((await fx.run(() => feasibilityLoader(fx.get(`/proposals/${id}/feasibility`, "amara", p)))).status).toBe(
      404,
    );
    expect((await fx.run(() => documentLoader(fx.get(`/proposals/${id}/science-case`, "amara", p)))).status).toBe(404);
    expect((await fx.upload(id, "amara", makeTinyPdf(["x"]), "x.pdf")).status).toBe(404);
    expect(
      (await fx.run(() => targetLoader(fx.get(`/proposals/${id}/targets/new`, "amara", { ...p, targetId: "new" }))))
        .status,
    ).toBe(404);
    // A number that does not exist answers the same way.
    expect(
      (await fx.run(() => editorLoader(fx.get("/proposals/999999", "amara", { proposalId: "999999" })))).status,
    ).toBe(404);
    expect((await fx.run(() => editorLoader(fx.get("/proposals/abc", "amara", { proposalId: "abc" })))).status).toBe(
      404,
    );
    expect((await fx.proposalRow(id)).title).toBe("Private draft");
  });

  it("answers 403 to a scheduler before looking the proposal up", async () => {
    const id = await fx.newDraft("ines", "Scheduler check");
    const p = { proposalId: String(id) };
    expect((await fx.run(() => editorLoader(fx.get(`/proposals/${id}`, "mei", p)))).status).toBe(403);
    expect((await fx.editor(id, "mei", { intent: "submit" })).status).toBe(403);
    expect((await fx.run(() => documentLoader(fx.get(`/proposals/${id}/science-case`, "mei", p)))).status).toBe(403);
  });

  it("lets a co-investigator invited before signing up in, and links the account on first visit", async () => {
    const id = await fx.newDraft("ines", "Team proposal");
    const added = await fx.editor(id, "ines", { intent: "add-member", email: "New.Comer@Elsewhere.example" });
    expect(added.status).toBe(302);
    const [member] = await testDb().select().from(proposalMembers).where(eq(proposalMembers.proposalId, id));
    expect(member.userId).toBeNull();
    // The notice went to the outbox in the same transaction.
    const mail = await testDb()
      .select()
      .from(outboxMessages)
      .where(eq(outboxMessages.toAddress, "New.Comer@Elsewhere.example"));
    expect(mail).toHaveLength(1);
    expect(mail[0].subject).toBe('You are a co-investigator on "Team proposal"');
    expect(mail[0].text).toMatch(/Inés|ines/i);
    await fx.signIn("newcomer", "new.comer@elsewhere.example", ["proposer"]);
    const list = await fx.run(() => listLoader(fx.get("/proposals", "newcomer")));
    expect(list.data.proposals.map((p: { id: number; role: string }) => [p.id, p.role])).toContainEqual([id, "Co-I"]);
    const page = await fx.run(() => editorLoader(fx.get(`/proposals/${id}`, "newcomer", { proposalId: String(id) })));
    expect(page.status).toBe(200);
    expect(page.data.abilities).toMatchObject({
      relation: "co-investigator",
      canEdit: true,
      canManageTeam: false,
      canWithdraw: false,
    });
    const [linked] = await testDb().select().from(proposalMembers).where(eq(proposalMembers.id, member.id));
    expect(linked.userId).toBe(fx.userId.newcomer);
    // A co-investigator edits the text but does not change the team.
    expect((await fx.saveText(id, "newcomer", { title: "Team proposal v2" })).status).toBe(302);
    const refused = await fx.editor(id, "newcomer", { intent: "add-member", email: "third@elsewhere.example" });
    expect(refused.status).toBe(403);
    expect(refused.data.errors.form).toBe("Only the PI adds or removes co-investigators.");
  });

  it("refuses the PI's own address, a duplicate and a malformed address, naming the field", async () => {
    const id = await fx.newDraft("ines", "Team checks");
    expect((await fx.editor(id, "ines", { intent: "add-member", email: fx.people.tomasz })).status).toBe(302);
    const dup = await fx.editor(id, "ines", { intent: "add-member", email: fx.people.tomasz.toUpperCase() });
    expect(dup.status).toBe(400);
    expect(dup.data.errors.email).toMatch(/already on the team/);
    const self = await fx.editor(id, "ines", { intent: "add-member", email: fx.people.ines });
    expect(self.data.errors.email).toMatch(/PI's own address/);
    const bad = await fx.editor(id, "ines", { intent: "add-member", email: "not-an-address" });
    expect(bad.status).toBe(400);
    expect(bad.data.errors.email).toBe("Co-investigator e-mail: not an e-mail address.");
    expect(bad.data.values.email).toBe("not-an-address");
    expect(await testDb().select().from(proposalMembers).where(eq(proposalMembers.proposalId, id))).toHaveLength(1);
    const [m] = await testDb().select().from(proposalMembers).where(eq(proposalMembers.proposalId, id));
    expect((await fx.editor(id, "ines", { intent: "remove-member", memberId: String(m.id) })).status).toBe(302);
    expect(await testDb().select().from(proposalMembers).where(eq(proposalMembers.proposalId, id))).toHaveLength(0);
  });
});
