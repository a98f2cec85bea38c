import { eq, inArray } from "drizzle-orm";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { activity, imports, invitations, noteAttachments, noteRevisions, notes, proposalMembers, proposals, targets, uploadedFiles } from "@/db/schema";
import { demoSketch } from "@/lib/bench/sketch-state";
import { benchFigureKinds } from "@/lib/exports/figures/bench-figures";
import { skyFigureKinds } from "@/lib/exports/figures/sky-figures";
import { benchFigureRoutes, skyFigureRoutes } from "@/lib/server/api/figure-routes";
import { socketAddressHeader } from "@/lib/security/client-address";
import { accountRoutes as publicAccountRoutes } from "@/lib/server/api/account-routes";
import { acceptInvitationRoutes } from "@/lib/server/api/member-routes";
import type { Actor, GetActor } from "@/lib/server/actor";
import { endpoints as matrixEndpoints, type Handler } from "./authorization-table";
import { absentUuid, answerOf, expectDocumentedAnswer, jsonText, type Answer, type AnswerRules } from "./hostile-input";
import { startUploadService, type UploadService } from "./upload-service";
import { createUser, createWorld, pointTargetInput, proposalInput, type World } from "./world";

/** A world for the hostile-input properties: the matrix's, plus a site admin and an uploaded target list. */
export interface HostileWorld extends World {
  admin: Actor;
  fileId: string;
}

const targetListCsv = ["name,ra,dec,mass [Msun],D_L [pc],D_S [pc],mu [mas/yr]", "HOS-0001,17:56:40.0,-29:30:00,0.5,4000,8000,5", "HOS-0002,17:58:01.0,-29:20:00,0.3,3000,8000,4"].join("\n");

export async function createHostileWorld(uploads: UploadService): Promise<HostileWorld> {
  const [world, admin] = await Promise.all([createWorld(), createUser("site-admin", "admin")]);
  const file = { name: "hostile-list.csv", bytes: new TextEncoder().encode(targetListCsv), type: "text/csv" };
  const attempt = await uploads.uploadAs(world.actors.coi, "targetList", { proposalId: world.proposalId }, file);
  if (attempt.stage !== "stored" || !attempt.serverData.ok) throw new Error(`upload refused: ${JSON.stringify(attempt)}`);
  return { ...world, admin, fileId: attempt.serverData.fileId };
}

export type HostileCaller = "signedOut" | "pi" | "admin";

export const actorOfCaller = (w: HostileWorld, caller: HostileCaller): Actor | null => (caller === "signedOut" ? null : caller === "pi" ? w.actors.pi : w.admin);

export interface HostileEndpoint {
  /** "METHOD /short/path", as in the authorization matrix. */
  name: string;
  method: string;
  /** The route's folder under app/, as Next names it: "/api/proposals/[proposalId]/targets". */
  route: string;
  handler: (getActor: GetActor) => Handler;
  params: (w: HostileWorld) => Record<string, string>;
  /** Route params that are not ids, with the values they take (every other param is a UUID). */
  paramChoices?: Record<string, readonly string[]>;
  /** A body the endpoint accepts; the properties bend its keys and values. */
  body?: (w: HostileWorld) => Record<string, unknown>;
  /** Every query key the endpoint reads, with a value it accepts. */
  query?: (w: HostileWorld) => Record<string, string>;
  /** Whose session the properties send: signed out always, the PI so validation is reached. */
  callers: HostileCaller[];
  /** Whether a refusal could have written to the world's proposal (POST, PATCH, DELETE on it). */
  isWrite: boolean;
  /** The refusal the templates get when they cannot be accepted as they stand (a token nobody was sent). */
  templateRefusal?: string;
}

/** The caller whose request with the templates should be accepted: the site admin on the admin routes, else the PI. */
export const mostPrivilegedCaller = (endpoint: HostileEndpoint): HostileCaller => (endpoint.callers.includes("admin") ? "admin" : endpoint.callers.includes("pi") ? "pi" : "signedOut");

