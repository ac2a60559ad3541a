import { and, gt, inArray, lt, sql } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { signInAttempts } from "~/db/schema/auth";
import { signInRateLimits } from "./config.server";

export type RateLimitResult = { ok: true } | { ok: false; retryAfterSeconds: number; message: string };

/**
 * The bucket an address counts in: an IPv4 address on its own; an IPv6 address by its /64 network
 * (one host or home usually holds a whole /64, so counting single addresses would let it rotate).
 */
export function addressBucket(address: string): string {
  const a = address.trim().toLowerCase();
  if (!a.includes(":")) return a || "unknown";
  const [head, tail = ""] = a.split("::");
  const left = head ? head.split(":") : [];
  const right = tail ? tail.split(":") : [];
  const groups = a.includes("::")
    ? [...left, ...Array(Math.max(0, 8 - left.length - right.length)).fill("0"), ...right]
    : left;
  if (groups.length !== 8 || groups.some((g) => !/^[0-9a-f]{1,4}$/.test(g))) return a;
  return `${groups
    .slice(0, 4)
    .map((g) => g.replace(/^0+(?=.)/, ""))
    .join(":")}::/64`;
}

/**
 * Records a sign-in attempt for the client address (and the e-mail address when given) and says
 * whether it stays within the limits in force (signInRateLimits). A refused attempt is not recorded.
 */
export async function recordSignInAttempt(
  db: Database,
  input: { address: string; email?: string },
  now = new Date(),
  limits: { windowMs: number; perAddress: number; perEmail: number } = signInRateLimits(),
): Promise<RateLimitResult> {
  const since = new Date(now.getTime() - limits.windowMs);
  const keys = [`ip:${addressBucket(input.address)}`];
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
