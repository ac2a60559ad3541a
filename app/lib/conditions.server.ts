/** `where` conditions that recur across the services' writes. */
import { and, type Column, notInArray, type SQL } from "drizzle-orm";

/**
 * The rows `scope` picks except those whose `column` is one of `keep` (every row of the scope when
 * `keep` is empty; `NOT IN ()` is not valid SQL). For "delete what the new list no longer holds".
 */
export function scopeExcept(scope: SQL, column: Column, keep: readonly (number | string)[]): SQL {
  return keep.length ? (and(scope, notInArray(column, [...keep])) as SQL) : scope;
}
