import { data, Form, href, redirect, useNavigation } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, Button, Card, TextField } from "~/components/ui";
import { dbContext } from "~/context";
import { readFormBody } from "~/lib/body.server";
import { getViewer } from "~/lib/guards.server";
import { clientAddress } from "~/services/auth/client-address.server";
import { signInOptions } from "~/services/auth/config.server";
import { sendSignInLink } from "~/services/auth/email-link.server";
import { safeNext } from "~/services/auth/next.server";
import { recordSignInAttempt } from "~/services/auth/rate-limit.server";
import { EmailLinkRequestSchema } from "~/services/auth/schemas";
import type { Route } from "./+types/sign-in";

export async function loader({ request, url }: Route.LoaderArgs) {
  // Public page; a signed-in person goes straight on.
  const viewer = await getViewer(request);
  const next = safeNext(url.searchParams.get("next"));
  if (viewer) throw redirect(next);
  return { next, ...signInOptions(), error: url.searchParams.get("error") };
}

/** The link form's answer when nothing was sent: what was typed, and the problem with it or the refusal. */
function notSent(email: string, problem: { fieldError?: string; message?: string }, init: ResponseInit) {
  return data(
    { sent: false as const, fieldError: problem.fieldError ?? null, email, message: problem.message ?? null },
    init,
  );
}

export async function action({ request, context }: Route.ActionArgs) {
  // Public action (it is how one signs in); rate-limited per address and per e-mail.
  const body = await readFormBody(request);
  if (!body.ok) return notSent("", { message: body.error }, { status: body.status });
  const form = Object.fromEntries(body.form);
  const parsed = v.safeParse(EmailLinkRequestSchema, form);
  if (!parsed.success) {
    return notSent(String(form.email ?? ""), { fieldError: parsed.issues[0].message }, { status: 400 });
  }
  const { email, next } = parsed.output;
  const db = context.get(dbContext);
  const limit = await recordSignInAttempt(db, { address: clientAddress(context), email });
  if (!limit.ok) {
    const headers = { "Retry-After": String(limit.retryAfterSeconds) };
    return notSent(email, { message: limit.message }, { status: 429, headers });
  }
  await sendSignInLink(db, email, safeNext(next));
  return { sent: true as const, fieldError: null, email, message: null };
}

export const meta: Route.MetaFunction = () => [{ title: "Sign in — Fringe Docket" }];

export default function SignIn({ loaderData, actionData }: Route.ComponentProps) {
  const navigation = useNavigation();
  const busy = navigation.state === "submitting";
  return (
    <div className="mx-auto max-w-lg space-y-6">
      <h1 className="text-2xl font-semibold">Sign in to Fringe Docket</h1>
      {loaderData.error ? <Alert>{loaderData.error}</Alert> : null}
      <Card title="With your observatory account">
        <p className="mb-4 text-night-700">Most people sign in through the observatory's single sign-on.</p>
        <a
          href={`${href("/auth/sso/start")}?next=${encodeURIComponent(loaderData.next)}`}
          className="inline-flex h-10 items-center rounded-lg bg-ember-700 px-4 font-medium text-white hover:bg-ember-800"
        >
          Continue with {loaderData.providerName}
        </a>
        {loaderData.usingFakeProvider ? (
          <p className="mt-3 text-sm text-night-600">
            This installation uses the local stand-in sign-on service: you pick one of the demo people or type any
            identity.
          </p>
        ) : null}
      </Card>
      <Card title="With a link by e-mail">
        {actionData?.sent ? (
          <div role="status" className="space-y-2">
            <p className="font-medium text-ok-700">Your sign-in link for {actionData.email} is queued for delivery.</p>
            <p className="text-sm text-night-700">
              It normally arrives within a minute and works once, for 15 minutes. If our mail server is slow, a link
              that could no longer arrive in time is not sent at all: you will get a short note instead, and you can ask
              here for a new one. Your first sign-in creates your account.
            </p>
            {loaderData.demoMode ? (
              <p className="text-sm text-night-700">
                Demo mode: no e-mail leaves this machine; the message is caught by the local mail catcher.
              </p>
            ) : null}
          </div>
        ) : (
          <Form method="post" className="space-y-3" noValidate>
            <input type="hidden" name="next" value={loaderData.next} />
            {actionData?.message ? <Alert tone="caution">{actionData.message}</Alert> : null}
            <TextField
              label="E-mail address"
              name="email"
              type="email"
              autoComplete="email"
              maxLength={254}
              required
              defaultValue={actionData?.email ?? ""}
              error={actionData?.fieldError ?? undefined}
              hint="No single sign-on? We send you a one-time link."
            />
            <Button type="submit" variant="secondary" disabled={busy}>
              {busy ? "Sending…" : "Send me a sign-in link"}
            </Button>
          </Form>
        )}
      </Card>
    </div>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
