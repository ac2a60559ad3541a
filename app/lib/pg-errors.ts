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

/** Network error codes of a database that cannot be reached (Node's, and postgres.js's own). */
const UNREACHABLE_CODES = new Set([
  "ECONNREFUSED",
  "ECONNRESET",
  "ETIMEDOUT",
  "EHOSTUNREACH",
  "ENETUNREACH",
  "ENOTFOUND",
  "EAI_AGAIN",
  "EPIPE",
  "CONNECT_TIMEOUT",
  "CONNECTION_CLOSED",
  "CONNECTION_ENDED",
  "CONNECTION_DESTROYED",
]);

/**
 * SQLSTATEs of a database that is down, restarting, overloaded or too slow: class 08 (connection
 * exception), 53300 too many connections, 57014 query canceled (the statement timeout), 57P01–57P03
 * (shut down, crashed, not yet accepting connections).
 */
function unavailableState(code: string): boolean {
  return code.startsWith("08") || ["53300", "57014", "57P01", "57P02", "57P03"].includes(code);
}

/**
 * True when `error` means the database is not answering (down, unreachable, restarting or past the
 * statement timeout) rather than that the request was wrong. Looks through wrapping errors (`cause`)
 * and the parts of an AggregateError (a refused connection to every address of a host name).
 */
export function isDatabaseUnavailable(error: unknown, depth = 0): boolean {
  if (!error || typeof error !== "object" || depth > 5) return false;
  const e = error as { code?: unknown; cause?: unknown; errors?: unknown };
  if (
    typeof e.code === "string" &&
    (UNREACHABLE_CODES.has(e.code) || (/^[0-9A-Z]{5}$/.test(e.code) && unavailableState(e.code)))
  )
    return true;
  if (Array.isArray(e.errors) && e.errors.some((x) => isDatabaseUnavailable(x, depth + 1))) return true;
  return isDatabaseUnavailable(e.cause, depth + 1);
}

/**
 * True for a PostgreSQL data exception (SQLSTATE class 22: a value out of range, a NUL byte in text,
 * a malformed number): input the app should have refused before it reached the database.
 */
export function isDataException(error: unknown): boolean {
  return pgCode(error)?.startsWith("22") ?? false;
}
