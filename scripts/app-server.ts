/**
 * The HTTP side of the app, one copy for `npm start`, `npm run dev` and the tests that drive the
 * built server in process: express in front of React Router's request handler.
 *
 * - The client's address is the socket's peer; X-Forwarded-For (and -Proto, -Host) count only when
 *   the peer is one of the proxies named in TRUSTED_PROXIES. It reaches the app on the router
 *   context under the key the build itself exports (`serverContexts`, app/entry.server.tsx).
 * - No body larger than REQUEST_BODY_MAX_BYTES reaches the app: a larger declared length is refused
 *   before anything is read (also before `100 Continue`), a longer chunked body is cut off while it
 *   streams; either way the app answers 413 with a readable page or JSON, and the rest of the body is
 *   read and dropped (up to DRAIN_LIMIT_BYTES) so the client sees that answer instead of a reset.
 */
import type { IncomingMessage, Server, ServerResponse } from "node:http";
import { writeReadableStreamToWritable } from "@react-router/node";
import express from "express";
import { createRequestHandler, type RouterContext, RouterContextProvider, type ServerBuild } from "react-router";
import type { BodyRefusal } from "~/context";
import { BODY_TOO_LARGE_CODE, REQUEST_BODY_MAX_BYTES } from "~/lib/body.server";

/** After refusing a body, how much more of it is read and dropped before the connection is closed. */
export const DRAIN_LIMIT_BYTES = 64 * 1024 * 1024;

type ServerContexts = {
  clientAddress: RouterContext<string>;
  bodyRefusal: RouterContext<BodyRefusal | null>;
};

export type AppServerOptions = {
  /** The server build, or (development) a function that loads the current one. */
  build: ServerBuild | (() => Promise<ServerBuild>);
  mode: "production" | "development";
  /** proxy-addr entries (addresses, CIDR ranges, loopback/linklocal/uniquelocal); empty: trust none. */
  trustedProxies: readonly string[];
  /** The built client files (production); development serves them through `before`. */
  clientDir?: string;
  /** Middleware that runs before the app (the Vite dev server's). */
  before?: express.RequestHandler[];
  maxBodyBytes?: number;
};

/** "::ffff:203.0.113.7" → "203.0.113.7"; other addresses as they are. */
export function normaliseAddress(address: string | undefined): string {
  if (!address) return "unknown";
  return address.startsWith("::ffff:") && address.includes(".") ? address.slice(7) : address;
}

function contextsOf(build: ServerBuild): ServerContexts {
  const found = (build.entry.module as unknown as { serverContexts?: ServerContexts }).serverContexts;
  if (!found) throw new Error("the server build does not export serverContexts (app/entry.server.tsx)");
  return found;
}

function declaredLength(req: IncomingMessage): number | null {
  const raw = req.headers["content-length"];
  return typeof raw === "string" && /^\d{1,15}$/.test(raw) ? Number(raw) : null;
}

type Tracked = IncomingMessage & { fdTooLarge?: boolean; fdDraining?: boolean };

/** Reads and drops the rest of a refused body, then lets the connection close; past the limit, cuts it. */
function drain(req: Tracked, res: ServerResponse) {
  if (req.fdDraining) return;
  req.fdDraining = true;
  if (!res.headersSent) res.setHeader("Connection", "close");
  req.removeAllListeners("data");
  let dropped = 0;
  req.on("data", (chunk: Buffer) => {
    dropped += chunk.length;
    if (dropped > DRAIN_LIMIT_BYTES) req.socket.destroy();
  });
  req.on("error", () => undefined);
  req.resume();
}

/**
 * The body as a web stream that ends in an error (code BODY_TOO_LARGE_CODE) once more than
 * `maxBytes` arrived; cancelling it drains the socket instead of destroying it.
 */
function cappedBody(req: Tracked, res: ServerResponse, maxBytes: number, onTooLarge: () => void) {
  let total = 0;
  return new ReadableStream<Uint8Array>({
    start(controller) {
      req.on("data", (chunk: Buffer) => {
        total += chunk.length;
        if (total > maxBytes) {
          onTooLarge();
          controller.error(
            Object.assign(new Error(`request body larger than ${maxBytes} bytes`), { code: BODY_TOO_LARGE_CODE }),
          );
          drain(req, res);
          return;
        }
        controller.enqueue(new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.byteLength));
        if ((controller.desiredSize ?? 1) <= 0) req.pause();
      });
      req.once("end", () => {
        if (total <= maxBytes) controller.close();
      });
      req.once("error", (e) => controller.error(e));
    },
    pull() {
      req.resume();
    },
    cancel() {
      drain(req, res);
    },
  });
}

