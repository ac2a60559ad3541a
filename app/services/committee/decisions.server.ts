/**
 * The chair's writes on the Ranking board: the triage line and disagreement threshold, the grades and
 * decisions with hours per configuration (only while the cycle is "deciding"), and the release that
 * sends every decision to every team, changes the proposals' statuses and closes the cycle — each in
 * one transaction with its audit entries.
 */
import { and, asc, eq, inArray } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { configurations } from "~/db/schema/array";
import { auditLog } from "~/db/schema/auth";
import { allocatedHours, committeeBoards, proposalDecisions, reviewAssignments, reviews } from "~/db/schema/committee";
import { cycles, type ProposalStatus, proposals } from "~/db/schema/proposals";
import { activeAssignment, submittedReview } from "~/lib/conditions.server";
import { configurationOf, reviewOfAssignment } from "~/lib/joins.server";
import { wakeOutboxSender } from "~/services/mail/sender.server";
import type { DecisionEntry } from "./decisions-form";
import { queueDecisionNotices } from "./notices.server";

type Outcome<T = object> = ({ ok: true } & T) | { ok: false; message: string };

export async function saveBoardSettings(
  db: Database,
  {
    cycleId,
    triageAfter,
    disagreementSpread,
    actorId,
  }: {
    cycleId: number;
    triageAfter: number | null;
    disagreementSpread: number;
    actorId: number;
  },
): Promise<Outcome> {
  return db.transaction(async (tx) => {
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId)).for("update");
    if (!cycle) return { ok: false, message: "No cycle with this number." };
    if (cycle.state !== "reviewing" && cycle.state !== "deciding")
      return { ok: false, message: "The triage line is placed while the cycle is reviewed or decided." };
    await tx
      .insert(committeeBoards)
      .values({ cycleId, triageAfter, disagreementSpread })
      .onConflictDoUpdate({ target: committeeBoards.cycleId, set: { triageAfter, disagreementSpread } });
    await tx.insert(auditLog).values({
      actorId,
      action: "board.triage",
      detail: { cycleId, cycle: cycle.name, triageAfter, disagreementSpread },
    });
    return { ok: true };
  });
}

/** Stores the grades, decisions, hours and messages of the entries (the proposals must be under review). */
export async function saveDecisions(
  db: Database,
  {
    cycleId,
    entries,
    actorId,
    now = new Date(),
  }: { cycleId: number; entries: DecisionEntry[]; actorId: number; now?: Date },
): Promise<Outcome<{ saved: number }>> {
  return db.transaction(async (tx) => {
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId)).for("update");
    if (!cycle) return { ok: false, message: "No cycle with this number." };
    if (cycle.state !== "deciding")
      return { ok: false, message: "Decisions are recorded only while the cycle is “Decisions in progress”." };
    const ids = entries.map((e) => e.proposalId);
    if (ids.length === 0) return { ok: true, saved: 0 };
    const open = await tx
      .select({ id: proposals.id })
      .from(proposals)
      .where(and(eq(proposals.cycleId, cycleId), inArray(proposals.id, ids), eq(proposals.status, "under_review")));
    if (open.length !== new Set(ids).size)
      return { ok: false, message: "Some of these proposals are not under review in this cycle." };
    for (const e of entries) {
      const row = {
        cycleId,
        finalGrade: e.finalGrade,
        decision: e.decision,
        message: e.message,
        decidedById: actorId,
        updatedAt: now,
      };
      await tx
        .insert(proposalDecisions)
        .values({ proposalId: e.proposalId, ...row, createdAt: now })
        .onConflictDoUpdate({ target: proposalDecisions.proposalId, set: row });
    }
    await tx.delete(allocatedHours).where(inArray(allocatedHours.proposalId, ids));
    const hourRows = entries.flatMap((e) =>
      Object.entries(e.hours)
        .filter(([, h]) => h > 0)
        .map(([cid, hours]) => ({ proposalId: e.proposalId, configurationId: Number(cid), hours })),
    );
    if (hourRows.length) await tx.insert(allocatedHours).values(hourRows);
    await tx.insert(auditLog).values({
      actorId,
      action: "decisions.saved",
      detail: { cycleId, cycle: cycle.name, proposals: ids.length, decided: entries.filter((e) => e.decision).length },
      createdAt: now,
    });
    return { ok: true, saved: entries.length };
  });
}

const STATUS_OF: Record<"accept" | "waitlist" | "decline", ProposalStatus> = {
  accept: "accepted",
  waitlist: "waitlisted",
  decline: "declined",
};

