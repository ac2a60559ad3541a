import { data, Form, useSearchParams } from "react-router";
import * as v from "valibot";
import { ErrorPage } from "~/components/ErrorPage";
import { Alert, Button, PageHeader, TextField } from "~/components/ui";
import { dbContext } from "~/context";
import { readFormBody } from "~/lib/body.server";
import { requirePermission } from "~/lib/guards.server";
import { findPerson, peopleOverview } from "~/services/admin/people.server";
import { PEOPLE_QUERY_MAX, PeopleActionSchema } from "~/services/admin/schemas";
import { AuditLogCard } from "./+shared/AuditLogCard";
import { refused, saveRoles, switchActive } from "./+shared/intents.server";
import { PersonCard } from "./+shared/PersonCard";
import type { Route } from "./+types/users";

export async function loader({ request, url, context }: Route.LoaderArgs) {
  await requirePermission(request, "users:manage");
  const asked = (url.searchParams.get("q") ?? "").trim();
  // A search over the stated limit is refused with a word, never cut short silently.
  const qTooLong = asked.length > PEOPLE_QUERY_MAX;
  const q = qTooLong ? "" : asked;
  return data(
    { q, qTooLong, ...(await peopleOverview(context.get(dbContext), { q })) },
    { status: qTooLong ? 400 : 200 },
  );
}

export async function action({ request, context }: Route.ActionArgs) {
  const viewer = await requirePermission(request, "users:manage");
  const body = await readFormBody(request);
  if (!body.ok) return refused(body.error, body.status);
  const { form } = body;
  const parsed = v.safeParse(PeopleActionSchema, {
    intent: form.get("intent"),
    userId: form.get("userId"),
    roles: form.getAll("roles"),
  });
  if (!parsed.success) return refused(parsed.issues[0].message, 400);
  const input = parsed.output;
  const db = context.get(dbContext);
  const person = await findPerson(db, { userId: input.userId });
  if (!person) return refused("Unknown person.", 404);
  switch (input.intent) {
    case "set-roles":
      return saveRoles(db, viewer, person, { roles: input.roles, search: new URL(request.url).search });
    case "deactivate":
    case "reactivate":
      return switchActive(db, viewer, person, { active: input.intent === "reactivate" });
  }
}

export const meta: Route.MetaFunction = () => [{ title: "People — Fringe Docket" }];

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
          <TextField
            label="Search by name, e-mail or institute"
            name="q"
            defaultValue={params.get("q") ?? ""}
            maxLength={PEOPLE_QUERY_MAX}
            hint={`Up to ${PEOPLE_QUERY_MAX} characters.`}
            error={
              loaderData.qTooLong
                ? `The search text is longer than ${PEOPLE_QUERY_MAX} characters; nothing was searched.`
                : undefined
            }
          />
        </div>
        <Button type="submit" variant="secondary">
          Search
        </Button>
      </Form>
      {actionData?.error ? <Alert className="mb-4">{actionData.error}</Alert> : null}
      <div className="grid gap-3">
        {loaderData.people.length === 0 ? (
          <p className="text-night-600">{`Nobody matches “${loaderData.q}”.`}</p>
        ) : null}
        {loaderData.people.map((p) => (
          <PersonCard key={p.id} person={p} />
        ))}
      </div>
      <AuditLogCard audit={loaderData.audit} />
    </>
  );
}

export function ErrorBoundary({ error }: Route.ErrorBoundaryProps) {
  return <ErrorPage error={error} />;
}
