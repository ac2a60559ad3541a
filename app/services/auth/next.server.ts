/**
 * Where a person may be sent after signing in: a path of this app, never another host. The text is
 * resolved as a browser would resolve it (`new URL(next, APP_ORIGIN)`) and accepted only when the
 * result has the app's own origin. Before that, anything a browser or an intermediary might read
 * differently is refused outright: control characters (a tab or newline is dropped by URL parsers,
 * so "/\t/evil.example" becomes "//evil.example"; CR/LF would split a header), backslashes (read as
 * "/" by browsers), a leading "//" (a host), and anything that is not a path starting with "/".
 */
import { env } from "~/env.server";

/** Longest destination kept, characters; a longer one is refused. */
export const MAX_NEXT_LENGTH = 2000;

/**
 * The destination as a same-origin path with its query and fragment ("/proposals/4?tab=team"),
 * or "/" when `next` is missing or not acceptable.
 */
export function safeNext(next: string | null | undefined, origin: string = env().APP_ORIGIN): string {
  if (typeof next !== "string" || next.length === 0 || next.length > MAX_NEXT_LENGTH) return "/";
  // biome-ignore lint/suspicious/noControlCharactersInRegex: refusing control characters is the point
  if (/[\u0000-\u001f\u007f-\u009f\\]/.test(next)) return "/";
  if (!next.startsWith("/") || next.startsWith("//")) return "/";
  let resolved: URL;
  let base: URL;
  try {
    base = new URL(origin);
    resolved = new URL(next, base);
  } catch {
    return "/";
  }
  if (resolved.origin !== base.origin) return "/";
  const path = `${resolved.pathname}${resolved.search}${resolved.hash}`;
  return path.startsWith("//") ? "/" : path;
}