/**
 * Releases the decisions: every proposal under review must have one. Each proposal's status changes,
 * its team is mailed the decision, the hours and the reviewers' comments to the PI (as "Reviewer 1",
 * "Reviewer 2", … in the order they were assigned), and the cycle closes.
 */
export async function releaseDecisions(
  db: Database,
  { cycleId, actorId, now = new Date() }: { cycleId: number; actorId: number; now?: Date },
): Promise<Outcome<{ released: number }>> {
  const out = await db.transaction(async (tx): Promise<Outcome<{ released: number }>> => {
    const [cycle] = await tx.select().from(cycles).where(eq(cycles.id, cycleId)).for("update");
    if (!cycle) return { ok: false, message: "No cycle with this number." };
    if (cycle.state !== "deciding")
      return { ok: false, message: "Decisions are released from a cycle in “Decisions in progress”." };
    const open = await tx
      .select({ proposal: proposals, decision: proposalDecisions })
      .from(proposals)
      .leftJoin(proposalDecisions, eq(proposalDecisions.proposalId, proposals.id))
      .where(and(eq(proposals.cycleId, cycleId), eq(proposals.status, "under_review")))
      .orderBy(asc(proposals.id));
    const undecided = open.filter((o) => !o.decision?.decision);
    if (undecided.length)
      return {
        ok: false,
        message: `${undecided.length} proposal${undecided.length === 1 ? " has" : "s have"} no decision yet: ${undecided
          .slice(0, 5)
          .map((u) => `“${u.proposal.title}”`)
          .join(", ")}${undecided.length > 5 ? ", …" : ""}.`,
      };
    const ids = open.map((o) => o.proposal.id);
    const [hours, comments] = ids.length
      ? await Promise.all([
          tx
            .select({
              proposalId: allocatedHours.proposalId,
              configuration: configurations.name,
              hours: allocatedHours.hours,
            })
            .from(allocatedHours)
            .innerJoin(configurations, configurationOf(allocatedHours.configurationId))
            .where(inArray(allocatedHours.proposalId, ids))
            .orderBy(asc(configurations.name)),
          tx
            .select({ proposalId: reviewAssignments.proposalId, text: reviews.commentToPi })
            .from(reviews)
            .innerJoin(reviewAssignments, reviewOfAssignment)
            .where(and(inArray(reviewAssignments.proposalId, ids), submittedReview, activeAssignment))
            .orderBy(asc(reviewAssignments.id)),
        ])
      : [[], []];
    const bare = open.find(
      (o) => o.decision!.decision === "accept" && !hours.some((h) => h.proposalId === o.proposal.id),
    );
    if (bare)
      return {
        ok: false,
        message: `“${bare.proposal.title}” is accepted without hours: grant hours or change the decision.`,
      };
    for (const { proposal, decision } of open) {
      const kind = decision!.decision!;
      const granted = hours.filter((h) => h.proposalId === proposal.id);
      await tx.update(proposals).set({ status: STATUS_OF[kind], updatedAt: now }).where(eq(proposals.id, proposal.id));
      await tx.update(proposalDecisions).set({ releasedAt: now }).where(eq(proposalDecisions.proposalId, proposal.id));
      await queueDecisionNotices(tx, {
        proposal,
        cycleName: cycle.name,
        decision: kind,
        hours: granted.map((h) => ({ configuration: h.configuration, hours: h.hours })),
        message: decision!.message,
        comments: comments
          .filter((c) => c.proposalId === proposal.id)
          .map((c, i) => ({ label: `Reviewer ${i + 1}`, text: c.text.trim() }))
          .filter((c) => c.text !== ""),
      });
      await tx.insert(auditLog).values({
        actorId,
        action: "decision.released",
        targetUserId: proposal.piId,
        detail: {
          cycleId,
          proposalId: proposal.id,
          title: proposal.title,
          decision: kind,
          hours: Object.fromEntries(granted.map((h) => [h.configuration, h.hours])),
        },
        createdAt: now,
      });
    }
    await tx.update(cycles).set({ state: "closed" }).where(eq(cycles.id, cycleId));
    await tx.insert(auditLog).values({
      actorId,
      action: "cycle.release",
      detail: { cycleId, cycle: cycle.name, from: "deciding", to: "closed", released: open.length },
      createdAt: now,
    });
    return { ok: true, released: open.length };
  });
  if (out.ok) wakeOutboxSender();
  return out;
}
