import { and, gt, inArray, lt, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { signInAttempts } from "~/db/schema/auth";
import { RATE_LIMITS } from "./config.server";

export type RateLimitResult = { ok: true } | { ok: false; retryAfterSeconds: number; message: string };

/**
 * Records a sign-in attempt for the client address (and the e-mail address when given) and says
 * whether it stays within the limits of RATE_LIMITS. A refused attempt is not recorded.
 */
export async function recordSignInAttempt(
  db: Database,
  input: { address: string; email?: string },
  now = new Date(),
  limits: { windowMs: number; perAddress: number; perEmail: number } = RATE_LIMITS,
): Promise<RateLimitResult> {
  const since = new Date(now.getTime() - limits.windowMs);
  const keys = [`ip:${input.address}`];
  if (input.email) keys.push(`email:${input.email.trim().toLowerCase()}`);
  const counts = await db
    .select({
      key: signInAttempts.key,
      n: sql<number>`count(*)::int`,
      oldest: sql<Date>`min(${signInAttempts.attemptedAt})`,
    })
    .from(signInAttempts)
    .where(and(inArray(signInAttempts.key, keys), gt(signInAttempts.attemptedAt, since)))
    .groupBy(signInAttempts.key);
  for (const c of counts) {
    const limit = c.key.startsWith("ip:") ? limits.perAddress : limits.perEmail;
    if (c.n >= limit) {
      const oldest = new Date(c.oldest).getTime();
      const retryAfterSeconds = Math.max(1, Math.ceil((oldest + limits.windowMs - now.getTime()) / 1000));
      const minutes = Math.ceil(retryAfterSeconds / 60);
      const who = c.key.startsWith("ip:") ? "from this network address" : "for this e-mail address";
      return {
        ok: false,
        retryAfterSeconds,
        message: `Too many sign-in attempts ${who}. Please wait about ${minutes} minute${minutes === 1 ? "" : "s"} and try again.`,
      };
    }
  }
  await db.insert(signInAttempts).values(keys.map((key) => ({ key, attemptedAt: now })));
  // Old attempts are of no further use.
  await db.delete(signInAttempts).where(lt(signInAttempts.attemptedAt, new Date(now.getTime() - 24 * 3600 * 1000)));
  return { ok: true };
}
