/**
 * Runs the app server (production build, or the Vite dev server with --dev) as a child process,
 * prints where it lives and who can sign in, and stops everything on Ctrl-C or SIGTERM.
 */
import { spawn, type ChildProcess } from "node:child_process";
import { DEMO_PEOPLE } from "~/db/demo-scenario";
import { env } from "~/env.server";

const dev = process.argv.includes("--dev");
const config = env();
const children: ChildProcess[] = [];

function run(command: string, args: string[], extraEnv: Record<string, string>) {
  const child = spawn(command, args, { stdio: "inherit", env: { ...process.env, ...extraEnv } });
  children.push(child);
  child.on("exit", (code, signal) => {
    if (!stopping) {
      console.error(`[serve] ${command} ${args.join(" ")} ended (${signal ?? code}); stopping`);
      stop(code ?? 1);
    }
  });
  return child;
}

let stopping = false;
/**
 * Asks every child to stop; the app server closes its listener on SIGTERM but its idle database
 * connections would keep it alive, so whatever is still running after 3 s is killed.
 */
function stop(code = 0) {
  if (stopping) return;
  stopping = true;
  const running = children.filter((c) => c.exitCode === null && c.signalCode === null);
  for (const c of running) c.kill("SIGTERM");
  const exitWhenDone = () => {
    if (children.every((c) => c.exitCode !== null || c.signalCode !== null)) process.exit(code);
  };
  for (const c of running) c.once("exit", exitWhenDone);
  exitWhenDone();
  setTimeout(() => {
    for (const c of children) if (c.exitCode === null && c.signalCode === null) c.kill("SIGKILL");
    setTimeout(() => process.exit(code), 200);
  }, 3000);
}
process.on("SIGINT", () => stop(0));
process.on("SIGTERM", () => stop(0));

const serverEnv = { PORT: String(config.PORT), HOST: config.HOST, DATABASE_URL: config.DATABASE_URL };
if (dev) {
  run(process.execPath, ["node_modules/@react-router/dev/bin.js", "dev", "--port", String(config.PORT), "--host", config.HOST], serverEnv);
} else {
  run(process.execPath, ["node_modules/@react-router/serve/bin.js", "./build/server/index.js"], serverEnv);
}

const shown = config.HOST === "0.0.0.0" || config.HOST === "127.0.0.1" ? "localhost" : config.HOST;
const lines = [
  "",
  `  Fringe Docket is running on http://${shown}:${config.PORT}`,
  "",
  "  Demo people (invented):",
  ...DEMO_PEOPLE.map((p) => `    ${p.email.padEnd(42)} ${p.roles.join(", ")}`),
  "",
  "  Ctrl-C stops the server; ./docker-less-pg.sh stop stops PostgreSQL.",
  "",
];
console.log(lines.join("\n"));
