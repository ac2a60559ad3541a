import { data, Form, useNavigation } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Badge, Button, Card, PageHeader, TextField } from "~/components/ui";
import { database } from "~/db/client.server";
import { redirectWithFlash } from "~/lib/flash.server";
import { requireUser } from "~/lib/guards.server";
import { createApiToken, listApiTokens, revokeApiToken } from "~/services/auth/api-tokens.server";
import { listUserSessions, revokeOtherSessions, revokeSession } from "~/services/auth/sessions.server";
import type { Route } from "./+types/index";

const ActionSchema = v.variant("intent", [
  v.object({
    intent: v.literal("revoke-session"),
    sessionId: v.pipe(v.string(), v.regex(/^[0-9a-f]{64}$/, "Unknown session.")),
  }),
  v.object({ intent: v.literal("revoke-other-sessions") }),
  v.object({
    intent: v.literal("create-token"),
    name: v.pipe(
      v.string(),
      v.trim(),
      v.nonEmpty("Give the token a name, e.g. the script that will use it."),
      v.maxLength(80, "Keep the name under 80 characters."),
    ),
  }),
  v.object({
    intent: v.literal("revoke-token"),
    tokenId: v.pipe(v.string(), v.transform(Number), v.integer("Unknown token.")),
  }),
]);

export async function loader({ request }: Route.LoaderArgs) {
  const viewer = await requireUser(request);
  const db = database();
  const [sessionRows, tokens] = await Promise.all([
    listUserSessions(db, viewer.user.id),
    listApiTokens(db, viewer.user.id),
  ]);
  return {
    user: viewer.user,
    roles: viewer.roles,
    currentSessionId: viewer.sessionId,
    sessions: sessionRows
      .map((s) => ({
        id: s.id,
        method: s.method,
        userAgent: s.userAgent,
        ipAddress: s.ipAddress,
        createdAt: s.createdAt.toISOString(),
        lastSeenAt: s.lastSeenAt.toISOString(),
        expiresAt: s.expiresAt.toISOString(),
      }))
      .reverse(),
    tokens: tokens.map((t) => ({
      ...t,
      createdAt: t.createdAt.toISOString(),
      lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
      revokedAt: t.revokedAt?.toISOString() ?? null,
    })),
  };
}

export async function action({ request }: Route.ActionArgs) {
  const viewer = await requireUser(request);
  const form = Object.fromEntries(await request.formData());
  const parsed = v.safeParse(ActionSchema, form);
  if (!parsed.success) {
    return data(
      { error: parsed.issues[0].message, newToken: null, tokenName: String(form.name ?? "") },
      { status: 400 },
    );
  }
  const db = database();
  const input = parsed.output;
  switch (input.intent) {
    case "revoke-session": {
      const ok = await revokeSession(db, viewer.user.id, input.sessionId);
      if (!ok)
        return data(
          { error: "That session is not yours or has already ended.", newToken: null, tokenName: "" },
          { status: 404 },
        );
      return redirectWithFlash("/account", { kind: "success", text: "The session has been signed out." });
    }
    case "revoke-other-sessions": {
      if (viewer.sessionId) await revokeOtherSessions(db, viewer.user.id, viewer.sessionId);
      return redirectWithFlash("/account", { kind: "success", text: "All your other sessions have been signed out." });
    }
    case "create-token": {
      const { token } = await createApiToken(db, viewer.user.id, input.name);
      return { error: null, newToken: { name: input.name, token }, tokenName: "" };
    }
    case "revoke-token": {
      const ok = await revokeApiToken(db, viewer.user.id, input.tokenId);
      if (!ok)
        return data(
          { error: "That token is not yours or is already revoked.", newToken: null, tokenName: "" },
          { status: 404 },
        );
      return redirectWithFlash("/account", { kind: "success", text: "The token has been revoked." });
    }
  }
}

export const meta: Route.MetaFunction = () => [{ title: "Your account — Fringe Docket" }];

const when = (iso: string | null) =>
  iso ? `${new Date(iso).toISOString().replace("T", " ").slice(0, 16)} UTC` : "never";

