import { routeArgs, testDb } from "@test/routes";
import { eq, sql } from "drizzle-orm";
import { createElement } from "react";
import { beforeEach, describe, expect, it } from "vitest";
import { outboxMessages } from "~/db/schema/mail";
import { userRoles, users } from "~/db/schema/users";
import { SignInLinkEmail } from "~/emails/SignInLinkEmail";
import { loader as mailboxLoader } from "~/routes/mailbox/index";
import { loader as messageLoader } from "~/routes/mailbox/message";
import { SESSION_COOKIE } from "~/services/auth/config.server";
import { consumeSignInLink, sendSignInLink } from "~/services/auth/email-link.server";
import { createSession } from "~/services/auth/sessions.server";
import { enqueueMail } from "~/services/mail/outbox.server";
import {
  getMessage,
  HIDDEN_TOKEN,
  listMessages,
  MAILBOX_PAGE_SIZE,
  parseMailboxQuery,
  parseMessageId,
} from "~/services/mailbox/queries.server";

/** The mailbox list's loader data (it answers through `data()` to carry its status). */
const listPage = async (args: Parameters<typeof mailboxLoader>[0]) => (await mailboxLoader(args)).data;

const LINK = "http://localhost:3000/auth/email/verify?token=abcdefghijklmnopqrstuvwxyz234567";

/** A sign-in notice for `to` under `subject`, its body carrying LINK. */
const signInMail = (to: string, subject: string) =>
  ({
    kind: "sign-in-link",
    to,
    subject,
    element: createElement(SignInLinkEmail, { name: "Mara", url: LINK }),
  }) as const;

beforeEach(async () => {
  await testDb().execute(sql`truncate outbox_messages restart identity`);
});

describe("mailbox reads", () => {
  it("lists newest first, searches address and subject, pages by 50 and finds one message", async () => {
    const db = testDb();
    const base = Date.now() - 1_000_000;
    const values = Array.from({ length: 120 }, (_, i) => ({
      kind: "submission" as const,
      toAddress: i % 3 === 0 ? `pi${i}@lumbre.example` : `coi${i}@example.org`,
      subject: i === 7 ? "100% done_now" : `Proposal ${i} received`,
      html: "<p>x</p>",
      text: "x",
      createdAt: new Date(base + i * 1000),
    }));
    await db.insert(outboxMessages).values(values);

    const all = { email: "admin@lumbre.example", readsAll: true };
    const first = await listMessages(db, { page: 1 }, all);
    expect(first.total).toBe(120);
    expect(first.pageCount).toBe(3);
    expect(first.rows).toHaveLength(MAILBOX_PAGE_SIZE);
    expect(first.rows[0].subject).toBe("Proposal 119 received");
    const third = await listMessages(db, { page: 3 }, all);
    expect(third.rows).toHaveLength(20);
    // Beyond the end: the last page.
    expect((await listMessages(db, { page: 99 }, all)).page).toBe(3);

    expect((await listMessages(db, { q: "LUMBRE.example" }, all)).total).toBe(40);
    expect((await listMessages(db, { q: "Proposal 11" }, all)).total).toBe(11); // 11, 110–119
    // LIKE wildcards in the search match themselves.
    const literal = await listMessages(db, { q: "100%" }, all);
    expect(literal.rows.map((r) => r.subject)).toEqual(["100% done_now"]);
    expect((await listMessages(db, { q: "_" }, all)).total).toBe(1);

    const one = await getMessage(db, first.rows[0].id, all);
    expect(one?.html).toBe("<p>x</p>");
    expect(await getMessage(db, 999_999, all)).toBeNull();
    // A reader who is not an administrator sees only what is addressed to them.
    const own = { email: "PI0@lumbre.example", readsAll: false };
    expect((await listMessages(db, {}, own)).rows.map((r) => r.toAddress)).toEqual(["pi0@lumbre.example"]);
    expect(await getMessage(db, first.rows[0].id, own)).toBeNull();
  });

  it("reads the query string and the message number defensively", () => {
    const q = (s: string) => parseMailboxQuery(new URLSearchParams(s));
    expect(q("")).toEqual({ q: "", page: 1, qTooLong: false });
    expect(q("q=%20ines%20&page=2")).toEqual({ q: "ines", page: 2, qTooLong: false });
    for (const bad of ["page=0", "page=-3", "page=abc", "page=1.5", "page=99999999999", "page="])
      expect(q(bad).page).toBe(1);
    // A search text over the stated limit is refused, never cut short silently.
    expect(q(`q=${"x".repeat(201)}`)).toEqual({ q: "", page: 1, qTooLong: true });
    expect(q(`q=${"x".repeat(200)}`).q).toHaveLength(200);

    expect(parseMessageId("42")).toBe(42);
    for (const bad of [undefined, "", "0", "-1", "042", "4e2", "1.0", "abc", "99999999999", "2147483648"])
      expect(parseMessageId(bad)).toBeNull();
  });
});

/** A new person `email` holding `role`, signed in: the request headers that carry their session cookie. */
async function signedIn(email: string, role: "admin" | "proposer" = "admin", name = email.split("@")[0]) {
  const db = testDb();
  const [user] = await db.insert(users).values({ email, name }).returning();
  await db.insert(userRoles).values({ userId: user.id, role });
  const { token } = await createSession(db, user.id, { method: "sso" });
  return { headers: { Cookie: `${SESSION_COOKIE}=${token}` } };
}

