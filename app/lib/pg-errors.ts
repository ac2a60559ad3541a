/** PostgreSQL error codes (SQLSTATE, PostgreSQL documentation appendix A) and how to read them. */

export const PG_UNIQUE_VIOLATION = "23505";
export const PG_FOREIGN_KEY_VIOLATION = "23503";
export const PG_CHECK_VIOLATION = "23514";
export const PG_SERIALIZATION_FAILURE = "40001";

/** The SQLSTATE of a PostgreSQL error, also when the query builder wrapped it (looks 4 causes deep). */
export function pgCode(error: unknown): string | undefined {
  let e = error as { code?: unknown; cause?: unknown } | undefined;
  for (let depth = 0; e && depth < 4; depth++) {
    if (typeof e.code === "string" && /^[0-9A-Z]{5}$/.test(e.code)) return e.code;
    e = e.cause as typeof e;
  }
  return undefined;
}

/** True for a unique-constraint violation (a name already taken). */
export function isUniqueViolation(error: unknown): boolean {
  return pgCode(error) === PG_UNIQUE_VIOLATION;
}