function toRequest(req: Tracked, res: ServerResponse, body: ReadableStream<Uint8Array> | null): Request {
  const r = req as express.Request;
  const forwardedPort = r.app.enabled("trust proxy") ? r.get("X-Forwarded-Host")?.split(":")[1] : undefined;
  const hostPort = r.get("host")?.split(":")[1];
  const port = [forwardedPort, hostPort].map((p) => Number.parseInt(p ?? "", 10)).find(Number.isSafeInteger);
  const hostname = r.hostname.split(/[\\/?#@]/)[0] || "localhost";
  const url = new URL(`${r.protocol}://${hostname}${port ? `:${port}` : ""}${r.originalUrl}`);
  const headers = new Headers();
  for (const [key, value] of Object.entries(req.headers)) {
    if (value === undefined) continue;
    for (const v of Array.isArray(value) ? value : [value]) headers.append(key, v);
  }
  const controller = new AbortController();
  res.on("close", () => {
    if (!res.writableFinished) controller.abort();
  });
  const init: RequestInit & { duplex?: "half" } = { method: req.method, headers, signal: controller.signal };
  if (body) {
    init.body = body;
    init.duplex = "half";
  }
  return new Request(url, init);
}

async function send(res: ServerResponse, response: Response) {
  if (res.destroyed || res.writableEnded) {
    await response.body?.cancel();
    return;
  }
  res.statusCode = response.status;
  res.statusMessage = response.statusText || res.statusMessage;
  for (const [key, value] of response.headers.entries()) res.appendHeader(key, value);
  if (response.body) {
    try {
      await writeReadableStreamToWritable(response.body, res);
    } catch (e) {
      if (!(res.destroyed || res.writableEnded)) throw e;
    }
  } else {
    res.end();
  }
}

export function createAppServer(options: AppServerOptions) {
  const maxBytes = options.maxBodyBytes ?? REQUEST_BODY_MAX_BYTES;
  const app = express();
  app.disable("x-powered-by");
  app.set("trust proxy", options.trustedProxies.length ? [...options.trustedProxies] : false);
  for (const mw of options.before ?? []) app.use(mw);
  if (options.clientDir) {
    const nosniff = (res: ServerResponse) => res.setHeader("X-Content-Type-Options", "nosniff");
    app.use(
      "/assets",
      express.static(`${options.clientDir}/assets`, { immutable: true, maxAge: "1y", setHeaders: nosniff }),
    );
    app.use(express.static(options.clientDir, { maxAge: "1h", setHeaders: nosniff }));
  }

  const handlers = new WeakMap<ServerBuild, ReturnType<typeof createRequestHandler>>();
  const loadBuild = typeof options.build === "function" ? options.build : async () => options.build as ServerBuild;

  // `use`, not `all("*")`: express would decode the path as a route parameter and fail (500) on
  // malformed percent-encoding; the app reads the address itself and answers that with a 404.
  app.use(async (req: express.Request & Tracked, res, next) => {
    try {
      const build = await loadBuild();
      let handle = handlers.get(build);
      if (!handle) {
        handle = createRequestHandler(build, options.mode);
        handlers.set(build, handle);
      }
      const keys = contextsOf(build);
      const context = new RouterContextProvider();
      context.set(keys.clientAddress, normaliseAddress(req.ip ?? req.socket.remoteAddress));

      let body: ReadableStream<Uint8Array> | null = null;
      if (req.method !== "GET" && req.method !== "HEAD") {
        const declared = declaredLength(req);
        if (req.fdTooLarge || (declared !== null && declared > maxBytes)) {
          context.set(keys.bodyRefusal, { reason: "too-large", limitBytes: maxBytes });
          drain(req, res);
        } else if (declared !== 0 && (declared !== null || req.headers["transfer-encoding"] !== undefined)) {
          body = cappedBody(req, res, maxBytes, () =>
            context.set(keys.bodyRefusal, { reason: "too-large", limitBytes: maxBytes }),
          );
        }
      }
      const response = await handle(toRequest(req, res, body), context);
      await send(res, response);
      // Whatever the app left unread is dropped, so the connection can close cleanly.
      if (!req.complete) drain(req, res);
    } catch (error) {
      next(error);
    }
  });

  app.use((error: unknown, _req: express.Request, res: express.Response, _next: express.NextFunction) => {
    console.error(error);
    if (res.headersSent) {
      res.end();
      return;
    }
    res.status(500).type("text/plain").send("Something went wrong on our side; please try again in a moment.");
  });

  /**
   * Hooks the server's `Expect: 100-continue` handling in: a body declared larger than the cap is
   * answered (413) without asking the client to send it.
   */
  function attach(server: Server) {
    server.on("checkContinue", (req: Tracked, res: ServerResponse) => {
      const declared = declaredLength(req);
      if (declared !== null && declared > maxBytes) req.fdTooLarge = true;
      else res.writeContinue();
      server.emit("request", req, res);
    });
  }

  return { app, attach };
}
