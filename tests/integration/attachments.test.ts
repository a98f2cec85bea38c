import { count, eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dbClient } from "@/db/client";
import { noteAttachments, uploadedFiles } from "@/db/schema";
import type { Actor } from "@/lib/server/actor";
import { attachmentFileRoutes } from "@/lib/server/api/upload-routes";
import { deleteAttachment, listAttachments } from "@/lib/server/attachments";
import { removeMember } from "@/lib/server/members";
import { createNote, deleteNote } from "@/lib/server/notes";
import { deleteProposal } from "@/lib/server/proposals";
import { deleteTarget } from "@/lib/server/targets";
import { card, fitsFile } from "../unit/imports/fits";
import { createUser, createWorld, type World } from "./support/world";
import { startUploadService, type UploadService } from "./support/upload-service";

const { db, sql: connection } = dbClient();
let service: UploadService;

beforeAll(async () => {
  service = await startUploadService();
});

afterAll(async () => {
  await service.stop();
  await connection.end();
});

// PNG signature (PNG Specification 3rd ed. §5.2) followed by arbitrary bytes: the type is read from content.
const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 1, 2, 3, 4]);
const noteInput = (w: World) => ({ proposalId: w.proposalId, targetId: w.targetId, noteId: w.noteId });

async function attach(world: World, name: string, bytes: Uint8Array) {
  const attempt = await service.uploadAs(world.actors.coi, "noteAttachment", noteInput(world), { name, bytes });
  if (attempt.stage !== "stored") throw new Error(`refused before upload: ${attempt.message}`);
  return attempt;
}

/** GET .../attachments/:id/file as `actor`, through the route handler the app serves. */
function readFile(world: World, attachmentId: string, actor: Actor | null): Promise<Response> {
  const params = { ...noteInput(world), attachmentId };
  const url = `http://arcwright.test/api/proposals/${world.proposalId}/targets/${world.targetId}/notes/${world.noteId}/attachments/${attachmentId}/file`;
  return attachmentFileRoutes(async () => actor).GET(new Request(url), { params: Promise.resolve(params) });
}

async function attachmentIdOf(world: World, name: string): Promise<string> {
  const found = (await listAttachments(noteInput(world), world.actors.pi)).find((a) => a.name === name);
  if (!found) throw new Error(`no attachment ${name}`);
  return found.id;
}

/** The fake's own URLs of a stored file, as a browser could guess or keep them. */
const rawUrlsOf = (key: string) => [`http://127.0.0.1:${service.fake.port}/f/${key}`, `http://localhost:${service.fake.port}/a/${appIdOf(service.fake.env.UPLOADTHING_TOKEN)}/${key}`];
const appIdOf = (token: string) => (JSON.parse(Buffer.from(token, "base64").toString("utf8")) as { appId: string }).appId;

async function fileRows(proposalId: string) {
  const [row] = await db.select({ n: count() }).from(uploadedFiles).where(eq(uploadedFiles.proposalId, proposalId));
  return row.n;
}

