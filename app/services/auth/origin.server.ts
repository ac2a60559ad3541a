import { env } from "~/env.server";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Cross-site request check for every state-changing request: a browser's Origin must be the app's
 * own, and a request the browser marks cross-site is refused. Scripts with an API token send no
 * Origin and pass. Returns a reason when the request must be refused.
 */
export function crossSiteReason(request: Request): string | null {
  if (SAFE_METHODS.has(request.method.toUpperCase())) return null;
  const origin = request.headers.get("Origin");
  const allowed = new Set([new URL(env().APP_ORIGIN).origin, new URL(request.url).origin]);
  if (origin && origin !== "null" && !allowed.has(origin)) return `requests from ${origin} are not accepted`;
  if (origin === "null") return "requests from an opaque origin are not accepted";
  if (request.headers.get("Sec-Fetch-Site") === "cross-site") return "cross-site requests are not accepted";
  return null;
}
