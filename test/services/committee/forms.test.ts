import { describe, expect, it } from "vitest";
import { type DecisionSubject, parseDecisionsForm } from "~/services/committee/decisions-form";
import { compareScores, onScale, scaleSteps, scaleText, stepLabel } from "~/services/committee/scale";
import { parseReviewForm } from "~/services/committee/schemas";

const scale = { best: 1, worst: 5 };
const form = (fields: Record<string, string>) => ({ get: (k: string) => fields[k] ?? null });

describe("the score scale", () => {
  it("reads in either direction", () => {
    expect(scaleText(scale)).toBe("1 = best … 5 = poorest");
    expect(scaleSteps(scale)).toEqual([1, 2, 3, 4, 5]);
    expect(scaleSteps({ best: 10, worst: 7 })).toEqual([10, 9, 8, 7]);
    expect(stepLabel(1, scale)).toBe("1 (best)");
    expect(stepLabel(5, scale)).toBe("5 (poorest)");
    expect(onScale(2.5, scale)).toBe(true);
    expect(onScale(0, scale)).toBe(false);
    expect(onScale(8, { best: 10, worst: 7 })).toBe(true);
    expect(compareScores(1, 2, scale)).toBeLessThan(0);
    expect(compareScores(9, 8, { best: 10, worst: 7 })).toBeLessThan(0);
  });
});

describe("the review form", () => {
  const values = (over: Record<string, string> = {}) => ({
    score: "2",
    commentToPi: " Clear case. ",
    commentToCommittee: "",
    confidence: "high",
    version: "3",
    ...over,
  });

  it("keeps an incomplete draft and trims the text", () => {
    expect(parseReviewForm(values({ score: "", confidence: "", commentToPi: "" }), scale, false)).toEqual({
      ok: true,
      value: { score: null, commentToPi: "", commentToCommittee: "", confidence: null, version: 3 },
    });
    expect(parseReviewForm(values(), scale, true)).toMatchObject({
      ok: true,
      value: { score: 2, commentToPi: "Clear case." },
    });
  });

  it("needs a score, a confidence and a comment to the PI to submit", () => {
    expect(parseReviewForm(values({ score: "", confidence: "", commentToPi: " " }), scale, true)).toEqual({
      ok: false,
      errors: {
        score: "Score: give a score to submit (1 = best … 5 = poorest)",
        confidence: "Confidence: say how confident you are to submit",
        commentToPi: "Comment to the PI: the team should hear why; write a few lines",
      },
    });
  });

  it("refuses a score off the scale, an unknown confidence, a long comment and a bad version, by field", () => {
    const out = parseReviewForm(
      values({ score: "6", confidence: "total", commentToCommittee: "x".repeat(5001), version: "-1" }),
      scale,
      false,
    );
    expect(out).toEqual({
      ok: false,
      errors: {
        score: "Score: a number on the cycle's scale, 1 = best … 5 = poorest",
        commentToCommittee: "Comment to the committee: at most 5000 characters",
        confidence: "Confidence: choose low, medium or high",
        version: "Version: a whole number",
      },
    });
  });
});

describe("the decisions form", () => {
  const subjects: DecisionSubject[] = [
    { id: 7, title: "Seven", hours: { 1: 10, 2: 4 }, configNames: { 1: "compact-3", 2: "medium-4" } },
    { id: 8, title: "Eight", hours: { 2: 6 }, configNames: { 1: "compact-3", 2: "medium-4" } },
  ];

  it("reads grades, decisions, hours on requested configurations and messages", () => {
    const out = parseDecisionsForm(
      form({
        "grade-7": "1.5",
        "decision-7": "accept",
        "hours-7-1": "8",
        "hours-7-2": "",
        "message-7": " Well done ",
        "grade-8": "",
        "decision-8": "waitlist",
      }),
      subjects,
      scale,
    );
    expect(out).toEqual({
      ok: true,
      entries: [
        { proposalId: 7, finalGrade: 1.5, decision: "accept", hours: { 1: 8 }, message: "Well done" },
        { proposalId: 8, finalGrade: null, decision: "waitlist", hours: {}, message: "" },
      ],
    });
  });

  it("names each field that is wrong", () => {
    const out = parseDecisionsForm(
      form({
        "grade-7": "7",
        "decision-7": "accept",
        "hours-7-1": "12",
        "decision-8": "decline",
        "hours-8-2": "3",
        "message-8": "y".repeat(2001),
      }),
      subjects,
      scale,
    );
    expect(out).toEqual({
      ok: false,
      errors: {
        "grade-7": "Final grade of “Seven”: a number on the cycle's scale, 1 = best … 5 = poorest",
        "hours-7-1": "Hours of “Seven” on compact-3: at most the 10 h requested",
        "message-8": "Message for “Eight”: at most 2000 characters",
        "decision-8": "Decision of “Eight”: hours are granted only to an accepted proposal",
      },
    });
    const none = parseDecisionsForm(form({ "decision-7": "accept", "decision-8": "maybe" }), subjects, scale);
    expect(none.ok ? {} : none.errors).toEqual({
      "decision-7": "Decision of “Seven”: an accepted proposal needs hours on at least one configuration",
      "decision-8": "Decision of “Eight”: accept, waitlist or decline",
    });
  });
});
