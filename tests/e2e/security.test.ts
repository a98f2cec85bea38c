import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import type { Browser, Page } from "playwright-core";
import { demoSketch, sketchToQueryString } from "@/lib/bench/sketch-state";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { baseUrl, launchBrowser, newPage } from "./support/browser";
import { demoProposalTitle, signInAsDemo } from "./support/demo";

let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
});

const proposalBody = (title: string) => ({
  title,
  cycle: "2033A",
  site: { name: "Mesa Lucerna Station", latitudeDeg: -31.27, longitudeDeg: -68.93, elevationM: 2480, horizonLimitDeg: 20 },
  instrument: { resolutionMas: 50, cadenceHours: 12, campaignLengthDays: 90 },
});

/** Records every CSP violation the page reports (W3C CSP3 `securitypolicyviolation` event). */
async function watchViolations(page: Page): Promise<() => Promise<string[]>> {
  await page.addInitScript(() => {
    const seen: string[] = [];
    (window as unknown as { __violations: string[] }).__violations = seen;
    document.addEventListener("securitypolicyviolation", (event) => seen.push(`${event.violatedDirective} ${event.blockedURI} at ${event.sourceFile}:${event.lineNumber}:${event.columnNumber}`));
  });
  return () => page.evaluate(() => (window as unknown as { __violations: string[] }).__violations);
}

