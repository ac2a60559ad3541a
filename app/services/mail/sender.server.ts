import { and, asc, eq, getTableColumns, isNull, lte, sql } from "drizzle-orm";
import { type Database, database } from "~/db/client.server";
import { outboxMessages } from "~/db/schema/mail";
import { parseMailEnv } from "./config.server";
import { createMailTransport, type MailTransport, senderDomain } from "./transport.server";

/** First retry after this many milliseconds; each further failure doubles it. */
export const RETRY_BASE_MS = 5_000;
/** Retries never wait longer than this, milliseconds (10 min). */
export const RETRY_CAP_MS = 600_000;

/**
 * Wait before the next attempt after `failures` failed attempts (1, 2, 3 … → 5 s, 10 s, 20 s …),
 * capped at 10 min. Values below 1 count as 1.
 */
export function retryDelayMs(failures: number): number {
  const n = Number.isFinite(failures) ? Math.max(1, Math.floor(failures)) : 1;
  return Math.min(RETRY_CAP_MS, RETRY_BASE_MS * 2 ** (n - 1));
}

export type DeliveryFailure = { id: number; error: string; attempts: number; nextAttemptAt: Date };
export type DeliveryReport = { sent: number[]; failed: DeliveryFailure[] };

function describeError(e: unknown): string {
  if (e instanceof Error) {
    const code = (e as Error & { code?: unknown }).code;
    const text = typeof code === "string" && !e.message.includes(code) ? `${code}: ${e.message}` : e.message;
    return text.slice(0, 1000);
  }
  return String(e).slice(0, 1000);
}

/**
 * Delivers the unsent messages that are due at `now`, at most `batch` of them, oldest due first.
 * Without `now`, the database's clock decides (the one that stamped the messages), so a message
 * written a moment ago is due at once even if the app's clock lags a little.
 *
 * Each message is taken in a transaction of its own with `FOR UPDATE SKIP LOCKED`, sent, and marked
 * sent (or given its next attempt) before that transaction commits, so concurrent senders never take
 * the same message and a message marked sent is never taken again. A failure sets `attempts`,
 * `lastError` and `nextAttemptAt = now + retryDelayMs(attempts)`; the message waits for that instant.
 */
export async function deliverDue(
  db: Database,
  transport: MailTransport,
  options: { now?: Date; batch?: number } = {},
): Promise<DeliveryReport> {
  const batch = Math.max(1, Math.floor(options.batch ?? 20));
  const domain = senderDomain(transport.from);
  const report: DeliveryReport = { sent: [], failed: [] };

  for (let i = 0; i < batch; i++) {
    const taken = await db.transaction(async (tx) => {
      const [found] = await tx
        .select({
          ...getTableColumns(outboxMessages),
          clock: sql`now()`.mapWith(outboxMessages.nextAttemptAt),
        })
        .from(outboxMessages)
        .where(and(isNull(outboxMessages.sentAt), lte(outboxMessages.nextAttemptAt, options.now ?? sql`now()`)))
        .orderBy(asc(outboxMessages.nextAttemptAt), asc(outboxMessages.id))
        .limit(1)
        .for("update", { skipLocked: true });
      if (!found) return false;
      const { clock, ...row } = found;
      const now = options.now ?? clock;
      try {
        const { messageId } = await transport.send({
          to: row.toAddress,
          subject: row.subject,
          html: row.html,
          text: row.text,
          // The same Message-ID on every attempt, so a receiver can tell a repeat from a new message.
          messageId: `<outbox-${row.id}-${row.createdAt.getTime()}@${domain}>`,
          headers: { "X-Fringe-Docket-Kind": row.kind },
        });
        await tx
          .update(outboxMessages)
          .set({ sentAt: now, smtpMessageId: messageId, lastError: null })
          .where(eq(outboxMessages.id, row.id));
        report.sent.push(row.id);
      } catch (e) {
        const attempts = row.attempts + 1;
        const nextAttemptAt = new Date(now.getTime() + retryDelayMs(attempts));
        const error = describeError(e);
        await tx
          .update(outboxMessages)
          .set({ attempts, nextAttemptAt, lastError: error })
          .where(eq(outboxMessages.id, row.id));
        report.failed.push({ id: row.id, error, attempts, nextAttemptAt });
      }
      return true;
    });
    if (!taken) break;
  }
  return report;
}

