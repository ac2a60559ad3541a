import { describe, expect, it } from "vitest";
import { parseEnv } from "~/env.server";

describe("environment validation", () => {
  it("fills defaults for a bare environment", () => {
    const env = parseEnv({});
    expect(env.PORT).toBe(3000);
    expect(env.DATABASE_URL).toMatch(/^postgres:\/\//);
  });

  it("names the variable that is wrong", () => {
    expect(() => parseEnv({ PORT: "eighty" })).toThrow(/PORT/);
    expect(() => parseEnv({ DATABASE_URL: "mysql://x" })).toThrow(/DATABASE_URL: must be a postgres:\/\/ URL/);
    expect(() => parseEnv({ APP_ORIGIN: "not a url" })).toThrow(/APP_ORIGIN/);
    expect(() => parseEnv({ COOKIE_SECRET: "short" })).toThrow(/COOKIE_SECRET: must be at least 16 characters/);
  });
});

describe("the public origin and the other server settings", () => {
  it("defaults APP_ORIGIN to http://localhost:$PORT, so links follow a non-default port", () => {
    expect(parseEnv({}).APP_ORIGIN).toBe("http://localhost:3000");
    expect(parseEnv({ PORT: "3917" }).APP_ORIGIN).toBe("http://localhost:3917");
    expect(parseEnv({ PORT: "3917", APP_ORIGIN: "https://docket.example/" }).APP_ORIGIN).toBe("https://docket.example");
    expect(() => parseEnv({ APP_ORIGIN: "https://docket.example/app" })).toThrow(/APP_ORIGIN: must be an origin/);
    expect(() => parseEnv({ APP_ORIGIN: "ftp://docket.example" })).toThrow(/APP_ORIGIN: must start with http/);
  });

  it("reads numbers strictly: no hex, no exponent, no spaces inside", () => {
    for (const bad of ["0x0BB8", "3e3", "30 00", "3000.5", "-1", "70000", ""])
      expect(() => parseEnv({ PORT: bad }), bad).toThrow(/PORT/);
    expect(parseEnv({ PORT: " 3001 " }).PORT).toBe(3001);
    expect(parseEnv({}).DB_CONNECT_TIMEOUT_S).toBe(3);
    expect(parseEnv({}).DB_STATEMENT_TIMEOUT_MS).toBe(10_000);
    expect(() => parseEnv({ DB_STATEMENT_TIMEOUT_MS: "1e4" })).toThrow(/DB_STATEMENT_TIMEOUT_MS/);
    expect(parseEnv({}).SIGN_IN_ATTEMPTS_PER_ADDRESS).toBe(30);
    expect(parseEnv({ SIGN_IN_ATTEMPTS_PER_ADDRESS: "500" }).SIGN_IN_ATTEMPTS_PER_ADDRESS).toBe(500);
    expect(() => parseEnv({ SIGN_IN_ATTEMPTS_PER_ADDRESS: "0" })).toThrow(/SIGN_IN_ATTEMPTS_PER_ADDRESS/);
  });

  it("takes trusted proxies as addresses, CIDR ranges or range names, and nothing else", () => {
    expect(parseEnv({}).TRUSTED_PROXIES).toEqual([]);
    expect(parseEnv({ TRUSTED_PROXIES: "loopback, 10.0.0.0/8,2001:db8::1" }).TRUSTED_PROXIES).toEqual([
      "loopback",
      "10.0.0.0/8",
      "2001:db8::1",
    ]);
    for (const bad of ["everyone", "10.0.0.0/33", "proxy.example", "*"])
      expect(() => parseEnv({ TRUSTED_PROXIES: bad }), bad).toThrow(/TRUSTED_PROXIES/);
  });
});
