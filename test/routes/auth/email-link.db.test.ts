import { cookiesFrom, formPost, routeArgs, settle, testDb } from "@test/routes";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { emailSignInTokens } from "~/db/schema/auth";
import { outboxMessages } from "~/db/schema/mail";
import { getViewer } from "~/lib/guards.server";
import { action as verifyAction, loader as verifyLoader } from "~/routes/auth/email-verify";
import { action as signInAction } from "~/routes/auth/sign-in";
import { RATE_LIMITS } from "~/services/auth/config.server";
import { deliverDue } from "~/services/mail/sender.server";
import { createMailTransport } from "~/services/mail/transport.server";
import { type FakeSmtp, startFakeSmtp } from "../../../scripts/fakes/smtp";

let smtp: FakeSmtp;
beforeAll(async () => {
  smtp = await startFakeSmtp();
});
afterAll(async () => {
  await smtp.stop();
});

function transport() {
  return createMailTransport({
    SMTP_HOST: "127.0.0.1",
    SMTP_PORT: smtp.port,
    SMTP_SECURE: false,
    SMTP_USER: undefined,
    SMTP_PASSWORD: undefined,
    MAIL_FROM: "Fringe Docket <docket@sierra-lumbre.example>",
  });
}

/** Asks for a link, delivers the outbox through the SMTP fake, and reads the link from the message. */
async function requestLink(email: string, address = "10.0.0.1") {
  const result = await signInAction(routeArgs("/sign-in", { ...formPost({ email, next: "/account" }), address }));
  expect(result).toMatchObject({ sent: true });
  await deliverDue(testDb(), transport());
  const received = smtp.messages().filter((m) => m.to.includes(email));
  const last = received[received.length - 1];
  expect(last.subject).toBe("Your Fringe Docket sign-in link");
  const link = last.text?.match(/https?:\/\/\S+\/auth\/email\/verify\?\S+/)?.[0];
  expect(link).toBeTruthy();
  return new URL(link!);
}

async function useLink(link: URL) {
  const page = await verifyLoader(routeArgs(link.pathname + link.search));
  expect(page.valid).toBe(true);
  return settle(() => verifyAction(routeArgs("/auth/email/verify", formPost({ token: page.token, next: page.next }))));
}

describe("e-mail link sign-in", () => {
  it("delivers a single-use link through SMTP; the first sign-in creates a proposer account", async () => {
    const link = await requestLink("first.timer@caldera-inst.example");
    // The token is stored hashed, never in clear.
    const rows = await testDb().select().from(emailSignInTokens);
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).not.toBe(link.searchParams.get("token"));
    expect(rows[0].tokenHash).toMatch(/^[0-9a-f]{64}$/);

    const done = await useLink(link);
    expect(done.status).toBe(302);
    expect(done.headers.get("Location")).toBe("/account");
    const viewer = await getViewer(new Request("http://localhost:3000/", { headers: { Cookie: cookiesFrom(done) } }));
    expect(viewer?.user.email).toBe("first.timer@caldera-inst.example");
    expect(viewer?.roles).toEqual(["proposer"]);
  });

  it("refuses a link used a second time", async () => {
    const link = await requestLink("twice@caldera-inst.example");
    expect((await useLink(link)).status).toBe(302);
    const again = await verifyAction(
      routeArgs("/auth/email/verify", formPost({ token: link.searchParams.get("token")!, next: "/" })),
    );
    expect(again).toMatchObject({
      init: { status: 400 },
      data: { error: "This sign-in link has already been used. Ask for a new one." },
    });
  });

  it("refuses an expired link (older than 15 minutes)", async () => {
    const link = await requestLink("late@caldera-inst.example");
    const token = link.searchParams.get("token")!;
    await testDb()
      .update(emailSignInTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(emailSignInTokens.email, "late@caldera-inst.example"));
    const result = await verifyAction(routeArgs("/auth/email/verify", formPost({ token, next: "/" })));
    expect(result).toMatchObject({ init: { status: 400 }, data: { error: expect.stringContaining("has expired") } });
  });

  it("refuses a made-up token", async () => {
    const result = await verifyAction(routeArgs("/auth/email/verify", formPost({ token: "a".repeat(32), next: "/" })));
    expect(result).toMatchObject({ init: { status: 400 }, data: { error: "This sign-in link is not valid." } });
    const bad = await verifyAction(routeArgs("/auth/email/verify", formPost({ token: "<script>", next: "/" })));
    expect(bad).toMatchObject({ init: { status: 400 } });
  });

  it("keeps what was typed and names the problem for a bad address", async () => {
    const result = await signInAction(routeArgs("/sign-in", formPost({ email: "not-an-address", next: "/" })));
    expect(result).toMatchObject({
      init: { status: 400 },
      data: { email: "not-an-address", fieldError: "That does not look like an e-mail address." },
    });
    const none = await testDb().select().from(outboxMessages);
    expect(none.filter((m) => m.toAddress === "not-an-address")).toHaveLength(0);
  });

  it("rate-limits per e-mail address with a clear message", async () => {
    const email = "eager@caldera-inst.example";
    for (let i = 0; i < RATE_LIMITS.perEmail; i++) {
      const ok = await signInAction(
        routeArgs("/sign-in", { ...formPost({ email, next: "/" }), address: `10.1.0.${i}` }),
      );
      expect(ok).toMatchObject({ sent: true });
    }
    const refused = await signInAction(
      routeArgs("/sign-in", { ...formPost({ email, next: "/" }), address: "10.1.0.99" }),
    );
    expect(refused).toMatchObject({
      init: { status: 429 },
      data: { message: expect.stringContaining("Too many sign-in attempts for this e-mail address") },
    });
  });

  it("rate-limits per client address", async () => {
    for (let i = 0; i < RATE_LIMITS.perAddress; i++) {
      await signInAction(
        routeArgs("/sign-in", { ...formPost({ email: `p${i}@caldera-inst.example`, next: "/" }), address: "10.9.9.9" }),
      );
    }
    const refused = await signInAction(
      routeArgs("/sign-in", { ...formPost({ email: "another@caldera-inst.example", next: "/" }), address: "10.9.9.9" }),
    );
    expect(refused).toMatchObject({
      init: { status: 429 },
      data: { message: expect.stringContaining("from this network address") },
    });
  });
});
