/** Each proposal of the cycle with its reviewers, their progress, declines and conflicts; assign by hand. */
import { Form } from "react-router";
import { Badge, Button, Card, IntentButton } from "~/components/ui";

type Row = {
  id: number;
  title: string;
  category: string;
  pi: string;
  active: number;
  assignments: {
    id: number;
    reviewer: string;
    status: "active" | "declined";
    declineReason: string | null;
    progress: "not started" | "draft" | "submitted";
  }[];
  conflicts: { reviewerId: number; name: string; text: string }[];
  eligible: { id: number; name: string }[];
};

const PROGRESS_TONE = { "not started": "neutral", draft: "caution", submitted: "ok" } as const;

export function ProposalAssignments({ proposals, editable }: { proposals: Row[]; editable: boolean }) {
  return (
    <Card title="Proposals and their reviewers" className="mt-6">
      <ul className="divide-y divide-night-100">
        {proposals.map((p) => (
          <li key={p.id} className="grid gap-2 py-3" aria-label={p.title}>
            <div className="flex flex-wrap items-baseline gap-2">
              <span className="font-semibold text-night-900">{p.title}</span>
              <span className="text-sm text-night-600">
                {p.pi} · {p.category} · {p.active} reviewer{p.active === 1 ? "" : "s"}
              </span>
            </div>
            <ul className="flex flex-wrap gap-2 text-sm">
              {p.assignments.map((a) => (
                <li
                  key={a.id}
                  className="flex flex-wrap items-center gap-1 rounded-lg bg-night-50 px-2 py-1 ring-1 ring-night-200"
                >
                  <span className="font-medium">{a.reviewer}</span>
                  {a.status === "declined" ? (
                    <Badge tone="danger">declined: {a.declineReason}</Badge>
                  ) : (
                    <Badge tone={PROGRESS_TONE[a.progress]}>{a.progress}</Badge>
                  )}
                  {editable && a.status === "active" && a.progress === "not started" ? (
                    <IntentButton
                      intent="remove"
                      hidden={{ assignmentId: a.id }}
                      variant="ghost"
                      label={`Take back ${a.reviewer} from ${p.title}`}
                    >
                      Take back
                    </IntentButton>
                  ) : null}
                </li>
              ))}
              {p.assignments.length === 0 ? <li className="text-night-600">No reviewer yet.</li> : null}
            </ul>
            {p.conflicts.length ? (
              <p className="text-sm text-night-700">
                Conflicts: {p.conflicts.map((c) => `${c.name} (${c.text})`).join("; ")}
              </p>
            ) : null}
            {editable && p.eligible.length ? (
              <Form method="post" className="flex flex-wrap items-center gap-2">
                <input type="hidden" name="intent" value="assign" />
                <input type="hidden" name="proposalId" value={p.id} />
                <label className="text-sm text-night-700" htmlFor={`assign-${p.id}`}>
                  Assign
                </label>
                <select
                  id={`assign-${p.id}`}
                  name="reviewerId"
                  className="rounded-lg border border-night-300 bg-white px-2 py-1 text-sm focus-visible:outline-3 focus-visible:outline-ember-500"
                  defaultValue=""
                >
                  <option value="">— a reviewer free of conflicts —</option>
                  {p.eligible.map((e) => (
                    <option key={e.id} value={e.id}>
                      {e.name}
                    </option>
                  ))}
                </select>
                <Button type="submit" size="sm" variant="secondary">
                  Assign and notify
                </Button>
              </Form>
            ) : null}
          </li>
        ))}
      </ul>
    </Card>
  );
}
