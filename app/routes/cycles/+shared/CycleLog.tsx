/** The audit log's entries about one cycle: transitions, assignments, conflicts, reviews, decisions. */

import { Card } from "~/components/ui";
import { plural } from "~/lib/format";

const WORDS: Record<string, string> = {
  "cycle.open": "opened the cycle for proposals",
  "cycle.start-review": "started the review",
  "cycle.close-review": "closed the review",
  "cycle.reopen-scoring": "reopened scoring",
  "cycle.release": "released the decisions",
  "assignments.saved": "assigned reviewers",
  "assignment.removed": "took back an assignment",
  "assignment.declined": "declined an assignment",
  "conflict.declared": "declared a conflict",
  "conflict.withdrawn": "withdrew a declared conflict",
  "review.submitted": "submitted a review",
  "reviews.reminded": "sent reminders",
  "board.triage": "placed the triage line",
  "decisions.saved": "saved grades and decisions",
  "decision.released": "sent a decision",
};

type Entry = { id: number; action: string; detail: Record<string, unknown>; at: string; actor: string | null };

function detailText(e: Entry): string {
  const d = e.detail;
  if (typeof d.title === "string" && typeof d.decision === "string") return `“${d.title}”: ${d.decision}`;
  if (typeof d.added === "number") return `${d.added} assignment${d.added === 1 ? "" : "s"} (${String(d.mode ?? "")})`;
  if (typeof d.proposalsUnderReview === "number") return `${plural(d.proposalsUnderReview, "proposal")} under review`;
  if (typeof d.reviewDeadline === "string") return `until ${d.reviewDeadline.slice(0, 16).replace("T", " ")} UTC`;
  if (typeof d.triageAfter === "number") return `after position ${d.triageAfter}`;
  return "";
}

export function CycleLog({ log }: { log: Entry[] }) {
  return (
    <Card title="Audit log of this cycle" className="mt-6">
      {log.length === 0 ? (
        <p className="text-sm text-night-600">Nothing recorded yet.</p>
      ) : (
        <ol className="divide-y divide-night-100 text-sm">
          {log.map((e) => (
            <li key={e.id} className="py-2">
              <span className="num text-night-600">{e.at}</span> —{" "}
              <span className="font-medium">{e.actor ?? "the system"}</span> {WORDS[e.action] ?? e.action}
              {detailText(e) ? <span className="text-night-700"> · {detailText(e)}</span> : null}
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}
