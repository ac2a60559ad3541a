/** A cycle's state as a badge: its own colour and words for each state of the committee's season. */
import type { ReactNode } from "react";
import { Link } from "react-router";
import { Badge, type BadgeTone } from "~/components/ui";
import type { CycleState } from "~/db/schema/proposals";

const TONE: Record<CycleState, BadgeTone> = {
  draft: "neutral",
  open: "ok",
  reviewing: "info",
  deciding: "caution",
  closed: "accent",
};

const WORDS: Record<CycleState, string> = {
  draft: "Being prepared",
  open: "Open for proposals",
  reviewing: "With the reviewers",
  deciding: "Decisions in progress",
  closed: "Decisions sent",
};

export function StateBadge({ state }: { state: CycleState }) {
  return <Badge tone={TONE[state]}>{WORDS[state]}</Badge>;
}

/** A card title naming a cycle: its name (a link when `to` is given), its state, and any further badges. */
type CycleTitleProps = { name: ReactNode; state: CycleState; to?: string; children?: ReactNode };

export function CycleTitle({ name, state, to, children }: CycleTitleProps) {
  return (
    <span className="flex flex-wrap items-center gap-2">
      {to ? (
        <Link to={to} className="hover:underline">
          {name}
        </Link>
      ) : (
        name
      )}{" "}
      <StateBadge state={state} />
      {children}
    </span>
  );
}
