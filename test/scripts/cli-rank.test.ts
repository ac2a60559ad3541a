import { cli, cliOk, expectRefused, requestFiles } from "@test/cli";
import { rankRequest } from "@test/rank-request";
import { describe, expect, it } from "vitest";

const { file } = requestFiles("cli-rank");

// r1: P1 = 2, P2 = 4 → μ = 3, σ = 1 → z = −1, +1.  r2: P1 = 3, P2 = 3.5 → μ = 3.25, σ = 0.25 → z = −1, +1.
// P1: z̄ = −1, mean 2.5, spread 0.5 → rank 1.  P2: z̄ = +1, mean 3.75, spread 0.25 → rank 2.
const request = rankRequest({ r1: { P1: 2, P2: 4 }, r2: { P1: 3, P2: 3.5 } });

describe("cli rank", { timeout: 60_000 }, () => {
  it("--input FILE prints one JSON object with exactly the contract's fields", () => {
    const r = cliOk(["rank", "--input", file("rank.json", request)]);
    expect(r.stdout.trim().split("\n")).toHaveLength(1);
    expect(JSON.parse(r.stdout)).toEqual({
      proposals: [
        { proposal: "P1", reviews: 2, meanScore: 2.5, spread: 0.5, normalizedScore: -1, rank: 1 },
        { proposal: "P2", reviews: 2, meanScore: 3.75, spread: 0.25, normalizedScore: 1, rank: 2 },
      ],
      reviewers: [
        { reviewer: "r1", reviews: 2, meanScore: 3, sdScore: 1 },
        { reviewer: "r2", reviews: 2, meanScore: 3.25, sdScore: 0.25 },
      ],
    });
  });

  it("reads standard input", () => {
    const r = cli(["rank"], JSON.stringify({ ...request, scale: { best: 5, worst: 1 } }));
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout).proposals.map((p: { proposal: string }) => p.proposal)).toEqual(["P2", "P1"]);
  });

  const bad: [string, unknown, RegExp][] = [
    [
      "a score outside the scale",
      { ...request, reviews: [...request.reviews, { reviewer: "r3", proposal: "P1", score: 6 }] },
      /^error: reviews\[4\]\.score: must lie within the scale 1–5$/,
    ],
    ["a missing scale", { reviews: request.reviews }, /^error: scale: is required$/],
    [
      "a repeated review",
      { ...request, reviews: [...request.reviews, { reviewer: "r2", proposal: "P2", score: 1 }] },
      /^error: reviews\[4\]: repeats reviews\[3\]/,
    ],
    ["invalid JSON", "{oops", /^error: the request is not valid JSON/],
  ];
  for (const [name, body, pattern] of bad) {
    it(`exits 2 with one line on stderr and nothing on stdout for ${name}`, () => {
      expectRefused(["rank", "--input", file("bad.json", body)], pattern);
    });
  }
});
