import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { dbClient } from "@/db/client";
import { acceptInvitationRoutes } from "@/lib/server/api/member-routes";
import { proposalRoutes } from "@/lib/server/api/proposal-routes";
import { targetCollectionRoutes } from "@/lib/server/api/target-routes";
import type { Actor } from "@/lib/server/actor";
import { base, endpoints, proposalParams, type Endpoint } from "./support/authorization-table";
import { startMailCatcher } from "./support/mail-catcher";
import { startUploadService, type UploadService } from "./support/upload-service";
import { actorFor, callers, createUser, createWorld, pointTargetInput, type Caller, type World } from "./support/world";

const methodOf = (name: string) => name.split(" ")[0];

async function call(endpoint: Endpoint, world: World, caller: Caller): Promise<{ status: number; body: unknown }> {
  return callAs(endpoint, world, actorFor(world, caller));
}

async function callAs(endpoint: Endpoint, world: World, actor: Actor | null): Promise<{ status: number; body: unknown }> {
  const body = endpoint.body?.(world);
  const request = new Request(endpoint.path(world), {
    method: methodOf(endpoint.name),
    ...(body === undefined ? {} : { body: JSON.stringify(body), headers: { "content-type": "application/json" } }),
  });
  const response = await endpoint.handler(async () => actor)(request, { params: Promise.resolve(endpoint.params(world)) });
  const isJson = response.headers.get("content-type")?.includes("application/json");
  return { status: response.status, body: isJson ? await response.json() : null };
}

let mail: Awaited<ReturnType<typeof startMailCatcher>>;
let uploads: UploadService;

beforeAll(async () => {
  mail = await startMailCatcher();
  uploads = await startUploadService();
});

afterAll(async () => {
  await uploads.stop();
  await mail.stop();
  await dbClient().sql.end();
});

const expectErrorCode = (status: number, body: unknown) => {
  if (status < 400) return;
  const code = (body as { error: { code: string } }).error.code;
  expect(code).toMatch({ 401: /^unauthorized:/, 403: /^forbidden:/, 404: /^not_found:/ }[status as 401 | 403 | 404]);
};

describe("authorization matrix: the site-admin column (a site admin who is not on the proposal)", () => {
  for (const endpoint of endpoints) {
    const expected = endpoint.siteAdmin;
    it(`${endpoint.name} as site admin → ${expected}`, async () => {
      const world = await createWorld();
      const admin = await createUser("site-admin", "admin");
      const { status, body } = await callAs(endpoint, world, admin);
      expect(status, JSON.stringify(body)).toBe(expected);
      expectErrorCode(status, body);
    });
  }
});

describe("authorization matrix: every endpoint × {signed out, non-member, viewer, Co-I, PI}", () => {
  for (const endpoint of endpoints) {
    callers.forEach((caller, index) => {
      const expected = endpoint.expected[index];
      it(`${endpoint.name} as ${caller} → ${expected}`, async () => {
        const world = await createWorld();
        const { status, body } = await call(endpoint, world, caller);
        expect(status, JSON.stringify(body)).toBe(expected);
        if (status >= 400) {
          const code = (body as { error: { code: string } }).error.code;
          expect(code).toMatch({ 401: /^unauthorized:/, 403: /^forbidden:/, 404: /^not_found:/ }[status as 401 | 403 | 404]);
        }
      });
    });
  }

  it("POST /invitations/accept: signed out 401, another address 403, the invited address joins with the role", async () => {
    const world = await createWorld();
    const invite = endpoints.find((e) => e.name === "POST /invitations")!;
    const email = `colleague-${Date.now()}@example.org`;
    const created = await invite.handler(async () => world.actors.pi)(
      new Request(invite.path(world), { method: "POST", body: JSON.stringify({ email, role: "viewer" }) }),
      { params: Promise.resolve(proposalParams(world)) },
    );
    expect(created.status).toBe(201);
    const sent = mail.messages.find((m) => m.to.includes(email));
    const token = /invitations\/([A-Za-z0-9_-]{43})/.exec(sent?.text ?? "")?.[1];
    expect(token).toBeDefined();

    const accept = (actor: World["actors"]["pi"] | null) =>
      acceptInvitationRoutes(async () => actor).POST(
        new Request("http://arcwright.test/api/invitations/accept", { method: "POST", body: JSON.stringify({ token }) }),
        { params: Promise.resolve({}) },
      );
    expect((await accept(null)).status).toBe(401);
    expect((await accept(world.actors.outsider)).status).toBe(403);
    const invitee = { ...world.actors.outsider, email };
    const accepted = await accept(invitee);
    expect(accepted.status).toBe(200);
    expect(await accepted.json()).toEqual({ proposalId: world.proposalId, role: "viewer" });
    expect((await accept(invitee)).status).toBe(400);
  });

  it("a malformed id answers 404 like a missing one, and bad input names its fields", async () => {
    const world = await createWorld();
    const get = proposalRoutes(async () => world.actors.pi).GET;
    const notUuid = await get(new Request("http://arcwright.test/api/proposals/nope"), { params: Promise.resolve({ proposalId: "nope" }) });
    expect(notUuid.status).toBe(404);
    const post = targetCollectionRoutes(async () => world.actors.pi).POST;
    const bad = await post(
      new Request(`${base(world)}/targets`, { method: "POST", body: JSON.stringify({ ...pointTargetInput, dec: "-95 00 00", lensMassSolar: null }) }),
      { params: Promise.resolve(proposalParams(world)) },
    );
    expect(bad.status).toBe(400);
    const { error } = (await bad.json()) as { error: { code: string; fields: Record<string, string[]> } };
    expect(error.code).toBe("bad_request:target");
    expect(Object.keys(error.fields)).toContain("dec");
  });
});

describe("authorization matrix: POST /api/uploadthing (the upload middleware), every caller", () => {
  const file = { name: "list.csv", bytes: new TextEncoder().encode("name,ra,dec\nTB-ML-0009,17 57 12.4,-29 12 05\n"), type: "text/csv" };
  // [signed out, non-member, viewer, Co-I, PI, site admin]: a refusal answers at the presign step with
  // its status; an editor's file is stored.
  const expected: (number | "stored")[] = [401, 404, 403, "stored", "stored", 403];
  for (const slug of ["targetList", "noteAttachment", "eventPhotometry"] as const) {
    it(`${slug}: ${expected.join(", ")}`, async () => {
      const world = await createWorld();
      const admin = await createUser("site-admin", "admin");
      const inputs = {
        targetList: { proposalId: world.proposalId },
        noteAttachment: { proposalId: world.proposalId, targetId: world.targetId, noteId: world.noteId },
        eventPhotometry: { proposalId: world.proposalId, targetId: world.targetId },
      };
      const input: Record<string, string> = inputs[slug];
      const actors = [...callers.map((c) => actorFor(world, c)), admin];
      const outcomes = [];
      for (const actor of actors) {
        const attempt = await uploads.uploadAs(actor, slug, input, file);
        outcomes.push(attempt.stage === "stored" ? "stored" : attempt.status);
      }
      expect(outcomes).toEqual(expected);
    });
  }
});