const night = "2031-03-01";

/** A point-lens target with every field a target has, the unused ones null. */
export const everyTargetField = { ...pointTargetInput, velocityDispersionKmPerS: null, lensRedshift: null, sourceRedshift: null };

/** Bodies with every key the endpoint reads, where the matrix sends only one. */
const bodyTemplates: Record<string, (w: HostileWorld) => Record<string, unknown>> = {
  "POST /proposals": () => ({ ...proposalInput, cycleStartDate: "2031-02-01", cycleEndDate: "2031-07-31", instrument: { ...proposalInput.instrument, airmassLimit: 2, interferometerWavelengthMm: null, interferometerBaselineKm: null } }),
  "PATCH /proposals/:id": () => ({ ...proposalInput, cycleStartDate: "2031-02-01", cycleEndDate: "2031-07-31", instrument: { ...proposalInput.instrument, airmassLimit: 2, interferometerWavelengthMm: 1.3, interferometerBaselineKm: 10_000 } }),
  "POST /targets": () => ({ ...everyTargetField, name: "TB-ML-0002" }),
  "PATCH /targets/:id": () => ({ ...everyTargetField, status: "accepted" }),
  "POST /imports/preview": (w) => importOf(w),
  "POST /imports": (w) => importOf(w),
};

/** A preview or commit of the world's uploaded list (`targetListCsv`), every column mapped. */
function importOf(w: HostileWorld) {
  const mapping = {
    name: { column: 0 },
    ra: { column: 1 },
    dec: { column: 2 },
    lensMassSolar: { column: 3, unit: "Msun" },
    lensDistancePc: { column: 4, unit: "pc" },
    sourceDistancePc: { column: 5, unit: "pc" },
    properMotionMasPerYr: { column: 6, unit: "mas/yr", isUnitAssumed: false },
  };
  return { fileId: w.fileId, mapping, fill: { lensModel: "point", priority: 3, sourceOffsetThetaE: 0.3 }, toleranceArcsec: 1 };
}

/** Every query key each reading endpoint takes (from its query schema), with a value it accepts. */
const queryTemplates: Record<string, (w: HostileWorld) => Record<string, string>> = {
  "GET /targets": () => ({ page: "1", pageSize: "50", sort: "einsteinRadiusMas", direction: "desc", q: "TB", status: "candidate", lensModel: "point", tag: "bulge", caseVerdict: "feasible", answeredCase: "photometric-microlensing" }),
  "GET /activity": () => ({ limit: "30", before: "1000000" }),
  "GET /admin/accounts": () => ({ q: "pi", page: "1", pageSize: "5" }),
  "GET /exports/targets": () => ({ format: "json", columns: "name,einsteinRadiusMas,raDeg", digits: "raDeg:6,3" }),
  "GET /exports/figures/:figure": () => ({ format: "svg", width: "800", dpi: "150", start: night, nights: "10" }),
  "GET /exports/summary": (w) => ({ figures: "season,night", nightTargets: w.targetId, night, columns: "name,einsteinRadiusMas", digits: "3" }),
};

const queryOfUrl = (url: string) => Object.fromEntries(new URL(url).searchParams);

