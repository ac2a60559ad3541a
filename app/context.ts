import { createContext } from "react-router";
import type { Database } from "~/db/client.server";

/**
 * The client's network address as the app server saw it (the socket's peer, or the address a
 * trusted proxy forwarded: scripts/app-server.ts), for rate limiting and the session list.
 * The server sets it through the key the build itself exports (`serverContexts` in
 * app/entry.server.tsx), so both sides use the same key object.
 */
export const clientAddressContext = createContext<string>("unknown");

/** What the app server refused of a request's body before the app saw it; null when nothing. */
export type BodyRefusal = { reason: "too-large"; limitBytes: number };
export const bodyRefusalContext = createContext<BodyRefusal | null>(null);

/**
 * Why a request failed in a way the client should hear about with its own status, recorded by
 * `handleError` (app/entry.server.tsx) and answered by the root middleware: the database not
 * answering (503), a body cut off at the cap (413), or input the database refused (400).
 */
export type RequestFailure = "database-unavailable" | "body-too-large" | "database-refused-input";
export const requestFailureContext = createContext<RequestFailure | null>(null);

/**
 * The database handle of the request, set by the root middleware (app/root.tsx) before any loader
 * or action runs; tests set their own. Read it with `context.get(dbContext)`.
 */
export const dbContext = createContext<Database>();
