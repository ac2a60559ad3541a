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

/**
 * The account for a verified identity: matched by single sign-on subject, else by e-mail (and then
 * linked), else created with the proposer role. Returns null for a deactivated account.
 */
export async function findOrCreateAccount(
  db: Database,
  identity: { email: string; name?: string; institute?: string; ssoSubject?: string },
) {
  return db.transaction(async (tx) => {
    let user =
      (identity.ssoSubject
        ? (await tx.select().from(users).where(eq(users.ssoSubject, identity.ssoSubject)))[0]
        : undefined) ?? (await findUserByEmail(tx, identity.email));
    let created = false;
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
    } else if (identity.ssoSubject && !user.ssoSubject) {
      [user] = await tx.update(users).set({ ssoSubject: identity.ssoSubject }).where(eq(users.id, user.id)).returning();
    }
    if (!user.active)
      return {
        user: null,
        created: false,
        reason: "This account has been deactivated. Ask the array's administrator.",
      };
    return { user, created, reason: null };
  });
}
