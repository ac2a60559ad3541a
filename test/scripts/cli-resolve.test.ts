import { cli, cliOk, expectRefused, requestFiles } from "@test/cli";
import { describe, expect, it } from "vitest";

const { file } = requestFiles("cli-resolve");

describe("cli resolve", { timeout: 60_000 }, () => {
  it('resolves {"name": "HD 39801"} to Betelgeuse with the contract fields', () => {
    const r = cliOk(["resolve", "--input", file("hd.json", { name: "HD 39801" })]);
    expect(r.stdout.trim().split("\n")).toHaveLength(1);
    const out = JSON.parse(r.stdout);
    // starnames.json / stars.8.json, HIP 27989.
    expect(out).toMatchObject({
      name: "Betelgeuse",
      hip: 27989,
      hd: 39801,
      raDeg: 88.7929,
      decDeg: 7.4071,
      vMag: 0.45,
      bv: 1.5,
    });
    expect(out.designations).toEqual(
      expect.arrayContaining(["Betelgeuse", "α Ori", "58 Ori", "HD 39801", "HIP 27989"]),
    );
  });

  it("reads standard input and forgives case and typos", () => {
    const r = cli(["resolve"], JSON.stringify({ name: "alpha orionsi" }));
    expect(r.status).toBe(0);
    expect(JSON.parse(r.stdout)).toMatchObject({ hip: 27989, matchedBy: "typo" });
  });

  const bad: [string, unknown, RegExp][] = [
    [
      "an unknown name, with near matches",
      { name: "Betelgoosey" },
      /^error: name: no star called "Betelgoosey" \(did you mean .*Betelgeuse.*\?\)$/,
    ],
    ["an unknown name without near matches", { name: "§§§" }, /^error: name: no star called "§§§"$/],
    ["a missing name", {}, /^error: name: is required$/],
    ["an empty name", { name: "  " }, /^error: name: must not be empty$/],
    ["a name that is not a string", { name: 39801 }, /^error: name: must be a string$/],
    ["not an object", [1], /^error: request must be a JSON object$/],
  ];
  for (const [what, body, message] of bad) {
    it(`rejects ${what} with exit 2 and one line on standard error`, () => {
      expectRefused(["resolve", "--input", file("bad.json", body)], message);
    });
  }
});
