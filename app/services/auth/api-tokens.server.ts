/**
 * Personal API tokens: shown once at creation, stored as SHA-256, revocable, with a last-used time,
 * scopes (what they may do: TOKEN_SCOPES) and an expiry (90 days unless chosen otherwise, at most a
 * year). A token opens the JSON API only; the guards keep it out of every page.
 */
import { and, desc, eq, isNull } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { apiTokens } from "~/db/schema/auth";
import { users } from "~/db/schema/users";
import { DEFAULT_TOKEN_LIFETIME_DAYS, TOKEN_LIFETIMES_DAYS, TOKEN_SCOPES, type TokenScope } from "~/lib/permissions";
import { generateSecret, hashSecret } from "./tokens.server";

/** Tokens start with this so they are easy to spot in scripts and logs. */
export const API_TOKEN_PREFIX = "fdk_";

const DAY_MS = 24 * 3600 * 1000;
const MAX_LIFETIME_DAYS = Math.max(...TOKEN_LIFETIMES_DAYS);

export type NewTokenOptions = {
  /** What the token may do; by default running computations only. */
  scopes?: readonly TokenScope[];
  /** Days until it expires (1 … 365); 90 by default. */
  lifetimeDays?: number;
  now?: Date;
};

export async function createApiToken(db: Database, userId: number, name: string, options: NewTokenOptions = {}) {
  const now = options.now ?? new Date();
  const scopes = TOKEN_SCOPES.filter((s) => (options.scopes ?? ["computations:read"]).includes(s));
  if (scopes.length === 0) throw new RangeError("a token needs at least one scope");
  const days = options.lifetimeDays ?? DEFAULT_TOKEN_LIFETIME_DAYS;
  if (!Number.isInteger(days) || days < 1 || days > MAX_LIFETIME_DAYS) {
    throw new RangeError(`a token lives 1 to ${MAX_LIFETIME_DAYS} days`);
  }
  const token = `${API_TOKEN_PREFIX}${generateSecret()}`;
  const [row] = await db
    .insert(apiTokens)
    .values({
      userId,
      name,
      tokenHash: hashSecret(token),
      prefix: token.slice(0, 10),
      scopes,
      createdAt: now,
      expiresAt: new Date(now.getTime() + days * DAY_MS),
    })
    .returning();
  return { token, row };
}

export async function listApiTokens(db: Database, userId: number) {
  return db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      prefix: apiTokens.prefix,
      scopes: apiTokens.scopes,
      createdAt: apiTokens.createdAt,
      expiresAt: apiTokens.expiresAt,
      lastUsedAt: apiTokens.lastUsedAt,
      revokedAt: apiTokens.revokedAt,
    })
    .from(apiTokens)
    .where(eq(apiTokens.userId, userId))
    .orderBy(desc(apiTokens.createdAt));
}

export async function revokeApiToken(db: Database, userId: number, tokenId: number) {
  const rows = await db
    .update(apiTokens)
    .set({ revokedAt: new Date() })
    .where(and(eq(apiTokens.id, tokenId), eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
    .returning({ id: apiTokens.id });
  return rows.length > 0;
}

export type TokenCheck =
  | { ok: true; user: typeof users.$inferSelect; tokenId: number; scopes: TokenScope[]; expiresAt: Date }
  | { ok: false; reason: "unknown" }
  | { ok: false; reason: "expired"; expiresAt: Date };

/**
 * The active account behind a bearer token with what the token may do; or why not: unknown
 * (never issued, revoked, or the account switched off) or expired.
 */
export async function checkApiToken(db: Database, token: string, now = new Date()): Promise<TokenCheck> {
  if (!token.startsWith(API_TOKEN_PREFIX) || token.length > 100) return { ok: false, reason: "unknown" };
  const [row] = await db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hashSecret(token)), isNull(apiTokens.revokedAt)));
  if (!row?.user.active) return { ok: false, reason: "unknown" };
  if (row.token.expiresAt.getTime() <= now.getTime()) {
    return { ok: false, reason: "expired", expiresAt: row.token.expiresAt };
  }
  await db.update(apiTokens).set({ lastUsedAt: now }).where(eq(apiTokens.id, row.token.id));
  const scopes = TOKEN_SCOPES.filter((s) => row.token.scopes.includes(s));
  return { ok: true, user: row.user, tokenId: row.token.id, scopes, expiresAt: row.token.expiresAt };
}

/** The active account behind a bearer token, or null (unknown, revoked, expired, or account inactive). */
export async function authenticateApiToken(db: Database, token: string, now = new Date()) {
  const check = await checkApiToken(db, token, now);
  return check.ok ? check.user : null;
}
