/** Finishing a sign-in: a session row, its cookie, and the redirect to where the person was going. */
import { href, redirect } from "react-router";
import type { Database } from "~/db/client.server";
import { safeNext } from "./next.server";
import { createSession, type SessionMethod, sessionCookieHeader } from "./sessions.server";

export async function signInAndRedirect(
  db: Database,
  request: Request,
  userId: number,
  method: SessionMethod,
  next: string | null | undefined,
  address: string,
  extraHeaders: string[] = [],
) {
  const { token, session } = await createSession(db, userId, {
    method,
    userAgent: request.headers.get("User-Agent") ?? "",
    ipAddress: address,
  });
  const headers = new Headers();
  headers.append("Set-Cookie", sessionCookieHeader(token, session.expiresAt));
  for (const h of extraHeaders) headers.append("Set-Cookie", h);
  return redirect(safeNext(next), { headers });
}

/** Back to the sign-in page, which shows `message` as the reason. */
export function backToSignIn(message: string) {
  return redirect(`${href("/sign-in")}?error=${encodeURIComponent(message)}`);
}
