import { dbContext } from "~/context";
import { findOrCreateAccount } from "~/services/auth/accounts.server";
import { clientAddress } from "~/services/auth/client-address.server";
import { completeSso, SsoError } from "~/services/auth/oidc.server";
import { backToSignIn, signInAndRedirect } from "~/services/auth/sign-in.server";
import type { Route } from "./+types/sso-callback";

/** The provider's answer checked (state, code, ID token), or the sign-in page with the reason. */
async function verifiedIdentity(request: Request) {
  try {
    return await completeSso(request);
  } catch (e) {
    if (e instanceof SsoError) throw backToSignIn(`Sign-in failed: ${e.message}.`);
    throw e;
  }
}

export async function loader({ request, context }: Route.LoaderArgs) {
  // Public: the provider sends the browser here; state, code and ID token are all checked.
  const db = context.get(dbContext);
  const result = await verifiedIdentity(request);
  const account = await findOrCreateAccount(db, {
    email: result.identity.email,
    name: result.identity.name,
    institute: result.identity.institute,
    ssoSubject: result.identity.subject,
    emailVerified: result.identity.emailVerified,
  });
  if (!account.user) throw backToSignIn(account.reason ?? "This account cannot sign in.");
  return signInAndRedirect(db, request, account.user.id, "sso", result.next, clientAddress(context), [
    result.clearCookie,
  ]);
}
