/**
 * Sign-in by e-mail link for people without single sign-on: a single-use token, stored hashed,
 * valid 15 minutes, sent through the outbox in the same transaction that stores it.
 */
import { and, eq, gt, isNull } from "drizzle-orm";
import { createElement } from "react";
import type { Database } from "~/db/client.server";
import { emailSignInTokens } from "~/db/schema/auth";
import { SignInLinkEmail } from "~/emails/SignInLinkEmail";
import { env } from "~/env.server";
import { enqueueMail } from "~/services/mail/outbox.server";
import { wakeOutboxSender } from "~/services/mail/sender.server";
import { findOrCreateAccount, findUserByEmail } from "./accounts.server";
import { EMAIL_LINK_LIFETIME_MS, EMAIL_LINK_USEFUL_MS } from "./config.server";
import { generateSecret, hashSecret, SECRET_PATTERN } from "./tokens.server";

/**
 * Stores a new link token for `email` and queues the message carrying it. Returns the link. The
 * message is given up (and a notice asking to request a new link sent instead) when the mail server
 * has not taken it while the link still has EMAIL_LINK_USEFUL_MS to run.
 */
export async function sendSignInLink(db: Database, email: string, next: string, now = new Date()) {
  const token = generateSecret();
  const url = new URL("/auth/email/verify", env().APP_ORIGIN);
  url.searchParams.set("token", token);
  if (next !== "/") url.searchParams.set("next", next);
  const expiresMinutes = Math.round(EMAIL_LINK_LIFETIME_MS / 60_000);
  await db.transaction(async (tx) => {
    const existing = await findUserByEmail(tx, email);
    await tx.insert(emailSignInTokens).values({
      email: email.trim(),
      tokenHash: hashSecret(token),
      createdAt: now,
      expiresAt: new Date(now.getTime() + EMAIL_LINK_LIFETIME_MS),
    });
    await enqueueMail(tx, {
      kind: "sign-in-link",
      to: email.trim(),
      subject: "Your Fringe Docket sign-in link",
      element: createElement(SignInLinkEmail, { name: existing?.name ?? null, url: url.toString(), expiresMinutes }),
      userId: existing?.id,
      deliverBy: new Date(now.getTime() + EMAIL_LINK_LIFETIME_MS - EMAIL_LINK_USEFUL_MS),
    });
  });
  wakeOutboxSender();
  return url.toString();
}

export type LinkResult =
  | { ok: true; user: NonNullable<Awaited<ReturnType<typeof findOrCreateAccount>>["user"]>; created: boolean }
  | { ok: false; reason: string };

/**
 * Uses a link token once: marks it used in the same statement that checks it is unused and
 * unexpired, then finds or creates the account (proposer role for a new one).
 */
export async function consumeSignInLink(db: Database, token: string, now = new Date()): Promise<LinkResult> {
  if (!SECRET_PATTERN.test(token)) return { ok: false, reason: "This sign-in link is not valid." };
  const hash = hashSecret(token);
  const [used] = await db
    .update(emailSignInTokens)
    .set({ usedAt: now })
    .where(
      and(
        eq(emailSignInTokens.tokenHash, hash),
        isNull(emailSignInTokens.usedAt),
        gt(emailSignInTokens.expiresAt, now),
      ),
    )
    .returning();
  if (!used) {
    const [row] = await db.select().from(emailSignInTokens).where(eq(emailSignInTokens.tokenHash, hash));
    if (!row) return { ok: false, reason: "This sign-in link is not valid." };
    if (row.usedAt) return { ok: false, reason: "This sign-in link has already been used. Ask for a new one." };
    return { ok: false, reason: "This sign-in link has expired (links last 15 minutes). Ask for a new one." };
  }
  const account = await findOrCreateAccount(db, { email: used.email, emailVerified: true });
  if (!account.user) return { ok: false, reason: account.reason ?? "This account cannot sign in." };
  return { ok: true, user: account.user, created: account.created };
}
