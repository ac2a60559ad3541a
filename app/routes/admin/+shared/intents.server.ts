/** The People page's form posts, one handler per intent (both are posted by a person's card). */
import { data, href } from "react-router";
import { redirectWithFlash } from "~/lib/flash.server";
import type { Viewer } from "~/lib/guards.server";
import type { Role } from "~/lib/permissions";
import { changeRoles, type Person, setActive } from "~/services/admin/people.server";

/** The database handle, as the service takes it. */
type Database = Parameters<typeof changeRoles>[0];

/** A refused post: the reason, shown above the list. */
export function refused(error: string, status: number) {
  return data({ error }, { status });
}

/** "Roles of Ada updated; granted chair; revoked proposer." or "No change to the roles of Ada." */
function rolesChangedText(name: string, { granted, revoked }: { granted: Role[]; revoked: Role[] }) {
  if (!granted.length && !revoked.length) return `No change to the roles of ${name}.`;
  const grantedText = granted.length ? `; granted ${granted.join(", ")}` : "";
  const revokedText = revoked.length ? `; revoked ${revoked.join(", ")}` : "";
  return `Roles of ${name} updated${grantedText}${revokedText}.`;
}

/** Saves a person's roles (never the viewer's own admin role) and comes back to the same search. */
export async function saveRoles(
  db: Database,
  viewer: Viewer,
  person: Person,
  { roles, search }: { roles: Role[]; search: string },
) {
  if (person.id === viewer.user.id && !roles.includes("admin")) {
    return refused("You cannot remove your own admin role; ask another administrator.", 400);
  }
  const change = await changeRoles(db, { actor: viewer.user, person, roles });
  return redirectWithFlash(`${href("/admin/users")}${search}`, {
    kind: "success",
    text: rolesChangedText(person.name, change),
  });
}

/** Switches a person's account off (signing them out everywhere) or on again; never the viewer's own. */
export async function switchActive(db: Database, viewer: Viewer, person: Person, { active }: { active: boolean }) {
  if (person.id === viewer.user.id) return refused("You cannot deactivate your own account.", 400);
  await setActive(db, viewer.user.id, person.id, active);
  return redirectWithFlash(href("/admin/users"), {
    kind: "success",
    text: active ? `${person.name} can sign in again.` : `${person.name} is deactivated and signed out everywhere.`,
  });
}
