import { describe, expect, it } from "vitest";
import { isDatabaseUnavailable, isDataException } from "~/lib/pg-errors";

const coded = (code: string) => Object.assign(new Error(code), { code });

describe("reading database errors", () => {
  it("tells a database that is not answering from a client's mistake", () => {
    // SQLSTATE values: PostgreSQL documentation, appendix A (class 08, 53300, 57014, 57P01–57P03).
    for (const code of [
      "ECONNREFUSED",
      "CONNECT_TIMEOUT",
      "CONNECTION_CLOSED",
      "08006",
      "57P01",
      "57P03",
      "57014",
      "53300",
    ])
      expect(isDatabaseUnavailable(coded(code)), code).toBe(true);
    for (const code of ["23505", "22P02", "42P01", "EACCES"])
      expect(isDatabaseUnavailable(coded(code)), code).toBe(false);
    expect(isDatabaseUnavailable(null)).toBe(false);
  });

  it("looks through wrapped errors and through the parts of an AggregateError", () => {
    const wrapped = new Error("Failed query: select 1", { cause: coded("ECONNREFUSED") });
    expect(isDatabaseUnavailable(wrapped)).toBe(true);
    const both = new AggregateError([coded("ECONNREFUSED"), coded("ECONNREFUSED")], "connect failed");
    expect(isDatabaseUnavailable(new Error("Failed query", { cause: both }))).toBe(true);
  });

  it("recognizes a data exception (class 22) as input the app should have refused", () => {
    expect(isDataException(new Error("Failed query", { cause: coded("22003") }))).toBe(true);
    expect(isDataException(coded("22021"))).toBe(true);
    expect(isDataException(coded("23505"))).toBe(false);
  });
});
