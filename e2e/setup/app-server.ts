/**
 * The production server as `npm start` runs it (`scripts/serve.ts`, the build in BUILD_DIR), on free
 * loopback ports with its local sign-on service and SMTP catcher: for the browser tests and the load test.
 */
import { type ChildProcess, spawn } from "node:child_process";
import { createServer } from "node:net";
import { fileURLToPath } from "node:url";

const root = fileURLToPath(new URL("../..", import.meta.url));

export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const address = srv.address();
      const port = typeof address === "object" && address ? address.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

async function waitForHttp(url: string, server: ChildProcess, timeoutMs: number) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`the app server exited with code ${server.exitCode}`);
    try {
      if ((await fetch(url)).status < 500) return;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the app server did not answer at ${url} within ${timeoutMs} ms`);
}

/**
 * Starts the server on `databaseUrl` in demo mode, with `env` on top of this process's environment (no
 * single sign-on issuer, no outside SMTP host), and waits up to `timeoutMs` for its first answer. On
 * failure the server is stopped and the error carries what it printed.
 */
export async function startAppServer(
  databaseUrl: string,
  { env = {}, timeoutMs = 30_000 }: { env?: Record<string, string>; timeoutMs?: number } = {},
): Promise<{ server: ChildProcess; baseUrl: string }> {
  const [port, idpPort, smtpPort] = [await freePort(), await freePort(), await freePort()];
  const baseUrl = `http://127.0.0.1:${port}`;
  const serverEnv: NodeJS.ProcessEnv = {
    ...process.env,
    NODE_ENV: "production",
    DATABASE_URL: databaseUrl,
    PORT: String(port),
    HOST: "127.0.0.1",
    APP_ORIGIN: baseUrl,
    FAKE_IDP_PORT: String(idpPort),
    SMTP_PORT: String(smtpPort),
    DEMO_MODE: "1",
    ...env,
  };
  delete serverEnv.OIDC_ISSUER;
  delete serverEnv.SMTP_HOST;
  const server = spawn(process.execPath, ["--import", "tsx", "scripts/serve.ts"], {
    cwd: root,
    env: serverEnv,
    stdio: ["ignore", "pipe", "pipe"],
  });
  const log: string[] = [];
  server.stdout?.on("data", (d) => log.push(String(d)));
  server.stderr?.on("data", (d) => log.push(String(d)));
  try {
    await waitForHttp(baseUrl, server, timeoutMs);
  } catch (e) {
    server.kill("SIGTERM");
    throw new Error(`${(e as Error).message}\n${log.join("")}`);
  }
  return { server, baseUrl };
}
