/**
 * Changing a proposal: creating it, its text and hours, and its course (submit, withdraw, reopen,
 * delete a draft).
 * Each change runs through `changeProposal` (lock.server.ts); inputs arrive validated by schemas.ts,
 * and the limits they are checked against live there. The team is in team.server.ts, the targets in
 * targets.server.ts, the science case in science-case.server.ts.
 */

import { eq } from "drizzle-orm";
import { createElement } from "react";
import type { Database } from "~/db/client.server";
import { bands } from "~/db/schema/array";
import { auditLog } from "~/db/schema/auth";
import { cycles, proposalHours, proposals } from "~/db/schema/proposals";
import { ProposalSubmittedEmail } from "~/emails/ProposalSubmittedEmail";
import { ProposalWithdrawnEmail } from "~/emails/ProposalWithdrawnEmail";
import { formatUtc, plural } from "~/lib/format";
import type { ProposalViewer } from "./access.server";
import { computeProposalFeasibility } from "./feasibility.server";
import { changeProposal, editDraft, type ProposalRef, ProposalRefusal } from "./lock.server";
import { NOTICE_KIND, noticeTeam, proposalSubject, proposalUrl, thenSend } from "./notices.server";
import { missingForSubmission, offeredConfigurations } from "./queries.server";
import type { DetailsInput } from "./schemas";
import { freezeVersion } from "./versions.server";
import { type FeasibilityAcknowledgement, failingLines } from "./warnings";
import { listWords } from "./words";

/** Someone who writes to the team: their name goes into the notices. */
type NamedRef = ProposalRef & { viewer: ProposalViewer & { user: { name: string } } };

/** A new draft in a cycle whose deadline is still ahead. Returns the proposal row. */
export async function createProposal(
  db: Database,
  {
    viewer,
    input,
    now = new Date(),
  }: { viewer: ProposalViewer; input: { cycleId: number; title: string }; now?: Date },
) {
  return db.transaction(async (tx) => {
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, input.cycleId));
    if (!cycle) throw new ProposalRefusal(400, "Cycle: choose one of the open cycles.", "cycleId");
    if (cycle.submissionDeadline.getTime() <= now.getTime()) {
      throw new ProposalRefusal(
        409,
        `Cycle: the ${cycle.name} deadline (${formatUtc(cycle.submissionDeadline)}) has passed; choose an open cycle.`,
        "cycleId",
      );
    }
    const [row] = await tx
      .insert(proposals)
      .values({ cycleId: cycle.id, piId: viewer.user.id, title: input.title })
      .returning();
    return row;
  });
}

/** Title, abstract, science category and band (the instrument follows the band). Returns the row. */
export async function saveDetails(db: Database, { input, ...ref }: ProposalRef & { input: DetailsInput }) {
  return changeProposal(db, ref, "canEdit", async ({ tx, now }) => {
    let instrumentId: number | null = null;
    if (input.bandId !== null) {
      const [band] = await tx.select().from(bands).where(eq(bands.id, input.bandId));
      if (!band) throw new ProposalRefusal(400, "Instrument and band: choose one of the bands listed.", "bandId");
      instrumentId = band.instrumentId;
    }
    const [row] = await tx
      .update(proposals)
      .set({ ...input, instrumentId, updatedAt: now })
      .where(eq(proposals.id, ref.proposalId))
      .returning();
    return row;
  });
}

/** Replaces the requested hours: one line per configuration; configurations not listed are dropped. */
export async function saveHours(
  db: Database,
  { lines, ...ref }: ProposalRef & { lines: { configurationId: number; hours: number }[] },
) {
  return editDraft(db, ref, async ({ tx, proposal, proposalId }) => {
    const offered = new Set((await offeredConfigurations(tx, { cycleId: proposal.cycleId })).map((c) => c.id));
    const stray = lines.find((l) => !offered.has(l.configurationId));
    if (stray) {
      throw new ProposalRefusal(
        400,
        "Requested hours: that configuration is not on offer this cycle.",
        `hours-${stray.configurationId}`,
      );
    }
    await tx.delete(proposalHours).where(eq(proposalHours.proposalId, proposalId));
    if (lines.length > 0) await tx.insert(proposalHours).values(lines.map((l) => ({ proposalId, ...l })));
  });
}

/**
 * Submits the proposal: checks the deadline and completeness, freezes a new version with the
 * feasibility report and the PDF, marks it submitted and queues a notice to the whole team, all
 * in one transaction; then wakes the sender. Returns the version number and the report.
 * When lines of the report fail, it submits only with `acknowledged` ("submit anyway"): the
 * acknowledgement is frozen with the version and written to the audit log.
 */
