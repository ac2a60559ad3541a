import { eq } from "drizzle-orm";
import { createElement } from "react";
import { data, Form, useSearchParams } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Badge, Button, Card, PageHeader, TextField } from "~/components/ui";
import { database } from "~/db/client.server";
import { ROLES, type Role, users } from "~/db/schema/users";
import { RoleChangeEmail } from "~/emails/RoleChangeEmail";
import { redirectWithFlash } from "~/lib/flash.server";
import { requirePermission } from "~/lib/guards.server";
import { recentAudit, searchUsers, setActive, setRoles } from "~/services/auth/accounts.server";
import { enqueueMail } from "~/services/mail/outbox.server";
import { wakeOutboxSender } from "~/services/mail/sender.server";
import type { Route } from "./+types/users";

const UserId = v.pipe(v.string(), v.transform(Number), v.integer("Unknown person."), v.minValue(1, "Unknown person."));

const ActionSchema = v.variant("intent", [
  v.object({ intent: v.literal("set-roles"), userId: UserId, roles: v.array(v.picklist(ROLES, "Unknown role.")) }),
  v.object({ intent: v.literal("deactivate"), userId: UserId }),
  v.object({ intent: v.literal("reactivate"), userId: UserId }),
]);

export async function loader({ request, url }: Route.LoaderArgs) {
  await requirePermission(request, "users:manage");
  const q = (url.searchParams.get("q") ?? "").slice(0, 100);
  const db = database();
  const [people, audit] = await Promise.all([searchUsers(db, q), recentAudit(db, 40)]);
  return {
    q,
    people: people.map((p) => ({
      id: p.id,
      name: p.name,
      email: p.email,
      institute: p.institute,
      active: p.active,
      roles: p.roles,
      lastSignInAt: p.lastSignInAt?.toISOString() ?? null,
    })),
    audit: audit.map((a) => ({ ...a, createdAt: a.createdAt.toISOString() })),
  };
}

export async function action({ request }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "users:manage");
  const form = await request.formData();
  const parsed = v.safeParse(ActionSchema, {
    intent: form.get("intent"),
    userId: form.get("userId"),
    roles: form.getAll("roles"),
  });
  if (!parsed.success) return data({ error: parsed.issues[0].message }, { status: 400 });
  const input = parsed.output;
  const db = database();
  const [target] = await db.select().from(users).where(eq(users.id, input.userId));
  if (!target) return data({ error: "Unknown person." }, { status: 404 });

  if (input.intent === "set-roles") {
    if (target.id === viewer.user.id && !input.roles.includes("admin")) {
      return data({ error: "You cannot remove your own admin role; ask another administrator." }, { status: 400 });
    }
    const change = await db.transaction(async (tx) => {
      const result = await setRoles(tx, viewer.user.id, target.id, input.roles as Role[]);
      if (result.granted.length || result.revoked.length) {
        await enqueueMail(tx, {
          kind: "role-change",
          to: target.email,
          subject: "Your roles in Fringe Docket have changed",
          element: createElement(RoleChangeEmail, {
            name: target.name,
            rolesGranted: result.granted,
            rolesRevoked: result.revoked,
            byName: viewer.user.name,
          }),
          userId: target.id,
        });
      }
      return result;
    });
    wakeOutboxSender();
    const text =
      change.granted.length || change.revoked.length
        ? `Roles of ${target.name} updated${change.granted.length ? `; granted ${change.granted.join(", ")}` : ""}${change.revoked.length ? `; revoked ${change.revoked.join(", ")}` : ""}.`
        : `No change to the roles of ${target.name}.`;
    return redirectWithFlash(`/admin/users${new URL(request.url).search}`, { kind: "success", text });
  }
  if (target.id === viewer.user.id) return data({ error: "You cannot deactivate your own account." }, { status: 400 });
  await setActive(db, viewer.user.id, target.id, input.intent === "reactivate");
  return redirectWithFlash("/admin/users", {
    kind: "success",
    text:
      input.intent === "reactivate"
        ? `${target.name} can sign in again.`
        : `${target.name} is deactivated and signed out everywhere.`,
  });
}

