import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, Badge, Card, PageHeader } from "~/components/ui";
import { dbContext } from "~/context";
import { readFormBody } from "~/lib/body.server";
import { requireUser } from "~/lib/guards.server";
import type { Role } from "~/lib/permissions";
import { accountOverview } from "~/services/account/account.server";
import { AccountActionSchema } from "~/services/account/schemas";
import { createToken, refused, revokeOtherSessions, revokeSession, revokeToken } from "./+shared/intents.server";
import { SessionsCard } from "./+shared/SessionsCard";
import { TokensCard } from "./+shared/TokensCard";
import type { Route } from "./+types/index";

export async function loader({ request, context }: Route.LoaderArgs) {
  const viewer = await requireUser(request);
  const overview = await accountOverview(context.get(dbContext), { userId: viewer.user.id });
  return { user: viewer.user, roles: viewer.roles, currentSessionId: viewer.sessionId, ...overview };
}

export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requireUser(request);
  const body = await readFormBody(request);
  if (!body.ok) return refused(body.error, body.status);
  const form: Record<string, unknown> = { ...Object.fromEntries(body.form), scopes: body.form.getAll("scopes") };
  const parsed = v.safeParse(AccountActionSchema, form);
  if (!parsed.success) {
    const typed = {
      name: String(body.form.get("name") ?? ""),
      scopes: body.form.getAll("scopes").map(String),
      lifetimeDays: String(body.form.get("lifetimeDays") ?? ""),
    };
    return refused(parsed.issues[0].message, 400, typed);
  }
  const db = context.get(dbContext);
  const input = parsed.output;
  switch (input.intent) {
    case "revoke-session":
      return revokeSession(db, viewer, input);
    case "revoke-other-sessions":
      return revokeOtherSessions(db, viewer);
    case "create-token":
      return createToken(db, viewer, input);
    case "revoke-token":
      return revokeToken(db, viewer, input);
  }
}

export const meta: Route.MetaFunction = () => [{ title: "Your account — Fringe Docket" }];

function RolesCard({ roles }: { roles: Role[] }) {
  return (
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
  );
}

export default function Account({ loaderData, actionData }: Route.ComponentProps) {
  const { user } = loaderData;
  return (
    <>
      <PageHeader
        title="Your account"
        lead={`${user.name} · ${user.email}${user.institute ? ` · ${user.institute}` : ""}`}
      />
      <div className="page-stack">
        <RolesCard roles={loaderData.roles} />
        {actionData?.error ? <Alert>{actionData.error}</Alert> : null}
        <SessionsCard sessions={loaderData.sessions} currentSessionId={loaderData.currentSessionId} />
        <TokensCard
          tokens={loaderData.tokens}
          newToken={actionData?.newToken ?? null}
          typed={actionData?.typed ?? null}
        />
      </div>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
