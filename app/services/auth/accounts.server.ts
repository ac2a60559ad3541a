/** Finding and creating accounts for sign-in; a new account is written to the audit log. */
import { eq, sql } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { auditLog } from "~/db/schema/auth";
import { ROLES, type Role, userRoles, users } from "~/db/schema/users";

type Tx = Transaction;
type Db = Database | Tx;

export async function rolesOf(db: Db, userId: number): Promise<Role[]> {
  const rows = await db.select({ role: userRoles.role }).from(userRoles).where(eq(userRoles.userId, userId));
  return ROLES.filter((r) => rows.some((row) => row.role === r));
}

export async function findUserByEmail(db: Db, email: string) {
  const [user] = await db.select().from(users).where(sql`lower(${users.email}) = lower(${email.trim()})`);
  return user ?? null;
}

/** Where a sign-in came from: single sign-on (with the provider's subject) or an e-mail link. */
export type SignInIdentity = {
  email: string;
  name?: string;
  institute?: string;
  /** "<issuer> <sub>" of a single sign-on identity. */
  ssoSubject?: string;
  /**
   * Whether whoever vouches for the identity has checked that the person owns `email`: the
   * provider's `email_verified` claim for single sign-on; always true for an e-mail link (the
   * person received it).
   */
  emailVerified: boolean;
};

export type AccountResult =
  | { user: typeof users.$inferSelect; created: boolean; reason: null }
  | { user: null; created: false; reason: string };

/**
 * The account for an identity. A single sign-on identity is matched by the provider's subject
 * only. An identity the provider has not linked yet is linked to the account with the same e-mail
 * address only when the provider says the address is verified, and only when that account is not
 * already linked to another subject; without a verified address no account is created either (so
 * nobody can claim an address that is not theirs ahead of its owner). A new account gets the
 * proposer role. A deactivated account cannot sign in.
 */
export async function findOrCreateAccount(db: Database, identity: SignInIdentity): Promise<AccountResult> {
  return db.transaction(async (tx): Promise<AccountResult> => {
    const refuse = (reason: string): AccountResult => ({ user: null, created: false, reason });
    let user = identity.ssoSubject
      ? (await tx.select().from(users).where(eq(users.ssoSubject, identity.ssoSubject)))[0]
      : undefined;
    let created = false;
    if (!user) {
      const byEmail = await findUserByEmail(tx, identity.email);
      if (identity.ssoSubject) {
        if (!identity.emailVerified) {
          return refuse(
            byEmail
              ? "The sign-on service has not verified this e-mail address, so it cannot be linked to the account that uses it. Sign in by e-mail link instead, or ask the sign-on service to verify the address."
              : "The sign-on service has not verified your e-mail address. Ask it to verify the address, or sign in by e-mail link.",
          );
        }
        if (byEmail?.ssoSubject) {
          return refuse(
            "This e-mail address belongs to an account linked to another single sign-on identity. Sign in with that identity, or ask the array's administrator.",
          );
        }
        if (byEmail) {
          [user] = await tx
            .update(users)
            .set({ ssoSubject: identity.ssoSubject })
            .where(eq(users.id, byEmail.id))
            .returning();
          await tx.insert(auditLog).values({
            actorId: byEmail.id,
            action: "account.linked",
            targetUserId: byEmail.id,
            detail: { via: "sso", by: "verified e-mail" },
          });
        }
      } else {
        user = byEmail ?? undefined;
      }
    }
    if (!user) {
      const fallbackName = identity.email.split("@")[0];
      [user] = await tx
        .insert(users)
        .values({
          email: identity.email.trim(),
          name: identity.name?.trim() || fallbackName,
          institute: identity.institute?.trim() ?? "",
          ssoSubject: identity.ssoSubject ?? null,
        })
        .returning();
      await tx.insert(userRoles).values({ userId: user.id, role: "proposer" });
      await tx.insert(auditLog).values({
        actorId: user.id,
        action: "account.created",
        targetUserId: user.id,
        detail: { via: identity.ssoSubject ? "sso" : "email-link" },
      });
      created = true;
    }
    if (!user.active) return refuse("This account has been deactivated. Ask the array's administrator.");
    return { user, created, reason: null };
  });
}
