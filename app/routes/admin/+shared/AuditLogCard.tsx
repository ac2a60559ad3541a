import { Card } from "~/components/ui";
import type { AuditRow } from "~/services/admin/people.server";

/** The latest changes of roles and accounts, newest first. */
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
              <span className="font-medium">{a.actor ?? "someone"}</span> {a.action.replace(".", " ")}
              {typeof a.detail.role === "string" ? ` (${a.detail.role})` : ""} for{" "}
              <span className="font-medium">{a.target ?? "—"}</span>
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}
