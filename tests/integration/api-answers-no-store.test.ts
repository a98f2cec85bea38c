import { afterAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { serverEnv } from "@/lib/env";
import type { Actor } from "@/lib/server/actor";
import { proposalCollectionRoutes } from "@/lib/server/api/proposal-routes";
import { handle } from "@/lib/server/http";
import { createWorld, proposalInput } from "./support/world";

afterAll(async () => {
  await dbClient().sql.end();
});

// RFC 9111 §5.2.2.5: no-store keeps an answer out of every cache, the browser's back/forward and
// disk caches included, where a member's data or a refusal naming their input would otherwise stay.
const proposals = (actor: Actor | null, init?: RequestInit) =>
  (init?.method === "POST" ? proposalCollectionRoutes(async () => actor).POST : proposalCollectionRoutes(async () => actor).GET)(
    new Request("http://127.0.0.1:1/api/proposals", init),
    { params: Promise.resolve({}) },
  );

const postProposal = (actor: Actor, headers: Record<string, string>) =>
  proposals(actor, { method: "POST", headers: { "content-type": "application/json", ...headers }, body: JSON.stringify({ ...proposalInput, title: "Origin check" }) });

describe("API answers are never stored by a cache (they had no Cache-Control)", () => {
  it("a JSON answer and an error answer carry Cache-Control: no-store", async () => {
    const world = await createWorld();
    const list = await proposals(world.actors.pi);
    expect(list.status).toBe(200);
    expect(list.headers.get("cache-control")).toBe("no-store");
    const signedOut = await proposals(null);
    expect(signedOut.status).toBe(401);
    expect(signedOut.headers.get("cache-control")).toBe("no-store");
  });

  it("a redirect (immutable headers) gets no-store too, and a handler's own Cache-Control is kept", async () => {
    const redirect = await handle(async () => Response.redirect("http://files.example/f/1", 302))();
    expect(redirect.status).toBe(302);
    expect(redirect.headers.get("location")).toBe("http://files.example/f/1");
    expect(redirect.headers.get("cache-control")).toBe("no-store");
    const own = await handle(async () => new Response("x", { headers: { "Cache-Control": "private, no-store" } }))();
    expect(own.headers.get("cache-control")).toBe("private, no-store");
  });
});

describe("writes must come from the configured origin (host-only check trusted X-Forwarded-Host)", () => {
  const appOrigin = new URL(serverEnv().NEXTAUTH_URL);
  const otherPort = new URL(appOrigin.href);
  otherPort.port = String(Number(appOrigin.port || 80) + 1);
  const otherScheme = new URL(appOrigin.href);
  otherScheme.protocol = appOrigin.protocol === "http:" ? "https:" : "http:";

  it("refuses another port, another scheme and a spoofed X-Forwarded-Host with 403 forbidden:origin", async () => {
    const world = await createWorld();
    for (const origin of [otherPort.origin, otherScheme.origin]) {
      const refused = await postProposal(world.actors.pi, { origin });
      expect(refused.status, origin).toBe(403);
      expect(((await refused.json()) as { error: { code: string } }).error.code).toBe("forbidden:origin");
    }
    const spoofed = await postProposal(world.actors.pi, { origin: "http://evil.example", host: "evil.example", "x-forwarded-host": "evil.example" });
    expect(spoofed.status).toBe(403);
    expect(spoofed.headers.get("cache-control")).toBe("no-store");
  });

  it("accepts the app's own origin, and a script that sends neither Origin nor Sec-Fetch-Site", async () => {
    const world = await createWorld();
    expect((await postProposal(world.actors.pi, { origin: appOrigin.origin })).status).toBe(201);
    expect((await postProposal(world.actors.pi, {})).status).toBe(201);
  });
});
