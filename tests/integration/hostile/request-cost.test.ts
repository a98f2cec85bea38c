import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import type { Actor, GetActor } from "@/lib/server/actor";
import { MAX_BODY_BYTES } from "@/lib/server/api/endpoint";
import { proposalCollectionRoutes } from "@/lib/server/api/proposal-routes";
import { previewImport } from "@/lib/server/imports";
import { targetCollectionRoutes } from "@/lib/server/api/target-routes";
import { slowdown } from "../../support/timing";
import { endpoints, type Handler } from "../support/authorization-table";
import { startMailCatcher } from "../support/mail-catcher";
import { startUploadService, type UploadService } from "../support/upload-service";
import { createWorld, pointTargetInput, proposalInput, type World } from "../support/world";

/**
 * What one request may cost the server: a body's text runs through linear-time patterns only, a
 * signed-out caller's body is never read, and a body is read no further than its size limit.
 */

let uploads: UploadService;
let mail: Awaited<ReturnType<typeof startMailCatcher>>;

beforeAll(async () => {
  mail = await startMailCatcher();
  uploads = await startUploadService();
});

afterAll(async () => {
  await uploads.stop();
  await mail.stop();
  await dbClient().sql.end();
});

/** A body stream that counts the bytes the server pulled from it; `totalBytes` of JSON-ish text in 64 KB chunks. */
function countedBody(totalBytes: number) {
  const chunk = new TextEncoder().encode(" ".repeat(64 * 1024));
  const counter = { pulledBytes: 0 };
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (counter.pulledBytes >= totalBytes) return controller.close();
      counter.pulledBytes += chunk.byteLength;
      controller.enqueue(chunk);
    },
  });
  return { stream, counter };
}

async function send(handler: (getActor: GetActor) => Handler, actor: Actor | null, url: string, method: string, params: Record<string, string>, body: BodyInit, headers: Record<string, string> = {}) {
  const request = new Request(url, { method, body, headers: { "content-type": "application/json", ...headers }, duplex: "half" } as RequestInit);
  const response = await handler(async () => actor)(request, { params: Promise.resolve(params) });
  return { status: response.status, body: (await response.json()) as { error?: { code: string; fields?: Record<string, string[]> } } };
}

const targetsUrl = (w: World) => `http://arcwright.test/api/proposals/${w.proposalId}/targets`;
const createTargetAs = (w: World, actor: Actor | null, body: unknown) =>
  send((getActor) => targetCollectionRoutes(getActor).POST as unknown as Handler, actor, targetsUrl(w), "POST", { proposalId: w.proposalId }, JSON.stringify(body));

/** The probe's coordinate: two 1.6 KB runs of spaces that the old pattern split every way (3.2 KB took seconds). */
const hostileDec = `1${" ".repeat(1600)}1${" ".repeat(1600)}x`;

describe("a 3.2 KB coordinate (regression: polynomial backtracking held a server process for seconds, signed out)", () => {
  it("signed out: answered 401 before the body is parsed, as fast as a normal body", async () => {
    const world = await createWorld();
    const hostile = await createTargetAs(world, null, { ...pointTargetInput, dec: hostileDec });
    expect(hostile.status).toBe(401);
    expect(hostile.body.error?.code).toBe("unauthorized:session");
    const ratio = await slowdown(() => createTargetAs(world, null, { ...pointTargetInput, dec: hostileDec }), () => createTargetAs(world, null, pointTargetInput));
    expect(ratio).toBeLessThan(5);
  });

  it("signed in: refused with a field error naming dec, faster than a normal target is added", async () => {
    const world = await createWorld();
    const hostile = await createTargetAs(world, world.actors.coi, { ...pointTargetInput, dec: hostileDec });
    expect(hostile.status).toBe(400);
    expect(hostile.body.error?.fields?.dec).toEqual(["Declination is at most 64 characters."]);
    let added = 0;
    const ratio = await slowdown(
      () => createTargetAs(world, world.actors.coi, { ...pointTargetInput, dec: hostileDec }),
      async () => expect((await createTargetAs(world, world.actors.coi, { ...pointTargetInput, name: `TB-ML-${++added}` })).status).toBe(201),
    );
    expect(ratio).toBeLessThan(5);
  });

  it("a hostile coordinate within the length limit is refused naming its field", async () => {
    const world = await createWorld();
    const within = `1${" ".repeat(30)}1${" ".repeat(30)}x`;
    const refused = await createTargetAs(world, world.actors.coi, { ...pointTargetInput, ra: within });
    expect(refused.status).toBe(400);
    expect(Object.keys(refused.body.error?.fields ?? {})).toEqual(["ra"]);
  });
});

describe("too-long text fields are refused with a field error naming them", () => {
  it.each([
    ["ra", "1".repeat(65), "Right ascension is at most 64 characters."],
    ["name", "N".repeat(121), "The target name is at most 120 characters."],
  ])("%s", async (field, value, message) => {
    const world = await createWorld();
    const refused = await createTargetAs(world, world.actors.coi, { ...pointTargetInput, [field]: value });
    expect(refused.status).toBe(400);
    expect(refused.body.error?.fields?.[field]).toEqual([message]);
  });
});

