/**
 * The join conditions that recur across the services' queries, each named after the foreign key it
 * follows, so that a query reads `.innerJoin(users, piOfProposal)` and every query follows a key the same
 * way. Conditions that only one query uses stay in that query.
 */
import { eq } from "drizzle-orm";
import type { AnyPgColumn } from "drizzle-orm/pg-core";
import { configurations } from "~/db/schema/array";
import { reviewAssignments, reviews } from "~/db/schema/committee";
import { nightPlanBlocks, nightPlans } from "~/db/schema/nights";
import { proposals } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";

/** A review and the assignment it answers (either side may be the one joined). */
export const reviewOfAssignment = eq(reviews.assignmentId, reviewAssignments.id);

/** The proposal an assignment is for. */
export const proposalOfAssignment = eq(proposals.id, reviewAssignments.proposalId);

/** The reviewer (a user) of an assignment. */
export const reviewerOfAssignment = eq(users.id, reviewAssignments.reviewerId);

/** The principal investigator (a user) of a proposal. */
export const piOfProposal = eq(users.id, proposals.piId);

/** The night plan a block belongs to. */
export const planOfBlock = eq(nightPlans.id, nightPlanBlocks.planId);

/** The configuration a row names in its `configurationId` column. */
export const configurationOf = (configurationId: AnyPgColumn) => eq(configurations.id, configurationId);