export type OutboxSender = {
  /** Runs a pass now (or right after the one under way). */
  wake(): void;
  /** Stops the loop; resolves when the pass under way, if any, has finished. */
  stop(): Promise<void>;
};

const sendersKey = Symbol.for("fringe-docket.outbox-senders");
type SendersHolder = { [sendersKey]?: Set<OutboxSender> };

function activeSenders(): Set<OutboxSender> {
  const holder = globalThis as SendersHolder;
  holder[sendersKey] ??= new Set();
  return holder[sendersKey];
}

/**
 * Runs `deliverDue` now and then every `intervalMs` after the previous pass ends (a timeout chain,
 * so passes never overlap; the timer does not keep the process alive). A pass that finds a full
 * batch runs again at once. Problems are logged with console.warn and the loop goes on.
 */
export function startOutboxSender({
  db,
  transport,
  intervalMs = 5_000,
  batch = 20,
}: {
  db: Database;
  transport: MailTransport;
  intervalMs?: number;
  batch?: number;
}): OutboxSender {
  let stopped = false;
  let again = false;
  let running: Promise<void> | null = null;
  let timer: ReturnType<typeof setTimeout> | undefined;

  function schedule(ms: number) {
    if (stopped) return;
    clearTimeout(timer);
    timer = setTimeout(() => void pass(), ms);
    timer.unref();
  }

  function pass(): Promise<void> {
    if (stopped) return Promise.resolve();
    if (running) {
      again = true;
      return running;
    }
    clearTimeout(timer);
    running = (async () => {
      try {
        do {
          again = false;
          const report = await deliverDue(db, transport, { batch });
          if (report.failed.length > 0) {
            const first = report.failed[0];
            console.warn(
              `[outbox] ${report.failed.length} message(s) not delivered, first #${first.id} (attempt ${first.attempts}): ${first.error}; ` +
                `next attempt ${first.nextAttemptAt.toISOString()}`,
            );
          }
          if (report.sent.length + report.failed.length >= batch) again = true;
        } while (again && !stopped);
      } catch (e) {
        console.warn(`[outbox] delivery pass failed: ${describeError(e)}`);
      } finally {
        running = null;
        schedule(intervalMs);
      }
    })();
    return running;
  }

  const sender: OutboxSender = {
    wake() {
      void pass();
    },
    async stop() {
      stopped = true;
      clearTimeout(timer);
      activeSenders().delete(sender);
      await running;
    },
  };
  activeSenders().add(sender);
  schedule(0);
  return sender;
}

/** Nudges every sender loop of this process to look for due messages now. Harmless when none runs. */
export function wakeOutboxSender(): void {
  for (const sender of activeSenders()) sender.wake();
}

const appSenderKey = Symbol.for("fringe-docket.outbox-app-sender");
type AppSenderHolder = { [appSenderKey]?: OutboxSender };

/**
 * The app server's one sender loop, configured from the environment (SMTP_*, MAIL_FROM,
 * MAIL_SENDER_INTERVAL_MS) and started on the first call; later calls return it. Returns null when
 * MAIL_SENDER=0 or under NODE_ENV=test (tests run their own senders).
 */
export function ensureOutboxSender(): OutboxSender | null {
  const holder = globalThis as AppSenderHolder;
  if (holder[appSenderKey]) return holder[appSenderKey];
  if (process.env.NODE_ENV === "test") return null;
  const config = parseMailEnv(process.env);
  if (config.MAIL_SENDER === "0") return null;
  holder[appSenderKey] = startOutboxSender({
    db: database(),
    transport: createMailTransport(config),
    intervalMs: config.MAIL_SENDER_INTERVAL_MS,
  });
  return holder[appSenderKey];
}