export const meta: Route.MetaFunction = () => [{ title: "People — Fringe Docket" }];

const when = (iso: string | null) => (iso ? `${iso.replace("T", " ").slice(0, 16)} UTC` : "never");

export default function AdminUsers({ loaderData, actionData }: Route.ComponentProps) {
  const [params] = useSearchParams();
  return (
    <>
      <PageHeader
        title="People"
        lead="Accounts and their roles. Every change is recorded in the audit log below and the person gets a notice."
      />
      <Form method="get" role="search" className="mb-4 flex max-w-xl items-end gap-3">
        <div className="flex-1">
          <TextField label="Search by name, e-mail or institute" name="q" defaultValue={params.get("q") ?? ""} />
        </div>
        <Button type="submit" variant="secondary">
          Search
        </Button>
      </Form>
      {actionData?.error ? (
        <p
          role="alert"
          className="mb-4 rounded-lg border border-danger-700/30 bg-danger-50 p-3 text-sm text-danger-700"
        >
          {actionData.error}
        </p>
      ) : null}
      <div className="grid gap-3">
        {loaderData.people.length === 0 ? <p className="text-night-600">Nobody matches “{loaderData.q}”.</p> : null}
        {loaderData.people.map((p) => (
          <Card key={p.id}>
            <div className="flex flex-wrap items-start justify-between gap-4">
              <div>
                <p className="font-semibold text-night-900">
                  {p.name} {p.active ? null : <Badge tone="danger">deactivated</Badge>}
                </p>
                <p className="text-sm text-night-600">
                  {p.email}
                  {p.institute ? ` · ${p.institute}` : ""} · last sign-in {when(p.lastSignInAt)}
                </p>
              </div>
              <Form method="post">
                <input type="hidden" name="userId" value={p.id} />
                <input type="hidden" name="intent" value={p.active ? "deactivate" : "reactivate"} />
                <Button
                  type="submit"
                  variant={p.active ? "secondary" : "primary"}
                  size="sm"
                  aria-label={`${p.active ? "Deactivate" : "Reactivate"} ${p.name}`}
                >
                  {p.active ? "Deactivate" : "Reactivate"}
                </Button>
              </Form>
            </div>
            <Form
              method="post"
              className="mt-3 flex flex-wrap items-center gap-x-4 gap-y-2"
              aria-label={`Roles of ${p.name}`}
            >
              <input type="hidden" name="intent" value="set-roles" />
              <input type="hidden" name="userId" value={p.id} />
              {ROLES.map((r) => (
                <label key={r} className="inline-flex items-center gap-1.5 text-sm">
                  <input
                    type="checkbox"
                    name="roles"
                    value={r}
                    defaultChecked={p.roles.includes(r)}
                    className="h-4 w-4 accent-ember-700"
                  />
                  {r}
                </label>
              ))}
              <Button type="submit" size="sm">
                Save roles
              </Button>
            </Form>
          </Card>
        ))}
      </div>
      <Card title="Audit log" className="mt-8">
        {loaderData.audit.length === 0 ? (
          <p className="text-sm text-night-600">No changes recorded yet.</p>
        ) : (
          <ol className="divide-y divide-night-100 text-sm">
            {loaderData.audit.map((a) => (
              <li key={a.id} className="py-2">
                <span className="num text-night-600">{when(a.createdAt)}</span> —{" "}
                <span className="font-medium">{a.actor ?? "someone"}</span> {a.action.replace(".", " ")}
                {typeof a.detail.role === "string" ? ` (${a.detail.role})` : ""} for{" "}
                <span className="font-medium">{a.target ?? "—"}</span>
              </li>
            ))}
          </ol>
        )}
      </Card>
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
