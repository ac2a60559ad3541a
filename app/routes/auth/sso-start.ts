import { redirect } from "react-router";
import { dbContext } from "~/context";
import { clientAddress } from "~/services/auth/client-address.server";
import { beginSso, SsoError } from "~/services/auth/oidc.server";
import { recordSignInAttempt } from "~/services/auth/rate-limit.server";
import { backToSignIn } from "~/services/auth/sign-in.server";
import type { Route } from "./+types/sso-start";

export async function loader({ url, context }: Route.LoaderArgs) {
  // Public: the first step of signing in; rate-limited per address.
  const next = url.searchParams.get("next") ?? "/";
  const limit = await recordSignInAttempt(context.get(dbContext), { address: clientAddress(context) });
  if (!limit.ok) throw backToSignIn(limit.message);
  try {
    const { url: target, cookie } = await beginSso(next);
    return redirect(target, { headers: { "Set-Cookie": cookie } });
  } catch (e) {
    const reason = e instanceof SsoError ? e.message : "the sign-on service could not be reached";
    throw backToSignIn(`Single sign-on is unavailable: ${reason}. Try the e-mail link instead.`);
  }
}
