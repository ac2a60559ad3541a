import { RouterContextProvider } from "react-router";
import { clientAddressContext, dbContext } from "~/context";
import { createDatabase, database } from "~/db/client.server";

/** The app's own pool, pointed at this test file's database. */
export function testDb() {
  return database();
}

export { createDatabase };

/**
 * Loader/action arguments for calling a route module directly, as the app server would: the
 * request at APP_ORIGIN (http://localhost:3000 by default), a router context carrying the client's
 * address and the database handle (this test file's database).
 */
export function routeArgs(path: string, init?: RequestInit & { params?: Record<string, string>; address?: string }) {
  const request = new Request(new URL(path, "http://localhost:3000"), init);
  const context = new RouterContextProvider();
  context.set(clientAddressContext, init?.address ?? "127.0.0.1");
  context.set(dbContext, database());
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
  for (const [k, val] of Object.entries(fields))
    for (const one of Array.isArray(val) ? val : [val]) body.append(k, one);
  const text = body.toString();
  return {
    method: "POST",
    body: text,
    headers: {
      "Content-Type": "application/x-www-form-urlencoded",
      "Content-Length": String(Buffer.byteLength(text)),
      ...headers,
    },
  };
}

/** `data(body, {status})` as React Router represents it. */
type DataWithInit = { type: "DataWithResponseInit"; data: unknown; init: ResponseInit | null };
const isDataWithInit = (x: unknown): x is DataWithInit =>
  typeof x === "object" && x !== null && (x as { type?: unknown }).type === "DataWithResponseInit";

/**
 * Runs a loader or action and gives back what it answered as a Response, whether it returned or
 * threw a Response or a `data(…, {status})`.
 */
export async function settle(fn: () => unknown): Promise<Response> {
  const asResponse = (x: unknown): Response | null => {
    if (x instanceof Response) return x;
    if (isDataWithInit(x)) return new Response(JSON.stringify(x.data), { ...(x.init ?? {}), headers: x.init?.headers });
    return null;
  };
  try {
    const out = await fn();
    const res = asResponse(out);
    if (res) return res;
    throw new Error(`expected a Response, got ${JSON.stringify(out)}`);
  } catch (e) {
    const res = asResponse(e);
    if (res) return res;
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