describe("note attachments through the upload service", () => {
  it("records a PNG and a FITS file by content, with the FITS header keywords and data size", async () => {
    const world = await createWorld();
    await attach(world, "chart.png", png);
    // FITS Standard 4.0 §4.4.1.1: data bytes = |BITPIX|/8 × NAXIS1 × NAXIS2 = 2 × 10 × 20 = 400.
    const fits = fitsFile([card("SIMPLE", "T"), card("BITPIX", "16"), card("NAXIS", "2"), card("NAXIS1", "10"), card("NAXIS2", "20"), card("OBJECT", "'K-17 core'")], 400);
    await attach(world, "spectrum.fits", fits);
    const attachments = await listAttachments(noteInput(world), world.actors.viewer);
    expect(attachments.map((a) => [a.name, a.kind, a.sizeBytes])).toEqual([
      ["chart.png", "png", png.length],
      ["spectrum.fits", "fits", fits.length],
    ]);
    const [header] = attachments[1].fitsHeader!.hdus;
    expect(header.dataBytes).toBe(400);
    expect(header.axes).toEqual([10, 20]);
    expect(header.keywords.find((k) => k.key === "OBJECT")?.text).toBe("K-17 core");
  });

  it("refuses a file whose content is no attachment type, deletes it and records nothing", async () => {
    const world = await createWorld();
    const before = await fileRows(world.proposalId);
    const attempt = await attach(world, "looks-like.png", new TextEncoder().encode("GIF89a not a png"));
    expect(attempt.serverData).toEqual({ ok: false, message: "Attach a PNG or JPEG image, a PDF or a FITS file; this file's content is none of them." });
    expect(await service.isStored(attempt.key, 3_000)).toBe(false);
    expect(await fileRows(world.proposalId)).toBe(before);
  });

  it("refuses a viewer (403) and a non-member (404) at the upload middleware, and an oversize file (413)", async () => {
    const world = await createWorld();
    const file = { name: "chart.png", bytes: png };
    expect(await service.uploadAs(world.actors.viewer, "noteAttachment", noteInput(world), file)).toMatchObject({ stage: "presign", status: 403 });
    expect(await service.uploadAs(world.actors.outsider, "noteAttachment", noteInput(world), file)).toMatchObject({ stage: "presign", status: 404 });
    const big = await service.uploadAs(world.actors.coi, "noteAttachment", noteInput(world), { ...file, declaredSize: 16 * 1024 * 1024 + 1 });
    expect(big).toEqual({ stage: "presign", status: 413, message: "The file is larger than 16 MB, the limit for an attachment." });
  });

  it("deleting an attachment, or its note, deletes the stored bytes through the upload service", async () => {
    const world = await createWorld();
    const first = await attach(world, "one.png", png);
    const second = await attach(world, "two.png", png);
    const [one] = await listAttachments(noteInput(world), world.actors.coi);
    await expect(deleteAttachment({ ...noteInput(world), attachmentId: one.id }, world.actors.viewer)).rejects.toMatchObject({ code: "forbidden:attachment" });
    expect(await service.isStored(first.key)).toBe(true);
    await deleteAttachment({ ...noteInput(world), attachmentId: one.id }, world.actors.coi);
    expect(await service.isStored(first.key)).toBe(false);
    expect(await service.isStored(second.key)).toBe(true);

    await deleteNote(noteInput(world), world.actors.coi);
    expect(await service.isStored(second.key)).toBe(false);
    const [left] = await db.select({ n: count() }).from(noteAttachments).where(eq(noteAttachments.noteId, world.noteId));
    expect(left.n).toBe(0);
    expect(await fileRows(world.proposalId)).toBe(0);
  });

  it("deleting a target deletes the stored bytes of its notes' attachments, and only those (a regression: they were left behind)", async () => {
    const world = await createWorld();
    const onNote = await attach(world, "on-note.png", png);
    // A second note on the same target.
    const other = await createNote({ proposalId: world.proposalId, targetId: world.targetId }, { body: "Second look." }, world.actors.coi);
    const onOther = await service.uploadAs(world.actors.coi, "noteAttachment", { ...noteInput(world), noteId: other.id }, { name: "other.png", bytes: png });
    if (onOther.stage !== "stored") throw new Error(`refused before upload: ${onOther.message}`);
    const elsewhere = await createWorld();
    const kept = await attach(elsewhere, "kept.png", png);

    await expect(deleteTarget({ proposalId: world.proposalId, targetId: world.targetId }, world.actors.viewer)).rejects.toMatchObject({ code: "forbidden:target" });
    expect(await service.isStored(onNote.key)).toBe(true);
    await deleteTarget({ proposalId: world.proposalId, targetId: world.targetId }, world.actors.coi);
    expect(await service.isStored(onNote.key)).toBe(false);
    expect(await service.isStored(onOther.key)).toBe(false);
    expect(await fileRows(world.proposalId)).toBe(0);
    expect(await service.isStored(kept.key)).toBe(true);
  });

  it("deleting a proposal deletes the stored bytes of every file it held", async () => {
    const world = await createWorld();
    const attached = await attach(world, "attached.png", png);
    // A target list held for its import record (PI or Co-I upload it; the import itself is not needed).
    const list = await service.uploadAs(world.actors.coi, "targetList", { proposalId: world.proposalId }, { name: "list.csv", bytes: new TextEncoder().encode("name,ra,dec\nK-1,10.0,-20.0\n"), type: "text/csv" });
    if (list.stage !== "stored") throw new Error(`refused before upload: ${list.message}`);
    const elsewhere = await createWorld();
    const kept = await attach(elsewhere, "kept.png", png);
    await expect(deleteProposal({ proposalId: world.proposalId }, world.actors.coi)).rejects.toMatchObject({ code: "forbidden:proposal" });
    expect(await service.isStored(attached.key)).toBe(true);
    await deleteProposal({ proposalId: world.proposalId }, world.actors.pi);
    expect(await service.isStored(attached.key)).toBe(false);
    expect(await service.isStored(list.key)).toBe(false);
    expect(await fileRows(world.proposalId)).toBe(0);
    expect(await service.isStored(kept.key)).toBe(true);
  });
});

