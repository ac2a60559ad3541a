/** The status of a proposal and the verdict of a feasibility line, as badges. */
import type { ReactNode } from "react";
import { Badge, type BadgeTone } from "~/components/ui";
import type { ProposalStatus } from "~/db/schema/proposals";
import type { Verdict } from "~/services/proposals/feasibility";

/**
 * Each status its own colour and mark, so no two look alike even without colour (a reader who does not
 * tell orange from red still tells ◔ from ✕): the mark is decoration, the label says it in words.
 */
export const STATUS_STYLE: Record<ProposalStatus, { tone: BadgeTone; mark: string }> = {
  draft: { tone: "neutral", mark: "✎" },
  submitted: { tone: "info", mark: "↑" },
  under_review: { tone: "accent", mark: "◔" },
  accepted: { tone: "ok", mark: "✓" },
  waitlisted: { tone: "caution", mark: "…" },
  declined: { tone: "danger", mark: "✕" },
  scheduled: { tone: "ok", mark: "★" },
  withdrawn: { tone: "neutral", mark: "↩" },
};

/** A badge with its mark before the words; the mark is decoration, hidden from screen readers. */
function MarkedBadge({ tone, mark, children }: { tone: BadgeTone; mark: string; children: ReactNode }) {
  return (
    <Badge tone={tone}>
      <span aria-hidden="true" className="mr-1 font-semibold">
        {mark}
      </span>
      {children}
    </Badge>
  );
}

export function StatusBadge({ status, label }: { status: ProposalStatus; label: string }) {
  const style = STATUS_STYLE[status];
  return (
    <MarkedBadge tone={style.tone} mark={style.mark}>
      <span>{label}</span>
    </MarkedBadge>
  );
}

const VERDICT: Record<Verdict, { tone: BadgeTone; label: string; mark: string }> = {
  pass: { tone: "ok", label: "pass", mark: "✓" },
  caution: { tone: "caution", label: "caution", mark: "!" },
  fail: { tone: "danger", label: "fail", mark: "✕" },
};

export function VerdictBadge({ verdict }: { verdict: Verdict }) {
  const v = VERDICT[verdict];
  return (
    <MarkedBadge tone={v.tone} mark={v.mark}>
      {v.label}
    </MarkedBadge>
  );
}
