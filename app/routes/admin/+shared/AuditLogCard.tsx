import { Card } from "~/components/ui";
import type { AuditRow } from "~/services/admin/people.server";

const text = (x: unknown) => (typeof x === "string" ? x : null);

/** What an entry did, after the actor's name: a registry change names its record, a role change its person. */
function AuditWhat({ entry }: { entry: AuditRow }) {
  const { action, detail } = entry;
  if (action.startsWith("registry.")) {
    const change = action.slice("registry.".length);
    const entity = text(detail.entity) ?? "record";
    if (change === "imported")
      return (
        <>
          imported {detail.kind === "stations" ? "stations" : "a registry file"} into{" "}
          <span className="font-medium">{text(detail.name) ?? "a site"}</span>
          {text(detail.summary) ? `: ${detail.summary}` : ""}
        </>
      );
    return (
      <>
        {change} {entity} <span className="font-medium">{text(detail.name) ?? "—"}</span> in the array registry
      </>
    );
  }
  return (
    <>
      {action.replace(".", " ")}
      {text(detail.role) ? ` (${detail.role})` : ""} for <span className="font-medium">{entry.target ?? "—"}</span>
    </>
  );
}

/** The latest changes of roles, accounts and the array registry, newest first. */
export function AuditLogCard({ audit }: { audit: AuditRow[] }) {
  return (
    <Card title="Audit log" className="mt-8">
      {audit.length === 0 ? (
        <p className="text-sm text-night-600">No changes recorded yet.</p>
      ) : (
        <ol className="divide-y divide-night-100 text-sm">
          {audit.map((a) => (
            <li key={a.id} className="py-2">
              <span className="num text-night-600">{a.at}</span> —{" "}
              <span className="font-medium">{a.actor ?? "someone"}</span> <AuditWhat entry={a} />
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}