describe("reading an attachment's file", () => {
  it("streams the bytes to members and an auditing admin only, checked at every read: signed out 401, non-member 404, removed member 404 (a regression: the file URL served anyone, removed members included)", async () => {
    const world = await createWorld();
    const stored = await attach(world, "chart.png", png);
    const id = await attachmentIdOf(world, "chart.png");
    const admin = await createUser("admin", "admin");
    for (const reader of [world.actors.viewer, world.actors.coi, world.actors.pi, admin]) {
      const response = await readFile(world, id, reader);
      expect(response.status).toBe(200);
      expect(new Uint8Array(await response.arrayBuffer())).toEqual(png);
    }
    const signedOut = await readFile(world, id, null);
    expect(signedOut.status).toBe(401);
    const outsider = await readFile(world, id, world.actors.outsider);
    expect(outsider.status).toBe(404);
    expect(((await outsider.json()) as { error: { code: string } }).error.code).toBe("not_found:proposal");

    await removeMember({ proposalId: world.proposalId, userId: world.actors.viewer.userId }, world.actors.pi);
    expect((await readFile(world, id, world.actors.viewer)).status).toBe(404);
    // The upload service serves the stored file to no URL a browser could hold.
    for (const url of rawUrlsOf(stored.key)) expect((await fetch(url)).status, url).toBe(403);
  });

  it("serves a PNG-signed polyglot declared text/html as image/png, never as a page (a regression: it ran its script on the file host)", async () => {
    const world = await createWorld();
    const polyglot = new Uint8Array([...png.subarray(0, 8), ...new TextEncoder().encode("<html><body><script>alert(document.domain)</script></body></html>")]);
    const stored = await service.uploadAs(world.actors.coi, "noteAttachment", noteInput(world), { name: "page.html", bytes: polyglot, type: "text/html" });
    expect(stored).toMatchObject({ stage: "stored", serverData: { ok: true } });
    const response = await readFile(world, await attachmentIdOf(world, "page.html"), world.actors.viewer);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("image/png");
    expect(response.headers.get("content-disposition")).toBe(`inline; filename="page.html"; filename*=UTF-8''page.html`);
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
    expect(response.headers.get("cache-control")).toBe("private, no-store");
    expect(response.headers.get("content-security-policy")).toBe("default-src 'none'; sandbox");
    if (stored.stage === "stored") for (const url of rawUrlsOf(stored.key)) expect((await fetch(url)).status, url).toBe(403);
  });

  it("serves a PDF and a FITS file as downloads of their own type, with the name intact", async () => {
    const world = await createWorld();
    await attach(world, "Spektrum (Ω) 'v2'.pdf", new TextEncoder().encode("%PDF-1.7\n%EOF\n"));
    const response = await readFile(world, await attachmentIdOf(world, "Spektrum (Ω) 'v2'.pdf"), world.actors.viewer);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    expect(response.headers.get("content-disposition")).toBe(`attachment; filename="Spektrum (_) 'v2'.pdf"; filename*=UTF-8''Spektrum%20%28%CE%A9%29%20%27v2%27.pdf`);
    expect(response.headers.get("x-content-type-options")).toBe("nosniff");
  });

  it("refuses an HTML and an SVG file at upload, whatever type they declare, and deletes them", async () => {
    const world = await createWorld();
    const files = [
      { name: "chart.png", type: "image/png", text: "<!DOCTYPE html><script>alert(1)</script>" },
      { name: "chart.svg", type: "image/svg+xml", text: '<svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>' },
    ];
    for (const file of files) {
      const attempt = await attach(world, file.name, new TextEncoder().encode(file.text));
      expect(attempt.serverData).toEqual({ ok: false, message: "Attach a PNG or JPEG image, a PDF or a FITS file; this file's content is none of them." });
      expect(await service.isStored(attempt.key, 3_000)).toBe(false);
    }
    expect(await listAttachments(noteInput(world), world.actors.viewer)).toEqual([]);
  });
});
