import { describe, expect, it } from "vitest";
import { EnvError, parseServerEnv } from "@/lib/env";
import { clientAddressOf, socketAddressHeader } from "@/lib/security/client-address";

// The address sign-in limits are keyed on (MDN, "X-Forwarded-For", security and privacy concerns:
// only the entries added by one's own trusted proxies can be believed).
describe("the client address of a request", () => {
  it("is the socket's peer, whatever X-Forwarded-For says, when no proxy is trusted", () => {
    const headers = new Headers({ [socketAddressHeader]: "203.0.113.9", "x-forwarded-for": "192.0.2.1, 192.0.2.2" });
    expect(clientAddressOf(headers, [])).toBe("203.0.113.9");
  });

  it("is the socket's peer when that peer is not the trusted proxy", () => {
    const headers = new Headers({ [socketAddressHeader]: "203.0.113.9", "x-forwarded-for": "192.0.2.1" });
    expect(clientAddressOf(headers, ["10.0.0.5"])).toBe("203.0.113.9");
  });

  it("behind the trusted proxy, is the nearest forwarded address that is no proxy (never the client-written left end)", () => {
    const headers = { [socketAddressHeader]: "::ffff:10.0.0.5", "x-forwarded-for": "6.6.6.6, 198.51.100.7, 10.0.0.6" };
    expect(clientAddressOf(headers, ["10.0.0.5", "10.0.0.6"])).toBe("198.51.100.7");
  });

  it("behind the trusted proxy, is the proxy itself when the forwarded entry cannot be read", () => {
    expect(clientAddressOf({ [socketAddressHeader]: "10.0.0.5", "x-forwarded-for": "not an address" }, ["10.0.0.5"])).toBe("10.0.0.5");
    expect(clientAddressOf({ [socketAddressHeader]: "10.0.0.5" }, ["10.0.0.5"])).toBe("10.0.0.5");
  });

  it("is one address however an IPv4 peer is spelled", () => {
    expect(clientAddressOf({ [socketAddressHeader]: "::ffff:203.0.113.9" }, [])).toBe("203.0.113.9");
  });

  it('is "unknown" without the launcher\'s header: X-Forwarded-For alone is never believed', () => {
    expect(clientAddressOf(new Headers({ "x-forwarded-for": "192.0.2.1" }), [])).toBe("unknown");
  });
});

describe("ARCWRIGHT_TRUSTED_PROXY", () => {
  const valid = { DATABASE_URL: "postgres://arc:pw@127.0.0.1:54329/arcwright" };

  it("is empty (no proxy trusted) by default, and a comma-separated list of IP addresses when set", () => {
    expect(parseServerEnv(valid).ARCWRIGHT_TRUSTED_PROXY).toEqual([]);
    expect(parseServerEnv({ ...valid, ARCWRIGHT_TRUSTED_PROXY: "10.0.0.5, ::1" }).ARCWRIGHT_TRUSTED_PROXY).toEqual(["10.0.0.5", "::1"]);
  });

  it("refuses a host name or a network, naming the variable", () => {
    for (const value of ["proxy.example", "10.0.0.0/8"]) {
      expect(() => parseServerEnv({ ...valid, ARCWRIGHT_TRUSTED_PROXY: value }), value).toThrow(EnvError);
      expect(() => parseServerEnv({ ...valid, ARCWRIGHT_TRUSTED_PROXY: value }), value).toThrow(/ARCWRIGHT_TRUSTED_PROXY/);
    }
  });
});
