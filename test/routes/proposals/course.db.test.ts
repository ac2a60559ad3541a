/**
 * The proposal's course asks first: submit, withdraw and delete need the dialog's `confirm=yes`;
 * failing feasibility lines need "submit anyway", recorded with the version and in the audit log;
 * a draft's PI deletes it with everything hanging off it.
 */
import { testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { auditLog } from "~/db/schema/auth";
import { proposalDocuments, proposalHours, proposalMembers, proposals, proposalTargets } from "~/db/schema/proposals";
import { loader as editorLoader } from "~/routes/proposals/editor/route";
import { loader as versionLoader } from "~/routes/proposals/version";
import * as fx from "./fixture";

fx.useProposalWorld();

const loadEditor = (id: number, key: string) =>
  fx.run(() => editorLoader(fx.get(`/proposals/${id}`, key, { proposalId: String(id) })));

/** A complete draft with a second target fainter than the H band's limit (its magnitude line fails). */
async function draftWithFaintTarget(title: string) {
  const id = await fx.completeDraft(title);
  const faint = await fx.addTarget(id, "ines", {
    name: "Faint Ember 9",
    ra: "10:10:10",
    dec: "-35:00:00",
    model: "uniformDisk",
    size_mas: "1",
    mag_H: "12",
  });
  expect(faint.status).toBe(302);
  return id;
}

const auditOf = (action: string, proposalId: number) =>
  testDb()
    .select()
    .from(auditLog)
    .where(eq(auditLog.action, action))
    .then((rows) => rows.filter((r) => r.detail.proposalId === proposalId));

describe("the proposal's course asks first", () => {
  it("refuses a submission and a withdrawal without the dialog's confirmation (400), then takes them", async () => {
    const id = await fx.completeDraft("Asked first");
    const bare = await fx.editor(id, "ines", { intent: "submit" });
    expect(bare.status).toBe(400);
    expect(bare.data.errors.form).toBe("Confirm the submission in the dialog.");
    expect((await fx.proposalRow(id)).status).toBe("draft");
    expect((await fx.editor(id, "ines", { intent: "submit", confirm: "no" })).status).toBe(400);
    expect((await fx.editor(id, "ines", { intent: "submit", confirm: "yes" })).status).toBe(302);
    expect((await fx.proposalRow(id)).status).toBe("submitted");

    const withdraw = await fx.editor(id, "ines", { intent: "withdraw" });
    expect(withdraw.status).toBe(400);
    expect(withdraw.data.errors.form).toBe("Confirm the withdrawal in the dialog.");
    expect((await fx.proposalRow(id)).status).toBe("submitted");
    expect((await fx.editor(id, "ines", { intent: "withdraw", confirm: "yes" })).status).toBe(302);
    expect((await fx.proposalRow(id)).status).toBe("withdrawn");
  });

  it("submits with failing feasibility lines only when told to submit anyway, and records who acknowledged", async () => {
    const id = await draftWithFaintTarget("Faint but keen");
    // The editor knows the failing line before the submission, to show it in the dialog.
    const page = await loadEditor(id, "ines");
    expect(page.data.submission.failing).toHaveLength(1);
    expect(page.data.submission.failing[0]).toMatch(
      /^Faint Ember 9 with compact-3 — Magnitude: H = 12\.00 mag is fainter than the band's limit/,
    );

    const refused = await fx.editor(id, "ines", { intent: "submit", confirm: "yes" });
    expect(refused.status).toBe(400);
    expect(refused.data.errors.form).toBe(
      '1 feasibility line fails: read the report, then confirm "Submit anyway" to submit with it.',
    );
    expect((await fx.proposalRow(id)).status).toBe("draft");
    expect(await auditOf("proposal.submitted-with-warnings", id)).toHaveLength(0);

    const before = Date.now();
    const out = await fx.editor(id, "ines", { intent: "submit", confirm: "yes", acknowledge: "yes" });
    expect(out.status).toBe(302);
    expect((await fx.proposalRow(id)).status).toBe("submitted");
    const [entry] = await auditOf("proposal.submitted-with-warnings", id);
    expect(entry).toMatchObject({
      actorId: fx.userId.ines,
      detail: { proposalId: id, version: 1, failingLines: 1, lines: ["Faint Ember 9 with compact-3 — Magnitude"] },
    });
    expect(entry.createdAt.getTime()).toBeGreaterThanOrEqual(before - 1000);

    // The version carries the acknowledgement, and the editor says it beside the version.
    const after = await loadEditor(id, "ines");
    const [v1] = after.data.versions.versions;
    expect(v1.version).toBe(1);
    expect(v1.acknowledged).toMatch(
      /^Submitted with 1 feasibility warning acknowledged by Inés Arroyo-Vidal, \d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC\.$/,
    );
    // The frozen version's own page says it too.
    const version = await fx.run(() =>
      versionLoader(fx.get(`/proposals/${id}/versions/1`, "ines", { proposalId: String(id), version: "1" })),
    );
    expect(version.data.snapshot.acknowledgement).toBe(v1.acknowledged);
  });

  it("submits a draft whose lines all pass without an acknowledgement and records none", async () => {
    const id = await fx.completeDraft("Nothing fails");
    const page = await loadEditor(id, "ines");
    expect(page.data.submission.failing).toEqual([]);
    expect((await fx.editor(id, "ines", { intent: "submit", confirm: "yes" })).status).toBe(302);
    const after = await loadEditor(id, "ines");
    expect(after.data.versions.versions[0].acknowledged).toBeNull();
    expect(await auditOf("proposal.submitted-with-warnings", id)).toHaveLength(0);
  });
});

describe("deleting a draft", () => {
  it("lets the PI delete a draft with everything hanging off it, after the confirmation", async () => {
    const db = testDb();
    const id = await fx.completeDraft("Delete me");
    expect((await fx.editor(id, "ines", { intent: "add-member", email: fx.people.tomasz })).status).toBe(302);
    expect((await loadEditor(id, "ines")).data.submission.abilities.canDelete).toBe(true);
    expect((await loadEditor(id, "tomasz")).data.submission.abilities.canDelete).toBe(false);

    const bare = await fx.editor(id, "ines", { intent: "delete" });
    expect(bare.status).toBe(400);
    expect(bare.data.errors.form).toBe("Confirm the deletion in the dialog.");
    expect(await fx.proposalRow(id)).toBeDefined();

    const coI = await fx.editor(id, "tomasz", { intent: "delete", confirm: "yes" });
    expect(coI.status).toBe(403);
    expect(coI.data.errors.form).toBe("Only the PI can delete the proposal.");
    expect(await fx.proposalRow(id)).toBeDefined();

    const out = await fx.editor(id, "ines", { intent: "delete", confirm: "yes" });
    expect(out.status).toBe(302);
    expect(out.location).toBe("/proposals");
    expect(out.headers?.get("Set-Cookie")).toMatch(/fd_flash=/);
    expect(await fx.proposalRow(id)).toBeUndefined();
    for (const table of [proposalMembers, proposalHours, proposalTargets, proposalDocuments])
      expect(await db.select().from(table).where(eq(table.proposalId, id))).toEqual([]);
    const [entry] = await auditOf("proposal.deleted", id);
    expect(entry).toMatchObject({ actorId: fx.userId.ines, detail: { proposalId: id, title: "Delete me" } });
    // Gone for everyone: the page is a 404 now.
    expect((await loadEditor(id, "ines")).status).toBe(404);
  });

  it("refuses to delete a proposal that is not a draft, or a draft that was submitted before (409)", async () => {
    const id = await fx.completeDraft("Keep me");
    expect((await fx.editor(id, "ines", { intent: "submit", confirm: "yes" })).status).toBe(302);
    const submitted = await fx.editor(id, "ines", { intent: "delete", confirm: "yes" });
    expect(submitted.status).toBe(409);
    expect(submitted.data.errors.form).toBe("Only a draft can be deleted; this proposal is submitted.");
    expect((await loadEditor(id, "ines")).data.submission.abilities.canDelete).toBe(false);

    expect((await fx.editor(id, "ines", { intent: "withdraw", confirm: "yes" })).status).toBe(302);
    expect((await fx.editor(id, "ines", { intent: "reopen" })).status).toBe(302);
    const reopened = await fx.editor(id, "ines", { intent: "delete", confirm: "yes" });
    expect(reopened.status).toBe(409);
    expect(reopened.data.errors.form).toBe(
      "This draft was submitted before (1 version); it stays on record and cannot be deleted.",
    );
    expect((await loadEditor(id, "ines")).data.submission.abilities.canDelete).toBe(false);
    expect((await fx.proposalRow(id)).status).toBe("draft");
    const [row] = await testDb().select().from(proposals).where(eq(proposals.id, id));
    expect(row.title).toBe("Keep me");
  });
});