export async function submitProposal(
  db: Database,
  { acknowledged = false, ...ref }: NamedRef & { acknowledged?: boolean },
) {
  const submitted = changeProposal(db, ref, "canSubmit", async ({ tx, proposal, cycle, now }) => {
    const missing = await missingForSubmission(tx, { proposal });
    if (missing.length > 0)
      throw new ProposalRefusal(400, `The proposal is not complete yet. It still needs ${listWords(missing)}.`);
    const report = await computeProposalFeasibility(tx, { proposalId: proposal.id, now });
    const failing = failingLines(report);
    if (failing.length > 0 && !acknowledged) {
      throw new ProposalRefusal(
        400,
        `${plural(failing.length, "feasibility line")} ${failing.length === 1 ? "fails" : "fail"}: read the report, then confirm "Submit anyway" to submit with ${failing.length === 1 ? "it" : "them"}.`,
      );
    }
    const user = ref.viewer.user;
    const acknowledgement: FeasibilityAcknowledgement | undefined = failing.length
      ? {
          failingLines: failing.length,
          lines: failing.map((l) => `${l.where} — ${l.label}`),
          byId: user.id,
          byName: user.name,
          at: now.toISOString(),
        }
      : undefined;
    const frozen = await freezeVersion(tx, { proposal, cycle, submittedById: user.id, now, report, acknowledgement });
    if (acknowledgement) {
      const { failingLines: count, lines } = acknowledgement;
      await tx.insert(auditLog).values({
        actorId: user.id,
        action: "proposal.submitted-with-warnings",
        detail: { proposalId: proposal.id, title: proposal.title, version: frozen.version, failingLines: count, lines },
        createdAt: now,
      });
    }
    const { version, snapshot, documentSha256 } = frozen;
    await noticeTeam(tx, {
      proposal,
      kind: NOTICE_KIND.submitted,
      subject: proposalSubject("Proposal submitted", proposal.title, cycle.name),
      element: (to) =>
        createElement(ProposalSubmittedEmail, {
          name: to.name,
          title: proposal.title,
          cycleName: cycle.name,
          version,
          submittedBy: ref.viewer.user.name,
          submittedAt: formatUtc(now),
          deadline: formatUtc(cycle.submissionDeadline),
          targets: snapshot.targets.length,
          hours: snapshot.hours.reduce((a, h) => a + h.hours, 0),
          verdict: report.verdict,
          documentSha256: documentSha256 ?? "",
          url: proposalUrl(proposal.id),
        }),
    });
    return { version, report };
  });
  return thenSend(submitted);
}

/** The PI pulls a submitted proposal back; the team is told. */
export async function withdrawProposal(db: Database, ref: NamedRef) {
  const withdrawn = changeProposal(db, ref, "canWithdraw", async ({ tx, proposal, cycle, now }) => {
    await tx.update(proposals).set({ status: "withdrawn", updatedAt: now }).where(eq(proposals.id, proposal.id));
    const reopenable = now.getTime() < cycle.submissionDeadline.getTime();
    await noticeTeam(tx, {
      proposal,
      kind: NOTICE_KIND.withdrawn,
      subject: proposalSubject("Proposal withdrawn", proposal.title, cycle.name),
      element: (to) =>
        createElement(ProposalWithdrawnEmail, {
          name: to.name,
          title: proposal.title,
          cycleName: cycle.name,
          withdrawnBy: ref.viewer.user.name,
          reopenUntil: reopenable ? formatUtc(cycle.submissionDeadline) : null,
          url: proposalUrl(proposal.id),
        }),
    });
  });
  return thenSend(withdrawn);
}

/** The PI turns a withdrawn proposal back into a draft (before the deadline). */
export async function reopenProposal(db: Database, ref: ProposalRef) {
  return changeProposal(db, ref, "canReopen", async ({ tx, proposalId, now }) => {
    await tx.update(proposals).set({ status: "draft", updatedAt: now }).where(eq(proposals.id, proposalId));
  });
}

/**
 * The PI deletes a draft with everything hanging off it (team, hours, targets, science case, previews),
 * and the audit log keeps its title. A draft that was ever submitted is refused: its versions belong
 * to the committee's record. Returns the title.
 */
export async function deleteDraft(db: Database, ref: ProposalRef) {
  return changeProposal(db, ref, "canDelete", async ({ tx, proposal, now }) => {
    await tx.delete(proposals).where(eq(proposals.id, proposal.id));
    await tx.insert(auditLog).values({
      actorId: ref.viewer.user.id,
      action: "proposal.deleted",
      detail: { proposalId: proposal.id, title: proposal.title, cycleId: proposal.cycleId },
      createdAt: now,
    });
    return { title: proposal.title };
  });
}
