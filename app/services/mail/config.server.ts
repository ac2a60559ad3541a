import * as v from "valibot";
import { envPort, envWholeNumber } from "~/lib/env-values";

/** `Name <address>` or a bare address; the address must look like one. */
const fromAddress = v.pipe(
  v.string(),
  v.trim(),
  v.check(
    (s) => /^(?:[^<>\r\n]*<[^\s<>@]+@[^\s<>@]+>|[^\s<>@]+@[^\s<>@]+)$/.test(s),
    "must be an address such as Name <docket@example.org>",
  ),
);

/**
 * The outgoing-mail part of the server's environment. Spread `MAIL_ENV_ENTRIES` into the app's one
 * env schema, or validate it on its own with `parseMailEnv`. `.env.example` documents each variable.
 */
export const MAIL_ENV_ENTRIES = {
  /** SMTP server; the local fake (scripts/fakes/smtp.ts) listens on 127.0.0.1:2525. */
  SMTP_HOST: v.optional(v.pipe(v.string(), v.trim(), v.nonEmpty("must not be empty")), "127.0.0.1"),
  SMTP_PORT: envPort("2525"),
  /** "1" = TLS from the first byte (port 465); "0" = plain, upgraded with STARTTLS when offered. */
  SMTP_SECURE: v.optional(
    v.pipe(
      v.picklist(["0", "1"], "must be 0 or 1"),
      v.transform((s) => s === "1"),
    ),
    "0",
  ),
  /** Credentials, when the server wants them; leave unset for the local fake. */
  SMTP_USER: v.optional(v.string()),
  SMTP_PASSWORD: v.optional(v.string()),
  MAIL_FROM: v.optional(fromAddress, "Fringe Docket <docket@sierra-lumbre.example>"),
  /** "0" keeps the app server from running the outbox sender (when another process runs it). */
  MAIL_SENDER: v.optional(v.picklist(["0", "1"], "must be 0 or 1"), "1"),
  /** How often the sender looks for due messages, milliseconds. */
  MAIL_SENDER_INTERVAL_MS: v.optional(envWholeNumber(100, 3_600_000, "of milliseconds"), "5000"),
};

export const MailEnvSchema = v.pipe(
  v.object(MAIL_ENV_ENTRIES),
  v.check((e) => e.SMTP_PASSWORD === undefined || e.SMTP_USER !== undefined, "SMTP_PASSWORD is set without SMTP_USER"),
);

export type MailEnv = v.InferOutput<typeof MailEnvSchema>;

/**
 * Validates the mail variables; a blank value counts as unset (its default applies). Throws naming
 * every variable that is malformed.
 */
export function parseMailEnv(source: Record<string, string | undefined>): MailEnv {
  const picked: Record<string, string | undefined> = {};
  for (const key of Object.keys(MAIL_ENV_ENTRIES)) {
    const value = source[key];
    picked[key] = value === undefined || value.trim() === "" ? undefined : value;
  }
  const result = v.safeParse(MailEnvSchema, picked);
  if (!result.success) {
    const lines = result.issues.map((issue) => {
      const key = issue.path?.map((p) => String(p.key)).join(".") ?? "mail";
      return `  ${key}: ${issue.message}`;
    });
    throw new Error(`Invalid mail environment:\n${lines.join("\n")}`);
  }
  return result.output;
}
