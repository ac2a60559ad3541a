import { createElement } from "react";
import { describe, expect, it } from "vitest";
import { RoleChangeEmail } from "~/emails/RoleChangeEmail";
import { SignInLinkEmail } from "~/emails/SignInLinkEmail";
import { parseMailEnv } from "~/services/mail/config.server";
import { renderMail } from "~/services/mail/outbox.server";

const LINK = "https://docket.example.org/auth/email/verify?token=abc234&next=%2Faccount";

/** Any HTML tag or entity left in the plain-text alternative. */
const MARKUP = /<\/?[a-z][^>]*>|&(?:amp|lt|gt|quot|#\d+);/i;

describe("sign-in link e-mail", () => {
  it("renders the link as a button and spelled out, and a plain-text alternative without markup", async () => {
    const { html, text } = await renderMail(createElement(SignInLinkEmail, { name: "Ines Calderón", url: LINK }));
    // React escapes & in attributes; the link survives as the browser will read it.
    expect(html).toContain(`href="${LINK.replace(/&/g, "&amp;")}"`);
    expect(html.match(/href="https:\/\/docket\.example\.org\/auth\/email\/verify/g)).toHaveLength(2);
    expect(html).toContain("Fringe Docket");
    expect(html).toContain("#161c2d"); // header band
    expect(html).toContain("#a03611"); // button
    expect(html).toMatch(/IBM Plex Sans/);
    expect(html).toContain("Hello Ines Calderón,");
    expect(html).toContain("15 minutes");

    expect(text).toContain(LINK);
    expect(text).toContain("Hello Ines Calderón,");
    expect(text).toContain("15 minutes");
    expect(text).not.toMatch(MARKUP);
  });

  it("greets a first-time address without a name and states another validity", async () => {
    const { html, text } = await renderMail(
      createElement(SignInLinkEmail, { name: null, url: LINK, expiresMinutes: 1 }),
    );
    expect(text).toMatch(/^Fringe Docket/);
    expect(text).toContain("Hello,");
    expect(text).toContain("within the next 1 minute.");
    expect(html).not.toContain("Hello null");
  });
});

describe("role change e-mail", () => {
  it("lists the roles granted and revoked, and who changed them", async () => {
    const { html, text } = await renderMail(
      createElement(RoleChangeEmail, {
        name: "Tomás Arrieta",
        rolesGranted: ["reviewer", "chair"],
        rolesRevoked: ["proposer"],
        byName: "Ada Quispe",
        accountUrl: "https://docket.example.org/account",
      }),
    );
    expect(html).toContain('href="https://docket.example.org/account"');
    expect(text).toContain("Ada Quispe changed your roles");
    expect(text).toMatch(/can act as\s+\* Reviewer — .*\s+\* Committee chair — /);
    expect(text).toMatch(/no longer act as\s+\* Proposer — /);
    expect(text).toContain("https://docket.example.org/account");
    expect(text).not.toMatch(MARKUP);
  });

  it("omits an empty list and escapes names in the HTML", async () => {
    const { html, text } = await renderMail(
      createElement(RoleChangeEmail, { name: "Lu <b>", rolesGranted: ["scheduler"], rolesRevoked: [], byName: "Ada" }),
    );
    expect(text).not.toContain("no longer act as");
    expect(text).toContain("Scheduler");
    expect(html).not.toContain("Lu <b>");
    expect(html).toContain("Lu &lt;b&gt;");
  });
});

describe("mail environment", () => {
  it("defaults to the local fake on loopback", () => {
    expect(parseMailEnv({})).toMatchObject({
      SMTP_HOST: "127.0.0.1",
      SMTP_PORT: 2525,
      SMTP_SECURE: false,
      MAIL_FROM: "Fringe Docket <docket@sierra-lumbre.example>",
      MAIL_SENDER: "1",
      MAIL_SENDER_INTERVAL_MS: 5000,
    });
    // Blank counts as unset.
    expect(parseMailEnv({ SMTP_HOST: "", SMTP_PORT: " " }).SMTP_HOST).toBe("127.0.0.1");
    expect(parseMailEnv({ SMTP_SECURE: "1", SMTP_PORT: "465" })).toMatchObject({ SMTP_SECURE: true, SMTP_PORT: 465 });
  });

  it("names the variable that is wrong", () => {
    expect(() => parseMailEnv({ SMTP_PORT: "twenty-five" })).toThrow(/SMTP_PORT: must be a port number/);
    expect(() => parseMailEnv({ SMTP_PORT: "70000" })).toThrow(/SMTP_PORT/);
    expect(() => parseMailEnv({ SMTP_SECURE: "yes" })).toThrow(/SMTP_SECURE: must be 0 or 1/);
    expect(() => parseMailEnv({ MAIL_FROM: "Fringe Docket" })).toThrow(/MAIL_FROM/);
    expect(() => parseMailEnv({ MAIL_SENDER_INTERVAL_MS: "10" })).toThrow(/MAIL_SENDER_INTERVAL_MS/);
    expect(() => parseMailEnv({ SMTP_PASSWORD: "secret" })).toThrow(/SMTP_PASSWORD is set without SMTP_USER/);
  });
});
