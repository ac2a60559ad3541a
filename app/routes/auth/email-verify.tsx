import { data, Form } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Button, Card } from "~/components/ui";
import { database } from "~/db/client.server";
import { clientAddress } from "~/services/auth/client-address.server";
import { consumeSignInLink } from "~/services/auth/email-link.server";
import { safeNext } from "~/services/auth/oidc.server";
import { recordSignInAttempt } from "~/services/auth/rate-limit.server";
import { signInAndRedirect } from "~/services/auth/sign-in.server";
import type { Route } from "./+types/email-verify";

const VerifySchema = v.object({
  token: v.pipe(v.string(), v.regex(/^[a-z2-7]{32}$/, "This sign-in link is not valid.")),
  next: v.optional(v.string(), "/"),
});

export function loader({ url }: Route.LoaderArgs) {
  // Public. Showing the page does not use the link (mail scanners open links); the button does.
  const parsed = v.safeParse(VerifySchema, {
    token: url.searchParams.get("token") ?? "",
    next: url.searchParams.get("next") ?? "/",
  });
  if (!parsed.success) return { valid: false as const, token: "", next: "/" };
  return { valid: true as const, token: parsed.output.token, next: safeNext(parsed.output.next) };
}

export async function action({ request, context }: Route.ActionArgs) {
  // Public: consumes the single-use token.
  const parsed = v.safeParse(VerifySchema, Object.fromEntries(await request.formData()));
  if (!parsed.success) return data({ error: parsed.issues[0].message }, { status: 400 });
  const db = database();
  const limit = await recordSignInAttempt(db, { address: clientAddress(context) });
  if (!limit.ok) return data({ error: limit.message }, { status: 429 });
  const result = await consumeSignInLink(db, parsed.output.token);
  if (!result.ok) return data({ error: result.reason }, { status: 400 });
  return signInAndRedirect(db, request, result.user.id, "email-link", parsed.output.next, clientAddress(context));
}

export const meta: Route.MetaFunction = () => [{ title: "Sign in by link — Fringe Docket" }];

export default function EmailVerify({ loaderData, actionData }: Route.ComponentProps) {
  const error = actionData?.error ?? (loaderData.valid ? null : "This sign-in link is not valid.");
  return (
    <div className="mx-auto max-w-lg">
      <Card title="Sign in by e-mail link">
        {error ? (
          <div className="space-y-3">
            <p role="alert" className="font-medium text-danger-700">
              {error}
            </p>
            <a className="font-medium text-ember-700 underline" href="/sign-in">
              Back to sign-in
            </a>
          </div>
        ) : (
          <Form method="post" className="space-y-3">
            <input type="hidden" name="token" value={loaderData.token} />
            <input type="hidden" name="next" value={loaderData.next} />
            <p className="text-night-700">Your link is ready. It works once.</p>
            <Button type="submit">Sign in now</Button>
          </Form>
        )}
      </Card>
    </div>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
