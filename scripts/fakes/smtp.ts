/**
 * A local SMTP server for development and tests: accepts every message on loopback (no TLS, no
 * authentication), parses it and keeps it in memory.
 *
 *   node --import tsx scripts/fakes/smtp.ts      # listens on 127.0.0.1:${FAKE_SMTP_PORT:-2525}
 *
 * In tests: `const smtp = await startFakeSmtp()` (a free port), then `smtp.messages()`, `smtp.stop()`.
 */
import { isIP } from "node:net";
import { pathToFileURL } from "node:url";
import { type AddressObject, simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

export type Received = {
  /** The SMTP envelope, as the client gave it in MAIL FROM and RCPT TO. */
  envelope: { from: string | null; to: string[] };
  /** Header addresses, bare (`docket@example.org`). */
  from: string | null;
  to: string[];
  subject: string;
  /** The HTML part, or null when the message had none. */
  html: string | null;
  /** The plain-text part, or null when the message had none. */
  text: string | null;
  messageId: string | null;
  /** Every header, lowercase names, decoded values. */
  headers: Record<string, string>;
  receivedAt: Date;
};

export type FakeSmtp = {
  host: string;
  port: number;
  /** What arrived so far, oldest first (a copy). */
  messages(): Received[];
  clear(): void;
  stop(): Promise<void>;
};

export type FakeSmtpOptions = {
  /** Loopback only: 127.0.0.1 (default), ::1 or localhost. */
  host?: string;
  /** 0 (default) picks a free port. */
  port?: number;
  /** Wait this long before accepting each message, ms (to widen races in tests). */
  delayMs?: number;
  /** Refuse these recipients with a permanent error (550). */
  rejectRecipient?: (address: string) => boolean;
  /** Called with each message once it is stored. */
  onMessage?: (message: Received) => void;
};

const LOOPBACK_HOSTS = new Set(["127.0.0.1", "::1", "localhost"]);
/** Largest message accepted, bytes. */
const MAX_SIZE = 10 * 1024 * 1024;

function isLoopbackAddress(address: string | undefined): boolean {
  if (!address) return false;
  const a = address.replace(/^::ffff:/, "");
  return (isIP(a) === 4 && a.startsWith("127.")) || a === "::1";
}

function addresses(value: AddressObject | AddressObject[] | undefined): string[] {
  const list = value === undefined ? [] : Array.isArray(value) ? value : [value];
  return list.flatMap((o) => o.value.map((a) => a.address ?? "").filter((a) => a !== ""));
}

function headerText(value: unknown): string {
  if (value === null || value === undefined) return "";
  if (typeof value === "string") return value;
  if (value instanceof Date) return value.toISOString();
  if (typeof value === "object" && "text" in value && typeof (value as { text: unknown }).text === "string") {
    return (value as { text: string }).text;
  }
  if (typeof value === "object" && "value" in value) return String((value as { value: unknown }).value);
  return String(value);
}

export function startFakeSmtp(options: FakeSmtpOptions = {}): Promise<FakeSmtp> {
  const host = options.host ?? "127.0.0.1";
  const port = options.port ?? 0;
  if (!LOOPBACK_HOSTS.has(host)) {
    return Promise.reject(new Error(`the fake SMTP server listens on loopback only, not on ${host}`));
  }
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    return Promise.reject(new Error(`not a port: ${port}`));
  }
  const received: Received[] = [];

  const server = new SMTPServer({
    secure: false,
    authOptional: true,
    disabledCommands: ["STARTTLS", "AUTH"],
    banner: "Fringe Docket local mail sink",
    size: MAX_SIZE,
    closeTimeout: 1_000,
    logger: false,
    onConnect(session, callback) {
      if (!isLoopbackAddress(session.remoteAddress)) return callback(new Error("loopback clients only"));
      callback();
    },
    onRcptTo(address, _session, callback) {
      if (options.rejectRecipient?.(address.address)) {
        const err = new Error(`no mailbox here for ${address.address}`) as Error & { responseCode: number };
        err.responseCode = 550;
        return callback(err);
      }
      callback();
    },
    onData(stream, session, callback) {
      simpleParser(stream)
        .then(async (parsed) => {
          if ((stream as { sizeExceeded?: boolean }).sizeExceeded) {
            const err = new Error("message too large") as Error & { responseCode: number };
            err.responseCode = 552;
            return callback(err);
          }
          const headers: Record<string, string> = {};
          for (const [key, value] of parsed.headers) headers[key] = headerText(value);
          const message: Received = {
            envelope: {
              from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
              to: session.envelope.rcptTo.map((r) => r.address),
            },
            from: addresses(parsed.from)[0] ?? null,
            to: addresses(parsed.to),
            subject: parsed.subject ?? "",
            html: typeof parsed.html === "string" ? parsed.html : null,
            text: parsed.text ?? null,
            messageId: parsed.messageId ?? null,
            headers,
            receivedAt: new Date(),
          };
          if (options.delayMs) await new Promise((r) => setTimeout(r, options.delayMs));
          received.push(message);
          options.onMessage?.(message);
          callback(null, "stored");
        })
        .catch((e: unknown) => {
          const err = new Error(
            `could not read the message: ${e instanceof Error ? e.message : String(e)}`,
          ) as Error & {
            responseCode: number;
          };
          err.responseCode = 451;
          callback(err);
        });
    },
  });

  return new Promise((resolve, reject) => {
    let listening = false;
    // Before listening an error (port taken) fails the start; afterwards errors belong to single
    // client connections and end only that connection.
    server.on("error", (e) => {
      if (!listening) reject(e);
    });
    server.listen(port, host, () => {
      listening = true;
      const address = server.server.address();
      const actualPort = typeof address === "object" && address ? address.port : port;
      resolve({
        host,
        port: actualPort,
        messages: () => [...received],
        clear: () => {
          received.length = 0;
        },
        stop: () => new Promise<void>((done) => server.close(() => done())),
      });
    });
  });
}

function portFromEnv(value: string | undefined): number {
  if (value === undefined || value === "") return 2525;
  if (!/^\d{1,5}$/.test(value) || Number(value) > 65535) {
    throw new Error(`FAKE_SMTP_PORT: must be a port number, not "${value}"`);
  }
  return Number(value);
}

async function main() {
  const smtp = await startFakeSmtp({
    host: process.env.FAKE_SMTP_HOST || "127.0.0.1",
    port: portFromEnv(process.env.FAKE_SMTP_PORT),
    onMessage: (m) => console.log(`[smtp] ${m.to.join(", ")} · ${m.subject}`),
  });
  console.log(
    `[smtp] local mail sink on ${smtp.host}:${smtp.port}; what it receives is kept in memory (the app's mailbox page lists the outbox)`,
  );
  const stop = () => {
    void smtp.stop().then(() => process.exit(0));
    setTimeout(() => process.exit(0), 2_000).unref();
  };
  process.on("SIGINT", stop);
  process.on("SIGTERM", stop);
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  main().catch((e: unknown) => {
    console.error(`[smtp] ${e instanceof Error ? e.message : String(e)}`);
    process.exit(1);
  });
}
