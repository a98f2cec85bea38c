import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

vi.mock("server-only", () => ({}));

import { dbClient } from "@/db/client";
import type { GetActor } from "@/lib/server/actor";
import { acceptInvitationRoutes, invitationCollectionRoutes, invitationRoutes, memberCollectionRoutes, memberRoutes } from "@/lib/server/api/member-routes";
import { accountCollectionRoutes, accountRoutes, siteAccessRoutes } from "@/lib/server/api/admin-routes";
import { activityRoutes, proposalCollectionRoutes, proposalRoutes } from "@/lib/server/api/proposal-routes";
import { noteCollectionRoutes, noteRoutes, targetCollectionRoutes, targetRoutes } from "@/lib/server/api/target-routes";
import { targetTableExportRoutes } from "@/lib/exports/server/routes";
import { attachmentCollectionRoutes, attachmentFileRoutes, attachmentRoutes, importCollectionRoutes, importPreviewRoutes } from "@/lib/server/api/upload-routes";
import { startMailCatcher } from "./support/mail-catcher";
import { actorFor, callers, createUser, createWorld, pointTargetInput, proposalInput, type Caller, type World } from "./support/world";
import type { Actor } from "@/lib/server/actor";

type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

interface Endpoint {
  name: string;
  handler: (getActor: GetActor) => Handler;
  path: (w: World) => string;
  params: (w: World) => Record<string, string>;
  body?: (w: World) => unknown;
  /** Expected status for [signed out, non-member, viewer, Co-I, PI]. */
  expected: [number, number, number, number, number];
}

const proposalParams = (w: World) => ({ proposalId: w.proposalId });
const targetParams = (w: World) => ({ proposalId: w.proposalId, targetId: w.targetId });
const noteParams = (w: World) => ({ ...targetParams(w), noteId: w.noteId });
const base = (w: World) => `http://arcwright.test/api/proposals/${w.proposalId}`;
const absentId = "00000000-0000-4000-8000-000000000000";
const as = <T extends Record<string, unknown>>(routes: (g: GetActor) => T, method: keyof T) => (g: GetActor) => routes(g)[method] as unknown as Handler;

