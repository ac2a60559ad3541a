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
