import { testDb } from "@test/routes";
import { eq, sql } from "drizzle-orm";
import { createElement } from "react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { outboxMessages } from "~/db/schema/mail";
import { users } from "~/db/schema/users";
import { RoleChangeEmail } from "~/emails/RoleChangeEmail";
import { SignInLinkEmail } from "~/emails/SignInLinkEmail";
import { sendSignInLink } from "~/services/auth/email-link.server";
import { parseMailEnv } from "~/services/mail/config.server";
import { enqueueMail } from "~/services/mail/outbox.server";
import { deliverDue, RETRY_CAP_MS, retryDelayMs, startOutboxSender } from "~/services/mail/sender.server";
import { createMailTransport, type MailTransport } from "~/services/mail/transport.server";
import { type FakeSmtp, startFakeSmtp } from "../../../scripts/fakes/smtp";

const LINK = "http://localhost:3000/auth/email/verify?token=abcdefghijklmnopqrstuvwxyz234567";

function signInMail(to: string, subject = "Your sign-in link") {
  return {
    kind: "sign-in-link" as const,
    to,
    subject,
    element: createElement(SignInLinkEmail, { name: "Ines Calderón", url: LINK }),
  };
}

function transportTo(port: number): MailTransport {
  return createMailTransport(
    { ...parseMailEnv({}), SMTP_PORT: port },
    { connectionMs: 2_000, greetingMs: 2_000, socketMs: 5_000 },
  );
}

async function row(id: number) {
  const [r] = await testDb().select().from(outboxMessages).where(eq(outboxMessages.id, id));
  return r;
}

async function waitFor(check: () => boolean | Promise<boolean>, timeoutMs = 5_000) {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error("timed out waiting");
    await new Promise((r) => setTimeout(r, 20));
  }
}

let smtp: FakeSmtp | null = null;
const transports: MailTransport[] = [];

function track(t: MailTransport) {
  transports.push(t);
  return t;
}

beforeEach(async () => {
  await testDb().execute(sql`truncate outbox_messages restart identity`);
  smtp = await startFakeSmtp({ port: 0 });
});

afterEach(async () => {
  for (const t of transports.splice(0)) t.close();
  await smtp?.stop();
  smtp = null;
});

