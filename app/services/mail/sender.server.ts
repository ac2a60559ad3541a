import { and, asc, eq, getTableColumns, gt, isNull, lte, sql } from "drizzle-orm";
import { createElement } from "react";
import { type Database, database, type Transaction } from "~/db/client.server";
import { type OutboxMessage, outboxMessages } from "~/db/schema/mail";
import { users } from "~/db/schema/users";
import { SIGN_IN_LATE_SUBJECT, SignInLateEmail } from "~/emails/SignInLateEmail";
import { env } from "~/env.server";
import { parseMailEnv } from "./config.server";
import { enqueueMail } from "./outbox.server";
import { createMailTransport, type MailTransport, senderDomain } from "./transport.server";

/** First retry after this many milliseconds; each further failure doubles it. */
export const RETRY_BASE_MS = 5_000;
/**
 * Retries never wait longer than this, milliseconds (20 s). With the sender waking for each retry
 * when it is due, a message waiting out a mail-server outage goes out at most this long (plus the
 * time of the attempt itself) after the server is back, well within 30 s; once one message gets
 * through, the others that are waiting are sent in the same pass.
 */
export const RETRY_CAP_MS = 20_000;

/**
 * Wait before the next attempt after `failures` failed attempts (1, 2, 3 … → 5 s, 10 s, 20 s, 20 s …),
 * capped at RETRY_CAP_MS. Values below 1 count as 1.
 */
export function retryDelayMs(failures: number): number {
  const n = Number.isFinite(failures) ? Math.max(1, Math.floor(failures)) : 1;
  return Math.min(RETRY_CAP_MS, RETRY_BASE_MS * 2 ** (Math.min(n, 30) - 1));
}

export type DeliveryFailure = { id: number; error: string; attempts: number; nextAttemptAt: Date };
export type DeliveryReport = {
  sent: number[];
  failed: DeliveryFailure[];
  /** Messages given up because they could no longer arrive in time (never sent). */
  abandoned?: number[];
  /** How many messages waiting out a back-off were made due because this pass got one through. */
  broughtForward?: number;
};

/**
 * Gives up a message whose `deliverBy` has passed: it is marked abandoned and never sent. For a
 * sign-in link, the person gets a short notice in its place asking them to request a new link.
 */
async function abandon(tx: Transaction, row: OutboxMessage, now: Date) {
  await tx
    .update(outboxMessages)
    .set({
      abandonedAt: now,
      lastError: "Not sent: it could no longer arrive before it expired.",
    })
    .where(eq(outboxMessages.id, row.id));
  if (row.kind !== "sign-in-link") return;
  const [person] = row.userId ? await tx.select().from(users).where(eq(users.id, row.userId)) : [];
  await enqueueMail(tx, {
    kind: "sign-in-late",
    to: row.toAddress,
    subject: SIGN_IN_LATE_SUBJECT,
    element: createElement(SignInLateEmail, {
      name: person?.name ?? null,
      signInUrl: new URL("/sign-in", env().APP_ORIGIN).toString(),
    }),
    userId: row.userId,
  });
}

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
 * A message past its `deliverBy` is abandoned instead of sent (see `abandon`). When any message got
 * through, the others waiting out a back-off are made due at once: the server is evidently back.
 */
export async function deliverDue(
  db: Database,
  transport: MailTransport,
  options: { now?: Date; batch?: number } = {},
): Promise<DeliveryReport> {
  const batch = Math.max(1, Math.floor(options.batch ?? 20));
  const domain = senderDomain(transport.from);
  const report: DeliveryReport = { sent: [], failed: [] };
  const abandoned: number[] = [];

  for (let i = 0; i < batch; i++) {
    const taken = await db.transaction(async (tx) => {
      const [found] = await tx
        .select({
          ...getTableColumns(outboxMessages),
          clock: sql`now()`.mapWith(outboxMessages.nextAttemptAt),
        })
        .from(outboxMessages)
        .where(
          and(
            isNull(outboxMessages.sentAt),
            isNull(outboxMessages.abandonedAt),
            lte(outboxMessages.nextAttemptAt, options.now ?? sql`now()`),
          ),
        )
        .orderBy(asc(outboxMessages.nextAttemptAt), asc(outboxMessages.id))
        .limit(1)
        .for("update", { skipLocked: true });
      if (!found) return false;
      const { clock, ...row } = found;
      const now = options.now ?? clock;
      if (row.deliverBy && row.deliverBy.getTime() <= now.getTime()) {
        await abandon(tx, row, now);
        abandoned.push(row.id);
        return true;
      }
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
  if (report.sent.length > 0) {
    // The server took a message: the ones waiting out a back-off need not wait any longer.
    const forward = await db
      .update(outboxMessages)
      .set({ nextAttemptAt: options.now ?? sql`now()` })
      .where(
        and(
          isNull(outboxMessages.sentAt),
          isNull(outboxMessages.abandonedAt),
          gt(outboxMessages.attempts, 0),
          gt(outboxMessages.nextAttemptAt, options.now ?? sql`now()`),
        ),
      )
      .returning({ id: outboxMessages.id });
    if (forward.length > 0) report.broughtForward = forward.length;
  }
  if (abandoned.length > 0) report.abandoned = abandoned;
  return report;
}

/** Milliseconds until the earliest queued message is due (0 when one is due now), or null when none waits. */
export async function msUntilNextDue(db: Database): Promise<number | null> {
  const [row] = await db
    .select({
      ms: sql<number | null>`extract(epoch from (min(${outboxMessages.nextAttemptAt}) - now())) * 1000`.mapWith((x) =>
        x === null ? null : Number(x),
      ),
    })
    .from(outboxMessages)
    .where(and(isNull(outboxMessages.sentAt), isNull(outboxMessages.abandonedAt)));
  return row?.ms === null || row?.ms === undefined ? null : Math.max(0, row.ms);
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
 * Runs `deliverDue` now and then every `intervalMs` after the previous pass ends, or sooner when a
 * queued message falls due before that (a timeout chain, so passes never overlap; the timer does not
 * keep the process alive). A pass that finds a full batch, or that got a message through after an
 * outage, runs again at once. Problems are logged with console.warn and the loop goes on.
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
  let nextMs = intervalMs;

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
          if (report.sent.length + report.failed.length + (report.abandoned?.length ?? 0) >= batch) again = true;
          // Messages just made due (the server is back) go in the next round of this pass.
          if (report.broughtForward) again = true;
        } while (again && !stopped);
        const due = await msUntilNextDue(db);
        nextMs = due === null ? intervalMs : Math.min(intervalMs, Math.max(50, Math.ceil(due)));
      } catch (e) {
        nextMs = intervalMs;
        console.warn(`[outbox] delivery pass failed: ${describeError(e)}`);
      } finally {
        running = null;
        schedule(nextMs);
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
