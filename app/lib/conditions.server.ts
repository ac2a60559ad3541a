/** `where` conditions that recur across the services' queries and writes. */
import { and, type Column, eq, isNotNull, notInArray, type SQL } from "drizzle-orm";
import { reviewAssignments, reviews } from "~/db/schema/committee";

/** An assignment in force: not declined. */
export const activeAssignment = eq(reviewAssignments.status, "active");

/** A review its reviewer has submitted (drafts are the reviewer's own). */
export const submittedReview = isNotNull(reviews.submittedAt);

/**
 * The rows `scope` picks except those whose `column` is one of `keep` (every row of the scope when
 * `keep` is empty; `NOT IN ()` is not valid SQL). For "delete what the new list no longer holds".
 */
export function scopeExcept(scope: SQL, column: Column, keep: readonly (number | string)[]): SQL {
  return keep.length ? (and(scope, notInArray(column, [...keep])) as SQL) : scope;
}
