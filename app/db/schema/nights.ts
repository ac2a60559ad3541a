import { sql } from "drizzle-orm";
import { check, date, index, integer, jsonb, pgEnum, pgTable, text } from "drizzle-orm/pg-core";
import { configurations } from "./array";
import { instant, optionalRefTo, refTo, serialId, timestamps } from "./columns";
import { cycles, proposals, proposalTargets } from "./proposals";
import { users } from "./users";

/**
 * The Night builder: which configuration is on the array each night of a cycle, and each night's plan of
 * calibrator–science–calibrator blocks with what became of every block. A night is named by its date D
 * (it begins on the local evening of D, CONVENTIONS.md); the array has one plan per night.
 */

/** A plan is a draft while the scheduler builds it, published once the PIs are told, executed once every block is marked. */
export const NIGHT_PLAN_STATES = ["draft", "published", "executed"] as const;
export type NightPlanState = (typeof NIGHT_PLAN_STATES)[number];
export const nightPlanStateEnum = pgEnum("night_plan_state", NIGHT_PLAN_STATES);

export const BLOCK_KINDS = ["calibrator", "science"] as const;
export type BlockKind = (typeof BLOCK_KINDS)[number];
export const blockKindEnum = pgEnum("night_block_kind", BLOCK_KINDS);

/** What became of a block: still planned, observed, or lost (to the weather or to a technical fault). */
export const BLOCK_OUTCOMES = ["planned", "executed", "weather", "technical"] as const;
export type BlockOutcome = (typeof BLOCK_OUTCOMES)[number];
export const blockOutcomeEnum = pgEnum("night_block_outcome", BLOCK_OUTCOMES);

/** The planner settings a plan was built with (degrees and minutes); the rest comes from the site. */
export type NightPlanSettingsJson = {
  minElevationDeg: number;
  moonMinSeparationDeg: number;
  sunMinSeparationDeg: number;
  scienceBlockMin: number;
  calibratorBlockMin: number;
};

/** What the last automatic plan (or re-plan) reported: targets without time and the planner's warnings. */
export type NightPlanReportJson = {
  unplaced: { target: string; code: string; reason: string }[];
  warnings: string[];
};

/** The configuration installed on the array for one night of a cycle (set by the scheduler in runs of nights). */
export const nightConfigurations = pgTable(
  "night_configurations",
  {
    nightDate: date("night_date").primaryKey(),
    cycleId: refTo(() => cycles.id),
    configurationId: refTo(() => configurations.id, "restrict"),
    setById: optionalRefTo(() => users.id),
    ...timestamps,
  },
  (t) => [index("night_configurations_cycle_idx").on(t.cycleId, t.nightDate)],
);

/** One night's plan. */
export const nightPlans = pgTable(
  "night_plans",
  {
    id: serialId(),
    nightDate: date("night_date").notNull().unique("night_plans_night_key"),
    cycleId: refTo(() => cycles.id),
    configurationId: refTo(() => configurations.id, "restrict"),
    state: nightPlanStateEnum("state").notNull().default("draft"),
    settings: jsonb("settings").$type<NightPlanSettingsJson>().notNull(),
    report: jsonb("report").$type<NightPlanReportJson>().notNull().default({ unplaced: [], warnings: [] }),
    createdById: optionalRefTo(() => users.id),
    publishedAt: instant("published_at"),
    publishedById: optionalRefTo(() => users.id),
    ...timestamps,
  },
  (t) => [index("night_plans_cycle_idx").on(t.cycleId)],
);

/**
 * A block of a plan, in time order (`position`). `target` is the science target served and `object` what
 * the telescopes point at, by the names the plan used; the proposal and its target are kept as references
 * (cleared if they are deleted, the names stay).
 */
export const nightPlanBlocks = pgTable(
  "night_plan_blocks",
  {
    id: serialId(),
    planId: refTo(() => nightPlans.id),
    position: integer("position").notNull(),
    kind: blockKindEnum("kind").notNull(),
    target: text("target").notNull(),
    object: text("object").notNull(),
    proposalId: optionalRefTo(() => proposals.id),
    proposalTargetId: optionalRefTo(() => proposalTargets.id),
    startUtc: instant("start_utc").notNull(),
    endUtc: instant("end_utc").notNull(),
    outcome: blockOutcomeEnum("outcome").notNull().default("planned"),
    note: text("note").notNull().default(""),
    markedAt: instant("marked_at"),
    markedById: optionalRefTo(() => users.id),
  },
  (t) => [
    index("night_plan_blocks_plan_idx").on(t.planId, t.position),
    index("night_plan_blocks_target_idx").on(t.proposalTargetId),
    index("night_plan_blocks_proposal_idx").on(t.proposalId),
    check("night_plan_blocks_time_check", sql`${t.endUtc} > ${t.startUtc}`),
  ],
);

export type NightPlan = typeof nightPlans.$inferSelect;
export type NightPlanBlock = typeof nightPlanBlocks.$inferSelect;
