import { invitationCollectionRoutes, invitationRoutes, memberCollectionRoutes, memberRoutes } from "@/lib/server/api/member-routes";
import { accountCollectionRoutes, accountRoutes, siteAccessRoutes } from "@/lib/server/api/admin-routes";
import { sessionRoutes } from "@/lib/server/api/account-routes";
import { activityRoutes, proposalCollectionRoutes, proposalRoutes } from "@/lib/server/api/proposal-routes";
import { noteCollectionRoutes, noteRoutes, targetCollectionRoutes, targetRoutes } from "@/lib/server/api/target-routes";
import { revisionCollectionRoutes, revisionUndoRoutes } from "@/lib/server/api/revision-routes";
import { skyFigureRoutes } from "@/lib/server/api/figure-routes";
import { calendarRoutes, targetTableExportRoutes, technicalSummaryRoutes } from "@/lib/server/api/export-routes";
import { attachmentCollectionRoutes, attachmentFileRoutes, attachmentRoutes, importCollectionRoutes, importPreviewRoutes } from "@/lib/server/api/upload-routes";
import { photometryCollectionRoutes, photometryFileRoutes, photometryPreviewRoutes } from "@/lib/server/api/photometry-routes";
import type { GetActor } from "@/lib/server/actor";
import { proposalInput, pointTargetInput, type World } from "./world";

/**
 * The authorization matrix: every route handler in app/api with the status each kind of caller gets.
 * tests/integration/authorization-matrix.test.ts calls every entry as every caller, and
 * tests/integration/authorization-completeness.test.ts fails when a route handler or server action in
 * app/ is in none of the lists here.
 */

export type Handler = (request: Request, context: { params: Promise<Record<string, string>> }) => Promise<Response>;

export interface Endpoint {
  /** "METHOD /short/path", the test's name. */
  name: string;
  /** The route's folder under app/, as Next names it: "/api/proposals/[proposalId]/targets". */
  route: string;
  handler: (getActor: GetActor) => Handler;
  path: (w: World) => string;
  params: (w: World) => Record<string, string>;
  body?: (w: World) => unknown;
  /** Expected status for [signed out, non-member, viewer, Co-I, PI]. */
  expected: [number, number, number, number, number];
  /**
   * Expected status for a site admin who is not a member of the proposal: they audit it with a
   * viewer's rights (reads 200, every change 403, invitations 403 like any non-PI) and alone may use
   * the admin endpoints.
   */
  siteAdmin: number;
}

export const proposalParams = (w: World) => ({ proposalId: w.proposalId });
const targetParams = (w: World) => ({ proposalId: w.proposalId, targetId: w.targetId });
const noteParams = (w: World) => ({ ...targetParams(w), noteId: w.noteId });
export const base = (w: World) => `http://arcwright.test/api/proposals/${w.proposalId}`;
const absentId = "00000000-0000-4000-8000-000000000000";
const as = <T extends Record<string, unknown>>(routes: (g: GetActor) => T, method: keyof T) => (g: GetActor) => routes(g)[method] as unknown as Handler;

