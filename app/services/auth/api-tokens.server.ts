/** Personal API tokens: shown once at creation, stored as SHA-256, revocable, with a last-used time. */
import { and, desc, eq, isNull } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { apiTokens } from "~/db/schema/auth";
import { users } from "~/db/schema/users";
import { generateSecret, hashSecret } from "./tokens.server";

/** Tokens start with this so they are easy to spot in scripts and logs. */
export const API_TOKEN_PREFIX = "fdk_";

export async function createApiToken(db: Database, userId: number, name: string) {
  const token = `${API_TOKEN_PREFIX}${generateSecret()}`;
  const [row] = await db
    .insert(apiTokens)
    .values({ userId, name, tokenHash: hashSecret(token), prefix: token.slice(0, 10) })
    .returning();
  return { token, row };
}

export async function listApiTokens(db: Database, userId: number) {
  return db
    .select({
      id: apiTokens.id,
      name: apiTokens.name,
      prefix: apiTokens.prefix,
      createdAt: apiTokens.createdAt,
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

/** The active account behind a bearer token, or null (unknown, revoked, or account inactive). */
export async function authenticateApiToken(db: Database, token: string, now = new Date()) {
  if (!token.startsWith(API_TOKEN_PREFIX) || token.length > 100) return null;
  const [row] = await db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, hashSecret(token)), isNull(apiTokens.revokedAt)));
  if (!row?.user.active) return null;
  await db.update(apiTokens).set({ lastUsedAt: now }).where(eq(apiTokens.id, row.token.id));
  return row.user;
}
