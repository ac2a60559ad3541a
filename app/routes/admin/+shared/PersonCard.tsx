import { Form } from "react-router";
import { Badge, Button, Card } from "~/components/ui";
import { ROLES } from "~/lib/permissions";
import type { PersonRow } from "~/services/admin/people.server";

/** The (de)activate button of a person's card. */
function ActiveToggle({ person: p }: { person: PersonRow }) {
  const verb = p.active ? "Deactivate" : "Reactivate";
  return (
    <Form method="post">
      <input type="hidden" name="userId" value={p.id} />
      <input type="hidden" name="intent" value={p.active ? "deactivate" : "reactivate"} />
      <Button type="submit" variant={p.active ? "secondary" : "primary"} size="sm" aria-label={`${verb} ${p.name}`}>
        {verb}
      </Button>
    </Form>
  );
}

/** The roles form of a person's card: a checkbox per role and one save button. */
function RolesForm({ person: p }: { person: PersonRow }) {
  return (
    <Form method="post" className="mt-3 flex flex-wrap items-center gap-x-4 gap-y-2" aria-label={`Roles of ${p.name}`}>
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
  );
}

/** One account: who it is, when they last signed in, and the forms that change it. */
export function PersonCard({ person: p }: { person: PersonRow }) {
  return (
    <Card>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <p className="font-semibold text-night-900">
            {p.name} {p.active ? null : <Badge tone="danger">deactivated</Badge>}
          </p>
          <p className="text-sm text-night-600">
            {p.email}
            {p.institute ? ` · ${p.institute}` : ""} · last sign-in {p.lastSignIn}
          </p>
        </div>
        <ActiveToggle person={p} />
      </div>
      <RolesForm person={p} />
    </Card>
  );
}
