import { describe, expect, it } from "vitest";
import { isDatabaseUnavailable } from "@/lib/server/http";

/** An error as a driver wraps it: `cause` chains as drizzle-orm's query error does. */
const wrapped = (cause: unknown) => Object.assign(new Error("Failed query: select 1"), { cause });
const coded = (code: string) => Object.assign(new Error(code), { code });

// Codes: Node's net errors; PostgreSQL documentation, Appendix A (SQLSTATE class 08, 57P01–57P03).
describe("an outage is told from a wrong query (503, not 500)", () => {
  it.each(["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT", "CONNECTION_CLOSED", "08006", "57P01", "57P02", "57P03"])("%s, however deeply wrapped", (code) => {
    expect(isDatabaseUnavailable(coded(code))).toBe(true);
    expect(isDatabaseUnavailable(wrapped(wrapped(coded(code))))).toBe(true);
  });

  it("a connection tried on several addresses (an AggregateError of refusals)", () => {
    expect(isDatabaseUnavailable(wrapped(new AggregateError([coded("ECONNREFUSED"), coded("ECONNREFUSED")], "connect failed")))).toBe(true);
  });

  it("but not a query the database refuses, nor a plain bug", () => {
    expect(isDatabaseUnavailable(wrapped(coded("23505")))).toBe(false);
    expect(isDatabaseUnavailable(new TypeError("x is undefined"))).toBe(false);
    expect(isDatabaseUnavailable(null)).toBe(false);
  });
});