/** The matrix's endpoints, with their bodies and query strings filled out to every key they read. */
const fromMatrix: HostileEndpoint[] = matrixEndpoints.map((e) => {
  const method = e.name.split(" ")[0];
  const body = bodyTemplates[e.name] ?? (e.body as HostileEndpoint["body"]);
  const query = queryTemplates[e.name] ?? ((w: HostileWorld) => queryOfUrl(e.path(w)));
  return {
    name: e.name,
    method,
    route: e.route,
    handler: e.handler,
    params: e.params,
    ...(e.name.startsWith("GET /exports/figures") ? { paramChoices: { figure: skyFigureKinds } } : {}),
    // The matrix names an absent attachment (tests/integration/attachments.test.ts uploads real ones).
    ...(e.route.includes("[attachmentId]") ? { templateRefusal: "not_found:attachment" } : {}),
    // The matrix names an absent revision (tests/integration/target-revisions.test.ts undoes real ones).
    ...(e.route.includes("[revisionId]") ? { templateRefusal: "not_found:revision" } : {}),
    // The matrix names an absent photometry upload and kept file (tests/integration/event-photometry.test.ts uploads real ones).
    ...(e.name.startsWith("POST /targets/:id/photometry") ? { templateRefusal: "not_found:file" } : {}),
    ...(e.route.includes("[photometryId]") ? { templateRefusal: "not_found:photometry" } : {}),
    // The world's proposal has no cycle dates, so no schedule to put in a calendar (exports-calendar.test.ts has one).
    ...(e.name === "GET /exports/calendar" ? { templateRefusal: "bad_request:calendar" } : {}),
    body,
    query,
    callers: e.route.startsWith("/api/admin") ? ["signedOut", "pi", "admin"] : ["signedOut", "pi"],
    isWrite: method !== "GET" && e.route.startsWith("/api/proposals/["),
  };
});

const signedOutOnly = (handler: Handler) => () => handler;
const strongPassword = "ochre-lantern-quasar-91";

/** The endpoints the matrix does not list: the account routes, accepting an invitation, the bench figures, the night chart. */
const beyondMatrix: HostileEndpoint[] = [
  { name: "POST /account/sign-up", method: "POST", route: "/api/account/sign-up", handler: signedOutOnly(publicAccountRoutes.signUp as Handler), params: () => ({}), body: () => ({ email: `hostile-${Date.now()}@example.org`, name: "Hostile Tester", password: strongPassword, callbackUrl: "/proposals" }), callers: ["signedOut"], isWrite: false },
  { name: "POST /account/reset-request", method: "POST", route: "/api/account/reset-request", handler: signedOutOnly(publicAccountRoutes.requestReset as Handler), params: () => ({}), body: (w) => ({ email: w.actors.pi.email }), callers: ["signedOut"], isWrite: false },
  { name: "POST /account/reset", method: "POST", route: "/api/account/reset", handler: signedOutOnly(publicAccountRoutes.reset as Handler), params: () => ({}), body: () => ({ token: "A".repeat(43), password: strongPassword }), callers: ["signedOut"], isWrite: false,
    templateRefusal: "bad_request:link" },
  { name: "POST /account/sign-in-link", method: "POST", route: "/api/account/sign-in-link", handler: signedOutOnly(publicAccountRoutes.requestLink as Handler), params: () => ({}), body: (w) => ({ email: w.actors.viewer.email }), callers: ["signedOut"], isWrite: false },
  { name: "POST /invitations/accept", method: "POST", route: "/api/invitations/accept", handler: (g) => acceptInvitationRoutes(g).POST as Handler, params: () => ({}), body: () => ({ token: "B".repeat(43) }), callers: ["signedOut", "pi"], isWrite: false, templateRefusal: "bad_request:invitation" },
  {
    name: "GET /exports/figures/night",
    method: "GET",
    route: "/api/proposals/[proposalId]/exports/figures/[figure]",
    handler: (g) => skyFigureRoutes(g).GET as Handler,
    params: (w) => ({ proposalId: w.proposalId, figure: "night" }),
    paramChoices: { figure: skyFigureKinds },
    query: (w) => ({ format: "svg", width: "800", dpi: "150", targetId: w.targetId, date: night }),
    callers: ["signedOut", "pi"],
    isWrite: false,
  },
  {
    name: "GET /bench/exports/:figure",
    method: "GET",
    route: "/api/bench/exports/[figure]",
    handler: (g) => benchFigureRoutes(g).GET as Handler,
    params: () => ({ figure: "deflection" }),
    paramChoices: { figure: benchFigureKinds },
    query: () => ({ ...demoSketch, rays: "200", format: "svg", width: "800", dpi: "150" }),
    callers: ["signedOut"],
    isWrite: false,
  },
];

