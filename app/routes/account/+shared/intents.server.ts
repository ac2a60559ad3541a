/** The account page's form posts, one handler per intent; each answers as the page expects. */
import { data, href } from "react-router";
import { redirectWithFlash } from "~/lib/flash.server";
import type { Viewer } from "~/lib/guards.server";
import type { TokenScope } from "~/lib/permissions";
import { endOtherSessions, endSession, issueApiToken, withdrawApiToken } from "~/services/account/account.server";

/** The database handle, as the service takes it. */
type Database = Parameters<typeof endSession>[0];

/** What was typed into the new-token form, kept when the post is refused. */
export type TypedToken = { name: string; scopes: string[]; lifetimeDays: string };

/** What an account post answers when it does not redirect: an error, or a token shown once. */
export type AccountActionData = {
  error: string | null;
  newToken: { name: string; token: string; scopes: string[]; expires: string } | null;
  typed: TypedToken | null;
};

/** A refused post: the reason, with what was typed into the token form so far. */
export function refused(error: string, status: number, typed: TypedToken | null = null) {
  return data({ error, newToken: null, typed } satisfies AccountActionData, { status });
}

const backToAccount = (text: string) => redirectWithFlash(href("/account"), { kind: "success", text });

export async function revokeSession(db: Database, viewer: Viewer, { sessionId }: { sessionId: string }) {
  const ended = await endSession(db, { userId: viewer.user.id, sessionId });
  if (!ended) return refused("That session is not yours or has already ended.", 404);
  return backToAccount("The session has been signed out.");
}

export async function revokeOtherSessions(db: Database, viewer: Viewer) {
  if (viewer.sessionId) await endOtherSessions(db, { userId: viewer.user.id, keepSessionId: viewer.sessionId });
  return backToAccount("All your other sessions have been signed out.");
}

export async function createToken(
  db: Database,
  viewer: Viewer,
  input: { name: string; scopes: TokenScope[]; lifetimeDays: number },
) {
  const newToken = await issueApiToken(db, { userId: viewer.user.id, ...input });
  return { error: null, newToken, typed: null } satisfies AccountActionData;
}

export async function revokeToken(db: Database, viewer: Viewer, { tokenId }: { tokenId: number }) {
  const revoked = await withdrawApiToken(db, { userId: viewer.user.id, tokenId });
  if (!revoked) return refused("That token is not yours or is already revoked.", 404);
  return backToAccount("The token has been revoked.");
}
