/** Reads of the outbox for the mailbox pages (guarded by the routes: admins, everyone in demo mode). */
import { count, desc, eq, ilike, or, type SQL } from "drizzle-orm";
import * as v from "valibot";
import type { Database } from "~/db/client.server";
import { type OutboxMessage, outboxMessages } from "~/db/schema/mail";
import { formatUtc, utcText } from "~/lib/format";
import { MAX_ROW_ID, toId } from "~/lib/not-found";

export const MAILBOX_PAGE_SIZE = 50;

export type MailStatus = "sent" | "pending" | "retrying";

export function mailStatus(row: Pick<OutboxMessage, "sentAt" | "attempts">): MailStatus {
  if (row.sentAt) return "sent";
  return row.attempts > 0 ? "retrying" : "pending";
}

/**
 * The list's query string: `q` searches address and subject (trimmed, at most 200 characters, blank
 * means no search); `page` counts from 1, and anything that is not a positive whole number is page 1.
 */
export const MailboxQuerySchema = v.object({
  q: v.fallback(
    v.pipe(
      v.string(),
      v.trim(),
      v.transform((s) => s.slice(0, 200)),
    ),
    "",
  ),
  page: v.fallback(v.pipe(v.string(), v.regex(/^\d{1,6}$/), v.transform(Number), v.integer(), v.minValue(1)), 1),
});

export type MailboxQuery = v.InferOutput<typeof MailboxQuerySchema>;

export function parseMailboxQuery(params: URLSearchParams): MailboxQuery {
  return v.parse(MailboxQuerySchema, {
    q: params.get("q") ?? undefined,
    page: params.get("page") ?? undefined,
  });
}

/** A message number from the address (`toId`), written plainly: "42", not "042" or " 42"; else null. */
export function parseMessageId(raw: string | undefined): number | null {
  const id = toId(raw);
  return id !== null && String(id) === raw ? id : null;
}

/** `%`, `_` and `\` match themselves in the search, not as LIKE wildcards. */
function likePattern(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

const listColumns = {
  id: outboxMessages.id,
  kind: outboxMessages.kind,
  toAddress: outboxMessages.toAddress,
  subject: outboxMessages.subject,
  createdAt: outboxMessages.createdAt,
  attempts: outboxMessages.attempts,
  nextAttemptAt: outboxMessages.nextAttemptAt,
  lastError: outboxMessages.lastError,
  sentAt: outboxMessages.sentAt,
};

export type MailboxRow = Pick<
  OutboxMessage,
  "id" | "kind" | "toAddress" | "subject" | "createdAt" | "attempts" | "nextAttemptAt" | "lastError" | "sentAt"
>;

export type MailboxPage = {
  rows: MailboxRow[];
  total: number;
  /** The page shown: the one asked for, or the last page when it asked beyond the end. */
  page: number;
  pageCount: number;
  pageSize: number;
  q: string;
};

/** One page of messages, newest first, optionally those whose address or subject contains `q`. */
export async function listMessages(db: Database, query: { q?: string; page?: number }): Promise<MailboxPage> {
  const q = (query.q ?? "").trim().slice(0, 200);
  const asked = Number.isInteger(query.page) && (query.page ?? 0) >= 1 ? (query.page as number) : 1;
  const where: SQL | undefined = q
    ? or(ilike(outboxMessages.toAddress, likePattern(q)), ilike(outboxMessages.subject, likePattern(q)))
    : undefined;
  const [{ total }] = await db.select({ total: count() }).from(outboxMessages).where(where);
  const pageCount = Math.max(1, Math.ceil(total / MAILBOX_PAGE_SIZE));
  const page = Math.min(asked, pageCount);
  const rows = await db
    .select(listColumns)
    .from(outboxMessages)
    .where(where)
    .orderBy(desc(outboxMessages.createdAt), desc(outboxMessages.id))
    .limit(MAILBOX_PAGE_SIZE)
    .offset((page - 1) * MAILBOX_PAGE_SIZE);
  return { rows, total, page, pageCount, pageSize: MAILBOX_PAGE_SIZE, q };
}

/** One message with its bodies, or null. */
export async function getMessage(db: Database, id: number): Promise<OutboxMessage | null> {
  if (!Number.isInteger(id) || id < 1 || id > MAX_ROW_ID) return null;
  const [row] = await db.select().from(outboxMessages).where(eq(outboxMessages.id, id));
  return row ?? null;
}

/** What both mailbox pages show of a message: recipient (and whether it is the viewer), delivery state. */
function summary(m: MailboxRow, viewerEmail: string) {
  return {
    id: m.id,
    kind: m.kind,
    to: m.toAddress,
    toViewer: m.toAddress.toLowerCase() === viewerEmail.toLowerCase(),
    subject: m.subject,
    created: formatUtc(m.createdAt),
    status: mailStatus(m),
    attempts: m.attempts,
    nextAttempt: utcText(m.nextAttemptAt),
    lastError: m.lastError,
    sent: utcText(m.sentAt),
  };
}

export type MessageSummary = ReturnType<typeof summary>;

/** One page of the mailbox list as the page shows it, for the viewer with this address. */
export async function mailboxOverview(
  db: Database,
  { query, viewerEmail }: { query: MailboxQuery; viewerEmail: string },
) {
  const { rows, ...page } = await listMessages(db, query);
  return { ...page, rows: rows.map((m) => ({ ...summary(m, viewerEmail), createdAt: m.createdAt.toISOString() })) };
}

/** One message with both its bodies, as the message page shows it; null when there is none. */
export async function messageView(db: Database, { id, viewerEmail }: { id: number; viewerEmail: string }) {
  const message = await getMessage(db, id);
  if (!message) return null;
  return {
    ...summary(message, viewerEmail),
    html: message.html,
    text: message.text,
    relatedUrl: message.relatedUrl && /^https?:\/\//i.test(message.relatedUrl) ? message.relatedUrl : null,
    smtpMessageId: message.smtpMessageId,
  };
}