/** Every method of every handler factory app/api uses (next-auth's and the upload SDK's own routes aside). */
export const hostileEndpoints: HostileEndpoint[] = [...fromMatrix, ...beyondMatrix];

/**
 * The URL of `route` with `params` in its [segments], percent-encoded as a browser does: UTF-8, with
 * an unpaired surrogate written as U+FFFD (WHATWG URL Standard, "UTF-8 percent-encode").
 */
export function urlOf(route: string, params: Record<string, string>): string {
  const segment = (name: string) => encodeURIComponent(params[name].replace(/\p{Cs}/gu, "\ufffd"));
  return `http://arcwright.test${route.replace(/\[(\w+)\]/g, (_, name: string) => segment(name))}`;
}

/** The names a request to `endpoint` may carry: its body keys and its query keys. */
export function inputNamesOf(endpoint: HostileEndpoint, w: HostileWorld): string[] {
  return [...Object.keys(endpoint.body?.(w) ?? {}), ...Object.keys(endpoint.query?.(w) ?? {})];
}

/** What every answer of `endpoint` is checked against. */
export function answerRulesOf(endpoint: HostileEndpoint, w: HostileWorld): AnswerRules {
  return { inputNames: inputNamesOf(endpoint, w) };
}

let requestCount = 0;

/**
 * Calls `endpoint` as `actor` at the URL its route and `params` make, with `query` (no "?") and `body`
 * text; each request comes from its own client address, so no per-address rate limit is reached.
 */
export async function send(endpoint: HostileEndpoint, actor: Actor | null, parts: { params: Record<string, string>; query?: string; body?: string }): Promise<Response> {
  requestCount += 1;
  const url = `${urlOf(endpoint.route, parts.params)}${parts.query ? `?${parts.query}` : ""}`;
  const hasBody = parts.body !== undefined && endpoint.method !== "GET";
  const headers = { [socketAddressHeader]: `198.51.${Math.floor(requestCount / 250) % 250}.${requestCount % 250}`, ...(hasBody ? { "content-type": "application/json" } : {}) };
  const request = new Request(url, { method: endpoint.method, headers, ...(hasBody ? { body: parts.body } : {}) });
  return endpoint.handler(async () => actor)(request, { params: Promise.resolve(parts.params) });
}

/** The query string `endpoint` accepts, from its template. */
export const acceptedQueryOf = (endpoint: HostileEndpoint, w: HostileWorld) => new URLSearchParams(endpoint.query?.(w) ?? {}).toString();

/** The body text `endpoint` accepts, from its template; undefined when it reads none. */
export function acceptedBodyOf(endpoint: HostileEndpoint, w: HostileWorld): string | undefined {
  const template = endpoint.body?.(w);
  return template === undefined ? undefined : jsonText(template);
}

/**
 * Everything stored for the world's proposal (the row, members, invitations, targets, notes and their
 * revisions, activity, files, imports, attachments), to show that a refused request changed none of it.
 */
export async function proposalSnapshot(w: Pick<World, "proposalId">): Promise<string> {
  const { db } = dbClient();
  const id = w.proposalId;
  const targetRows = await db.select().from(targets).where(eq(targets.proposalId, id)).orderBy(targets.id);
  const noteRows = targetRows.length === 0 ? [] : await db.select().from(notes).where(inArray(notes.targetId, targetRows.map((t) => t.id))).orderBy(notes.id);
  const noteIds = noteRows.length === 0 ? [absentUuid] : noteRows.map((n) => n.id);
  const [proposal, members, invited, revisions, feed, files, imported, attachments] = await Promise.all([
    db.select().from(proposals).where(eq(proposals.id, id)),
    db.select().from(proposalMembers).where(eq(proposalMembers.proposalId, id)).orderBy(proposalMembers.userId),
    db.select().from(invitations).where(eq(invitations.proposalId, id)).orderBy(invitations.id),
    db.select().from(noteRevisions).where(inArray(noteRevisions.noteId, noteIds)).orderBy(noteRevisions.noteId, noteRevisions.version),
    db.select().from(activity).where(eq(activity.proposalId, id)).orderBy(activity.id),
    db.select().from(uploadedFiles).where(eq(uploadedFiles.proposalId, id)).orderBy(uploadedFiles.id),
    db.select().from(imports).where(eq(imports.proposalId, id)).orderBy(imports.id),
    db.select().from(noteAttachments).where(inArray(noteAttachments.noteId, noteIds)).orderBy(noteAttachments.id),
  ]);
  return JSON.stringify({ proposal, members, invited, targetRows, noteRows, revisions, feed, files, imported, attachments });
}

