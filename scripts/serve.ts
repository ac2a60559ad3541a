/**
 * The app server: the production build behind express (or the Vite dev server with --dev), the
 * local stand-ins for hosted services when no real one is configured (the sign-on provider when
 * OIDC_ISSUER is unset, the SMTP server when SMTP_HOST is unset), and the outbox sender loop.
 * Prints where everything lives and who can sign in; stops everything on Ctrl-C or SIGTERM.
 */
import { type ChildProcess, spawn } from "node:child_process";
import type { Server } from "node:http";
import { fileURLToPath, pathToFileURL } from "node:url";
import { createRequestHandler } from "@react-router/express";
import express from "express";
import { RouterContextProvider, type ServerBuild } from "react-router";
import { clientAddressContext } from "~/context";
import { closeDatabase } from "~/db/client.server";
import { DEMO_PEOPLE } from "~/db/seed/scenario";
import { env } from "~/env.server";
import { authEnv } from "~/services/auth/config.server";
import { parseMailEnv } from "~/services/mail/config.server";
import { ensureOutboxSender } from "~/services/mail/sender.server";
import { startFakeIdentityProvider } from "./fakes/identity-provider";
import { startFakeSmtp } from "./fakes/smtp";

const root = fileURLToPath(new URL("..", import.meta.url));
const buildDir = `${root}/${process.env.BUILD_DIR ?? "build"}`;
const dev = process.argv.includes("--dev");
const config = env();
const auth = authEnv();
const mail = parseMailEnv(process.env);
const stops: (() => Promise<void> | void)[] = [];
let stopping = false;

async function stop(code = 0) {
  if (stopping) return;
  stopping = true;
  const timer = setTimeout(() => process.exit(code), 4000);
  for (const fn of stops.reverse()) {
    try {
      await fn();
    } catch {
      // keep stopping the rest
    }
  }
  clearTimeout(timer);
  process.exit(code);
}
process.on("SIGINT", () => void stop(0));
process.on("SIGTERM", () => void stop(0));

const notes: string[] = [];

if (auth.usingFakeProvider) {
  const idp = await startFakeIdentityProvider({
    port: auth.FAKE_IDP_PORT,
    clients: [
      {
        clientId: auth.OIDC_CLIENT_ID,
        clientSecret: auth.OIDC_CLIENT_SECRET,
        redirectUris: [`${config.APP_ORIGIN}/auth/sso/callback`],
      },
    ],
    people: config.DEMO_MODE === "1" ? DEMO_PEOPLE : [],
  });
  stops.push(idp.stop);
  notes.push(`  Local sign-on service (stand-in for the observatory's): ${idp.issuer}`);
}
if (!process.env.SMTP_HOST) {
  const smtp = await startFakeSmtp({ port: mail.SMTP_PORT });
  stops.push(smtp.stop);
  notes.push(`  Local SMTP catcher: 127.0.0.1:${smtp.port} (messages also listed in the app's mailbox)`);
}

if (dev) {
  const child: ChildProcess = spawn(
    process.execPath,
    [`${root}/node_modules/@react-router/dev/bin.js`, "dev", "--port", String(config.PORT), "--host", config.HOST],
    { stdio: "inherit", env: process.env, cwd: root },
  );
  child.on("exit", (code) => void stop(code ?? 0));
  stops.push(() => {
    if (child.exitCode === null) child.kill("SIGTERM");
  });
  // The dev server runs in its own process; mail written there goes out on the sender's next poll.
  const sender = ensureOutboxSender();
  if (sender) stops.push(() => sender.stop());
} else {
  const build = (await import(pathToFileURL(`${buildDir}/server/index.js`).href)) as ServerBuild;
  const app = express();
  app.disable("x-powered-by");
  app.use("/assets", express.static(`${buildDir}/client/assets`, { immutable: true, maxAge: "1y" }));
  app.use(express.static(`${buildDir}/client`, { maxAge: "1h" }));
  app.all(
    "*",
    createRequestHandler({
      build,
      mode: "production",
      getLoadContext(req) {
        const context = new RouterContextProvider();
        context.set(clientAddressContext, req.socket.remoteAddress ?? "unknown");
        return context as never;
      },
    }),
  );
  const server: Server = await new Promise((resolve, reject) => {
    const s = app.listen(config.PORT, config.HOST, () => resolve(s));
    s.once("error", reject);
  });
  stops.push(
    () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  );
  const sender = ensureOutboxSender();
  if (sender) stops.push(() => sender.stop());
  stops.push(() => closeDatabase());
}

const shown = config.HOST === "0.0.0.0" || config.HOST === "127.0.0.1" ? "localhost" : config.HOST;
const lines = [
  "",
  `  Fringe Docket is running on http://${shown}:${config.PORT}${dev ? " (development)" : ""}`,
  ...notes,
  "",
  ...(config.DEMO_MODE === "1"
    ? [
        "  Demo sign-ins (invented people): press “Sign in”, continue with single sign-on, pick one:",
        ...DEMO_PEOPLE.map((p) => `    ${p.name.padEnd(20)} ${p.email.padEnd(42)} ${p.roles.join(", ")}`),
        "",
      ]
    : []),
  "  Ctrl-C stops the server; ./docker-less-pg.sh stop stops PostgreSQL.",
  "",
];
console.log(lines.join("\n"));
