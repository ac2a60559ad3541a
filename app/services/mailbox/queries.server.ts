/**
 * Reads of the outbox for the mailbox pages. The mailbox stands in for each person's own inbox: a
 * person reads the messages addressed to them; an administrator (`mailbox:all`) reads everyone's,
 * except that a one-time sign-in link still valid is hidden from everyone but its recipient.
 */
import { and, count, desc, eq, gt, ilike, inArray, isNull, or, type SQL, sql } from "drizzle-orm";
import * as v from "valibot";
import type { Database } from "~/db/client.server";
import { emailSignInTokens } from "~/db/schema/auth";
import { type OutboxMessage, outboxMessages } from "~/db/schema/mail";
import { formatUtc, utcText } from "~/lib/format";
import { MAX_ROW_ID, toId } from "~/lib/not-found";
import { hashSecret } from "~/services/auth/tokens.server";

export const MAILBOX_PAGE_SIZE = 50;

/**
 * Where a message stands: delivered to the mail server; queued (no attempt yet); queued and
 * retrying after failed attempts; or abandoned (not sent: it could no longer arrive in time).
 */
export type MailStatus = "delivered" | "queued" | "retrying" | "abandoned";

export function mailStatus(row: Pick<OutboxMessage, "sentAt" | "attempts" | "abandonedAt">): MailStatus {
  if (row.sentAt) return "delivered";
  if (row.abandonedAt) return "abandoned";
  return row.attempts > 0 ? "retrying" : "queued";
}

/** Whose messages a reader sees: their own (by address), or everyone's. */
export type MailboxReader = { email: string; readsAll: boolean };

function readable(reader: MailboxReader): SQL | undefined {
  return reader.readsAll ? undefined : sql`lower(${outboxMessages.toAddress}) = lower(${reader.email})`;
}

import { MAILBOX_QUERY_MAX } from "./limits";

export { MAILBOX_QUERY_MAX };

/**
 * The list's query string: `q` searches address and subject (trimmed, blank means no search; a text
 * over MAILBOX_QUERY_MAX characters is not cut short but refused: no search, `qTooLong` set); `page`
 * counts from 1, and anything that is not a positive whole number is page 1.
 */
export const MailboxQuerySchema = v.object({
  q: v.fallback(v.pipe(v.string(), v.trim()), ""),
  page: v.fallback(v.pipe(v.string(), v.regex(/^\d{1,6}$/), v.transform(Number), v.integer(), v.minValue(1)), 1),
});

export type MailboxQuery = v.InferOutput<typeof MailboxQuerySchema> & { qTooLong: boolean };

export function parseMailboxQuery(params: URLSearchParams): MailboxQuery {
  const parsed = v.parse(MailboxQuerySchema, {
    q: params.get("q") ?? undefined,
    page: params.get("page") ?? undefined,
  });
  const qTooLong = parsed.q.length > MAILBOX_QUERY_MAX;
  return { ...parsed, q: qTooLong ? "" : parsed.q, qTooLong };
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
  abandonedAt: outboxMessages.abandonedAt,
};

export type MailboxRow = Pick<
  OutboxMessage,
  | "id"
  | "kind"
  | "toAddress"
  | "subject"
  | "createdAt"
  | "attempts"
  | "nextAttemptAt"
  | "lastError"
  | "sentAt"
  | "abandonedAt"
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

/**
 * One page of the messages `reader` may read, newest first, optionally those whose address or
 * subject contains `q`.
 */