export const endpoints: Endpoint[] = [
  { name: "GET /proposals", route: "/api/proposals", siteAdmin: 200, handler: as(proposalCollectionRoutes, "GET"), path: () => "http://arcwright.test/api/proposals", params: () => ({}), expected: [401, 200, 200, 200, 200] },
  { name: "POST /proposals", route: "/api/proposals", siteAdmin: 201, handler: as(proposalCollectionRoutes, "POST"), path: () => "http://arcwright.test/api/proposals", params: () => ({}), body: () => proposalInput, expected: [401, 201, 201, 201, 201] },
  { name: "GET /proposals/:id", route: "/api/proposals/[proposalId]", siteAdmin: 200, handler: as(proposalRoutes, "GET"), path: base, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  { name: "PATCH /proposals/:id", route: "/api/proposals/[proposalId]", siteAdmin: 403, handler: as(proposalRoutes, "PATCH"), path: base, params: proposalParams, body: () => ({ title: "Renamed" }), expected: [401, 404, 403, 403, 200] },
  { name: "DELETE /proposals/:id", route: "/api/proposals/[proposalId]", siteAdmin: 403, handler: as(proposalRoutes, "DELETE"), path: base, params: proposalParams, expected: [401, 404, 403, 403, 204] },
  { name: "GET /activity", route: "/api/proposals/[proposalId]/activity", siteAdmin: 200, handler: as(activityRoutes, "GET"), path: (w) => `${base(w)}/activity`, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  { name: "GET /members", route: "/api/proposals/[proposalId]/members", siteAdmin: 200, handler: as(memberCollectionRoutes, "GET"), path: (w) => `${base(w)}/members`, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  {
    name: "PATCH /members/:userId",
    route: "/api/proposals/[proposalId]/members/[userId]",
    siteAdmin: 403,
    handler: as(memberRoutes, "PATCH"),
    path: (w) => `${base(w)}/members/${w.actors.viewer.userId}`,
    params: (w) => ({ proposalId: w.proposalId, userId: w.actors.viewer.userId }),
    body: () => ({ role: "coi" }),
    expected: [401, 404, 403, 403, 200],
  },
  {
    name: "DELETE /members/:userId",
    route: "/api/proposals/[proposalId]/members/[userId]",
    siteAdmin: 403,
    handler: as(memberRoutes, "DELETE"),
    path: (w) => `${base(w)}/members/${w.actors.coi.userId}`,
    params: (w) => ({ proposalId: w.proposalId, userId: w.actors.coi.userId }),
    expected: [401, 404, 403, 403, 204],
  },
  { name: "GET /invitations", route: "/api/proposals/[proposalId]/invitations", siteAdmin: 403, handler: as(invitationCollectionRoutes, "GET"), path: (w) => `${base(w)}/invitations`, params: proposalParams, expected: [401, 404, 403, 403, 200] },
  {
    name: "POST /invitations",
    route: "/api/proposals/[proposalId]/invitations",
    siteAdmin: 403,
    handler: as(invitationCollectionRoutes, "POST"),
    path: (w) => `${base(w)}/invitations`,
    params: proposalParams,
    body: () => ({ email: `new-${Math.random().toString(36).slice(2)}@example.org`, role: "coi" }),
    expected: [401, 404, 403, 403, 201],
  },
  {
    name: "DELETE /invitations/:id",
    route: "/api/proposals/[proposalId]/invitations/[invitationId]",
    siteAdmin: 403,
    handler: as(invitationRoutes, "DELETE"),
    path: (w) => `${base(w)}/invitations/${w.invitationId}`,
    params: (w) => ({ proposalId: w.proposalId, invitationId: w.invitationId }),
    expected: [401, 404, 403, 403, 204],
  },
  { name: "GET /targets", route: "/api/proposals/[proposalId]/targets", siteAdmin: 200, handler: as(targetCollectionRoutes, "GET"), path: (w) => `${base(w)}/targets?sort=einsteinRadiusMas&direction=desc`, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  { name: "POST /targets", route: "/api/proposals/[proposalId]/targets", siteAdmin: 403, handler: as(targetCollectionRoutes, "POST"), path: (w) => `${base(w)}/targets`, params: proposalParams, body: () => ({ ...pointTargetInput, name: "TB-ML-0002" }), expected: [401, 404, 403, 201, 201] },
  { name: "GET /targets/:id", route: "/api/proposals/[proposalId]/targets/[targetId]", siteAdmin: 200, handler: as(targetRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}`, params: targetParams, expected: [401, 404, 200, 200, 200] },
  { name: "PATCH /targets/:id", route: "/api/proposals/[proposalId]/targets/[targetId]", siteAdmin: 403, handler: as(targetRoutes, "PATCH"), path: (w) => `${base(w)}/targets/${w.targetId}`, params: targetParams, body: () => ({ status: "accepted" }), expected: [401, 404, 403, 200, 200] },
  { name: "DELETE /targets/:id", route: "/api/proposals/[proposalId]/targets/[targetId]", siteAdmin: 403, handler: as(targetRoutes, "DELETE"), path: (w) => `${base(w)}/targets/${w.targetId}`, params: targetParams, expected: [401, 404, 403, 204, 204] },
  { name: "GET /notes", route: "/api/proposals/[proposalId]/targets/[targetId]/notes", siteAdmin: 200, handler: as(noteCollectionRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/notes`, params: targetParams, expected: [401, 404, 200, 200, 200] },
  { name: "POST /notes", route: "/api/proposals/[proposalId]/targets/[targetId]/notes", siteAdmin: 403, handler: as(noteCollectionRoutes, "POST"), path: (w) => `${base(w)}/targets/${w.targetId}/notes`, params: targetParams, body: () => ({ body: "Seeing 0.8″." }), expected: [401, 404, 403, 201, 201] },
  { name: "GET /notes/:id", route: "/api/proposals/[proposalId]/targets/[targetId]/notes/[noteId]", siteAdmin: 200, handler: as(noteRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}`, params: noteParams, expected: [401, 404, 200, 200, 200] },
  { name: "PATCH /notes/:id", route: "/api/proposals/[proposalId]/targets/[targetId]/notes/[noteId]", siteAdmin: 403, handler: as(noteRoutes, "PATCH"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}`, params: noteParams, body: () => ({ body: "Revised.", version: 1 }), expected: [401, 404, 403, 200, 200] },
  { name: "DELETE /notes/:id", route: "/api/proposals/[proposalId]/targets/[targetId]/notes/[noteId]", siteAdmin: 403, handler: as(noteRoutes, "DELETE"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}`, params: noteParams, expected: [401, 404, 403, 204, 204] },
  { name: "GET /targets/:id/revisions", route: "/api/proposals/[proposalId]/targets/[targetId]/revisions", siteAdmin: 200, handler: as(revisionCollectionRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/revisions`, params: targetParams, expected: [401, 404, 200, 200, 200] },
  {
    name: "POST /targets/:id/revisions",
    route: "/api/proposals/[proposalId]/targets/[targetId]/revisions",
    siteAdmin: 403,
    handler: as(revisionCollectionRoutes, "POST"),
    path: (w) => `${base(w)}/targets/${w.targetId}/revisions`,
    params: targetParams,
    body: () => ({
      t0JdUtc: 2463020.92,
      u0: 0.081,
      einsteinTimeDays: 27.6,
      rho: null,
      parallaxNorth: null,
      parallaxEast: null,
      sourceMagnitude: 19.4,
      blendFraction: 0.8,
      sourceBand: null,
      summary: { chi2: 410, dof: 402, pointCount: 412, referenceDataset: "Survey I", datasets: ["Survey I"], sigmas: { t0Days: 0.01, u0: 0.002, tEDays: 0.4 }, errorScales: { "Survey I": 1.1 } },
    }),
    expected: [401, 404, 403, 201, 201],
  },
  { name: "POST /revisions/:id/undo", route: "/api/proposals/[proposalId]/targets/[targetId]/revisions/[revisionId]/undo", siteAdmin: 403, handler: as(revisionUndoRoutes, "POST"), path: (w) => `${base(w)}/targets/${w.targetId}/revisions/${absentId}/undo`, params: (w) => ({ ...targetParams(w), revisionId: absentId }), expected: [401, 404, 403, 404, 404] },
  // The role check comes before the file is looked up, so editors reach "no such file" (a random id).
  { name: "POST /imports/preview", route: "/api/proposals/[proposalId]/imports/preview", siteAdmin: 403, handler: as(importPreviewRoutes, "POST"), path: (w) => `${base(w)}/imports/preview`, params: proposalParams, body: () => ({ fileId: absentId }), expected: [401, 404, 403, 404, 404] },
  { name: "POST /imports", route: "/api/proposals/[proposalId]/imports", siteAdmin: 403, handler: as(importCollectionRoutes, "POST"), path: (w) => `${base(w)}/imports`, params: proposalParams, body: () => ({ fileId: absentId, mapping: { name: { column: 0 }, ra: { column: 1 }, dec: { column: 2 } } }), expected: [401, 404, 403, 404, 404] },
  { name: "GET /notes/:id/attachments", route: "/api/proposals/[proposalId]/targets/[targetId]/notes/[noteId]/attachments", siteAdmin: 200, handler: as(attachmentCollectionRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}/attachments`, params: noteParams, expected: [401, 404, 200, 200, 200] },
  { name: "DELETE /attachments/:id", route: "/api/proposals/[proposalId]/targets/[targetId]/notes/[noteId]/attachments/[attachmentId]", siteAdmin: 403, handler: as(attachmentRoutes, "DELETE"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}/attachments/${absentId}`, params: (w) => ({ ...noteParams(w), attachmentId: absentId }), expected: [401, 404, 403, 404, 404] },
  { name: "GET /attachments/:id/file", route: "/api/proposals/[proposalId]/targets/[targetId]/notes/[noteId]/attachments/[attachmentId]/file", siteAdmin: 404, handler: as(attachmentFileRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/notes/${w.noteId}/attachments/${absentId}/file`, params: (w) => ({ ...noteParams(w), attachmentId: absentId }), expected: [401, 404, 404, 404, 404] },
  { name: "GET /targets/:id/photometry", route: "/api/proposals/[proposalId]/targets/[targetId]/photometry", siteAdmin: 200, handler: as(photometryCollectionRoutes, "GET"), path: (w) => `${base(w)}/targets/${w.targetId}/photometry`, params: targetParams, expected: [401, 404, 200, 200, 200] },
  {
    name: "POST /targets/:id/photometry",
    route: "/api/proposals/[proposalId]/targets/[targetId]/photometry",
    siteAdmin: 403,
    handler: as(photometryCollectionRoutes, "POST"),
    path: (w) => `${base(w)}/targets/${w.targetId}/photometry`,
    params: targetParams,
    body: () => ({ fileId: absentId, mapping: { timeColumn: 0, timeKind: "HJD", timeOffsetDays: 2450000, timeScale: "UTC", brightnessKind: "magnitude", valueColumn: 1, errorColumn: 2 } }),
    expected: [401, 404, 403, 404, 404],
  },
  { name: "POST /targets/:id/photometry/preview", route: "/api/proposals/[proposalId]/targets/[targetId]/photometry/preview", siteAdmin: 403, handler: as(photometryPreviewRoutes, "POST"), path: (w) => `${base(w)}/targets/${w.targetId}/photometry/preview`, params: targetParams, body: () => ({ fileId: absentId }), expected: [401, 404, 403, 404, 404] },
  { name: "DELETE /photometry/:id", route: "/api/proposals/[proposalId]/targets/[targetId]/photometry/[photometryId]", siteAdmin: 403, handler: as(photometryFileRoutes, "DELETE"), path: (w) => `${base(w)}/targets/${w.targetId}/photometry/${absentId}`, params: (w) => ({ ...targetParams(w), photometryId: absentId }), expected: [401, 404, 403, 404, 404] },
  { name: "GET /exports/targets", route: "/api/proposals/[proposalId]/exports/targets", siteAdmin: 200, handler: as(targetTableExportRoutes, "GET"), path: (w) => `${base(w)}/exports/targets?format=json&columns=name,einsteinRadiusMas`, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  { name: "GET /exports/figures/:figure", route: "/api/proposals/[proposalId]/exports/figures/[figure]", siteAdmin: 200, handler: as(skyFigureRoutes, "GET"), path: (w) => `${base(w)}/exports/figures/season?start=2031-03-01&nights=10&format=svg`, params: (w) => ({ proposalId: w.proposalId, figure: "season" }), expected: [401, 404, 200, 200, 200] },
  // A proposal without cycle dates has no schedule: members get the 400 that says so, after the role check.
  { name: "GET /exports/calendar", route: "/api/proposals/[proposalId]/exports/calendar", siteAdmin: 400, handler: as(calendarRoutes, "GET"), path: (w) => `${base(w)}/exports/calendar?targetId=${w.targetId}`, params: proposalParams, expected: [401, 404, 400, 400, 400] },
  { name: "GET /exports/summary", route: "/api/proposals/[proposalId]/exports/summary", siteAdmin: 200, handler: as(technicalSummaryRoutes, "GET"), path: (w) => `${base(w)}/exports/summary?columns=name,einsteinRadiusMas`, params: proposalParams, expected: [401, 404, 200, 200, 200] },
  // The site's own area: only a site admin lists accounts or changes a site role (see siteAdminExpected).
  { name: "GET /admin/accounts", route: "/api/admin/accounts", siteAdmin: 200, handler: as(accountCollectionRoutes, "GET"), path: () => "http://arcwright.test/api/admin/accounts?pageSize=5", params: () => ({}), expected: [401, 403, 403, 403, 403] },
  {
    name: "PATCH /admin/accounts/:userId",
    route: "/api/admin/accounts/[userId]",
    siteAdmin: 200,
    handler: as(accountRoutes, "PATCH"),
    path: (w) => `http://arcwright.test/api/admin/accounts/${w.actors.viewer.userId}`,
    params: (w) => ({ userId: w.actors.viewer.userId }),
    body: () => ({ siteRole: "member" }),
    expected: [401, 403, 403, 403, 403],
  },
  { name: "GET /admin/access", route: "/api/admin/access", siteAdmin: 200, handler: as(siteAccessRoutes, "GET"), path: () => "http://arcwright.test/api/admin/access", params: () => ({}), expected: [200, 200, 200, 200, 200] },
  // "Sign out everywhere": anyone signed in ends their own sessions, and only their own.
  { name: "DELETE /account/sessions", route: "/api/account/sessions", siteAdmin: 204, handler: as(sessionRoutes, "DELETE"), path: () => "http://arcwright.test/api/account/sessions", params: () => ({}), expected: [401, 204, 204, 204, 204] },
];

/** The method and route of a handler in app/api. */
export interface RouteMethod {
  method: string;
  route: string;
}

/**
 * Handlers whose role rules need more than one call and are checked by their own test, which is
 * named here; each checks every caller kind of the matrix.
 */
export const checkedByOwnTest: (RouteMethod & { test: string })[] = [
  { method: "POST", route: "/api/invitations/accept", test: "authorization-matrix.test.ts: POST /invitations/accept" },
  { method: "POST", route: "/api/uploadthing", test: "authorization-matrix.test.ts: POST /api/uploadthing (the upload middleware)" },
];

/**
 * Handlers open to everyone by design; none of them reads the session or any proposal's data.
 * `why` is the design reason; `sessionOnlyFor` names the one request that reads the session to
 * raise a limit, every other request being answered alike for every caller.
 */
export const openRoutes: (RouteMethod & { why: string; sessionOnlyFor?: string })[] = [
  { method: "GET", route: "/favicon.ico", why: "browsers ask for it unprompted; it only redirects to the app icon" },
  { method: "GET", route: "/api/health", why: "liveness and database reachability, for monitoring" },
  { method: "GET", route: "/api/references", why: "the BibTeX of the product's references: public knowledge, read from the code's registry" },
  { method: "GET", route: "/api/bench/exports/[figure]", why: "the lens bench is open without signing in, so are its figures", sessionOnlyFor: "a PNG wider than 2000 px (exports-figures.test.ts)" },
  { method: "POST", route: "/api/account/sign-up", why: "creating an account comes before having a session" },
  { method: "POST", route: "/api/account/sign-in-link", why: "asking for a sign-in link comes before having a session" },
  { method: "POST", route: "/api/account/reset-request", why: "asking for a reset link comes before having a session" },
  { method: "POST", route: "/api/account/reset", why: "the e-mailed single-use token is the credential" },
  { method: "GET", route: "/api/auth/[...nextauth]", why: "next-auth's own sign-in, session and CSRF endpoints" },
  { method: "POST", route: "/api/auth/[...nextauth]", why: "next-auth's own sign-in and sign-out (CSRF token checked by next-auth)" },
  { method: "GET", route: "/api/uploadthing", why: "the upload SDK's route configuration (no data); uploads themselves are POST" },
];

/** Server actions ("use server" functions) with the test that checks their role rules. The product has none. */
export const serverActions: { file: string; action: string; test: string }[] = [];