describe("enqueueMail", () => {
  it("writes nothing when the surrounding transaction rolls back", async () => {
    const db = testDb();
    await expect(
      db.transaction(async (tx) => {
        await enqueueMail(tx, signInMail("rollback@example.org"));
        const inside = await tx.select().from(outboxMessages);
        expect(inside).toHaveLength(1);
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await db.select().from(outboxMessages)).toHaveLength(0);
  });

  it("keeps the message when the transaction commits, rendered as HTML and plain text", async () => {
    const db = testDb();
    const [user] = await db.insert(users).values({ email: "ines@example.org", name: "Ines Calderón" }).returning();
    const id = await db.transaction(async (tx) => {
      const m = await enqueueMail(tx, { ...signInMail("ines@example.org"), userId: user.id, relatedUrl: LINK });
      return m.id;
    });
    const r = await row(id);
    expect(r.kind).toBe("sign-in-link");
    expect(r.toAddress).toBe("ines@example.org");
    expect(r.html).toMatch(/^<!DOCTYPE html/);
    expect(r.html).toContain(`href="${LINK}"`);
    expect(r.text).toContain(LINK);
    expect(r.text).not.toMatch(/<[a-z][^>]*>/i);
    expect(r.attempts).toBe(0);
    expect(r.sentAt).toBeNull();
    expect(r.userId).toBe(user.id);
    // The message outlives the account it was about.
    await db.delete(users).where(eq(users.id, user.id));
    expect((await row(id)).userId).toBeNull();
  });

  it("refuses malformed input before writing anything", async () => {
    const db = testDb();
    await expect(enqueueMail(db, signInMail("not an address"))).rejects.toThrow(/to: not an e-mail address/);
    await expect(enqueueMail(db, signInMail("a@example.org", "two\nlines"))).rejects.toThrow(/subject spans lines/);
    await expect(
      enqueueMail(db, { ...signInMail("a@example.org"), relatedUrl: "javascript:alert(1)" }),
    ).rejects.toThrow(/relatedUrl/);
    await expect(enqueueMail(db, { ...signInMail("a@example.org"), kind: "gossip" as never })).rejects.toThrow(/kind/);
    expect(await db.select().from(outboxMessages)).toHaveLength(0);
  });
});

describe("deliverDue", () => {
  it("delivers a due message once, with subject, recipient, HTML and text intact, and marks it sent", async () => {
    const db = testDb();
    const m = await enqueueMail(db, signInMail("ines@example.org", "Sign in to Fringe Docket"));
    const transport = track(transportTo(smtp!.port));

    const report = await deliverDue(db, transport);
    expect(report).toEqual({ sent: [m.id], failed: [] });

    const got = smtp!.messages();
    expect(got).toHaveLength(1);
    expect(got[0].subject).toBe("Sign in to Fringe Docket");
    expect(got[0].to).toEqual(["ines@example.org"]);
    expect(got[0].envelope.to).toEqual(["ines@example.org"]);
    expect(got[0].from).toBe("docket@sierra-lumbre.example");
    expect(got[0].html).toContain(`href="${LINK}"`);
    expect(got[0].html).toContain("#161c2d");
    expect(got[0].text).toContain(LINK);
    expect(got[0].headers["x-fringe-docket-kind"]).toBe("sign-in-link");

    const r = await row(m.id);
    expect(r.sentAt).not.toBeNull();
    expect(r.smtpMessageId).toBe(got[0].messageId);
    expect(r.smtpMessageId).toMatch(new RegExp(`^<outbox-${m.id}-\\d+@sierra-lumbre\\.example>$`));
    expect(r.attempts).toBe(0);

    // A second pass finds nothing to do.
    expect(await deliverDue(db, transport)).toEqual({ sent: [], failed: [] });
    expect(smtp!.messages()).toHaveLength(1);
  });

  it("leaves messages that are not due yet", async () => {
    const db = testDb();
    const m = await enqueueMail(db, signInMail("later@example.org"));
    await db
      .update(outboxMessages)
      .set({ nextAttemptAt: new Date(Date.now() + 60_000) })
      .where(eq(outboxMessages.id, m.id));
    const transport = track(transportTo(smtp!.port));
    expect(await deliverDue(db, transport)).toEqual({ sent: [], failed: [] });
    expect(await deliverDue(db, transport, { now: new Date(Date.now() + 61_000) })).toEqual({
      sent: [m.id],
      failed: [],
    });
    expect(smtp!.messages()).toHaveLength(1);
  });

  it("survives an SMTP outage: retries with back-off and delivers exactly once when the server is back", async () => {
    const db = testDb();
    const port = smtp!.port;
    const transport = track(transportTo(port));
    await smtp!.stop();
    smtp = null;

    const m = await enqueueMail(db, {
      kind: "role-change",
      to: "tomas@example.org",
      subject: "Your roles in Fringe Docket have changed",
      element: createElement(RoleChangeEmail, {
        name: "Tomás",
        rolesGranted: ["reviewer"],
        rolesRevoked: [],
        byName: "Ada",
      }),
    });

    // Just after the message was written (its stamp has microseconds; a JS date only milliseconds).
    const t0 = new Date(m.nextAttemptAt.getTime() + 1);
    const first = await deliverDue(db, transport, { now: t0 });
    expect(first.sent).toEqual([]);
    expect(first.failed).toHaveLength(1);
    let r = await row(m.id);
    expect(r.sentAt).toBeNull();
    expect(r.attempts).toBe(1);
    expect(r.nextAttemptAt.getTime()).toBe(t0.getTime() + 5_000);
    expect(r.nextAttemptAt.getTime()).toBeGreaterThan(Date.now());
    expect(r.lastError).toMatch(/ECONNREFUSED/);

    // Still away at the next attempt: the wait doubles.
    const t1 = new Date(r.nextAttemptAt.getTime() + 1);
    await deliverDue(db, transport, { now: t1 });
    r = await row(m.id);
    expect(r.attempts).toBe(2);
    expect(r.nextAttemptAt.getTime()).toBe(t1.getTime() + 10_000);

    // Before that instant nothing is tried, even with the server back.
    smtp = await startFakeSmtp({ port });
    expect(smtp.port).toBe(port);
    expect(await deliverDue(db, transport, { now: new Date(r.nextAttemptAt.getTime() - 1) })).toEqual({
      sent: [],
      failed: [],
    });
    expect(smtp.messages()).toHaveLength(0);

    const t2 = new Date(r.nextAttemptAt.getTime() + 1);
    expect((await deliverDue(db, transport, { now: t2 })).sent).toEqual([m.id]);
    expect(smtp.messages()).toHaveLength(1);
    expect(smtp.messages()[0].subject).toBe("Your roles in Fringe Docket have changed");
    r = await row(m.id);
    expect(r.sentAt?.getTime()).toBe(t2.getTime());
    expect(r.lastError).toBeNull();

    // No duplicates on later passes, however late.
    await deliverDue(db, transport, { now: new Date(t2.getTime() + 3_600_000) });
    expect(smtp.messages()).toHaveLength(1);
  });

  it("gives each message to one sender only when two run at once", async () => {
    const db = testDb();
    await smtp!.stop();
    smtp = await startFakeSmtp({ port: 0, delayMs: 15 });
    const ids: number[] = [];
    for (let i = 0; i < 12; i++) ids.push((await enqueueMail(db, signInMail(`p${i}@example.org`, `Message ${i}`))).id);

    const [a, b] = await Promise.all([
      deliverDue(db, track(transportTo(smtp.port)), { batch: 50 }),
      deliverDue(db, track(transportTo(smtp.port)), { batch: 50 }),
    ]);
    expect(a.failed).toEqual([]);
    expect(b.failed).toEqual([]);
    // Both took part, and no message went to both.
    expect(a.sent.length).toBeGreaterThan(0);
    expect(b.sent.length).toBeGreaterThan(0);
    expect([...a.sent, ...b.sent].sort((x, y) => x - y)).toEqual(ids);

    const subjects = smtp.messages().map((m) => m.subject);
    expect(subjects).toHaveLength(12);
    expect(new Set(subjects).size).toBe(12);
    const unsent = await db.select().from(outboxMessages).where(sql`${outboxMessages.sentAt} is null`);
    expect(unsent).toHaveLength(0);
  });

  it("keeps delivering the others when the server refuses one recipient", async () => {
    const db = testDb();
    await smtp!.stop();
    smtp = await startFakeSmtp({ port: 0, rejectRecipient: (a) => a.startsWith("nobody@") });
    const bad = await enqueueMail(db, signInMail("nobody@example.org", "Refused"));
    const good = await enqueueMail(db, signInMail("somebody@example.org", "Accepted"));
    const report = await deliverDue(db, track(transportTo(smtp.port)));
    expect(report.sent).toEqual([good.id]);
    expect(report.failed.map((f) => f.id)).toEqual([bad.id]);
    expect((await row(bad.id)).lastError).toMatch(/550|nobody@example\.org/);
    expect(smtp.messages().map((m) => m.subject)).toEqual(["Accepted"]);
  });

  it("honours the batch size", async () => {
    const db = testDb();
    for (let i = 0; i < 5; i++) await enqueueMail(db, signInMail(`b${i}@example.org`));
    const transport = track(transportTo(smtp!.port));
    expect((await deliverDue(db, transport, { batch: 2 })).sent).toHaveLength(2);
    expect((await deliverDue(db, transport, { batch: 2 })).sent).toHaveLength(2);
    expect((await deliverDue(db, transport, { batch: 2 })).sent).toHaveLength(1);
    expect(smtp!.messages()).toHaveLength(5);
  });
});

describe("retryDelayMs", () => {
  it("doubles from 5 s and stops at 20 s, so a message goes out within 30 s of the server's return", () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8].map(retryDelayMs)).toEqual([
      5_000, 10_000, 20_000, 20_000, 20_000, 20_000, 20_000, 20_000,
    ]);
    expect(retryDelayMs(50)).toBe(20_000);
    expect(retryDelayMs(5000)).toBe(20_000);
    expect(retryDelayMs(0)).toBe(5_000);
    expect(RETRY_CAP_MS).toBeLessThan(30_000);
  });
});

