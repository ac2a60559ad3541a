import { createDatabase, database } from "~/db/client.server";

/** The app's own pool, pointed at this test file's database. */
export function testDb() {
  return database();
}

export { createDatabase };

/** Minimal loader/action arguments for calling a route module directly. */
export function routeArgs(path: string, init?: RequestInit & { params?: Record<string, string> }) {
  const request = new Request(new URL(path, "http://localhost:3000"), init);
  return {
    request,
    url: new URL(request.url),
    params: init?.params ?? {},
    context: {} as never,
    pattern: "",
  } as never;
}
