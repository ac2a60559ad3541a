/** Submitting, withdrawing and reopening: frozen versions, their notices and their pages. */
import { testDb } from "@test/routes";
import { asc, eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { outboxMessages } from "~/db/schema/mail";
import { proposalDocuments, proposals, proposalVersions } from "~/db/schema/proposals";
import { loader as feasibilityLoader } from "~/routes/proposals/feasibility";
import { loader as documentLoader } from "~/routes/proposals/science-case";
import { loader as versionLoader } from "~/routes/proposals/version";
import type { FeasibilityReport } from "~/services/proposals/feasibility";
import { makeTinyPdf } from "~/services/proposals/pdf";
import type { ProposalSnapshot } from "~/services/proposals/versions.server";
import * as fx from "./fixture";

fx.useProposalWorld();

describe("submitting, withdrawing and reopening", () => {
  it("lists what is missing and refuses an incomplete proposal", async () => {
    const id = await fx.newDraft("ines", "Incomplete");
    const out = await fx.editor(id, "ines", { intent: "submit", confirm: "yes" });
    expect(out.status).toBe(400);
    expect(out.data.errors.form).toBe(
      "The proposal is not complete yet. It still needs an abstract, a science category, an instrument and band, at least one target, requested hours for at least one configuration and the science case (PDF).",
    );
    expect((await fx.proposalRow(id)).status).toBe("draft");
  });

  it("freezes a version with the report and the PDF, queues the notices, then refuses edits", async () => {
    const id = await fx.completeDraft("Ready to go");
    await fx.editor(id, "ines", { intent: "add-member", email: fx.people.tomasz });
    // A co-investigator may submit.
    const out = await fx.editor(id, "tomasz", { intent: "submit", confirm: "yes" });
    expect(out.status).toBe(302);
    const row = await fx.proposalRow(id);
    expect(row).toMatchObject({ status: "submitted", currentVersion: 1 });
    const [v] = await testDb().select().from(proposalVersions).where(eq(proposalVersions.proposalId, id));
    const snap = v.snapshot as unknown as ProposalSnapshot;
    expect(snap).toMatchObject({
      title: "Ready to go",
      abstract: "We measure a diameter.",
      scienceCategory: "Stellar surfaces and diameters",
    });
    expect(snap.targets.map((t) => t.name)).toEqual(["Lumbre Nova 12"]);
    expect(snap.hours).toEqual([
      { configurationId: fx.world.configId["compact-3"], configuration: "compact-3", hours: 6 },
    ]);
    expect(snap.feasibility.cells).toHaveLength(1);
    expect(snap.feasibility.cells[0].lines.map((l) => l.check)).toEqual([
      "combiner",
      "observable-time",
      "resolution",
      "visibility",
      "magnitude",
      "closure",
    ]);
    const [doc] = await testDb().select().from(proposalDocuments).where(eq(proposalDocuments.proposalId, id));
    expect(v.documentSha256).toBe(doc.sha256);
    expect(Buffer.from(v.documentData!).equals(Buffer.from(doc.data))).toBe(true);
    expect(v.submittedById).toBe(fx.userId.tomasz);
    const notices = await testDb()
      .select()
      .from(outboxMessages)
      .where(eq(outboxMessages.subject, 'Proposal submitted: "Ready to go" (T-open)'));
    expect(notices.map((n) => n.toAddress).sort()).toEqual([fx.people.ines, fx.people.tomasz].sort());
    expect(notices.every((n) => n.kind === "submission")).toBe(true);

    // Read-only now: every change is refused and the snapshot stays as it was.
    const edit = await fx.saveText(id, "ines", { title: "Changed after" });
    expect(edit.status).toBe(409);
    expect((await fx.upload(id, "ines", makeTinyPdf(["new"]), "new.pdf")).status).toBe(409);
    expect((await fx.editor(id, "ines", { intent: "submit", confirm: "yes" })).status).toBe(409);
    const [again] = await testDb().select().from(proposalVersions).where(eq(proposalVersions.proposalId, id));
    expect(again.snapshot).toEqual(v.snapshot);
    expect((await fx.proposalRow(id)).title).toBe("Ready to go");

    // The frozen report and version are what the pages show.
    const feas = await fx.run(() =>
      feasibilityLoader(fx.get(`/proposals/${id}/feasibility`, "ines", { proposalId: String(id) })),
    );
    expect(feas.data.frozen).toBe(true);
    expect(((await feas.data.report) as FeasibilityReport).computedAt).toBe(snap.feasibility.computedAt);
    const version = await fx.run(() =>
      versionLoader(fx.get(`/proposals/${id}/versions/1`, "ines", { proposalId: String(id), version: "1" })),
    );
    expect(version.data.snapshot.title).toBe("Ready to go");
    expect(
      (
        await fx.run(() =>
          versionLoader(fx.get(`/proposals/${id}/versions/1`, "amara", { proposalId: String(id), version: "1" })),
        )
      ).status,
    ).toBe(404);
    expect(
      (
        await fx.run(() =>
          versionLoader(fx.get(`/proposals/${id}/versions/2`, "ines", { proposalId: String(id), version: "2" })),
        )
      ).status,
    ).toBe(404);
  });

  it("lets only the PI withdraw and reopen, and a new submission adds version 2 beside the first", async () => {
    const id = await fx.completeDraft("Second thoughts");
    await fx.editor(id, "ines", { intent: "add-member", email: fx.people.tomasz });
    expect((await fx.editor(id, "ines", { intent: "submit", confirm: "yes" })).status).toBe(302);
    const coI = await fx.editor(id, "tomasz", { intent: "withdraw", confirm: "yes" });
    expect(coI.status).toBe(403);
    expect(coI.data.errors.form).toBe("Only the PI can withdraw the proposal.");
    expect((await fx.editor(id, "ines", { intent: "withdraw", confirm: "yes" })).status).toBe(302);
    expect((await fx.proposalRow(id)).status).toBe("withdrawn");
    const withdrawn = await testDb()
      .select()
      .from(outboxMessages)
      .where(eq(outboxMessages.subject, 'Proposal withdrawn: "Second thoughts" (T-open)'));
    expect(withdrawn).toHaveLength(2);
    expect((await fx.editor(id, "ines", { intent: "withdraw", confirm: "yes" })).status).toBe(409);
    expect((await fx.editor(id, "tomasz", { intent: "reopen" })).status).toBe(403);
    expect((await fx.editor(id, "ines", { intent: "reopen" })).status).toBe(302);
    expect((await fx.proposalRow(id)).status).toBe("draft");
    expect(
      (
        await fx.saveText(id, "ines", {
          title: "Second thoughts, revised",
          abstract: "Revised.",
          scienceCategory: "Stellar surfaces and diameters",
          bandId: String(fx.world.bandH),
        })
      ).status,
    ).toBe(302);
    expect((await fx.editor(id, "ines", { intent: "submit", confirm: "yes" })).status).toBe(302);
    const versions = await testDb()
      .select()
      .from(proposalVersions)
      .where(eq(proposalVersions.proposalId, id))
      .orderBy(asc(proposalVersions.version));
    expect(versions.map((v) => [v.version, (v.snapshot as unknown as ProposalSnapshot).title])).toEqual([
      [1, "Second thoughts"],
      [2, "Second thoughts, revised"],
    ]);
    expect((await fx.proposalRow(id)).currentVersion).toBe(2);
    // The first version's PDF can still be downloaded.
    const v1 = await fx.run(() =>
      documentLoader(fx.get(`/proposals/${id}/science-case?version=1`, "tomasz", { proposalId: String(id) })),
    );
    expect(v1.status).toBe(200);
  });

  it("refuses to reopen once the deadline has passed", async () => {
    const db = testDb();
    const [p] = await db
      .insert(proposals)
      .values({
        cycleId: fx.world.closedCycleId,
        piId: fx.userId.ines,
        title: "Withdrawn late",
        status: "withdrawn",
        currentVersion: 1,
      })
      .returning();
    const out = await fx.editor(p.id, "ines", { intent: "reopen" });
    expect(out.status).toBe(409);
    expect(out.data.errors.form).toMatch(/T-closed deadline .* has passed: the proposal can no longer be reopened/);
    expect((await fx.proposalRow(p.id)).status).toBe("withdrawn");
  });
});
