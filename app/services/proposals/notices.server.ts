/**
 * The notices a proposal sends: queued in the outbox inside the transaction that makes the change
 * (both are kept or both are lost); the command wakes the sender once the transaction has committed.
 */
import { eq } from "drizzle-orm";
import type { ReactElement } from "react";
import { href } from "react-router";
import type { DbOrTx } from "~/db/client.server";
import type { MailKind } from "~/db/schema/mail";
import type { proposals } from "~/db/schema/proposals";
import { users } from "~/db/schema/users";
import { env } from "~/env.server";
import { enqueueMail } from "~/services/mail/outbox.server";
import { wakeOutboxSender } from "~/services/mail/sender.server";
import { teamMembers } from "./access.server";
import { clip } from "./words";

/** The mail kind of each notice (the outbox keeps a fixed list of kinds). */
export const NOTICE_KIND = {
  coInvestigator: "co-investigator",
  submitted: "submission",
  withdrawn: "withdrawal",
} as const satisfies Record<string, MailKind>;

/** The proposal's page, as an absolute address for a notice. */
export function proposalUrl(id: number): string {
  return `${env().APP_ORIGIN.replace(/\/$/, "")}${href("/proposals/:proposalId", { proposalId: String(id) })}`;
}

/** A mail subject about a proposal: `Prefix: "Title" (Cycle)`, the title clipped to one short line. */
export function proposalSubject(prefix: string, title: string, cycleName: string): string {
  return `${prefix}: "${clip(title, 120)}" (${cycleName})`;
}

export type Recipient = { email: string; name: string | null; userId: number | null };

/** Everyone a notice about the proposal goes to: the PI and every co-investigator, each address once. */
async function teamAddresses(db: DbOrTx, proposal: typeof proposals.$inferSelect): Promise<Recipient[]> {
  const [pi] = await db.select().from(users).where(eq(users.id, proposal.piId));
  const out: Recipient[] = [{ email: pi.email, name: pi.name, userId: pi.id }];
  for (const m of await teamMembers(db, { proposalId: proposal.id })) {
    if (!out.some((o) => o.email.toLowerCase() === m.email.toLowerCase()))
      out.push({ email: m.email, name: m.user?.name ?? null, userId: m.userId });
  }
  return out;
}

/** Queues one notice to one person about the proposal. */
export async function queueNotice(
  db: DbOrTx,
  notice: { kind: MailKind; proposalId: number; subject: string; to: Recipient; element: ReactElement },
) {
  await enqueueMail(db, {
    kind: notice.kind,
    to: notice.to.email,
    subject: notice.subject,
    element: notice.element,
    userId: notice.to.userId,
    relatedUrl: proposalUrl(notice.proposalId),
  });
}

/** Queues a notice to the whole team, one message each, written for each recipient by `element`. */
export async function noticeTeam(
  db: DbOrTx,
  {
    proposal,
    ...notice
  }: {
    proposal: typeof proposals.$inferSelect;
    kind: MailKind;
    subject: string;
    element: (to: Recipient) => ReactElement;
  },
) {
  for (const to of await teamAddresses(db, proposal)) {
    await queueNotice(db, { ...notice, proposalId: proposal.id, to, element: notice.element(to) });
  }
}

/** Runs a command that queues notices, then wakes the sender once its transaction has committed. */
export async function thenSend<T>(command: Promise<T>): Promise<T> {
  const out = await command;
  wakeOutboxSender();
  return out;
}
