import { describe, expect, it } from "vitest";
import { addressBucket } from "~/services/auth/rate-limit.server";

describe("the rate-limit bucket of a client address", () => {
  it("counts an IPv4 address on its own", () => {
    expect(addressBucket("203.0.113.7")).toBe("203.0.113.7");
    expect(addressBucket("203.0.113.8")).toBe("203.0.113.8");
  });

  it("counts an IPv6 address by its /64 network, however it is written", () => {
    // RFC 4291 §2.2: "::" stands for one or more groups of zeros; leading zeros may be left out.
    expect(addressBucket("2001:db8:0:1::42")).toBe("2001:db8:0:1::/64");
    expect(addressBucket("2001:0DB8:0000:0001:ffff:0:0:1")).toBe("2001:db8:0:1::/64");
    expect(addressBucket("2001:db8:0:2::42")).toBe("2001:db8:0:2::/64");
    expect(addressBucket("::1")).toBe("0:0:0:0::/64");
  });
});
