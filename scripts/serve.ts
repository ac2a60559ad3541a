/**
 * The app server: the production build behind express (or, with --dev, Vite's dev server inside the
 * same express app: scripts/app-server.ts), the local stand-ins for hosted services when no real one
 * is configured (the sign-on provider when OIDC_ISSUER is unset, the SMTP server when SMTP_HOST is
 * unset), and the outbox sender loop. Prints where everything lives and who can sign in; stops
 * everything on Ctrl-C or SIGTERM.
 */
import { spawn } from "node:child_process";
import { createServer, type Server } from "node:http";
import { setPriority } from "node:os";
import { fileURLToPath, pathToFileURL } from "node:url";
import type { ServerBuild } from "react-router";
import { closeDatabase } from "~/db/client.server";
import { DEMO_PEOPLE } from "~/db/seed/scenario";
import { env } from "~/env.server";
import { authEnv } from "~/services/auth/config.server";
import { stopImagingQueues } from "~/services/imaging/queue.server";
import { parseMailEnv } from "~/services/mail/config.server";
import { ensureOutboxSender } from "~/services/mail/sender.server";
import { createAppServer } from "./app-server";
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

/** express in front of the app (scripts/app-server.ts): the built bundle, or Vite's dev server in process. */
async function appServer(
  httpServer: Server,
): Promise<ReturnType<typeof createAppServer> & { close?: () => Promise<void> }> {
  const trustedProxies = config.TRUSTED_PROXIES;
  if (!dev) {
    const build = (await import(pathToFileURL(`${buildDir}/server/index.js`).href)) as ServerBuild;
    return createAppServer({ build, mode: "production", trustedProxies, clientDir: `${buildDir}/client` });
  }
  // Development: the same server, with Vite (HMR and on-the-fly builds) as middleware in this process,
  // so the client address, the body cap and the headers work exactly as in production.
  const { createServer: createViteServer, isRunnableDevEnvironment } = await import("vite");
  const vite = await createViteServer({
    root,
    server: { middlewareMode: true, ws: { server: httpServer } },
    appType: "custom",
  });
  const ssr = vite.environments.ssr;
  if (!isRunnableDevEnvironment(ssr)) throw new Error("the Vite SSR environment cannot run modules");
  const built = createAppServer({
    build: () => ssr.runner.import("virtual:react-router/server-build") as Promise<ServerBuild>,
    mode: "development",
    trustedProxies,
    before: [vite.middlewares],
  });
  return { ...built, close: () => vite.close() };
}

const server = createServer();
const { app, attach, close } = await appServer(server);
if (close) stops.push(close);
server.on("request", app);
attach(server);
await new Promise<void>((resolve, reject) => {
  server.once("error", reject);
  server.listen(config.PORT, config.HOST, () => resolve());
});
stops.push(
  () =>
    new Promise<void>((resolve) => {
      server.closeAllConnections();
      server.close(() => resolve());
    }),
);
// Imaging-preview workers (scripts/worker.ts), each a process of its own, stopped with the server.
for (let i = 0; i < config.IMAGING_WORKERS; i++) {
  const worker = spawn(process.execPath, ["--import", "tsx", `${root}/scripts/worker.ts`], {
    cwd: root,
    env: process.env,
    stdio: "inherit",
  });
  // Below the server's priority (a nice increment, as the computation pool's threads): pages stay quick.
  try {
    if (worker.pid) setPriority(worker.pid, 10);
  } catch {
    // not allowed here: the worker runs at the server's priority
  }
  worker.on("exit", (code, signal) => {
    if (!stopping) console.warn(`[imaging] worker ${worker.pid} ended (${signal ?? `exit ${code}`})`);
  });
  stops.push(
    () =>
      new Promise<void>((resolve) => {
        if (worker.exitCode !== null || worker.signalCode !== null) return resolve();
        worker.once("exit", () => resolve());
        worker.kill("SIGTERM");
      }),
  );
}
if (config.IMAGING_WORKERS > 0) {
  notes.push(`  Imaging-preview workers: ${config.IMAGING_WORKERS} (npm run worker starts more, on any machine)`);
}
const sender = ensureOutboxSender();
if (sender) stops.push(() => sender.stop());
stops.push(() => stopImagingQueues());
stops.push(() => closeDatabase());

const lines = [
  "",
  `  Fringe Docket is running on ${config.APP_ORIGIN}${dev ? " (development)" : ""}`,
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
