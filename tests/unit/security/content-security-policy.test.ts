import { describe, expect, it } from "vitest";
import { contentSecurityPolicy, originOf } from "@/lib/security/content-security-policy";

const base = { nonce: "bm9uY2U=", development: false, connectOrigins: [], imageOrigins: [], https: false };
const directives = (policy: string) => new Map(policy.split("; ").map((d) => [d.split(" ")[0], d.split(" ").slice(1)] as const));

// Directive names and keyword sources as defined by W3C Content Security Policy Level 3.
describe("the Content-Security-Policy", () => {
  it("allows scripts only with the nonce, and no eval in production", () => {
    const d = directives(contentSecurityPolicy(base));
    expect(d.get("script-src")).toEqual(["'self'", "'nonce-bm9uY2U='", "'strict-dynamic'"]);
    expect(d.get("script-src")).not.toContain("'unsafe-inline'");
    expect(d.get("script-src")).not.toContain("'unsafe-eval'");
  });

  it("forbids framing, plugins, base rewriting and foreign form targets", () => {
    const d = directives(contentSecurityPolicy(base));
    expect(d.get("frame-ancestors")).toEqual(["'none'"]);
    expect(d.get("object-src")).toEqual(["'none'"]);
    expect(d.get("base-uri")).toEqual(["'none'"]);
    expect(d.get("form-action")).toEqual(["'self'"]);
    expect(d.get("default-src")).toEqual(["'self'"]);
  });

  it("names the upload service's origins only where they are used", () => {
    const d = directives(contentSecurityPolicy({ ...base, connectOrigins: ["http://127.0.0.1:54331"], imageOrigins: ["http://localhost:54331"] }));
    expect(d.get("connect-src")).toEqual(["'self'", "http://127.0.0.1:54331"]);
    expect(d.get("img-src")).toContain("http://localhost:54331");
    expect(d.get("script-src")).not.toContain("http://127.0.0.1:54331");
  });

  it("adds eval and the reload socket for development only, and upgrades requests behind HTTPS", () => {
    const dev = directives(contentSecurityPolicy({ ...base, development: true }));
    expect(dev.get("script-src")).toContain("'unsafe-eval'");
    expect(dev.get("connect-src")).toContain("ws:");
    expect(directives(contentSecurityPolicy({ ...base, https: true })).has("upgrade-insecure-requests")).toBe(true);
    expect(directives(contentSecurityPolicy(base)).has("upgrade-insecure-requests")).toBe(false);
  });

  it("takes origins from absolute URLs and ignores unset or broken ones", () => {
    expect(originOf("http://127.0.0.1:54331/some/path")).toEqual(["http://127.0.0.1:54331"]);
    expect(originOf(undefined)).toEqual([]);
    expect(originOf("::")).toEqual([]);
  });
});
