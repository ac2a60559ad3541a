/**
 * What the committee's decisions give others:
 *  - the proposer's page: the released decision of a proposal, the chair's message, the hours per
 *    configuration and the reviewers' comments to the PI (anonymous) — `decisionForTeam`;
 *  - the night plans: every accepted program of a cycle with its targets and the hours each target is
 *    owed — `acceptedPrograms`. The hours live in `allocated_hours` (proposal_id, configuration_id,
 *    hours) for proposals whose `proposal_decisions.decision` is "accept" and `released_at` is set.
 */
import { and, asc, eq, inArray, isNotNull } from "drizzle-orm";
import type { DbOrTx } from "~/db/client.server";
import { configurations } from "~/db/schema/array";
import { allocatedHours, proposalDecisions, reviewAssignments, reviews } from "~/db/schema/committee";
import { type CalibratorJson, cycles, proposals, proposalTargets } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { activeAssignment, submittedReview } from "~/lib/conditions.server";
import { configurationOf, piOfProposal, reviewOfAssignment } from "~/lib/joins.server";

export const DECISION_WORDS = { accept: "Accepted", waitlist: "Waiting list", decline: "Not accepted" } as const;

export type TeamDecision = {
  cycleName: string;
  decision: "accept" | "waitlist" | "decline";
  words: string;
  message: string;
  hours: { configuration: string; hours: number }[];
  totalHours: number;
  comments: { label: string; text: string }[];
  releasedAt: string;
};

/**
 * The released decision of a proposal for its team, or null while none has been released. The caller
 * has checked that the viewer is on the team (the proposal pages' own access rule).
 */
export async function decisionForTeam(
  db: DbOrTx,
  { proposalId }: { proposalId: number },
): Promise<TeamDecision | null> {
  const [row] = await db
    .select({ decision: proposalDecisions, cycle: cycles.name })
    .from(proposalDecisions)
    .innerJoin(cycles, eq(cycles.id, proposalDecisions.cycleId))
    .where(and(eq(proposalDecisions.proposalId, proposalId), isNotNull(proposalDecisions.releasedAt)));
  if (!row?.decision.decision || !row.decision.releasedAt) return null;
  const [hours, comments] = await Promise.all([
    db
      .select({ configuration: configurations.name, hours: allocatedHours.hours })
      .from(allocatedHours)
      .innerJoin(configurations, configurationOf(allocatedHours.configurationId))
      .where(eq(allocatedHours.proposalId, proposalId))
      .orderBy(asc(configurations.name)),
    db
      .select({ text: reviews.commentToPi })
      .from(reviews)
      .innerJoin(reviewAssignments, reviewOfAssignment)
      .where(and(eq(reviewAssignments.proposalId, proposalId), activeAssignment, submittedReview))
      .orderBy(asc(reviewAssignments.id)),
  ]);
  const kind = row.decision.decision;
  return {
    cycleName: row.cycle,
    decision: kind,
    words: DECISION_WORDS[kind],
    message: row.decision.message,
    hours: kind === "accept" ? hours : [],
    totalHours: kind === "accept" ? hours.reduce((s, h) => s + h.hours, 0) : 0,
    comments: comments
      .map((c, i) => ({ label: `Reviewer ${i + 1}`, text: c.text.trim() }))
      .filter((c) => c.text !== ""),
    releasedAt: row.decision.releasedAt.toISOString(),
  };
}

export type AcceptedProgram = {
  proposalId: number;
  title: string;
  pi: string;
  /** The board's order when decided: grade first, as stored; lower number = higher priority. */
  finalGrade: number | null;
  configurationId: number;
  configuration: string;
  allocatedHours: number;
  targets: {
    name: string;
    raDeg: number;
    decDeg: number;
    minElevationDeg: number | null;
    calibrators: CalibratorJson[];
    /** The configuration's hours shared equally among the proposal's targets (as they were requested). */
    hoursOwed: number;
  }[];
};

/**
 * Accepted programs of a cycle, one entry per (proposal, configuration) with hours: the input of the
 * night plans. Only released decisions count.
 */
export async function acceptedPrograms(db: DbOrTx, { cycleId }: { cycleId: number }): Promise<AcceptedProgram[]> {
  const rows = await db
    .select({
      proposalId: proposals.id,
      title: proposals.title,
      pi: users.name,
      finalGrade: proposalDecisions.finalGrade,
      configurationId: allocatedHours.configurationId,
      configuration: configurations.name,
      hours: allocatedHours.hours,
    })
    .from(proposalDecisions)
    .innerJoin(proposals, eq(proposals.id, proposalDecisions.proposalId))
    .innerJoin(users, piOfProposal)
    .innerJoin(allocatedHours, eq(allocatedHours.proposalId, proposals.id))
    .innerJoin(configurations, configurationOf(allocatedHours.configurationId))
    .where(
      and(
        eq(proposalDecisions.cycleId, cycleId),
        eq(proposalDecisions.decision, "accept"),
        isNotNull(proposalDecisions.releasedAt),
        inArray(proposals.status, ["accepted", "scheduled"]),
      ),
    )
    .orderBy(asc(proposals.id), asc(configurations.name));
  const ids = [...new Set(rows.map((r) => r.proposalId))];
  const targets = ids.length
    ? await db
        .select()
        .from(proposalTargets)
        .where(inArray(proposalTargets.proposalId, ids))
        .orderBy(asc(proposalTargets.position), asc(proposalTargets.id))
    : [];
  return rows.map((r) => {
    const mine = targets.filter((t) => t.proposalId === r.proposalId);
    return {
      proposalId: r.proposalId,
      title: r.title,
      pi: r.pi,
      finalGrade: r.finalGrade,
      configurationId: r.configurationId,
      configuration: r.configuration,
      allocatedHours: r.hours,
      targets: mine.map((t) => ({
        name: t.name,
        raDeg: t.raDeg,
        decDeg: t.decDeg,
        minElevationDeg: t.minElevationDeg,
        calibrators: t.calibrators,
        hoursOwed: mine.length ? r.hours / mine.length : 0,
      })),
    };
  });
}
