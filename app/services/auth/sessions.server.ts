/** Session rows behind the `fd_session` cookie: random token in the cookie, its SHA-256 in the table. */
import { and, eq, gt, lt, ne, type SQL } from "drizzle-orm";
import type { Database } from "~/db/client.server";
import { sessions } from "~/db/schema/auth";
import { users } from "~/db/schema/users";
import { env } from "~/env.server";
import { SESSION_COOKIE, SESSION_LIFETIME_MS, SESSION_RENEW_BEFORE_MS } from "./config.server";
import { generateSecret, hashSecret, SECRET_PATTERN } from "./tokens.server";

export type SessionMethod = "sso" | "email-link";

export async function createSession(
  db: Database,
  userId: number,
  meta: { method: SessionMethod; userAgent?: string; ipAddress?: string },
  now = new Date(),
) {
  const token = generateSecret();
  const [session] = await db
    .insert(sessions)
    .values({
      id: hashSecret(token),
      userId,
      method: meta.method,
      userAgent: (meta.userAgent ?? "").slice(0, 300),
      ipAddress: meta.ipAddress ?? "",
      createdAt: now,
      lastSeenAt: now,
      expiresAt: new Date(now.getTime() + SESSION_LIFETIME_MS),
    })
    .returning();
  await db.update(users).set({ lastSignInAt: now }).where(eq(users.id, userId));
  return { token, session };
}

/**
 * The live session for a cookie token, or null when unknown, expired or the account is inactive.
 * Slides the expiry forward when less than half the lifetime remains.
 */
export async function validateSessionToken(db: Database, token: string, now = new Date()) {
  if (!SECRET_PATTERN.test(token)) return null;
  const id = hashSecret(token);
  const [row] = await db
    .select({ session: sessions, user: users })
    .from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(eq(sessions.id, id));
  if (!row) return null;
  if (row.session.expiresAt.getTime() <= now.getTime() || !row.user.active) {
    await db.delete(sessions).where(eq(sessions.id, id));
    return null;
  }
  let session = row.session;
  const renew = session.expiresAt.getTime() - now.getTime() < SESSION_RENEW_BEFORE_MS;
  const touch = now.getTime() - session.lastSeenAt.getTime() > 60_000;
  if (renew || touch) {
    const [updated] = await db
      .update(sessions)
      .set({
        lastSeenAt: now,
        ...(renew ? { expiresAt: new Date(now.getTime() + SESSION_LIFETIME_MS) } : {}),
      })
      .where(eq(sessions.id, id))
      .returning();
    session = updated ?? session;
  }
  return { session, user: row.user, renewed: renew };
}

export async function listUserSessions(db: Database, userId: number, now = new Date()) {
  return db
    .select()
    .from(sessions)
    .where(and(eq(sessions.userId, userId), gt(sessions.expiresAt, now)))
    .orderBy(sessions.lastSeenAt);
}

/** Ends the person's sessions that also match `which` (all of them without it); true when any ended. */
async function endSessions(db: Database, userId: number, which?: SQL) {
  const ended = await db
    .delete(sessions)
    .where(and(eq(sessions.userId, userId), which))
    .returning({ id: sessions.id });
  return ended.length > 0;
}

/** Ends one session of the person; false when it is not theirs or has already ended. */
export function revokeSession(db: Database, userId: number, sessionId: string) {
  return endSessions(db, userId, eq(sessions.id, sessionId));
}

export function revokeOtherSessions(db: Database, userId: number, keepSessionId: string) {
  return endSessions(db, userId, ne(sessions.id, keepSessionId));
}

export function revokeAllSessions(db: Database, userId: number) {
  return endSessions(db, userId);
}

export async function deleteExpiredSessions(db: Database, now = new Date()) {
  await db.delete(sessions).where(lt(sessions.expiresAt, now));
}

/** Secure cookies whenever the app is served over https (plain-http loopback servers excepted). */
export function cookieIsSecure(): boolean {
  return env().APP_ORIGIN.startsWith("https:");
}

export function sessionCookieHeader(token: string, expiresAt: Date): string {
  const parts = [
    `${SESSION_COOKIE}=${token}`,
    "Path=/",
    "HttpOnly",
    "SameSite=Lax",
    `Expires=${expiresAt.toUTCString()}`,
  ];
  if (cookieIsSecure()) parts.push("Secure");
  return parts.join("; ");
}

export function clearSessionCookieHeader(): string {
  const parts = [`${SESSION_COOKIE}=`, "Path=/", "HttpOnly", "SameSite=Lax", "Max-Age=0"];
  if (cookieIsSecure()) parts.push("Secure");
  return parts.join("; ");
}

/**
 * The value of cookie `name`, percent-decoded; null when it is absent or cannot be decoded (a
 * mangled cookie such as `fd_session=%` is treated as no cookie, never as an error).
 */
export function readCookie(request: Request, name: string): string | null {
  const header = request.headers.get("Cookie");
  if (!header) return null;
  for (const part of header.split(";")) {
    const [k, ...rest] = part.trim().split("=");
    if (k !== name) continue;
    try {
      return decodeURIComponent(rest.join("="));
    } catch {
      return null;
    }
  }
  return null;
}
