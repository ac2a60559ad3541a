import { describe, expect, it } from "vitest";
import { safeNext } from "~/services/auth/next.server";

const ORIGIN = "http://localhost:3000";

describe("where a person may be sent after signing in", () => {
  it("keeps paths of the app, with their query and fragment", () => {
    expect(safeNext("/proposals/4", ORIGIN)).toBe("/proposals/4");
    expect(safeNext("/sketchpad?ra=05:36:12&dec=-01:12:07#uv", ORIGIN)).toBe("/sketchpad?ra=05:36:12&dec=-01:12:07#uv");
    expect(safeNext("/a/../account", ORIGIN)).toBe("/account");
  });

  // Each of these resolves, in a browser, to another host (or splits a header): all must go home.
  const refused = [
    "/\t/evil.example", // the tab is dropped by URL parsers: "//evil.example"
    "/\n/evil.example",
    "/\r\nSet-Cookie: x=1",
    "/\\evil.example",
    "/\\\\evil.example",
    "\\\\evil.example",
    "//evil.example",
    "///evil.example",
    "https://evil.example/",
    "http://localhost:3000.evil.example/",
    "javascript:alert(1)",
    "evil.example",
    " /account",
    "/\u0000x",
    "/\u007f",
    "/\u0085",
    "",
    `/${"a".repeat(2001)}`,
  ];
  for (const next of refused) {
    it(`sends ${JSON.stringify(next).slice(0, 40)} home`, () => {
      expect(safeNext(next, ORIGIN)).toBe("/");
    });
  }

  it("treats a missing destination as home", () => {
    expect(safeNext(null, ORIGIN)).toBe("/");
    expect(safeNext(undefined, ORIGIN)).toBe("/");
  });
});
