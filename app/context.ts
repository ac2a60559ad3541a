import { createContext } from "react-router";
import type { Database } from "~/db/client.server";

/** The client's network address, set by the app server (scripts/serve.ts) for rate limiting. */
export const clientAddressContext = createContext<string>("unknown");

/**
 * The database handle of the request, set by the root middleware (app/root.tsx) before any loader
 * or action runs; tests set their own. Read it with `context.get(dbContext)`.
 */
export const dbContext = createContext<Database>();
