import { createContext } from "react-router";

/** The client's network address, set by the app server (scripts/serve.ts) for rate limiting. */
export const clientAddressContext = createContext<string>("unknown");
