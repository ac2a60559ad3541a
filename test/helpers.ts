import { RouterContextProvider } from "react-router";
import { clientAddressContext } from "~/context";
import { createDatabase, database } from "~/db/client.server";

/** The app's own pool, pointed at this test file's database. */
export function testDb() {
  return database();
}

export { createDatabase };

/**
 * Loader/action arguments for calling a route module directly, as the app server would: the
 * request at APP_ORIGIN (http://localhost:3000 by default), a router context carrying the client's
 * address.
 */
export function routeArgs(
  path: string,
  init?: RequestInit & { params?: Record<string, string>; address?: string },
) {
  const request = new Request(new URL(path, "http://localhost:3000"), init);
  const context = new RouterContextProvider();
  context.set(clientAddressContext, init?.address ?? "127.0.0.1");
  return {
    request,
    url: new URL(request.url),
    params: init?.params ?? {},
    context,
    pattern: "",
  } as never;
}

/** A form POST request body for an action. */
export function formPost(fields: Record<string, string | string[]>, headers: Record<string, string> = {}): RequestInit {
  const body = new URLSearchParams();
  for (const [k, val] of Object.entries(fields)) for (const one of Array.isArray(val) ? val : [val]) body.append(k, one);
  return { method: "POST", body, headers: { "Content-Type": "application/x-www-form-urlencoded", ...headers } };
}

/** Runs a loader or action and gives back its Response whether it was returned or thrown. */
export async function settle(fn: () => unknown): Promise<Response> {
  try {
    const out = await fn();
    if (out instanceof Response) return out;
    throw new Error(`expected a Response, got ${JSON.stringify(out)}`);
  } catch (e) {
    if (e instanceof Response) return e;
    throw e;
  }
}

/** The `name=value` part of each Set-Cookie header of a response, joined for a Cookie header. */
export function cookiesFrom(response: Response): string {
  return response.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .filter((c) => !c.endsWith("="))
    .join("; ");
}
