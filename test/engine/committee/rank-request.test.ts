import { describe, expect, it } from "vitest";
import { parseRankRequest } from "~/engine";

const ok = {
  scale: { best: 1, worst: 5 },
  reviews: [
    { reviewer: "r1", proposal: "P1", score: 2 },
    { reviewer: "r2", proposal: "P1", score: 4.5 },
  ],
};

describe("rank request schema", () => {
  it("accepts the contract's example and ignores unknown keys", () => {
    const r = parseRankRequest({ ...ok, note: "x", reviews: [{ ...ok.reviews[0], comment: "y" }] });
    expect(r).toEqual({ ok: true, value: { scale: ok.scale, reviews: [ok.reviews[0]] } });
  });

  const bad: [string, unknown, string][] = [
    ["a non-object body", [1], "request must be a JSON object"],
    ["a missing scale", { reviews: [] }, "scale: is required"],
    ["a missing scale end", { ...ok, scale: { best: 1 } }, "scale.worst: is required"],
    ["equal ends", { ...ok, scale: { best: 3, worst: 3 } }, "scale.worst: must differ from scale.best"],
    ["missing reviews", { scale: ok.scale }, "reviews: is required"],
    ["reviews not an array", { ...ok, reviews: {} }, "reviews: must be an array"],
    [
      "an empty reviewer id",
      { ...ok, reviews: [{ reviewer: "", proposal: "P1", score: 1 }] },
      "reviews[0].reviewer: must not be empty",
    ],
    [
      "a numeric proposal id",
      { ...ok, reviews: [{ reviewer: "r1", proposal: 7, score: 1 }] },
      "reviews[0].proposal: must be a string",
    ],
    [
      "a score that is not a number",
      { ...ok, reviews: [{ reviewer: "r1", proposal: "P1", score: "2" }] },
      "reviews[0].score: must be a number",
    ],
    [
      "a score above the scale",
      { ...ok, reviews: [...ok.reviews, { reviewer: "r3", proposal: "P1", score: 5.01 }] },
      "reviews[2].score: must lie within the scale 1–5",
    ],
    [
      "a score outside a reversed scale",
      { scale: { best: 5, worst: 1 }, reviews: [...ok.reviews, { reviewer: "r3", proposal: "P2", score: 0 }] },
      "reviews[2].score: must lie within the scale 1–5",
    ],
    [
      "a repeated reviewer and proposal",
      { ...ok, reviews: [...ok.reviews, { reviewer: "r1", proposal: "P1", score: 3 }] },
      'reviews[2]: repeats reviews[0]: reviewer "r1" already scored proposal "P1" (one review per reviewer and proposal)',
    ],
  ];
  for (const [name, body, message] of bad) {
    it(`refuses ${name} with one line naming the field`, () => {
      const r = parseRankRequest(body);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.message).toBe(message);
    });
  }

  it("accepts the ends of the scale in either order", () => {
    const reviews = [
      { reviewer: "r1", proposal: "P1", score: 1 },
      { reviewer: "r1", proposal: "P2", score: 5 },
    ];
    expect(parseRankRequest({ scale: { best: 1, worst: 5 }, reviews }).ok).toBe(true);
    expect(parseRankRequest({ scale: { best: 5, worst: 1 }, reviews }).ok).toBe(true);
  });
});
