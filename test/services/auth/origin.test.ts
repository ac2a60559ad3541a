import { describe, expect, it } from "vitest";
import { crossSiteReason } from "~/services/auth/origin.server";

// APP_ORIGIN defaults to http://localhost:3000 (app/env.server.ts).
const post = (headers: Record<string, string>, url = "http://localhost:3000/account") =>
  new Request(url, { method: "POST", headers });

describe("cross-site request check", () => {
  it("lets same-origin posts and header-less scripts through", () => {
    expect(crossSiteReason(post({ Origin: "http://localhost:3000" }))).toBeNull();
    expect(crossSiteReason(post({}))).toBeNull();
    expect(crossSiteReason(post({ "Sec-Fetch-Site": "same-origin" }))).toBeNull();
  });

  it("refuses another origin, an opaque origin and a browser-marked cross-site request", () => {
    expect(crossSiteReason(post({ Origin: "http://evil.example" }))).toBe(
      "requests from http://evil.example are not accepted",
    );
    expect(crossSiteReason(post({ Origin: "null" }))).toMatch(/opaque origin/);
    expect(crossSiteReason(post({ "Sec-Fetch-Site": "cross-site" }))).toMatch(/cross-site/);
  });

  it("never blocks reads", () => {
    expect(
      crossSiteReason(new Request("http://localhost:3000/", { headers: { Origin: "http://evil.example" } })),
    ).toBeNull();
  });
});
