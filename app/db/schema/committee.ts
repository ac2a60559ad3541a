import {
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  uniqueIndex,
} from "drizzle-orm/pg-core";
import { sites } from "./array";
import { instant, keyRefTo, optionalRefTo, refTo, serialId, timestamps } from "./columns";
import { cycles, hoursPerConfiguration, proposals } from "./proposals";
import { users } from "./users";

/**
 * The time-allocation committee of a cycle: its members, their conflicts and assignments, the reviews,
 * the chair's board (triage line, grades, decisions with allocated hours) and the darkness of the cycle
 * kept for the board.
 */

/** The reviewers of a cycle (people with the reviewer role the chair put on its committee). */
export const committeeMembers = pgTable(
  "committee_members",
  {
    cycleId: refTo(() => cycles.id),
    userId: refTo(() => users.id),
    addedAt: instant("added_at").notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.cycleId, t.userId] }), index("committee_members_user_idx").on(t.userId)],
);

/**
 * Conflicts a reviewer declared on a proposal, with the reason. The automatic ones (on the team, same
 * institute) are not stored: they follow from the team and the institutes at any moment.
 */
export const reviewConflicts = pgTable(
  "review_conflicts",
  {
    id: serialId(),
    proposalId: refTo(() => proposals.id),
    reviewerId: refTo(() => users.id),
    reason: text("reason").notNull(),
    declaredAt: instant("declared_at").notNull().defaultNow(),
  },
  (t) => [uniqueIndex("review_conflicts_key").on(t.proposalId, t.reviewerId)],
);

export const ASSIGNMENT_STATUSES = ["active", "declined"] as const;
export type AssignmentStatus = (typeof ASSIGNMENT_STATUSES)[number];
export const assignmentStatusEnum = pgEnum("assignment_status", ASSIGNMENT_STATUSES);

/** A reviewer asked to review a proposal; declined with a reason when the reviewer cannot. */
export const reviewAssignments = pgTable(
  "review_assignments",
  {
    id: serialId(),
    cycleId: refTo(() => cycles.id),
    proposalId: refTo(() => proposals.id),
    reviewerId: refTo(() => users.id),
    status: assignmentStatusEnum("status").notNull().default("active"),
    declineReason: text("decline_reason"),
    declinedAt: instant("declined_at"),
    assignedById: optionalRefTo(() => users.id),
    assignedAt: instant("assigned_at").notNull().defaultNow(),
    /** When the reviewer was last sent a reminder about this review. */
    remindedAt: instant("reminded_at"),
  },
  (t) => [
    uniqueIndex("review_assignments_key").on(t.proposalId, t.reviewerId),
    index("review_assignments_cycle_idx").on(t.cycleId),
    index("review_assignments_reviewer_idx").on(t.reviewerId),
  ],
);

export const REVIEW_CONFIDENCES = ["low", "medium", "high"] as const;
export type ReviewConfidence = (typeof REVIEW_CONFIDENCES)[number];
export const reviewConfidenceEnum = pgEnum("review_confidence", REVIEW_CONFIDENCES);

/**
 * A reviewer's review of one assignment: a draft until `submittedAt` is set. `version` grows by one
 * with every save; a save names the version it started from and is refused when another save came
 * first (optimistic concurrency), so nothing is overwritten unseen.
 */
export const reviews = pgTable(
  "reviews",
  {
    id: serialId(),
    assignmentId: refTo(() => reviewAssignments.id),
    /** On the cycle's scale (cycles.score_best … score_worst); null while a draft has none. */
    score: doublePrecision("score"),
    commentToPi: text("comment_to_pi").notNull().default(""),
    commentToCommittee: text("comment_to_committee").notNull().default(""),
    confidence: reviewConfidenceEnum("confidence"),
    submittedAt: instant("submitted_at"),
    version: integer("version").notNull().default(1),
    ...timestamps,
  },
  (t) => [uniqueIndex("reviews_assignment_key").on(t.assignmentId)],
);

/** The chair's settings of a cycle's Ranking board. */
export const committeeBoards = pgTable("committee_boards", {
  cycleId: keyRefTo(() => cycles.id),
  /** Proposals ranked below this position (in the board's order) are not discussed; null = no line. */
  triageAfter: integer("triage_after"),
  /** A proposal whose scores spread (population SD) more than this is flagged as a disagreement. */
  disagreementSpread: doublePrecision("disagreement_spread").notNull().default(1),
  updatedAt: instant("updated_at")
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
});

export const DECISIONS = ["accept", "waitlist", "decline"] as const;
export type Decision = (typeof DECISIONS)[number];
export const decisionEnum = pgEnum("committee_decision", DECISIONS);

/**
 * The chair's record of a proposal: the final grade after the discussion (on the cycle's scale), the
 * decision with its message to the team, and when the decision was released (sent to the team).
 */
export const proposalDecisions = pgTable(
  "proposal_decisions",
  {
    proposalId: keyRefTo(() => proposals.id),
    cycleId: refTo(() => cycles.id),
    finalGrade: doublePrecision("final_grade"),
    decision: decisionEnum("decision"),
    message: text("message").notNull().default(""),
    decidedById: optionalRefTo(() => users.id),
    releasedAt: instant("released_at"),
    ...timestamps,
  },
  (t) => [index("proposal_decisions_cycle_idx").on(t.cycleId)],
);

/**
 * Hours granted to an accepted proposal per configuration: the input of the night plans (each target of
 * the proposal owes its share of its configuration's hours).
 */
export const allocatedHours = hoursPerConfiguration("allocated_hours");

/**
 * The darkness of a cycle's period at one site, as the engine computed it (every night, 24 LST bins),
 * kept so the Ranking board does not recompute it on every load. `fingerprint` names what it was
 * computed from (site position, period, bins); a different fingerprint means recompute.
 */
export const cycleDarkTime = pgTable(
  "cycle_dark_time",
  {
    cycleId: refTo(() => cycles.id),
    siteId: refTo(() => sites.id),
    fingerprint: text("fingerprint").notNull(),
    darkTime: jsonb("dark_time").$type<Record<string, unknown>>().notNull(),
    computedAt: instant("computed_at").notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.cycleId, t.siteId] })],
);
