/**
 * The production build served in this test process, through the same app server `npm start` uses
 * (scripts/app-server.ts), on a free loopback port; the database is this test file's (test/setup).
 * Needs `npx react-router build` first (npm test builds before it runs these tests); BUILD_DIR picks
 * another build folder.
 */
import { existsSync } from "node:fs";
import { createServer, request as httpRequest, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { fileURLToPath, pathToFileURL } from "node:url";
import type { ServerBuild } from "react-router";
import { type AppServerOptions, createAppServer } from "../../scripts/app-server";

const root = fileURLToPath(new URL("../..", import.meta.url));

export type BuiltApp = {
  /** "http://127.0.0.1:<port>" */
  url: string;
  port: number;
  close(): Promise<void>;
};

let buildPromise: Promise<ServerBuild> | undefined;

/** The server build of BUILD_DIR (default "build"), loaded once per test file. */
export function loadBuild(): Promise<ServerBuild> {
  const dir = process.env.BUILD_DIR ?? "build";
  const file = `${root}/${dir}/server/index.js`;
  if (!existsSync(file)) {
    throw new Error(`No production build in ${dir}/: run \`npx react-router build\` first (npm test does).`);
  }
  buildPromise ??= import(/* @vite-ignore */ pathToFileURL(file).href) as Promise<ServerBuild>;
  return buildPromise;
}

/** Starts the built app on 127.0.0.1 (a free port). */
export async function startBuiltApp(options: Partial<Omit<AppServerOptions, "build">> = {}): Promise<BuiltApp> {
  const build = await loadBuild();
  const { app, attach } = createAppServer({
    build,
    mode: "production",
    trustedProxies: [],
    clientDir: `${root}/${process.env.BUILD_DIR ?? "build"}/client`,
    ...options,
  });
  const server: Server = createServer(app);
  attach(server);
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", () => resolve()));
  const port = (server.address() as AddressInfo).port;
  return {
    url: `http://127.0.0.1:${port}`,
    port,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

export type RawAnswer = { status: number; headers: Record<string, string | string[] | undefined>; body: string };

/**
 * One HTTP request through node:http, for what fetch cannot do: a chosen source address
 * (`localAddress`, e.g. 127.0.0.2), a body written in pieces, no Content-Length.
 */
export function rawRequest(
  url: string,
  options: {
    method?: string;
    headers?: Record<string, string>;
    body?: Buffer | string | (Buffer | string)[];
    localAddress?: string;
  } = {},
): Promise<RawAnswer> {
  const parts = options.body === undefined ? [] : Array.isArray(options.body) ? options.body : [options.body];
  const headers = { ...options.headers };
  // One piece is sent with its length, as browsers do; several pieces (or a chunked header) without.
  if (parts.length === 1 && !("Transfer-Encoding" in headers))
    headers["Content-Length"] = String(Buffer.byteLength(parts[0]));
  return new Promise((resolve, reject) => {
    const req = httpRequest(
      url,
      { method: options.method ?? "GET", headers, localAddress: options.localAddress },
      (res) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", () =>
          resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks).toString("utf8") }),
        );
        res.on("error", reject);
      },
    );
    req.on("error", reject);
    for (const p of parts) req.write(p);
    req.end();
  });
}