describe("after a mail-server outage", () => {
  /**
   * The sender loop, replayed on a simulated clock: a pass at every instant a queued message falls
   * due (the loop wakes for it), or every `intervalMs` when none does.
   */
  async function replay(transport: MailTransport, from: Date, until: Date, intervalMs = 5_000) {
    const db = testDb();
    let now = from;
    const passes: { at: Date; report: Awaited<ReturnType<typeof deliverDue>> }[] = [];
    while (now <= until) {
      const report = await deliverDue(db, transport, { now });
      passes.push({ at: now, report });
      const [next] = await db
        .select({ at: sql<Date | null>`min(${outboxMessages.nextAttemptAt})`.mapWith((x) => (x ? new Date(x) : null)) })
        .from(outboxMessages)
        .where(sql`${outboxMessages.sentAt} is null and ${outboxMessages.abandonedAt} is null`);
      const due = next?.at && next.at > now ? next.at.getTime() : now.getTime() + intervalMs;
      now = new Date(Math.min(due, now.getTime() + intervalMs) + 1);
    }
    return passes;
  }

  it("delivers every queued message within 30 s of the server's return, after a 10-minute outage", async () => {
    const db = testDb();
    let up = false;
    const sent: string[] = [];
    const flaky: MailTransport = {
      from: "Fringe Docket <docket@sierra-lumbre.example>",
      async send(mail) {
        if (!up) throw Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:2525"), { code: "ECONNREFUSED" });
        sent.push(mail.to);
        return { messageId: mail.messageId };
      },
      close() {},
    };
    const first = await enqueueMail(db, signInMail("early@example.org"));
    await enqueueMail(db, { ...signInMail("later@example.org"), kind: "role-change" });
    const t0 = new Date(first.nextAttemptAt.getTime() + 1);
    const back = new Date(t0.getTime() + 10 * 60_000);
    await replay(flaky, t0, back);
    expect(sent).toEqual([]);
    expect((await row(first.id)).attempts).toBeGreaterThan(5);
    up = true;
    const after = await replay(flaky, back, new Date(back.getTime() + 60_000));
    const delivered = after.find((p) => p.report.sent.length > 0)!;
    expect(delivered.at.getTime() - back.getTime()).toBeLessThanOrEqual(30_000);
    // Both went out in that same pass: the first success brings the others forward.
    expect(sent.sort()).toEqual(["early@example.org", "later@example.org"]);
  });

  it("never sends a sign-in link that could no longer arrive in time, and asks the person to request another", async () => {
    const db = testDb();
    const now = new Date();
    const link = await enqueueMail(db, { ...signInMail("late@example.org"), deliverBy: new Date(now.getTime() - 1) });
    const other = await enqueueMail(db, {
      kind: "role-change",
      to: "late@example.org",
      subject: "Your roles in Fringe Docket have changed",
      element: createElement(RoleChangeEmail, {
        name: "L",
        rolesGranted: ["reviewer"],
        rolesRevoked: [],
        byName: "Ada",
      }),
    });
    const transport = track(transportTo(smtp!.port));
    const report = await deliverDue(db, transport, { now: new Date(now.getTime() + 1000) });
    expect(report.abandoned).toEqual([link.id]);
    const given = await row(link.id);
    expect(given.sentAt).toBeNull();
    expect(given.abandonedAt).not.toBeNull();
    expect(given.lastError).toMatch(/could no longer arrive before it expired/);
    // The link itself never reaches the server; a short note in its place does, and the other message.
    await deliverDue(db, transport, { now: new Date(now.getTime() + 2000) });
    const got = smtp!.messages();
    expect(got.map((m) => m.subject).sort()).toEqual([
      "Your Fringe Docket sign-in link could not be delivered in time",
      "Your roles in Fringe Docket have changed",
    ]);
    expect(got.some((m) => (m.text ?? "").includes(LINK))).toBe(false);
    const late = got.find((m) => m.subject.startsWith("Your Fringe Docket sign-in link could not"))!;
    expect(late.text).toMatch(/ask for a new one/i);
    expect(late.text).toContain("/sign-in");
    expect((await row(other.id)).sentAt).not.toBeNull();
  });

  it("gives a sign-in link a deadline three minutes before it expires", async () => {
    const db = testDb();
    const t0 = new Date();
    await sendSignInLink(db, "deadline@example.org", "/", t0);
    const [r] = await db.select().from(outboxMessages).where(eq(outboxMessages.toAddress, "deadline@example.org"));
    expect(r.deliverBy?.getTime()).toBe(t0.getTime() + 12 * 60_000);
  });
});

