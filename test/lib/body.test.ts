import { describe, expect, it } from "vitest";
import { parseForm, readBodyCapped } from "~/lib/body.server";

function streamed(chunks: number, size: number) {
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      for (let i = 0; i < chunks; i++) controller.enqueue(new Uint8Array(size).fill(97));
      controller.close();
    },
  });
  return new Request("http://localhost/x", { method: "POST", body, duplex: "half" } as RequestInit);
}

describe("reading a body with a cap", () => {
  it("refuses by the declared length before reading", async () => {
    const req = new Request("http://localhost/x", {
      method: "POST",
      body: "abc",
      headers: { "Content-Length": "5000000" },
    });
    expect(await readBodyCapped(req, 1000)).toEqual({ ok: false, reason: "too-large" });
  });

  it("counts a streamed body without a length and stops past the cap", async () => {
    expect(await readBodyCapped(streamed(4, 400), 1000)).toEqual({ ok: false, reason: "too-large" });
    const ok = await readBodyCapped(streamed(2, 400), 1000);
    expect(ok.ok && ok.bytes.byteLength).toBe(800);
  });

  it("parses a form from the bytes, and says null for something that is not a form", async () => {
    const req = new Request("http://localhost/x", {
      method: "POST",
      body: "a=1&b=two",
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
    });
    const read = await readBodyCapped(req, 1000);
    if (!read.ok) throw new Error("expected a body");
    const form = await parseForm(req, read.bytes);
    expect(form?.get("b")).toBe("two");
    const bad = new Request("http://localhost/x", {
      method: "POST",
      body: "--x",
      headers: { "Content-Type": "multipart/form-data; boundary=zz" },
    });
    const badRead = await readBodyCapped(bad, 1000);
    if (!badRead.ok) throw new Error("expected a body");
    expect(await parseForm(bad, badRead.bytes)).toBeNull();
  });
});
