import { href, redirect } from "react-router";
import { dbContext } from "~/context";
import { getViewer } from "~/lib/guards.server";
import { clearSessionCookieHeader, revokeSession } from "~/services/auth/sessions.server";
import type { Route } from "./+types/sign-out";

export async function loader(_: Route.LoaderArgs) {
  // Signing out is a POST; a GET just goes home.
  return redirect(href("/"));
}

export async function action({ request, context }: Route.ActionArgs) {
  // Anyone may sign out; only their own session is ended.
  const viewer = await getViewer(request);
  if (viewer?.sessionId) await revokeSession(context.get(dbContext), viewer.user.id, viewer.sessionId);
  return redirect(href("/"), { headers: { "Set-Cookie": clearSessionCookieHeader() } });
}
