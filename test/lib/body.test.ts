import { describe, expect, it } from "vitest";
import {
  BODY_TOO_LARGE_CODE,
  CONTENT_TYPE_MAX_BYTES,
  isBodyTooLarge,
  parseForm,
  REQUEST_BODY_MAX_BYTES,
  readBodyCapped,
  readFormBody,
} from "~/lib/body.server";
import { MAX_BODY_BYTES } from "~/lib/json.server";
import { MAX_FORM_BODY_BYTES, MAX_UPLOAD_BODY_BYTES } from "~/services/proposals/upload.server";
import { MAX_IMPORT_BYTES } from "~/services/registry/upload";

function streamed(chunks: number, size: number) {
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      for (let i = 0; i < chunks; i++) controller.enqueue(new Uint8Array(size).fill(97));
      controller.close();
    },
  });
  return new Request("http://localhost/x", { method: "POST", body, duplex: "half" } as RequestInit);
}

/** `body` posted as `type`, read through a cap of 1000 bytes, then parsed as a form. */
async function postedForm(body: string, type: string) {
  const req = new Request("http://localhost/x", { method: "POST", body, headers: { "Content-Type": type } });
  const read = await readBodyCapped(req, 1000);
  if (!read.ok) throw new Error("expected a body");
  return parseForm(req, read.bytes);
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
    const form = await postedForm("a=1&b=two", "application/x-www-form-urlencoded");
    expect(form?.get("b")).toBe("two");
    expect(await postedForm("--x", "multipart/form-data; boundary=zz")).toBeNull();
  });
});

describe("the shared form reader", () => {
  const post = (body: BodyInit, type?: string) =>
    new Request("http://localhost/x", {
      method: "POST",
      body,
      headers: type ? { "Content-Type": type } : {},
    });

  it("answers another content type with 415 and a form over the cap with 413, never a 500", async () => {
    expect(await readFormBody(post("hello", "text/plain"))).toEqual({
      ok: false,
      status: 415,
      error: "This page takes a form, not text/plain.",
    });
    expect(await readFormBody(post('{"a":1}', "application/json"))).toMatchObject({ ok: false, status: 415 });
    const big = await readFormBody(post(`a=${"x".repeat(70_000)}`, "application/x-www-form-urlencoded"));
    expect(big).toMatchObject({
      ok: false,
      status: 413,
      error: "The form is larger than 64 KB; shorten the longest text and send it again.",
    });
  });

  it("refuses a NUL character in a field, naming the field, instead of storing or dropping it", async () => {
    const read = await readFormBody(post("name=ok&notes=a%00b", "application/x-www-form-urlencoded"));
    expect(read).toMatchObject({ ok: false, status: 400 });
    expect(!read.ok && read.error).toMatch(/The field “notes” contains a NUL character/);
    const fine = await readFormBody(post("name=Lumbre%20Nova", "application/x-www-form-urlencoded"));
    expect(fine.ok && fine.form.get("name")).toBe("Lumbre Nova");
  });

  it("reads the app server's cut-off stream as too large", async () => {
    const cut = new ReadableStream<Uint8Array>({
      start(controller) {
        controller.enqueue(new Uint8Array(10));
        controller.error(Object.assign(new Error("too large"), { code: BODY_TOO_LARGE_CODE }));
      },
    });
    const req = new Request("http://localhost/x", { method: "POST", body: cut, duplex: "half" } as RequestInit);
    expect(await readBodyCapped(req, 1000)).toEqual({ ok: false, reason: "too-large" });
    expect(isBodyTooLarge(new TypeError("failed", { cause: { code: BODY_TOO_LARGE_CODE } }))).toBe(true);
    expect(isBodyTooLarge(new Error("other"))).toBe(false);
  });

  it("has a server-wide cap at least as large as every route's own", () => {
    expect(REQUEST_BODY_MAX_BYTES).toBeGreaterThanOrEqual(MAX_UPLOAD_BODY_BYTES);
    expect(REQUEST_BODY_MAX_BYTES).toBeGreaterThanOrEqual(MAX_IMPORT_BYTES);
    expect(CONTENT_TYPE_MAX_BYTES["application/json"]).toBeGreaterThanOrEqual(MAX_BODY_BYTES);
    expect(CONTENT_TYPE_MAX_BYTES["application/x-www-form-urlencoded"]).toBeGreaterThanOrEqual(MAX_FORM_BODY_BYTES);
  });
});
