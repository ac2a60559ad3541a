/**
 * The signed-in person's own account: where they are signed in and their API tokens, each of which
 * only they can end. Every call is scoped by `userId`; an id that is not theirs changes nothing.
 */
import type { Database } from "~/db/client.server";
import { formatUtc, utcText } from "~/lib/format";
import type { TokenScope } from "~/lib/permissions";
import { createApiToken, listApiTokens, revokeApiToken } from "~/services/auth/api-tokens.server";
import { listUserSessions, revokeOtherSessions, revokeSession } from "~/services/auth/sessions.server";

/** The person's live sessions (most recently used first) and tokens, with their instants as UTC text. */
export async function accountOverview(db: Database, { userId }: { userId: number }) {
  const [sessions, tokens] = await Promise.all([listUserSessions(db, userId), listApiTokens(db, userId)]);
  return {
    sessions: sessions
      .map((s) => ({
        id: s.id,
        method: s.method,
        userAgent: s.userAgent,
        address: s.ipAddress,
        started: formatUtc(s.createdAt),
        lastUsed: formatUtc(s.lastSeenAt),
        expires: formatUtc(s.expiresAt),
      }))
      .reverse(),
    tokens: tokens.map((t) => ({
      id: t.id,
      name: t.name,
      prefix: t.prefix,
      scopes: t.scopes,
      created: formatUtc(t.createdAt),
      expires: formatUtc(t.expiresAt),
      expired: t.expiresAt.getTime() <= Date.now(),
      lastUsed: utcText(t.lastUsedAt) ?? "never",
      revokedAt: t.revokedAt?.toISOString() ?? null,
    })),
  };
}

export type AccountSession = Awaited<ReturnType<typeof accountOverview>>["sessions"][number];
export type AccountToken = Awaited<ReturnType<typeof accountOverview>>["tokens"][number];

/** Signs out one of the person's sessions; false when it is not theirs or has already ended. */
export function endSession(db: Database, { userId, sessionId }: { userId: number; sessionId: string }) {
  return revokeSession(db, userId, sessionId);
}

/** Signs out every session of the person but `keepSessionId` (the browser asking). */
export function endOtherSessions(db: Database, { userId, keepSessionId }: { userId: number; keepSessionId: string }) {
  return revokeOtherSessions(db, userId, keepSessionId);
}

/** A new token for the person, with its scopes and lifetime; the secret is in the answer and nowhere else. */
export async function issueApiToken(
  db: Database,
  { userId, name, scopes, lifetimeDays }: { userId: number; name: string; scopes: TokenScope[]; lifetimeDays: number },
) {
  const { token, row } = await createApiToken(db, userId, name, { scopes, lifetimeDays });
  return { name, token, scopes: row.scopes, expires: formatUtc(row.expiresAt) };
}

/** Revokes one of the person's tokens; false when it is not theirs or is already revoked. */
export function withdrawApiToken(db: Database, { userId, tokenId }: { userId: number; tokenId: number }) {
  return revokeApiToken(db, userId, tokenId);
}
