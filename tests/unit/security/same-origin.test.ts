import { describe, expect, it } from "vitest";
import { crossSiteError, crossSiteRefusal } from "@/lib/security/same-origin";

// Expected answers follow the OWASP CSRF Prevention Cheat Sheet (standard-header origin check and
// Fetch Metadata) and RFC 9110 §9.2.1 (safe methods change nothing).
const appOrigin = "http://arcwright.example:3000";
const post = (facts: Partial<Parameters<typeof crossSiteRefusal>[0]>) =>
  crossSiteRefusal({ method: "POST", appOrigin, origin: null, secFetchSite: null, ...facts });

describe("cross-site refusal of state-changing requests", () => {
  it("lets reads through whatever their origin", () => {
    for (const method of ["GET", "HEAD", "get"]) {
      expect(crossSiteRefusal({ method, appOrigin, origin: "https://evil.example", secFetchSite: "cross-site" })).toBeNull();
    }
  });

  it("refuses another origin's CORS preflight (the app grants no cross-origin access)", () => {
    expect(crossSiteRefusal({ method: "OPTIONS", appOrigin, origin: "https://evil.example", secFetchSite: "cross-site" })).not.toBeNull();
    expect(crossSiteRefusal({ method: "OPTIONS", appOrigin, origin: null, secFetchSite: null })).toBeNull();
  });

  it("accepts the configured origin, host compared without case and a default port as if written", () => {
    expect(post({ origin: "http://arcwright.example:3000" })).toBeNull();
    expect(post({ origin: "http://ARCWRIGHT.example:3000" })).toBeNull();
    expect(post({ appOrigin: "https://arcwright.example/", origin: "https://arcwright.example:443" })).toBeNull();
  });

  it("refuses another site, another port, another scheme, an opaque 'null' origin and garbage", () => {
    for (const origin of ["https://evil.example", "http://arcwright.example:3001", "http://arcwright.example", "https://arcwright.example:3000", "null", "not a url"]) {
      for (const method of ["POST", "PATCH", "PUT", "DELETE"]) {
        expect(crossSiteRefusal({ method, appOrigin, origin, secFetchSite: null }), `${method} from ${origin}`).toMatch(/must come from this site/);
      }
    }
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
    const foreign = crossSiteError(new Request("http://arcwright.example/api/proposals", { method: "POST", headers: { origin: "https://elsewhere.example", host: "arcwright.example" } }), "http://arcwright.example");
    expect(foreign?.code).toBe("forbidden:origin");
    expect(crossSiteError(new Request("http://arcwright.example/api/proposals", { method: "POST", headers: { origin: "http://arcwright.example" } }), "http://arcwright.example")).toBeNull();
  });

  it("refuses a foreign Origin that names itself in Host and X-Forwarded-Host (headers the client writes)", () => {
    const spoofed = new Request("http://arcwright.example:3000/api/proposals", {
      method: "POST",
      headers: { origin: "http://evil.example", host: "evil.example", "x-forwarded-host": "evil.example", "x-forwarded-proto": "http" },
    });
    expect(crossSiteError(spoofed, appOrigin)?.code).toBe("forbidden:origin");
  });

  it("compares with the configured origin (NEXTAUTH_URL), not the URL the request names", () => {
    const request = new Request("http://127.0.0.1:3000/api/proposals", { method: "POST", headers: { origin: "http://127.0.0.1:3000" } });
    expect(crossSiteError(request, "http://127.0.0.1:3000")).toBeNull();
    expect(crossSiteError(request, "https://arcwright.example")?.code).toBe("forbidden:origin");
  });
});
