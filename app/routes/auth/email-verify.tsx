import { data, Form, href } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Button, Card } from "~/components/ui";
import { dbContext } from "~/context";
import { readFormBody } from "~/lib/body.server";
import { clientAddress } from "~/services/auth/client-address.server";
import { consumeSignInLink } from "~/services/auth/email-link.server";
import { safeNext } from "~/services/auth/next.server";
import { recordSignInAttempt } from "~/services/auth/rate-limit.server";
import { SignInLinkSchema } from "~/services/auth/schemas";
import { signInAndRedirect } from "~/services/auth/sign-in.server";
import type { Route } from "./+types/email-verify";

export function loader({ url }: Route.LoaderArgs) {
  // Public. Showing the page does not use the link (mail scanners open links); the button does.
  const parsed = v.safeParse(SignInLinkSchema, {
    token: url.searchParams.get("token") ?? "",
    next: url.searchParams.get("next") ?? "/",
  });
  if (!parsed.success) return { valid: false as const, token: "", next: "/" };
  return { valid: true as const, token: parsed.output.token, next: safeNext(parsed.output.next) };
}

export async function action({ request, context }: Route.ActionArgs) {
  // Public: consumes the single-use token.
  const body = await readFormBody(request);
  if (!body.ok) return data({ error: body.error }, { status: body.status });
  const parsed = v.safeParse(SignInLinkSchema, Object.fromEntries(body.form));
  if (!parsed.success) return data({ error: parsed.issues[0].message }, { status: 400 });
  const db = context.get(dbContext);
  const address = clientAddress(context);
  const limit = await recordSignInAttempt(db, { address });
  if (!limit.ok) return data({ error: limit.message }, { status: 429 });
  const result = await consumeSignInLink(db, parsed.output.token);
  if (!result.ok) return data({ error: result.reason }, { status: 400 });
  return signInAndRedirect(db, request, result.user.id, "email-link", parsed.output.next, address);
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
            <a className="font-medium text-ember-700 underline" href={href("/sign-in")}>
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
