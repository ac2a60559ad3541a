import { render, toPlainText } from "@react-email/render";
import { PgTransaction } from "drizzle-orm/pg-core";
import type { ReactElement } from "react";
import * as v from "valibot";
import type { DbOrTx } from "~/db/client.server";
import { MAIL_KINDS, type MailKind, type OutboxMessage, outboxMessages } from "~/db/schema/mail";
import { wakeOutboxSender } from "./sender.server";

export type NewMail = {
  kind: MailKind;
  /** One recipient address. */
  to: string;
  subject: string;
  /** A React e-mail component from app/emails/, e.g. `<SignInLinkEmail … />`. */
  element: ReactElement;
  userId?: number | null;
  relatedUrl?: string | null;
  /** Not sent at all if it has not gone out by then (a sign-in link that would arrive dead). */
  deliverBy?: Date | null;
};

const NewMailSchema = v.object({
  kind: v.picklist(MAIL_KINDS, "unknown mail kind"),
  to: v.pipe(v.string(), v.trim(), v.maxLength(320, "address too long"), v.email("not an e-mail address")),
  subject: v.pipe(
    v.string(),
    v.trim(),
    v.nonEmpty("subject is empty"),
    v.maxLength(300, "subject too long"),
    v.check((s) => !/[\r\n]/.test(s), "subject spans lines"),
  ),
  userId: v.nullish(v.pipe(v.number(), v.integer(), v.minValue(1))),
  relatedUrl: v.nullish(
    v.pipe(
      v.string(),
      v.maxLength(2000, "URL too long"),
      v.url("not a URL"),
      v.check((s) => /^https?:\/\//i.test(s), "not an http(s) URL"),
    ),
  ),
});

/**
 * Renders a message and writes it to the outbox. Pass the transaction that makes the change the
 * message is about, so both are kept or both are lost; then call `wakeOutboxSender()` after the
 * transaction commits. Given the database itself, the row is committed at once and the sender is
 * woken here.
 *
 * Throws (before writing anything) when the address, subject, kind or URL is malformed.
 */
export async function enqueueMail(db: DbOrTx, mail: NewMail): Promise<OutboxMessage> {
  const parsed = v.safeParse(NewMailSchema, {
    kind: mail.kind,
    to: mail.to,
    subject: mail.subject,
    userId: mail.userId,
    relatedUrl: mail.relatedUrl,
  });
  if (!parsed.success) {
    const detail = parsed.issues.map((i) => `${i.path?.map((p) => String(p.key)).join(".") ?? "mail"}: ${i.message}`);
    throw new TypeError(`enqueueMail: ${detail.join("; ")}`);
  }
  const { html, text } = await renderMail(mail.element);
  const [row] = await db
    .insert(outboxMessages)
    .values({
      kind: parsed.output.kind,
      toAddress: parsed.output.to,
      subject: parsed.output.subject,
      html,
      text,
      userId: parsed.output.userId ?? null,
      relatedUrl: parsed.output.relatedUrl ?? null,
      deliverBy: mail.deliverBy ?? null,
    })
    .returning();
  if (!(db instanceof PgTransaction)) wakeOutboxSender();
  return row;
}

/** The HTML document of an e-mail component and its plain-text alternative. */
export async function renderMail(element: ReactElement): Promise<{ html: string; text: string }> {
  const html = await render(element);
  const text = toPlainText(html).trim();
  return { html, text };
}