describe("mailbox pages", () => {
  async function thrownBy(fn: () => Promise<unknown>) {
    try {
      await fn();
    } catch (e) {
      return e as { status?: number; init?: { status?: number }; headers?: Headers };
    }
    throw new Error("expected the loader to throw");
  }

  it("sends anonymous visitors to sign in", async () => {
    const thrown = await thrownBy(() => mailboxLoader(routeArgs("/mailbox")));
    expect(thrown.status).toBe(302);
    expect(thrown.headers?.get("Location")).toMatch(/^\/sign-in\?next=%2Fmailbox/);
    const again = await thrownBy(() => messageLoader(routeArgs("/mailbox/1", { params: { messageId: "1" } })));
    expect(again.status).toBe(302);
  });

  it("lists and shows messages, treats a bad page as page 1 and a bad number as 404", async () => {
    const db = testDb();
    const init = await signedIn("mara@example.org", "admin", "Mara Oyarzún");
    const mine = await enqueueMail(db, signInMail("MARA@example.org", "For the viewer"));
    await enqueueMail(db, signInMail("other@example.org", "For someone else"));

    const list = await listPage(routeArgs("/mailbox?page=banana&q=", init));
    expect(list.page).toBe(1);
    expect(list.total).toBe(2);
    expect(list.rows.map((r) => [r.subject, r.status, r.toViewer])).toEqual([
      ["For someone else", "queued", false],
      ["For the viewer", "queued", true],
    ]);
    const found = await listPage(routeArgs("/mailbox?q=viewer", init));
    expect(found.rows.map((r) => r.id)).toEqual([mine.id]);

    const one = await messageLoader(
      routeArgs(`/mailbox/${mine.id}`, { ...init, params: { messageId: String(mine.id) } }),
    );
    expect(one.message.subject).toBe("For the viewer");
    expect(one.message.html).toContain(LINK);
    expect(one.message.status).toBe("queued");

    for (const bad of ["0", "abc", "1e3", "99999999999", String(mine.id + 1000)]) {
      const thrown = await thrownBy(() =>
        messageLoader(routeArgs(`/mailbox/${bad}`, { ...init, params: { messageId: bad } })),
      );
      expect(thrown.init?.status).toBe(404);
    }
  });
});

describe("whose mail a signed-in person reads", () => {
  async function statusOf(fn: () => Promise<unknown>) {
    try {
      await fn();
      return 200;
    } catch (e) {
      return (e as { init?: { status?: number }; status?: number }).init?.status ?? (e as { status?: number }).status;
    }
  }

  it("shows a person only their own messages, whatever the demo mode says", async () => {
    const db = testDb();
    process.env.DEMO_MODE = "1";
    const ines = await signedIn("ines@valle-alto.example", "proposer");
    const hers = await enqueueMail(db, signInMail("ines@valle-alto.example", "Ines's link"));
    const admins = await sendSignInLink(db, "root@lumbre.example", "/");
    const [adminRow] = await db
      .select()
      .from(outboxMessages)
      .where(eq(outboxMessages.toAddress, "root@lumbre.example"));
    expect(admins).toContain("token=");

    const list = await listPage(routeArgs("/mailbox", ines));
    expect(list.readsAll).toBe(false);
    expect(list.rows.map((r) => r.subject)).toEqual(["Ines's link"]);
    // The administrator's sign-in link is "no such message" to her, by number or by search.
    const theirs = await statusOf(() =>
      messageLoader(routeArgs(`/mailbox/${adminRow.id}`, { ...ines, params: { messageId: String(adminRow.id) } })),
    );
    expect(theirs).toBe(404);
    expect((await listPage(routeArgs("/mailbox?q=root", ines))).total).toBe(0);
    const own = await messageLoader(
      routeArgs(`/mailbox/${hers.id}`, { ...ines, params: { messageId: String(hers.id) } }),
    );
    expect(own.message.text).toContain(LINK);
  });

  it("shows an administrator everything, with a live one-time link hidden until it is used", async () => {
    const db = testDb();
    const admin = await signedIn("root@lumbre.example", "admin");
    const link = await sendSignInLink(db, "kenji@tidewater.example", "/proposals");
    const token = new URL(link).searchParams.get("token")!;
    const [row] = await db.select().from(outboxMessages).where(eq(outboxMessages.toAddress, "kenji@tidewater.example"));
    const open = () =>
      messageLoader(routeArgs(`/mailbox/${row.id}`, { ...admin, params: { messageId: String(row.id) } }));

    const list = await listPage(routeArgs("/mailbox", admin));
    expect(list.readsAll).toBe(true);
    expect(list.rows.map((r) => r.to)).toContain("kenji@tidewater.example");
    const live = (await open()).message;
    expect(live.html).not.toContain(token);
    expect(live.text).not.toContain(token);
    expect(live.text).toContain(`token=${HIDDEN_TOKEN}`);
    expect(live.linkHiddenUntil).toMatch(/UTC$/);
    expect(JSON.stringify(live)).not.toContain(token);

    // Once used, the link opens nothing any more and is shown as it was.
    expect((await consumeSignInLink(db, token)).ok).toBe(true);
    const used = (await open()).message;
    expect(used.text).toContain(token);
    expect(used.linkHiddenUntil).toBeNull();
  });
});
