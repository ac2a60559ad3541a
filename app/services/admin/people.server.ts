/**
 * The administrator's People page: finding accounts, changing their roles and switching them off
 * or on again. Every change is written to the audit log; a change of roles also sends the person a
 * notice, in the same transaction.
 */
import { and, asc, eq, ilike, inArray, or, sql } from "drizzle-orm";
import { createElement } from "react";
import type { Database, DbOrTx } from "~/db/client.server";
import { auditLog } from "~/db/schema/auth";
import { ROLES, type Role, userRoles, users } from "~/db/schema/users";
import { ROLE_CHANGE_SUBJECT, RoleChangeEmail } from "~/emails/RoleChangeEmail";
import { formatUtc, utcText } from "~/lib/format";
import { rolesOf } from "~/services/auth/accounts.server";
import { revokeAllSessions } from "~/services/auth/sessions.server";
import { enqueueMail } from "~/services/mail/outbox.server";
import { wakeOutboxSender } from "~/services/mail/sender.server";

import { PEOPLE_QUERY_MAX } from "./schemas";

export { PEOPLE_QUERY_MAX };

/** `%`, `_` and `\` match themselves in a search, not as LIKE wildcards. */
function likePattern(term: string): string {
  return `%${term.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** An account as stored. */
export type Person = typeof users.$inferSelect;

export async function searchUsers(db: Database, q: string, limit = 100) {
  const term = q.trim();
  const where = term
    ? or(
        ilike(users.name, likePattern(term)),
        ilike(users.email, likePattern(term)),
        ilike(users.institute, likePattern(term)),
      )
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
export async function setRoles(tx: DbOrTx, actorId: number, targetUserId: number, next: Role[]) {
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

/** Switches an account off (and signs it out everywhere) or on again, and logs it. */
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

/** What the People page shows for a search: the people found and the latest 40 audit entries. */
export async function peopleOverview(db: Database, { q }: { q: string }) {
  const [people, audit] = await Promise.all([searchUsers(db, q), recentAudit(db, 40)]);
  return {
    people: people.map((p) => ({
      id: p.id,
      name: p.name,
      email: p.email,
      institute: p.institute,
      active: p.active,
      roles: p.roles,
      lastSignIn: utcText(p.lastSignInAt) ?? "never",
    })),
    audit: audit.map(({ createdAt, ...entry }) => ({ ...entry, at: formatUtc(createdAt) })),
  };
}

export type PersonRow = Awaited<ReturnType<typeof peopleOverview>>["people"][number];
export type AuditRow = Awaited<ReturnType<typeof peopleOverview>>["audit"][number];

/** The account with this id, or null. */
export async function findPerson(db: Database, { userId }: { userId: number }): Promise<Person | null> {
  const [person] = await db.select().from(users).where(eq(users.id, userId));
  return person ?? null;
}

/**
 * Gives `person` exactly `roles` on behalf of `actor`; when anything changed, the notice to the
 * person is written in the same transaction and the outbox sender is woken once it has committed.
 */
export async function changeRoles(
  db: Database,
  { actor, person, roles }: { actor: { id: number; name: string }; person: Person; roles: Role[] },
) {
  const change = await db.transaction(async (tx) => {
    const result = await setRoles(tx, actor.id, person.id, roles);
    if (result.granted.length || result.revoked.length) {
      await enqueueMail(tx, {
        kind: "role-change",
        to: person.email,
        subject: ROLE_CHANGE_SUBJECT,
        element: createElement(RoleChangeEmail, {
          name: person.name,
          rolesGranted: result.granted,
          rolesRevoked: result.revoked,
          byName: actor.name,
        }),
        userId: person.id,
      });
    }
    return result;
  });
  wakeOutboxSender();
  return change;
}