describe("signed out, a write with a bad body answers 401, not 400, and its body is never read", () => {
  const writes = endpoints.filter((e) => e.body !== undefined && e.expected[0] === 401);

  it("covers every write with a body in the authorization matrix", () => {
    expect(writes.map((e) => e.name)).toEqual(expect.arrayContaining(["POST /proposals", "PATCH /proposals/:id", "POST /targets", "PATCH /targets/:id"]));
  });

  for (const endpoint of writes) {
    it(endpoint.name, async () => {
      const world = await createWorld();
      const { stream, counter } = countedBody(1024 * 1024);
      const method = endpoint.name.split(" ")[0];
      const answer = await send(endpoint.handler, null, endpoint.path(world), method, endpoint.params(world), stream);
      expect(answer.status, JSON.stringify(answer.body)).toBe(401);
      expect(answer.body.error?.code).toMatch(/^unauthorized:/);
      // The stream hands out its first chunk when the request is built; nothing past that is pulled.
      expect(counter.pulledBytes).toBeLessThanOrEqual(128 * 1024);
    });
  }
});

describe("a 20 MB body (regression: it was read whole before the 256 KB check)", () => {
  const proposalsUrl = "http://arcwright.test/api/proposals";
  const createProposal = (getActor: GetActor) => proposalCollectionRoutes(getActor).POST as unknown as Handler;

  it("is answered 413 after little more than 256 KB is read", async () => {
    const world = await createWorld();
    const { stream, counter } = countedBody(20 * 1024 * 1024);
    const answer = await send(createProposal, world.actors.pi, proposalsUrl, "POST", {}, stream);
    expect(answer.status).toBe(413);
    expect(answer.body.error?.code).toBe("payload_too_large:body");
    // The stream hands out a few chunks ahead of the reader; 20 MB read whole would be 80 times this.
    expect(counter.pulledBytes).toBeGreaterThan(MAX_BODY_BYTES);
    expect(counter.pulledBytes).toBeLessThan(1024 * 1024);
  });

  it("is answered 413 without reading a byte when Content-Length says it is too large", async () => {
    const world = await createWorld();
    const { stream, counter } = countedBody(20 * 1024 * 1024);
    const answer = await send(createProposal, world.actors.pi, proposalsUrl, "POST", {}, stream, { "content-length": String(20 * 1024 * 1024) });
    expect(answer.status).toBe(413);
    expect(answer.body.error?.code).toBe("payload_too_large:body");
    expect(counter.pulledBytes).toBeLessThanOrEqual(64 * 1024);
  });

  it("a body just under the limit is still read", async () => {
    const world = await createWorld();
    const padded = JSON.stringify(proposalInput).padEnd(MAX_BODY_BYTES - 1, " ");
    const answer = await send(createProposal, world.actors.pi, proposalsUrl, "POST", {}, padded);
    expect(answer.status).toBe(201);
  });
});

describe("an uploaded target list (regression: header and unit patterns took polynomial time)", () => {
  const encode = (text: string) => new TextEncoder().encode(text);

  async function upload(world: World, text: string) {
    const attempt = await uploads.uploadAs(world.actors.coi, "targetList", { proposalId: world.proposalId }, { name: "list.csv", bytes: encode(text), type: "text/csv" });
    if (attempt.stage !== "stored") throw new Error(`upload refused: ${JSON.stringify(attempt)}`);
    return attempt.serverData;
  }

  const normalList = "name,ra,dec,mass [Msun],D_L [pc],D_S [pc]\nA,17:56:40.0,-29:30:00,0.5,4000,8000\n";

  it("a 600-character header of spaces around a bracket is refused as fast as a normal list is stored", async () => {
    const world = await createWorld();
    // The probe's shape: the old pattern took about 2 s on it.
    const hostileList = `name,ra,dec,a${" ".repeat(300)}[${" ".repeat(298)}x\nA,17:56:40.0,-29:30:00,1\n`;
    const refused = await upload(world, hostileList);
    expect(refused).toEqual({ ok: false, message: expect.stringContaining("The header of column 4 is longer than 200 characters") });
    expect(await slowdown(() => upload(world, hostileList), () => upload(world, normalList), { runs: 3 })).toBeLessThan(3);
  });

  it("a mass cell of 20,000 spaces is a row error, previewed as fast as a normal list", async () => {
    const world = await createWorld();
    const hostile = await upload(world, `name,ra,dec,mass [Msun],D_L [pc],D_S [pc]\nA,17:56:40.0,-29:30:00,1${" ".repeat(20_000)}x,4000,8000\n`);
    const normal = await upload(world, normalList);
    if (!hostile.ok || !normal.ok) throw new Error("upload refused");
    const params = { proposalId: world.proposalId };
    const preview = await previewImport(params, { fileId: hostile.fileId }, world.actors.coi);
    expect(preview.rows[0].errors.join(" ")).toContain("is longer than 100 characters");
    const ratio = await slowdown(
      () => previewImport(params, { fileId: hostile.fileId }, world.actors.coi),
      () => previewImport(params, { fileId: normal.fileId }, world.actors.coi),
      { runs: 3 },
    );
    expect(ratio).toBeLessThan(3);
  });
});