export async function listMessages(
  db: Database,
  query: { q?: string; page?: number },
  reader: MailboxReader,
): Promise<MailboxPage> {
  const q = (query.q ?? "").trim().slice(0, MAILBOX_QUERY_MAX);
  const asked = Number.isInteger(query.page) && (query.page ?? 0) >= 1 ? (query.page as number) : 1;
  const search: SQL | undefined = q
    ? or(ilike(outboxMessages.toAddress, likePattern(q)), ilike(outboxMessages.subject, likePattern(q)))
    : undefined;
  const where = and(readable(reader), search);
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

/** One message with its bodies, if `reader` may read it; else null (the same as no such message). */
export async function getMessage(db: Database, id: number, reader: MailboxReader): Promise<OutboxMessage | null> {
  if (!Number.isInteger(id) || id < 1 || id > MAX_ROW_ID) return null;
  const [row] = await db
    .select()
    .from(outboxMessages)
    .where(and(eq(outboxMessages.id, id), readable(reader)));
  return row ?? null;
}

/** A one-time sign-in token inside a message's link ("…/auth/email/verify?token=…"). */
const LINK_TOKEN = /([?&](?:amp;)?token=)([a-z2-7]{32})\b/g;

export const HIDDEN_TOKEN = "hidden-until-used-or-expired";

/**
 * The message's bodies with every still-valid one-time sign-in link hidden (its token replaced by
 * HIDDEN_TOKEN), and until when the last of them stays valid; a used or expired link is harmless and
 * shown as it was.
 */
export async function redactLiveLinks(
  db: Database,
  message: Pick<OutboxMessage, "html" | "text" | "relatedUrl">,
  now = new Date(),
): Promise<{ html: string; text: string; relatedUrl: string | null; hiddenUntil: Date | null }> {
  const found = new Set<string>();
  for (const body of [message.html, message.text, message.relatedUrl ?? ""]) {
    for (const m of body.matchAll(LINK_TOKEN)) found.add(m[2]);
  }
  if (found.size === 0) return { ...message, hiddenUntil: null };
  const byHash = new Map([...found].map((t) => [hashSecret(t), t]));
  const live = await db
    .select({ tokenHash: emailSignInTokens.tokenHash, expiresAt: emailSignInTokens.expiresAt })
    .from(emailSignInTokens)
    .where(
      and(
        inArray(emailSignInTokens.tokenHash, [...byHash.keys()]),
        isNull(emailSignInTokens.usedAt),
        gt(emailSignInTokens.expiresAt, now),
      ),
    );
  if (live.length === 0) return { ...message, hiddenUntil: null };
  const hide = new Set(live.map((l) => byHash.get(l.tokenHash)));
  const redact = (s: string) =>
    s.replace(LINK_TOKEN, (all, head, token) => (hide.has(token) ? `${head}${HIDDEN_TOKEN}` : all));
  const hiddenUntil = new Date(Math.max(...live.map((l) => l.expiresAt.getTime())));
  return {
    html: redact(message.html),
    text: redact(message.text),
    relatedUrl: message.relatedUrl ? redact(message.relatedUrl) : null,
    hiddenUntil,
  };
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
    abandoned: utcText(m.abandonedAt),
  };
}

export type MessageSummary = ReturnType<typeof summary>;

/** One page of the mailbox list as the page shows it, for `reader`. */
export async function mailboxOverview(db: Database, { query, reader }: { query: MailboxQuery; reader: MailboxReader }) {
  const { rows, ...page } = await listMessages(db, query, reader);
  return {
    ...page,
    qTooLong: query.qTooLong,
    readsAll: reader.readsAll,
    rows: rows.map((m) => ({ ...summary(m, reader.email), createdAt: m.createdAt.toISOString() })),
  };
}

/**
 * One message with both its bodies, as the message page shows it; null when there is none or it is
 * not the reader's. Someone else's live sign-in link is hidden.
 */
export async function messageView(db: Database, { id, reader }: { id: number; reader: MailboxReader }) {
  const message = await getMessage(db, id, reader);
  if (!message) return null;
  const own = message.toAddress.toLowerCase() === reader.email.toLowerCase();
  const shown = own ? { ...message, hiddenUntil: null } : await redactLiveLinks(db, message);
  return {
    ...summary(message, reader.email),
    html: shown.html,
    text: shown.text,
    relatedUrl: shown.relatedUrl && /^https?:\/\//i.test(shown.relatedUrl) ? shown.relatedUrl : null,
    linkHiddenUntil: utcText(shown.hiddenUntil),
    smtpMessageId: message.smtpMessageId,
  };
}
