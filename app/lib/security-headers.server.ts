/**
 * The security headers of every answer: a Content-Security-Policy (with a fresh nonce for the inline
 * scripts React Router writes into each page), no framing, no MIME sniffing, no referrer beyond the
 * app, HSTS over https, and `Cache-Control: no-store` on everything a signed-in person is shown.
 */
import { randomBytes } from "node:crypto";
import { env } from "~/env.server";
import { SESSION_COOKIE } from "~/services/auth/config.server";

/** A fresh nonce for one page: 16 random bytes, base64. */
export function newNonce(): string {
  return randomBytes(16).toString("base64");
}

/**
 * The policy of an HTML page. Scripts: the app's own files and the inline ones carrying `nonce`
 * (React Router's hydration data); nothing inline without it, no eval. Styles: the app's own plus
 * inline ones, which the plotting library writes into the page and into `style` attributes. Images:
 * own, `data:` and `blob:` (plot downloads). Workers: own and `blob:`. No plugins, no framing, forms
 * post only to the app. In development the dev server's websocket is allowed too.
 */
export function pageSecurityPolicy(nonce: string, options: { dev?: boolean; https?: boolean } = {}): string {
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}'`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    `connect-src 'self'${options.dev ? " ws: wss:" : ""}`,
    "worker-src 'self' blob:",
    "frame-src 'self'",
    "object-src 'none'",
    "base-uri 'none'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ];
  if (options.https) directives.push("upgrade-insecure-requests");
  return directives.join("; ");
}

/** The policy of every other answer (JSON, CSV, PDF, redirects): never framed, nothing to run. */
export const RESOURCE_SECURITY_POLICY = "frame-ancestors 'none'";

/** True when the app is reached over https (its own URL, or the public origin it is configured with). */
export function servedOverHttps(request: Request): boolean {
  return new URL(request.url).protocol === "https:" || env().APP_ORIGIN.startsWith("https:");
}

/** True when the request carries a session cookie or an API token (its answer is someone's own). */
export function carriesCredentials(request: Request): boolean {
  if (request.headers.has("Authorization")) return true;
  return (request.headers.get("Cookie") ?? "").split(";").some((c) => c.trim().startsWith(`${SESSION_COOKIE}=`));
}

/**
 * Sets the headers every answer carries, on `response` (a fresh copy when its headers are frozen).
 * A page keeps the policy `handleRequest` gave it; anything else gets `RESOURCE_SECURITY_POLICY`.
 */
export function withSecurityHeaders(request: Request, response: Response): Response {
  let out = response;
  try {
    out.headers.set("X-Content-Type-Options", "nosniff");
  } catch {
    out = new Response(response.body, response);
    out.headers.set("X-Content-Type-Options", "nosniff");
  }
  const h = out.headers;
  if (!h.has("Content-Security-Policy")) h.set("Content-Security-Policy", RESOURCE_SECURITY_POLICY);
  h.set("X-Frame-Options", "DENY");
  // Same-origin requests keep their Origin header (the cross-site check needs it); nothing leaks out.
  h.set("Referrer-Policy", "same-origin");
  h.set("Cross-Origin-Opener-Policy", "same-origin");
  h.set("Permissions-Policy", "camera=(), microphone=(), geolocation=(), payment=()");
  if (servedOverHttps(request)) h.set("Strict-Transport-Security", "max-age=31536000; includeSubDomains");
  if (carriesCredentials(request) || h.has("Set-Cookie")) {
    h.set("Cache-Control", "no-store");
    h.delete("Expires");
  }
  return out;
}
