import { describe, expect, it } from "vitest";
import { crossSiteError, crossSiteRefusal } from "@/lib/security/same-origin";

// Expected answers follow the OWASP CSRF Prevention Cheat Sheet (standard-header origin check and
// Fetch Metadata) and RFC 9110 §9.2.1 (safe methods change nothing).
const post = (facts: Partial<Parameters<typeof crossSiteRefusal>[0]>) =>
  crossSiteRefusal({ method: "POST", host: "arcwright.example:3000", origin: null, secFetchSite: null, ...facts });

describe("cross-site refusal of state-changing requests", () => {
  it("lets reads through whatever their origin", () => {
    for (const method of ["GET", "HEAD", "get"]) {
      expect(crossSiteRefusal({ method, host: "a.example", origin: "https://evil.example", secFetchSite: "cross-site" })).toBeNull();
    }
  });

  it("refuses another origin's CORS preflight (the app grants no cross-origin access)", () => {
    expect(crossSiteRefusal({ method: "OPTIONS", host: "a.example", origin: "https://evil.example", secFetchSite: "cross-site" })).not.toBeNull();
    expect(crossSiteRefusal({ method: "OPTIONS", host: "a.example", origin: null, secFetchSite: null })).toBeNull();
  });

  it("accepts a same-origin Origin, host compared without case", () => {
    expect(post({ origin: "http://arcwright.example:3000" })).toBeNull();
    expect(post({ origin: "http://ARCWRIGHT.example:3000" })).toBeNull();
  });

  it("refuses another site, another port, an opaque 'null' origin and garbage", () => {
    for (const origin of ["https://evil.example", "http://arcwright.example:3001", "http://arcwright.example", "null", "not a url"]) {
      for (const method of ["POST", "PATCH", "PUT", "DELETE"]) {
        expect(crossSiteRefusal({ method, host: "arcwright.example:3000", origin, secFetchSite: null }), `${method} from ${origin}`).toMatch(/must come from this site/);
      }
    }
  });

  it("refuses when the Host is missing but an Origin is present", () => {
    expect(post({ host: null, origin: "http://arcwright.example:3000" })).not.toBeNull();
  });

  it("without Origin, trusts Fetch Metadata: same-origin and user-typed pass, cross-site and same-site do not", () => {
    expect(post({ secFetchSite: "same-origin" })).toBeNull();
    expect(post({ secFetchSite: "none" })).toBeNull();
    expect(post({ secFetchSite: "cross-site" })).toMatch(/cross-site/);
    expect(post({ secFetchSite: "same-site" })).toMatch(/same-site/);
  });

  it("lets through a request with neither header (not sent by a browser page, so no ambient cookies by accident)", () => {
    expect(post({})).toBeNull();
  });
});

describe("crossSiteError on a fetch Request", () => {
  it("answers a foreign Origin with forbidden:origin and lets the app's own origin through", () => {
    const foreign = crossSiteError(new Request("http://arcwright.example/api/proposals", { method: "POST", headers: { origin: "https://elsewhere.example", host: "arcwright.example" } }));
    expect(foreign?.code).toBe("forbidden:origin");
    expect(crossSiteError(new Request("http://arcwright.example/api/proposals", { method: "POST", headers: { origin: "http://arcwright.example" } }))).toBeNull();
  });
});
