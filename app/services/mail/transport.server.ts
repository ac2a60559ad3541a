import nodemailer from "nodemailer";
import type { MailEnv } from "./config.server";

/** One message as the sender hands it to the transport. */
export type OutgoingMail = {
  to: string;
  subject: string;
  html: string;
  text: string;
  /** The Message-ID header, angle brackets included; the same on every attempt of one message. */
  messageId: string;
  headers?: Record<string, string>;
};

export type MailTransport = {
  /** The From header every message carries. */
  readonly from: string;
  /** Sends one message; resolves with the Message-ID it went out with, rejects when the server refuses or is away. */
  send(mail: OutgoingMail): Promise<{ messageId: string }>;
  /** Closes any open connection. */
  close(): void;
};

export type MailTransportConfig = Pick<
  MailEnv,
  "SMTP_HOST" | "SMTP_PORT" | "SMTP_SECURE" | "SMTP_USER" | "SMTP_PASSWORD" | "MAIL_FROM"
>;

export type MailTransportTimeouts = {
  /** Time to open the TCP connection, ms. */
  connectionMs?: number;
  /** Time for the server's greeting after connecting, ms. */
  greetingMs?: number;
  /** Idle time allowed on an open connection, ms. */
  socketMs?: number;
};

/**
 * An SMTP transport through nodemailer. Timeouts are short so that a dead or hanging server fails a
 * delivery attempt within seconds; the outbox retries it later.
 */
export function createMailTransport(config: MailTransportConfig, timeouts: MailTransportTimeouts = {}): MailTransport {
  const transporter = nodemailer.createTransport({
    host: config.SMTP_HOST,
    port: config.SMTP_PORT,
    secure: config.SMTP_SECURE,
    auth: config.SMTP_USER ? { user: config.SMTP_USER, pass: config.SMTP_PASSWORD ?? "" } : undefined,
    connectionTimeout: timeouts.connectionMs ?? 5_000,
    greetingTimeout: timeouts.greetingMs ?? 5_000,
    socketTimeout: timeouts.socketMs ?? 15_000,
    dnsTimeout: 5_000,
    logger: false,
    debug: false,
  });
  return {
    from: config.MAIL_FROM,
    async send(mail) {
      const info = await transporter.sendMail({
        from: config.MAIL_FROM,
        to: mail.to,
        subject: mail.subject,
        html: mail.html,
        text: mail.text,
        messageId: mail.messageId,
        headers: mail.headers,
      });
      if (info.rejected.length > 0) {
        throw new Error(`the server refused ${info.rejected.map(String).join(", ")}`);
      }
      return { messageId: info.messageId || mail.messageId };
    },
    close() {
      transporter.close();
    },
  };
}

/** The domain part of a From value (`Name <a@b.example>` → `b.example`); used to build Message-IDs. */
export function senderDomain(from: string): string {
  const match = /@([^\s<>@]+)>?\s*$/.exec(from);
  return match ? match[1] : "localhost";
}
