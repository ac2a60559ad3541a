import { describe, expect, it } from "vitest";
import {
  availableTransitions,
  type CycleForGuards,
  scoringClosedBecause,
  scoringOpen,
  transitionRefusal,
} from "~/services/cycles/states";

const now = new Date("2027-02-01T12:00:00Z");
const h = (hours: number) => new Date(now.getTime() + hours * 3_600_000);
const cycle = (over: Partial<CycleForGuards>): CycleForGuards => ({
  state: "open",
  submissionDeadline: h(-1),
  reviewDeadline: h(24 * 14),
  offers: 3,
  members: 4,
  ...over,
});

describe("the cycle's season", () => {
  it("opens a draft only with its deadline ahead and something on offer", () => {
    expect(transitionRefusal(cycle({ state: "draft", submissionDeadline: h(48) }), "open", now)).toBeNull();
    expect(transitionRefusal(cycle({ state: "draft", submissionDeadline: h(-1) }), "open", now)).toMatch(
      /deadline has passed/,
    );
    expect(transitionRefusal(cycle({ state: "draft", submissionDeadline: h(48), offers: 0 }), "open", now)).toMatch(
      /Offer at least one configuration/,
    );
  });

  it("starts the review only after the submission deadline, with a review deadline ahead and a committee", () => {
    expect(transitionRefusal(cycle({}), "start-review", now)).toBeNull();
    // One minute before the deadline, proposers may still submit.
    expect(transitionRefusal(cycle({ submissionDeadline: h(1 / 60) }), "start-review", now)).toMatch(/not passed yet/);
    expect(transitionRefusal(cycle({ reviewDeadline: null }), "start-review", now)).toMatch(/review deadline/);
    expect(transitionRefusal(cycle({ reviewDeadline: h(-1) }), "start-review", now)).toMatch(/review deadline/);
    expect(transitionRefusal(cycle({ members: 0 }), "start-review", now)).toMatch(/at least one reviewer/);
  });

  it("refuses every transition from the wrong state, naming both", () => {
    expect(transitionRefusal(cycle({ state: "closed" }), "reopen-scoring", now, h(10))).toMatch(
      /“Decisions sent”.*“With the reviewers” or “Decisions in progress”/,
    );
    expect(transitionRefusal(cycle({ state: "open" }), "close-review", now)).toMatch(/“Open for proposals”/);
    expect(transitionRefusal(cycle({ state: "reviewing" }), "open", now)).not.toBeNull();
  });

  it("reopens scoring from reviewing or deciding with a new deadline ahead", () => {
    expect(transitionRefusal(cycle({ state: "deciding" }), "reopen-scoring", now, h(24))).toBeNull();
    expect(transitionRefusal(cycle({ state: "reviewing" }), "reopen-scoring", now, h(24))).toBeNull();
    expect(transitionRefusal(cycle({ state: "deciding" }), "reopen-scoring", now, h(-24))).toMatch(/lies ahead/);
    expect(transitionRefusal(cycle({ state: "deciding" }), "reopen-scoring", now, null)).toMatch(/lies ahead/);
  });

  it("offers the transitions of the state, with the reason each is refused now", () => {
    expect(availableTransitions(cycle({ state: "reviewing" }), now).map((t) => [t.transition, t.refusal])).toEqual([
      ["close-review", null],
      ["reopen-scoring", null],
    ]);
    expect(availableTransitions(cycle({ state: "closed" }), now)).toEqual([]);
    const open = availableTransitions(cycle({ submissionDeadline: h(5) }), now);
    expect(open.map((t) => t.transition)).toEqual(["start-review"]);
    expect(open[0].refusal).toMatch(/not passed yet/);
  });

  it("lets reviewers score only while the cycle is with them and before the review deadline", () => {
    expect(scoringOpen({ state: "reviewing", reviewDeadline: h(1) }, now)).toBe(true);
    expect(scoringOpen({ state: "reviewing", reviewDeadline: h(0) }, now)).toBe(false);
    expect(scoringClosedBecause({ state: "reviewing", reviewDeadline: h(-1) }, now)).toMatch(/chair may reopen/);
    expect(scoringClosedBecause({ state: "deciding", reviewDeadline: h(10) }, now)).toMatch(/review is closed/);
    expect(scoringClosedBecause({ state: "open", reviewDeadline: h(10) }, now)).toMatch(/not started/);
  });
});
