/** The status of a proposal and the verdict of a feasibility line, as badges. */
import { Badge, type BadgeTone } from "~/components/ui";
import type { ProposalStatus } from "~/db/schema/proposals";
import type { Verdict } from "~/services/proposals/feasibility";

const STATUS_TONE: Record<ProposalStatus, BadgeTone> = {
  draft: "neutral",
  submitted: "info",
  under_review: "accent",
  accepted: "ok",
  waitlisted: "caution",
  declined: "danger",
  scheduled: "ok",
  withdrawn: "neutral",
};

export function StatusBadge({ status, label }: { status: ProposalStatus; label: string }) {
  return <Badge tone={STATUS_TONE[status]}>{label}</Badge>;
}

const VERDICT: Record<Verdict, { tone: BadgeTone; label: string; mark: string }> = {
  pass: { tone: "ok", label: "pass", mark: "✓" },
  caution: { tone: "caution", label: "caution", mark: "!" },
  fail: { tone: "danger", label: "fail", mark: "✕" },
};

export function VerdictBadge({ verdict }: { verdict: Verdict }) {
  const v = VERDICT[verdict];
  return (
    <Badge tone={v.tone}>
      <span aria-hidden="true" className="mr-1 font-semibold">
        {v.mark}
      </span>
      {v.label}
    </Badge>
  );
}
