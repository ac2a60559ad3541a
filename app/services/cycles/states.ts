/**
 * The committee's season of a cycle, as a state machine (pure, safe in the browser):
 *
 *   draft ──open──▶ open ──start-review──▶ reviewing ──close-review──▶ deciding ──release──▶ closed
 *                                            ▲   │                        │
 *                                            └───┴──── reopen-scoring ◀───┘
 *
 * Each transition is a guarded action the chair confirms. The guards, in plain words:
 *  - open: the submission deadline lies ahead and at least one configuration is on offer;
 *  - start-review: the submission deadline has passed (no submission after it), a review deadline
 *    lies ahead and the committee has at least one member;
 *  - close-review: scoring ends (from then on only the chair's decisions change);
 *  - reopen-scoring: back to reviewing with a new review deadline ahead (from reviewing, it moves the
 *    deadline; after release nothing reopens);
 *  - release: every proposal under review has a decision (see the board); done by the Ranking board.
 */
import type { CycleState } from "~/db/schema/proposals";

export { CYCLE_STATES, type CycleState } from "~/db/schema/proposals";

export const STATE_WORDS: Record<CycleState, string> = {
  draft: "Being prepared",
  open: "Open for proposals",
  reviewing: "With the reviewers",
  deciding: "Decisions in progress",
  closed: "Decisions sent",
};

export const TRANSITIONS = ["open", "start-review", "close-review", "reopen-scoring"] as const;
export type Transition = (typeof TRANSITIONS)[number];

export type TransitionSpec = {
  from: readonly CycleState[];
  to: CycleState;
  /** The button's words. */
  label: string;
  /** What the confirmation says will happen. */
  consequence: string;
};

export const TRANSITION_SPECS: Record<Transition, TransitionSpec> = {
  open: {
    from: ["draft"],
    to: "open",
    label: "Open for proposals",
    consequence: "Proposers can start drafts in this cycle and submit them until the deadline.",
  },
  "start-review": {
    from: ["open"],
    to: "reviewing",
    label: "Start the review",
    consequence:
      "Every submitted proposal goes to the committee (status “Under review”); reviewers can declare conflicts, read their assignments and score until the review deadline.",
  },
  "close-review": {
    from: ["reviewing"],
    to: "deciding",
    label: "Close the review",
    consequence:
      "Scoring ends now, even for reviews still in draft. The Ranking board takes the submitted scores; decisions can be recorded.",
  },
  "reopen-scoring": {
    from: ["reviewing", "deciding"],
    to: "reviewing",
    label: "Reopen scoring",
    consequence: "Reviewers can save and submit reviews again until the new review deadline.",
  },
};

/** What the guards need to know about a cycle. */
export type CycleForGuards = {
  state: CycleState;
  submissionDeadline: Date;
  reviewDeadline: Date | null;
  offers: number;
  members: number;
};

/** Why `transition` may not happen now, or null when it may. `newReviewDeadline` only for reopen-scoring. */
export function transitionRefusal(
  cycle: CycleForGuards,
  transition: Transition,
  now: Date,
  newReviewDeadline: Date | null = null,
): string | null {
  const spec = TRANSITION_SPECS[transition];
  if (!spec.from.includes(cycle.state)) {
    return `The cycle is “${STATE_WORDS[cycle.state]}”; “${spec.label}” is for a cycle ${spec.from
      .map((s) => `“${STATE_WORDS[s]}”`)
      .join(" or ")}.`;
  }
  switch (transition) {
    case "open":
      if (cycle.submissionDeadline.getTime() <= now.getTime())
        return "The submission deadline has passed: move it ahead before opening the cycle.";
      if (cycle.offers === 0) return "Offer at least one configuration before opening the cycle.";
      return null;
    case "start-review":
      if (cycle.submissionDeadline.getTime() > now.getTime())
        return "The submission deadline has not passed yet: proposers may still submit.";
      if (!cycle.reviewDeadline || cycle.reviewDeadline.getTime() <= now.getTime())
        return "Set a review deadline that lies ahead (Edit the cycle) before starting the review.";
      if (cycle.members === 0) return "Put at least one reviewer on the committee (Edit the cycle) first.";
      return null;
    case "close-review":
      return null;
    case "reopen-scoring":
      if (!newReviewDeadline || newReviewDeadline.getTime() <= now.getTime())
        return "Give a new review deadline that lies ahead.";
      return null;
  }
}

/** The transitions the cycle offers from its state, each with the reason it is refused now (or null). */
export function availableTransitions(cycle: CycleForGuards, now: Date) {
  return TRANSITIONS.filter((t) => TRANSITION_SPECS[t].from.includes(cycle.state)).map((t) => ({
    transition: t,
    ...TRANSITION_SPECS[t],
    // reopen-scoring takes its deadline from the form; its other guards do not depend on it.
    refusal: t === "reopen-scoring" ? null : transitionRefusal(cycle, t, now),
  }));
}

/** Is scoring open: the cycle with the reviewers and its review deadline ahead. */
export function scoringOpen(cycle: { state: CycleState; reviewDeadline: Date | null }, now: Date): boolean {
  return cycle.state === "reviewing" && cycle.reviewDeadline !== null && now.getTime() < cycle.reviewDeadline.getTime();
}

/** Why scoring is closed, or null when it is open. */
export function scoringClosedBecause(
  cycle: { state: CycleState; reviewDeadline: Date | null },
  now: Date,
): string | null {
  if (cycle.state !== "reviewing") {
    return cycle.state === "deciding" || cycle.state === "closed"
      ? "The review is closed: scores can no longer change."
      : "The review has not started yet.";
  }
  if (cycle.reviewDeadline === null || now.getTime() >= cycle.reviewDeadline.getTime())
    return "The review deadline has passed; the chair may reopen scoring.";
  return null;
}
