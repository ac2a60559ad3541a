/** Finding, creating and changing accounts; every change of roles or status is written to the audit log. */
import { and, asc, eq, ilike, inArray, or, sql } from "drizzle-orm";
import type { Database, Transaction } from "~/db/client.server";
import { auditLog } from "~/db/schema/auth";
import { ROLES, type Role, userRoles, users } from "~/db/schema/users";
import { revokeAllSessions } from "./sessions.server";

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

export async function searchUsers(db: Database, q: string, limit = 100) {
  const term = q.trim();
  const where = term
    ? or(ilike(users.name, `%${term}%`), ilike(users.email, `%${term}%`), ilike(users.institute, `%${term}%`))
    : undefined;
  const list = await db.select().from(users).where(where).orderBy(asc(users.name)).limit(limit);
  const roles = list.length
    ? await db
        .select()
        .from(userRoles)
        .where(
          inArray(
            userRoles.userId,
            list.map((u) => u.id),
          ),
        )
    : [];
  return list.map((u) => ({ ...u, roles: ROLES.filter((r) => roles.some((x) => x.userId === u.id && x.role === r)) }));
}

/**
 * Sets a person's roles to exactly `next` and logs each grant and revocation; returns what changed.
 * Call it inside a transaction together with whatever else belongs to the change (the notice).
 */
export async function setRoles(tx: Db, actorId: number, targetUserId: number, next: Role[]) {
  const current = await rolesOf(tx, targetUserId);
  const granted = next.filter((r) => !current.includes(r));
  const revoked = current.filter((r) => !next.includes(r));
  if (granted.length) await tx.insert(userRoles).values(granted.map((role) => ({ userId: targetUserId, role })));
  if (revoked.length)
    await tx.delete(userRoles).where(and(eq(userRoles.userId, targetUserId), inArray(userRoles.role, revoked)));
  for (const role of granted)
    await tx.insert(auditLog).values({ actorId, action: "role.granted", targetUserId, detail: { role } });
  for (const role of revoked)
    await tx.insert(auditLog).values({ actorId, action: "role.revoked", targetUserId, detail: { role } });
  return { granted, revoked };
}

export async function setActive(db: Database, actorId: number, targetUserId: number, active: boolean) {
  await db.transaction(async (tx) => {
    await tx.update(users).set({ active }).where(eq(users.id, targetUserId));
    await tx
      .insert(auditLog)
      .values({ actorId, action: active ? "account.reactivated" : "account.deactivated", targetUserId, detail: {} });
  });
  if (!active) await revokeAllSessions(db, targetUserId);
}

export async function recentAudit(db: Database, limit = 50) {
  const actor = sql<string | null>`(select name from users where users.id = ${auditLog.actorId})`;
  const target = sql<string | null>`(select name from users where users.id = ${auditLog.targetUserId})`;
  return db
    .select({
      id: auditLog.id,
      action: auditLog.action,
      detail: auditLog.detail,
      createdAt: auditLog.createdAt,
      actor,
      target,
    })
    .from(auditLog)
    .orderBy(sql`${auditLog.createdAt} desc, ${auditLog.id} desc`)
    .limit(limit);
}