describe("startOutboxSender", () => {
  it("delivers a message written through the database as soon as it is woken", async () => {
    const db = testDb();
    // A long interval: only the wake-up from enqueueMail can deliver within the test.
    const sender = startOutboxSender({ db, transport: track(transportTo(smtp!.port)), intervalMs: 3_600_000 });
    try {
      await new Promise((r) => setTimeout(r, 100)); // the first, empty pass
      await enqueueMail(db, signInMail("woken@example.org", "Woken"));
      await waitFor(() => smtp!.messages().length === 1);
      expect(smtp!.messages()[0].subject).toBe("Woken");
    } finally {
      await sender.stop();
    }
  });

  it("warns (never errors) while the server is away, and delivers once it is back", async () => {
    const db = testDb();
    const port = smtp!.port;
    await smtp!.stop();
    smtp = null;
    const warn = vi.spyOn(console, "warn").mockImplementation(() => {});
    const m = await enqueueMail(db, signInMail("outage@example.org", "After the outage"));
    const sender = startOutboxSender({ db, transport: track(transportTo(port)), intervalMs: 50 });
    try {
      await waitFor(() => warn.mock.calls.length > 0);
      expect(String(warn.mock.calls[0][0])).toMatch(/\[outbox\] 1 message\(s\) not delivered.*ECONNREFUSED/);
      expect((await row(m.id)).attempts).toBeGreaterThanOrEqual(1);
      smtp = await startFakeSmtp({ port });
      // Move the message's next attempt to now instead of waiting out the back-off.
      await db.update(outboxMessages).set({ nextAttemptAt: new Date() }).where(eq(outboxMessages.id, m.id));
      // Marked sent once its transaction commits, a moment after the server took it.
      await waitFor(async () => (await row(m.id)).sentAt !== null);
      expect(smtp!.messages()).toHaveLength(1);
    } finally {
      await sender.stop();
    }
    expect(smtp.messages()).toHaveLength(1);
  });

  it("never runs two passes at once, however often it is woken", async () => {
    const db = testDb();
    let inFlight = 0;
    let most = 0;
    let sends = 0;
    const slow: MailTransport = {
      from: "Fringe Docket <docket@sierra-lumbre.example>",
      async send(mail) {
        inFlight += 1;
        most = Math.max(most, inFlight);
        await new Promise((r) => setTimeout(r, 10));
        inFlight -= 1;
        sends += 1;
        return { messageId: mail.messageId };
      },
      close() {},
    };
    for (let i = 0; i < 6; i++)
      await db
        .insert(outboxMessages)
        .values({ kind: "reminder", toAddress: `r${i}@example.org`, subject: "R", html: "<p>R</p>", text: "R" });
    const sender = startOutboxSender({ db, transport: slow, intervalMs: 3_600_000, batch: 2 });
    try {
      for (let i = 0; i < 20; i++) sender.wake();
      await waitFor(() => sends === 6);
      expect(most).toBe(1);
    } finally {
      await sender.stop();
    }
  });
});