export interface RequestParts {
  params: Record<string, string>;
  query?: string;
  body?: string;
}

export interface EndpointProperty<T> {
  /** The endpoints it runs on (all by default). */
  only?: (endpoint: HostileEndpoint) => boolean;
  numRuns: (endpoint: HostileEndpoint, w: HostileWorld) => number;
  /** The hostile part of the request. */
  input: (endpoint: HostileEndpoint, w: HostileWorld) => fc.Arbitrary<T>;
  /** The whole request: the hostile part with the accepted rest. */
  parts: (endpoint: HostileEndpoint, w: HostileWorld, value: T) => RequestParts;
  /** What else this property expects of the answer. */
  expectAlso?: (answer: Answer, endpoint: HostileEndpoint, caller: HostileCaller, parts: RequestParts) => void;
  /** First check, on a fresh world, that the accepted templates are accepted. */
  checkTemplates?: boolean;
}

/**
 * One describe block per endpoint, each with its own world (its deletes and edits cannot disturb
 * another endpoint's runs), and one fast-check property per caller: the answer to every generated
 * request is in the documented shape (`expectDocumentedAnswer`), and as the PI a refused write leaves
 * everything stored for the proposal as it was.
 */
export function describeEveryEndpoint<T>(title: string, property: EndpointProperty<T>): void {
  describe(title, () => {
    let uploads: UploadService;
    beforeAll(async () => {
      uploads = await startUploadService();
    });
    afterAll(async () => {
      await uploads.stop();
    });

    for (const endpoint of hostileEndpoints.filter(property.only ?? (() => true))) {
      describe(endpoint.name, () => {
        let world: HostileWorld;
        beforeAll(async () => {
          world = await createHostileWorld(uploads);
        });

        if (property.checkTemplates) {
          it("accepts its templates (so the bent ones reach past the first check)", async () => {
            const answer = await answerOf(await send(endpoint, actorOfCaller(world, mostPrivilegedCaller(endpoint)), { params: endpoint.params(world), query: acceptedQueryOf(endpoint, world), body: acceptedBodyOf(endpoint, world) }));
            if (endpoint.templateRefusal) expect((answer.body as { error: { code: string } }).error.code).toBe(endpoint.templateRefusal);
            else expect(answer.status, JSON.stringify(answer.body)).toBeLessThan(300);
          });
        }

        for (const caller of endpoint.callers) {
          it(`as ${caller}`, async () => {
            const rules = answerRulesOf(endpoint, world);
            const check = fc.asyncProperty(property.input(endpoint, world), async (value) => {
              const before = caller === "pi" && endpoint.isWrite ? await proposalSnapshot(world) : undefined;
              const parts = property.parts(endpoint, world, value);
              const answer = await answerOf(await send(endpoint, actorOfCaller(world, caller), parts));
              expectDocumentedAnswer(answer, rules);
              property.expectAlso?.(answer, endpoint, caller, parts);
              if (before !== undefined && answer.status >= 400) expect(await proposalSnapshot(world), `${answer.status} changed stored data`).toBe(before);
            });
            await fc.assert(check, { numRuns: property.numRuns(endpoint, world) });
          });
        }
      });
    }
  });
}
