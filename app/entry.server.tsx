/**
 * Server rendering of a page (streamed, as React Router's default does), with a fresh nonce for the
 * inline scripts and the page's Content-Security-Policy; and `handleError`, which tells the root
 * middleware why a request failed when the client should hear it with its own status (the database
 * not answering → 503, a body cut off at the cap → 413) instead of a 500.
 */
import { PassThrough } from "node:stream";
import { createReadableStreamFromReadable } from "@react-router/node";
import { isbot } from "isbot";
import { renderToPipeableStream } from "react-dom/server";
import type { EntryContext, HandleErrorFunction, RouterContextProvider } from "react-router";
import { isRouteErrorResponse, ServerRouter } from "react-router";
import { bodyRefusalContext, clientAddressContext, type RequestFailure, requestFailureContext } from "./context";
import { isBodyTooLarge } from "./lib/body.server";
import { isDatabaseUnavailable, isDataException } from "./lib/pg-errors";
import { newNonce, pageSecurityPolicy, servedOverHttps } from "./lib/security-headers.server";

export const streamTimeout = 5_000;

/**
 * The router-context keys the app server (scripts/app-server.ts) fills in. The server takes them
 * from the build it serves, so it sets the very keys the app's loaders read.
 */
export const serverContexts = { clientAddress: clientAddressContext, bodyRefusal: bodyRefusalContext };

export default function handleRequest(
  request: Request,
  responseStatusCode: number,
  responseHeaders: Headers,
  routerContext: EntryContext,
  _loadContext: RouterContextProvider,
) {
  const nonce = newNonce();
  responseHeaders.set(
    "Content-Security-Policy",
    pageSecurityPolicy(nonce, { dev: import.meta.env.DEV, https: servedOverHttps(request) }),
  );
  if (request.method.toUpperCase() === "HEAD") {
    return new Response(null, { status: responseStatusCode, headers: responseHeaders });
  }

  return new Promise<Response>((resolve, reject) => {
    let shellRendered = false;
    const userAgent = request.headers.get("user-agent");
    // Crawlers get the whole page at once; people get the shell as soon as it is ready.
    const readyOption = (userAgent && isbot(userAgent)) || routerContext.isSpaMode ? "onAllReady" : "onShellReady";
    let timeoutId: ReturnType<typeof setTimeout> | undefined = setTimeout(() => abort(), streamTimeout + 1000);

    const { pipe, abort } = renderToPipeableStream(
      <ServerRouter context={routerContext} url={request.url} nonce={nonce} />,
      {
        nonce,
        [readyOption]() {
          shellRendered = true;
          const body = new PassThrough({
            final(callback) {
              clearTimeout(timeoutId);
              timeoutId = undefined;
              callback();
            },
          });
          responseHeaders.set("Content-Type", "text/html; charset=utf-8");
          pipe(body);
          resolve(
            new Response(createReadableStreamFromReadable(body), {
              headers: responseHeaders,
              status: responseStatusCode,
            }),
          );
        },
        onShellError(error: unknown) {
          reject(error);
        },
        onError(error: unknown) {
          responseStatusCode = 500;
          if (shellRendered) console.error(error);
        },
      },
    );
  });
}

/** What kind of failure `error` is, when the client should be told with a status of its own. */
function failureOf(error: unknown): RequestFailure | null {
  if (isDatabaseUnavailable(error)) return "database-unavailable";
  if (isBodyTooLarge(error)) return "body-too-large";
  if (isDataException(error)) return "database-refused-input";
  return null;
}

/** A write whose Origin header names another site than the one it was sent to. */
function crossOriginPost(request: Request): boolean {
  const origin = request.headers.get("Origin");
  if (!origin || ["GET", "HEAD"].includes(request.method.toUpperCase())) return false;
  try {
    return new URL(origin).host !== new URL(request.url).host;
  } catch {
    return true;
  }
}

export const handleError: HandleErrorFunction = (error, { request, context }) => {
  if (request.signal.aborted) return;
  // A 4xx the router answers itself (a POST to a page without a form, an unknown address) is the
  // client's mistake, answered as such; nothing to log.
  if (isRouteErrorResponse(error) && error.status < 500) return;
  if (crossOriginPost(request)) {
    // React Router refused a form posted from another site (400) before any action ran.
    console.warn(
      `[cross-site] ${request.method} ${new URL(request.url).pathname} from ${request.headers.get("Origin")}`,
    );
    return;
  }
  const failure = failureOf(error);
  if (failure) {
    // Not a bug of ours to log with a stack: the root middleware answers it (503, 413 or 400).
    (context as RouterContextProvider | undefined)?.set(requestFailureContext, failure);
    const detail = error instanceof Error ? error.message.split("\n")[0] : String(error);
    console.warn(`[${failure}] ${request.method} ${new URL(request.url).pathname}: ${detail}`);
    return;
  }
  console.error(error);
};