export default function Account({ loaderData, actionData }: Route.ComponentProps) {
  const { user, roles, sessions, tokens, currentSessionId } = loaderData;
  const busy = useNavigation().state === "submitting";
  return (
    <>
      <PageHeader
        title="Your account"
        lead={`${user.name} · ${user.email}${user.institute ? ` · ${user.institute}` : ""}`}
      />
      <div className="grid gap-6">
        <Card title="Roles">
          <div className="flex flex-wrap gap-2">
            {roles.length ? (
              roles.map((r) => (
                <Badge key={r} tone="accent">
                  {r}
                </Badge>
              ))
            ) : (
              <span className="text-night-600">No roles yet.</span>
            )}
          </div>
          <p className="mt-2 text-sm text-night-600">Roles are granted by the array's administrator.</p>
        </Card>

        {actionData?.error ? (
          <p role="alert" className="rounded-lg border border-danger-700/30 bg-danger-50 p-3 text-sm text-danger-700">
            {actionData.error}
          </p>
        ) : null}

        <Card
          title="Where you are signed in"
          actions={
            sessions.length > 1 ? (
              <Form method="post">
                <input type="hidden" name="intent" value="revoke-other-sessions" />
                <Button type="submit" variant="secondary" size="sm">
                  Sign out everywhere else
                </Button>
              </Form>
            ) : null
          }
        >
          <ul className="divide-y divide-night-100">
            {sessions.map((s) => (
              <li key={s.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
                <div className="text-sm">
                  <p className="font-medium text-night-900">
                    {s.userAgent ? s.userAgent.slice(0, 80) : "Unknown browser"}{" "}
                    {s.id === currentSessionId ? <Badge tone="ok">this browser</Badge> : null}
                  </p>
                  <p className="text-night-600">
                    via {s.method === "sso" ? "single sign-on" : "e-mail link"} · started {when(s.createdAt)} · last
                    used {when(s.lastSeenAt)} · expires {when(s.expiresAt)}
                  </p>
                </div>
                {s.id !== currentSessionId ? (
                  <Form method="post">
                    <input type="hidden" name="intent" value="revoke-session" />
                    <input type="hidden" name="sessionId" value={s.id} />
                    <Button
                      type="submit"
                      variant="secondary"
                      size="sm"
                      aria-label={`Sign out the session started ${when(s.createdAt)}`}
                    >
                      Sign out
                    </Button>
                  </Form>
                ) : null}
              </li>
            ))}
          </ul>
        </Card>

        <Card title="API tokens">
          <p className="mb-3 text-sm text-night-700">
            Scripts call <code className="rounded bg-night-100 px-1">/api/*</code> with{" "}
            <code className="rounded bg-night-100 px-1">Authorization: Bearer &lt;token&gt;</code>. A token acts with
            your roles; it is shown once.
          </p>
          {actionData?.newToken ? (
            <div role="status" className="mb-4 rounded-lg border border-ok-700/30 bg-ok-50 p-3 text-sm">
              <p className="font-semibold text-ok-700">
                New token “{actionData.newToken.name}” — copy it now, it will not be shown again:
              </p>
              <code
                data-testid="new-token"
                className="mt-1 block break-all rounded bg-white p-2 font-mono text-night-900"
              >
                {actionData.newToken.token}
              </code>
            </div>
          ) : null}
          <Form method="post" className="mb-4 flex flex-wrap items-end gap-3">
            <input type="hidden" name="intent" value="create-token" />
            <div className="min-w-60 flex-1">
              <TextField
                label="Token name"
                name="name"
                maxLength={80}
                defaultValue={actionData?.tokenName ?? ""}
                placeholder="e.g. coverage batch script"
              />
            </div>
            <Button type="submit" disabled={busy}>
              Create token
            </Button>
          </Form>
          {tokens.length === 0 ? (
            <p className="text-sm text-night-600">No tokens yet.</p>
          ) : (
            <ul className="divide-y divide-night-100">
              {tokens.map((t) => (
                <li key={t.id} className="flex flex-wrap items-center justify-between gap-3 py-2 text-sm">
                  <div>
                    <span className="font-medium">{t.name}</span> <code className="text-night-600">{t.prefix}…</code>{" "}
                    {t.revokedAt ? <Badge tone="danger">revoked</Badge> : <Badge tone="ok">active</Badge>}
                    <p className="text-night-600">
                      created {when(t.createdAt)} · last used {when(t.lastUsedAt)}
                    </p>
                  </div>
                  {!t.revokedAt ? (
                    <Form method="post">
                      <input type="hidden" name="intent" value="revoke-token" />
                      <input type="hidden" name="tokenId" value={t.id} />
                      <Button type="submit" variant="danger" size="sm" aria-label={`Revoke token ${t.name}`}>
                        Revoke
                      </Button>
                    </Form>
                  ) : null}
                </li>
              ))}
            </ul>
          )}
        </Card>
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
