/**
 * Valibot rules for values read from the environment (strings), shared by every part of the server's
 * env schema: a whole number written in digits and a TCP port.
 */
import * as v from "valibot";

/**
 * Digits only, read as a whole number in [min, max]. `what` follows "must be a whole number" in the
 * message, e.g. "of milliseconds".
 */
export const envWholeNumber = (min: number, max: number, what?: string) =>
  v.pipe(
    v.string(),
    v.regex(/^\d+$/, what ? `must be a whole number ${what}` : "must be a whole number"),
    v.transform(Number),
    v.minValue(min, `must be at least ${min}`),
    v.maxValue(max, `must be at most ${max}`),
  );

/** A TCP port, 1 to 65535, with its default. */
export const envPort = (fallback: string) =>
  v.optional(
    v.pipe(
      v.string(),
      v.regex(/^\d{1,5}$/, "must be a port number"),
      v.transform(Number),
      v.minValue(1, "must be a port number"),
      v.maxValue(65535, "must be a port number"),
    ),
    fallback,
  );