describe("security headers (OWASP HTTP Headers Cheat Sheet; W3C CSP3)", () => {
  it("serves every page with a nonce policy, the nonce on each of its scripts, and a new nonce per response", async () => {
    const nonces = new Set<string>();
    for (const path of ["/", "/bench", "/sign-in", "/references"]) {
      const response = await fetch(`${baseUrl}${path}`);
      expect(response.status).toBe(200);
      const policy = response.headers.get("content-security-policy") ?? "";
      const nonce = /'nonce-([A-Za-z0-9+/=]+)'/.exec(policy)?.[1];
      expect(nonce, policy).toBeDefined();
      nonces.add(nonce!);
      expect(policy).toContain("frame-ancestors 'none'");
      expect(policy).toContain("object-src 'none'");
      expect(policy).not.toMatch(/script-src[^;]*'unsafe-inline'/);
      expect(policy).not.toMatch(/script-src[^;]*'unsafe-eval'/);
      // The upload service is reachable from the browser, because uploads go straight to it.
      expect(policy).toMatch(new RegExp(`connect-src 'self' ${process.env.UPLOADTHING_INGEST_URL ? new URL(process.env.UPLOADTHING_INGEST_URL).origin : ""}`));
      const html = await response.text();
      const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
      expect(scripts.length).toBeGreaterThan(0);
      for (const tag of scripts) expect(tag, tag).toContain(`nonce="${nonce}"`);

      expect(response.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
      expect(response.headers.get("x-content-type-options")).toBe("nosniff");
      expect(response.headers.get("x-frame-options")).toBe("DENY");
    }
    expect(nonces.size).toBe(4);
    const api = await fetch(`${baseUrl}/api/health`);
    expect(api.headers.get("x-content-type-options")).toBe("nosniff");
    expect(api.headers.get("referrer-policy")).toBe("strict-origin-when-cross-origin");
  });

  it("API answers, refusals included, reach the browser with Cache-Control: no-store (RFC 9111 §5.2.2.5)", async () => {
    const health = await fetch(`${baseUrl}/api/health`);
    expect(health.status).toBe(200);
    expect(health.headers.get("cache-control")).toBe("no-store");
    const signedOut = await fetch(`${baseUrl}/api/proposals`);
    expect(signedOut.status).toBe(401);
    expect(signedOut.headers.get("cache-control")).toBe("no-store");
    const bench = await fetch(`${baseUrl}/api/bench/exports/deflection?format=svg`);
    expect(bench.status).toBe(200);
    expect(bench.headers.get("cache-control")).toBe("private, no-store");
  });

  it("the product works under its policy: no violation on the pages a team uses, the 3D view and an upload page included", async () => {
    const { page, context, consoleErrors } = await newPage(browser);
    const violations = await watchViolations(page);
    await signInAsDemo(page, "pi");
    await page.getByRole("link", { name: demoProposalTitle }).click();
    await page.getByTestId("target-row").first().waitFor();
    const proposalPath = new URL(page.url()).pathname;
    await page.getByTestId("target-row").first().getByRole("link").first().click();
    await page.waitForURL("**/targets/**");
    await page.getByRole("heading", { level: 1 }).waitFor();
    await page.goto(`${proposalPath}/sky`);
    await page.getByRole("heading", { level: 1 }).waitFor();
    await page.goto(`${proposalPath}/import`);
    await page.getByRole("heading", { level: 1 }).waitFor();
    await page.goto("/references");
    await page.getByRole("heading", { level: 1 }).waitFor();
    // A bench link traces its bundle on arrival, in workers, and draws it with WebGL.
    await page.goto(`/bench?${sketchToQueryString({ ...demoSketch, rays: "300" })}`);
    await page.waitForFunction(() => Number(document.querySelector('[data-testid="fate-count-escaped"]')?.textContent) > 0);
    expect(await violations()).toEqual([]);
    await context.close();
    expect(consoleErrors.filter((e) => /Content Security Policy|Refused to/.test(e))).toEqual([]);
  });

  it("sets the session cookie httpOnly and SameSite=Lax (Secure only behind HTTPS)", async () => {
    const { page, context } = await newPage(browser);
    await signInAsDemo(page, "viewer");
    const cookies = await context.cookies();
    const session = cookies.find((c) => c.name.endsWith("next-auth.session-token"));
    expect(session, cookies.map((c) => c.name).join(", ")).toBeDefined();
    expect(session!.httpOnly).toBe(true);
    expect(session!.sameSite).toBe("Lax");
    expect(session!.secure).toBe(baseUrl.startsWith("https://"));
    const csrf = cookies.find((c) => c.name.endsWith("next-auth.csrf-token"));
    expect(csrf?.httpOnly).toBe(true);
    await context.close();
  });
});

describe("cross-origin requests that change data (OWASP CSRF Prevention Cheat Sheet)", () => {
  let attacker: Server;
  let attackerUrl: string;

  beforeAll(async () => {
    // Another origin on loopback. Ports do not make sites (RFC 6265bis "same-site"), so SameSite
    // cookies alone would not stop this page: the origin check has to.
    attacker = createServer((_request, response) => {
      response.setHeader("content-type", "text/html");
      response.end(`<!doctype html><title>elsewhere</title><script>
        const body = ${JSON.stringify(JSON.stringify(proposalBody("Planted by another site")))};
        window.done = Promise.allSettled([
          fetch(${JSON.stringify(`${baseUrl}/api/proposals`)}, { method: "POST", mode: "no-cors", credentials: "include", headers: { "content-type": "text/plain" }, body }),
          fetch(${JSON.stringify(`${baseUrl}/api/proposals`)}, { method: "POST", credentials: "include", headers: { "content-type": "application/json" }, body }),
        ]).then(() => "sent");
      </script>`);
    });
    await new Promise<void>((resolve) => attacker.listen(0, "127.0.0.1", resolve));
    attackerUrl = `http://127.0.0.1:${(attacker.address() as AddressInfo).port}/`;
  });

  afterAll(async () => {
    await new Promise((resolve) => attacker.close(resolve));
  });

  it("a signed-in member who visits another site does not create, change or delete anything", async () => {
    const { page, context } = await newPage(browser);
    await signInAsDemo(page, "pi");
    const refused: number[] = [];
    page.on("response", (response) => {
      if (response.url().startsWith(`${baseUrl}/api/`)) refused.push(response.status());
    });
    await page.goto(attackerUrl);
    await expect(page.evaluate(() => (window as unknown as { done: Promise<string> }).done)).resolves.toBe("sent");
    const list = await context.request.get(`${baseUrl}/api/proposals`);
    const { proposals } = (await list.json()) as { proposals: { title: string }[] };
    expect(proposals.map((p) => p.title)).not.toContain("Planted by another site");
    await context.close();
  });

  it("answers a foreign Origin with 403 in the error shape, and the same request from the app's own origin succeeds", async () => {
    const { page, context } = await newPage(browser);
    await signInAsDemo(page, "pi");
    const foreign = await context.request.post(`${baseUrl}/api/proposals`, {
      data: proposalBody("Foreign origin"),
      headers: { origin: "https://elsewhere.example" },
    });
    expect(foreign.status()).toBe(403);
    expect((await foreign.json()).error.code).toBe("forbidden:origin");
    const crossSite = await context.request.delete(`${baseUrl}/api/proposals/00000000-0000-4000-8000-000000000000`, {
      headers: { "sec-fetch-site": "cross-site" },
    });
    expect(crossSite.status()).toBe(403);

    // From the page itself (the browser sets Origin): accepted.
    const created = await page.evaluate(async (body) => {
      const response = await fetch("/api/proposals", { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) });
      return { status: response.status, id: ((await response.json()) as { proposal?: { id: string } }).proposal?.id };
    }, proposalBody("Same-origin check"));
    expect(created.status).toBe(201);
    const removed = await page.evaluate(async (id) => (await fetch(`/api/proposals/${id}`, { method: "DELETE" })).status, created.id!);
    expect(removed).toBe(204);
    await context.close();
  });

  it("refuses another port or scheme of the same host, and a foreign Origin however X-Forwarded-Host is set (the check compared hosts and believed that header)", async () => {
    const { page, context } = await newPage(browser);
    await signInAsDemo(page, "pi");
    const app = new URL(baseUrl);
    const sameHost = (change: (url: URL) => void) => {
      const url = new URL(app.href);
      change(url);
      return url.origin;
    };
    const origins = [
      attackerUrl.replace(/\/$/, ""),
      sameHost((url) => (url.protocol = app.protocol === "http:" ? "https:" : "http:")),
    ];
    for (const origin of origins) {
      const refused = await context.request.post(`${baseUrl}/api/proposals`, { data: proposalBody(`From ${origin}`), headers: { origin } });
      expect(refused.status(), origin).toBe(403);
      expect((await refused.json()).error.code).toBe("forbidden:origin");
    }
    const spoofed = await context.request.post(`${baseUrl}/api/proposals`, {
      data: proposalBody("Spoofed forwarded host"),
      headers: { origin: "http://evil.example", "x-forwarded-host": "evil.example", "x-forwarded-proto": "http" },
    });
    expect(spoofed.status()).toBe(403);
    const list = await context.request.get(`${baseUrl}/api/proposals`);
    const titles = ((await list.json()) as { proposals: { title: string }[] }).proposals.map((p) => p.title);
    expect(titles.filter((title) => title.startsWith("From ") || title === "Spoofed forwarded host")).toEqual([]);
    await context.close();
  });
});
