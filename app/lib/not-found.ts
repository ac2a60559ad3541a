/**
 * One way to say "not found": route ids parsed strictly, and a one-line guard that throws the 404
 * page (or any other status) when a row is missing.
 */
import { data } from "react-router";

/** Largest id a PostgreSQL `serial`/`integer` column holds. */
export const MAX_ROW_ID = 2_147_483_647;

/** A row id from a route or query parameter: digits only, 1 … 2³¹−1; null for anything else. */
export function toId(raw: string | null | undefined): number | null {
  if (typeof raw !== "string" || !/^\d{1,10}$/.test(raw.trim())) return null;
  const id = Number(raw);
  return id >= 1 && id <= MAX_ROW_ID ? id : null;
}

/** Throws the error page with `message` (404 unless told otherwise). */
export function notFound(message: string, status = 404): never {
  throw data(message, { status });
}

/**
 * Narrows `value` to a present value, or throws the 404 page with `message`:
 * `invariantResponse(row, "There is no station with that number.")`.
 */
export function invariantResponse<T>(value: T, message: string, status = 404): asserts value is NonNullable<T> {
  if (value === null || value === undefined || value === false) notFound(message, status);
}

/** A row id from a route parameter, or the 404 page "There is no {what} with that number.". */
export function idParam(raw: string | undefined, what: string): number {
  const id = toId(raw);
  invariantResponse(id, `There is no ${what} with that number.`);
  return id;
}

/**
 * The row a route parameter names, or the 404 page with `message` when the parameter is no id or
 * `load` finds nothing: `await rowOfParam(params.cycleId, (cycleId) => getCycle(db, { cycleId }), "…")`.
 */
export async function rowOfParam<T>(
  raw: string | undefined,
  load: (id: number) => Promise<T | null | undefined>,
  message: string,
): Promise<NonNullable<T>> {
  const id = toId(raw);
  const row = id === null ? null : await load(id);
  invariantResponse(row, message);
  return row;
}
