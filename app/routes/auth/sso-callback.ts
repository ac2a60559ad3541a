import { redirect } from "react-router";
import { database } from "~/db/client.server";
import { findOrCreateAccount } from "~/services/auth/accounts.server";
import { clientAddress } from "~/services/auth/client-address.server";
import { completeSso, SsoError } from "~/services/auth/oidc.server";
import { signInAndRedirect } from "~/services/auth/sign-in.server";
import type { Route } from "./+types/sso-callback";

function backToSignIn(message: string) {
  return redirect(`/sign-in?error=${encodeURIComponent(message)}`);
}

export async function loader({ request, context }: Route.LoaderArgs) {
  // Public: the provider sends the browser here; state, code and ID token are all checked.
  const db = database();
  let result;
  try {
    result = await completeSso(request);
  } catch (e) {
    if (e instanceof SsoError) throw backToSignIn(`Sign-in failed: ${e.message}.`);
    throw e;
  }
  const account = await findOrCreateAccount(db, {
    email: result.identity.email,
    name: result.identity.name,
    institute: result.identity.institute,
    ssoSubject: result.identity.subject,
  });
  if (!account.user) throw backToSignIn(account.reason ?? "This account cannot sign in.");
  return signInAndRedirect(db, request, account.user.id, "sso", result.next, clientAddress(context), [
    result.clearCookie,
  ]);
}
