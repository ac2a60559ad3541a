import { describe, expect, it } from "vitest";
import { rowOfParam } from "~/lib/not-found";

/** What a call threw, for checking the error page it would show. */
async function thrown(p: Promise<unknown>) {
  try {
    await p;
  } catch (e) {
    return e;
  }
  throw new Error("expected a throw");
}

describe("the row a route parameter names", () => {
  const rows = new Map([[7, { id: 7, name: "2027A" }]]);
  const load = async (id: number) => rows.get(id) ?? null;

  it("loads the row of a well-formed id", async () => {
    await expect(rowOfParam("7", load, "No cycle with this number.")).resolves.toEqual({ id: 7, name: "2027A" });
  });

  it.each(["8", "abc", "0", "-7", "99999999999", undefined])(
    "answers %s with the 404 page and the message",
    async (raw) => {
      const e = await thrown(rowOfParam(raw, load, "No cycle with this number."));
      expect(e).toMatchObject({ init: { status: 404 }, data: "No cycle with this number." });
    },
  );

  it("never asks for a row when the parameter is no id", async () => {
    const asked: number[] = [];
    await thrown(rowOfParam("x1", async (id) => asked.push(id), "No cycle with this number."));
    expect(asked).toEqual([]);
  });
});