const endpoints: Endpoint[] = [
  { name: "GET /proposals", handler: as(proposalCollectionRoutes, "GET"), path: () => "http://arcwright.test/api/proposals", params: () => ({}), expected: [401, 200, 200, 200, 200] },
  { name: "POST /proposals", handler: as(proposalCollectionRoutes, "POST"), path: () => "http://arcwright.test/api/proposals", params: () => ({}), body: () => proposalInput, expected: [401, 201, 201, 201, 201] },
  { name: "GET /proposals/:id", handler: as(proposalRoutes, "GET"), path: base, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  { name: "PATCH /proposals/:id", handler: as(proposalRoutes, "PATCH"), path: base, params: proposalParams, body: () => ({ title: "Renamed" }), expected: [401, 404, 403, 403, 200] },
  { name: "DELETE /proposals/:id", handler: as(proposalRoutes, "DELETE"), path: base, params: proposalParams, expected: [401, 404, 403, 403, 204] },
  { name: "GET /activity", handler: as(activityRoutes, "GET"), path: (w) => `${base(w)}/activity`, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  { name: "GET /members", handler: as(memberCollectionRoutes, "GET"), path: (w) => `${base(w)}/members`, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  {
    name: "PATCH /members/:userId",
    handler: as(memberRoutes, "PATCH"),
    path: (w) => `${base(w)}/members/${w.actors.viewer.userId}`,
    params: (w) => ({ proposalId: w.proposalId, userId: w.actors.viewer.userId }),
    body: () => ({ role: "coi" }),
    expected: [401, 404, 403, 403, 200],
  },
  {
    name: "DELETE /members/:userId",
    handler: as(memberRoutes, "DELETE"),
    path: (w) => `${base(w)}/members/${w.actors.coi.userId}`,
    params: (w) => ({ proposalId: w.proposalId, userId: w.actors.coi.userId }),
    expected: [401, 404, 403, 403, 204],
  },
  { name: "GET /invitations", handler: as(invitationCollectionRoutes, "GET"), path: (w) => `${base(w)}/invitations`, params: proposalParams, expected: [401, 404, 403, 403, 200] },
  {
    name: "POST /invitations",
    handler: as(invitationCollectionRoutes, "POST"),
    path: (w) => `${base(w)}/invitations`,
    params: proposalParams,
    body: () => ({ email: `new-${Math.random().toString(36).slice(2)}@example.org`, role: "coi" }),
    expected: [401, 404, 403, 403, 201],
  },
  {
    name: "DELETE /invitations/:id",
    handler: as(invitationRoutes, "DELETE"),
    path: (w) => `${base(w)}/invitations/${w.invitationId}`,
    params: (w) => ({ proposalId: w.proposalId, invitationId: w.invitationId }),
    expected: [401, 404, 403, 403, 204],
  },
  { name: "GET /targets", handler: as(targetCollectionRoutes, "GET"), path: (w) => `${base(w)}/targets?sort=einsteinRadiusMas&direction=desc`, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  { name: "POST /targets", handler: as(targetCollectionRoutes, "POST"), path: (w) => `${base(w)}/targets`, params: proposalParams, body: () => ({ ...pointTargetInput, name: "TB-ML-0002" }), expected: [401, 404, 403, 201, 201] },
  { name: "GET /targets/:id", handler: as(targetRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}`, params: targetParams, expected: [401, 404, 200, 200, 200] },
  { name: "PATCH /targets/:id", handler: as(targetRoutes, "PATCH"), path: (w) => `${base(w)}/targets/${w.targetId}`, params: targetParams, body: () => ({ status: "accepted" }), expected: [401, 404, 403, 200, 200] },
  { name: "DELETE /targets/:id", handler: as(targetRoutes, "DELETE"), path: (w) => `${base(w)}/targets/${w.targetId}`, params: targetParams, expected: [401, 404, 403, 204, 204] },
  { name: "GET /notes", handler: as(noteCollectionRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/notes`, params: targetParams, expected: [401, 404, 200, 200, 200] },
  { name: "POST /notes", handler: as(noteCollectionRoutes, "POST"), path: (w) => `${base(w)}/targets/${w.targetId}/notes`, params: targetParams, body: () => ({ body: "Seeing 0.8″." }), expected: [401, 404, 403, 201, 201] },
  { name: "GET /notes/:id", handler: as(noteRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}`, params: noteParams, expected: [401, 404, 200, 200, 200] },
  { name: "PATCH /notes/:id", handler: as(noteRoutes, "PATCH"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}`, params: noteParams, body: () => ({ body: "Revised.", version: 1 }), expected: [401, 404, 403, 200, 200] },
  { name: "DELETE /notes/:id", handler: as(noteRoutes, "DELETE"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}`, params: noteParams, expected: [401, 404, 403, 204, 204] },
  // The role check comes before the file is looked up, so editors reach "no such file" (a random id).
  { name: "POST /imports/preview", handler: as(importPreviewRoutes, "POST"), path: (w) => `${base(w)}/imports/preview`, params: proposalParams, body: () => ({ fileId: absentId }), expected: [401, 404, 403, 404, 404] },
  { name: "POST /imports", handler: as(importCollectionRoutes, "POST"), path: (w) => `${base(w)}/imports`, params: proposalParams, body: () => ({ fileId: absentId, mapping: { name: { column: 0 }, ra: { column: 1 }, dec: { column: 2 } } }), expected: [401, 404, 403, 404, 404] },
  { name: "GET /notes/:id/attachments", handler: as(attachmentCollectionRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}/attachments`, params: noteParams, expected: [401, 404, 200, 200, 200] },
  { name: "DELETE /attachments/:id", handler: as(attachmentRoutes, "DELETE"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}/attachments/${absentId}`, params: (w) => ({ ...noteParams(w), attachmentId: absentId }), expected: [401, 404, 403, 404, 404] },
  { name: "GET /attachments/:id/file", handler: as(attachmentFileRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}/attachments/${absentId}/file`, params: (w) => ({ ...noteParams(w), attachmentId: absentId }), expected: [401, 404, 404, 404, 404] },
  { name: "GET /exports/targets", handler: as(targetTableExportRoutes, "GET"), path: (w) => `${base(w)}/exports/targets?format=json&columns=name,einsteinRadiusMas`, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  // The site's own area: only a site admin lists accounts or changes a site role (see siteAdminExpected).
  { name: "GET /admin/accounts", handler: as(accountCollectionRoutes, "GET"), path: () => "http://arcwright.test/api/admin/accounts?pageSize=5", params: () => ({}), expected: [401, 403, 403, 403, 403] },
  {
    name: "PATCH /admin/accounts/:userId",
    handler: as(accountRoutes, "PATCH"),
    path: (w) => `http://arcwright.test/api/admin/accounts/${w.actors.viewer.userId}`,
    params: (w) => ({ userId: w.actors.viewer.userId }),
    body: () => ({ siteRole: "member" }),
    expected: [401, 403, 403, 403, 403],
  },
  { name: "GET /admin/access", handler: as(siteAccessRoutes, "GET"), path: () => "http://arcwright.test/api/admin/access", params: () => ({}), expected: [200, 200, 200, 200, 200] },
];

/**
 * The site-admin column: a site admin who is not a member of the proposal audits it with a viewer's
 * rights (reads 200, every change 403, invitations 403 like any non-PI) and alone may use the admin
 * endpoints. Every endpoint needs an entry; a missing one fails its test.
 */
const siteAdminExpected: Record<string, number> = {
  "GET /proposals": 200,
  "POST /proposals": 201,
  "GET /proposals/:id": 200,
  "PATCH /proposals/:id": 403,
  "DELETE /proposals/:id": 403,
  "GET /activity": 200,
  "GET /members": 200,
  "PATCH /members/:userId": 403,
  "DELETE /members/:userId": 403,
  "GET /invitations": 403,
  "POST /invitations": 403,
  "DELETE /invitations/:id": 403,
  "GET /targets": 200,
  "POST /targets": 403,
  "GET /targets/:id": 200,
  "PATCH /targets/:id": 403,
  "DELETE /targets/:id": 403,
  "GET /notes": 200,
  "POST /notes": 403,
  "GET /notes/:id": 200,
  "PATCH /notes/:id": 403,
  "DELETE /notes/:id": 403,
  "POST /imports/preview": 403,
  "POST /imports": 403,
  "GET /notes/:id/attachments": 200,
  "DELETE /attachments/:id": 403,
  "GET /attachments/:id/file": 404,
  "GET /exports/targets": 200,
  "GET /admin/accounts": 200,
  "PATCH /admin/accounts/:userId": 200,
  "GET /admin/access": 200,
};

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
  return { status: response.status, body: response.status === 204 ? null : await response.json() };
}

let mail: Awaited<ReturnType<typeof startMailCatcher>>;

beforeAll(async () => {
  mail = await startMailCatcher();
});

afterAll(async () => {
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
    const expected = siteAdminExpected[endpoint.name];
    it(`${endpoint.name} as site admin → ${expected}`, async () => {
      expect(expected, `siteAdminExpected has no entry for ${endpoint.name}`).toBeDefined();
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
