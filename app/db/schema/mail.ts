import { sql } from "drizzle-orm";
import { index, integer, pgTable, text } from "drizzle-orm/pg-core";
import { instant, optionalRefTo, serialId } from "./columns";
import { users } from "./users";

/**
 * What caused a message. Stored as text so a new kind needs no migration; the mailbox shows it as a
 * label.
 */
export const MAIL_KINDS = [
  "sign-in-link",
  "sign-in-late",
  "role-change",
  "submission",
  "withdrawal",
  "co-investigator",
  "assignment",
  "reminder",
  "decision",
  "night-plan",
] as const;
export type MailKind = (typeof MAIL_KINDS)[number];

/**
 * The outbox: every e-mail the app sends, written in the same transaction as the change that caused
 * it and delivered later by the sender loop (app/services/mail/sender.server.ts). A row is sent once
 * `sentAt` is set; until then it is queued and `attempts`, `nextAttemptAt` and `lastError` describe
 * the retries; `abandonedAt` marks one given up because it could no longer arrive in time.
 */
export const outboxMessages = pgTable(
  "outbox_messages",
  {
    id: serialId(),
    kind: text("kind").$type<MailKind>().notNull(),
    toAddress: text("to_address").notNull(),
    subject: text("subject").notNull(),
    /** The rendered HTML body. */
    html: text("html").notNull(),
    /** The plain-text alternative of the same message. */
    text: text("text").notNull(),
    /** The account the message is about, when there is one; kept when the account is removed. */
    userId: optionalRefTo(() => users.id),
    /** The page the message points to (a proposal, a night plan, a sign-in link). */
    relatedUrl: text("related_url"),
    createdAt: instant("created_at").notNull().defaultNow(),
    /** Delivery attempts that failed so far. */
    attempts: integer("attempts").notNull().default(0),
    /** The sender picks the message up at or after this instant. */
    nextAttemptAt: instant("next_attempt_at").notNull().defaultNow(),
    lastError: text("last_error"),
    /**
     * A message that has not gone out by then is not sent at all (a sign-in link that would arrive
     * dead); null for messages that keep their use.
     */
    deliverBy: instant("deliver_by"),
    /** Set when the sender gave the message up (past `deliverBy`); it is never sent after that. */
    abandonedAt: instant("abandoned_at"),
    sentAt: instant("sent_at"),
    /** The Message-ID the message was sent with. */
    smtpMessageId: text("smtp_message_id"),
  },
  (t) => [
    // The sender's query: unsent rows in order of their next attempt.
    index("outbox_messages_due_idx").on(t.nextAttemptAt, t.id).where(sql`sent_at is null and abandoned_at is null`),
    // The mailbox lists newest first.
    index("outbox_messages_created_idx").on(t.createdAt.desc(), t.id.desc()),
    index("outbox_messages_user_idx").on(t.userId),
  ],
);

export type OutboxMessage = typeof outboxMessages.$inferSelect;
