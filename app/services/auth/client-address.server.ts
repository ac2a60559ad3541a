import type { RouterContextProvider } from "react-router";
import { clientAddressContext } from "~/context";

/** The client's address as the app server saw it ("unknown" where no server sets it, e.g. in tests). */
export function clientAddress(context: Readonly<RouterContextProvider> | undefined): string {
  try {
    return context?.get(clientAddressContext) ?? "unknown";
  } catch {
    return "unknown";
  }
}
