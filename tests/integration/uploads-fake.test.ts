import { createHash, randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { createServer, type IncomingMessage, type Server } from "node:http";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { createRouteHandler, createUploadthing, UTApi, UTFile, type FileRouter } from "uploadthing/server";
import { startUploadFake, type UploadFake } from "@/scripts/fakes/uploads.mjs";

// The real uploadthing server SDK (route handler, UTApi) against the local fake of the hosted
// service. The browser's two steps (HEAD and multipart PUT of the presigned URL) are done with fetch
// exactly as uploadthing/client sends them; everything else is the SDK's own code.

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const CALLBACK_TIMEOUT_MS = 3_000;

interface Completed {
  key: string;
  ufsUrl: string;
  name: string;
  fileHash: string;
  uploadedBy: unknown;
}
const completed: Completed[] = [];

const f = createUploadthing();
const router = {
  findingChart: f({ image: { maxFileSize: "1MB" } })
    .middleware(() => ({ uploadedBy: "observer-7" }))
    .onUploadComplete(({ file, metadata }) => {
      completed.push({ key: file.key, ufsUrl: file.ufsUrl, name: file.name, fileHash: file.fileHash, uploadedBy: metadata.uploadedBy });
      return { storedKey: file.key };
    }),
  privateSpectrum: f({ blob: { maxFileSize: "1MB", acl: "private" } }).onUploadComplete(() => ({ stored: true })),
  failingRecord: f({ blob: { maxFileSize: "1MB" } }).onUploadComplete(() => {
    throw new Error("the note record could not be saved");
  }),
} satisfies FileRouter;

let stateDir: string;
let appServer: Server;
let appUrl: string;
let fake: UploadFake;
let handler: (request: Request) => Promise<Response>;

function pngBytes(length: number): Uint8Array<ArrayBuffer> {
  const bytes = new Uint8Array(randomBytes(length));
  bytes.set(PNG_SIGNATURE, 0);
  return bytes;
}

async function toWebRequest(request: IncomingMessage, origin: string): Promise<Request> {
  const chunks: Buffer[] = [];
  for await (const chunk of request) chunks.push(chunk as Buffer);
  const headers = new Headers();
  for (const [name, value] of Object.entries(request.headers)) {
    if (value !== undefined) headers.set(name, Array.isArray(value) ? value.join(", ") : value);
  }
  const hasBody = request.method !== "GET" && request.method !== "HEAD";
  return new Request(new URL(request.url ?? "/", origin), { method: request.method, headers, body: hasBody ? Buffer.concat(chunks) : undefined });
}

/** Step 2 of an upload, as the browser client sends it: the app signs one presigned URL per file. */
async function requestPresigned(slug: string, file: { name: string; size: number; type: string }, via = handler) {
  const response = await via(
    new Request(`${appUrl}/api/uploadthing?actionType=upload&slug=${slug}`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ input: null, files: [{ ...file, lastModified: Date.now() }] }),
    }),
  );
  expect(response.status).toBe(200);
  const presigned = (await response.json()) as { url: string; key: string; name: string }[];
  expect(presigned).toHaveLength(1);
  return presigned[0];
}

/** Step 5, as uploadthing/client does it: one multipart field `file`, from byte 0. */
function putFile(url: string, bytes: Uint8Array<ArrayBuffer>, name: string, type: string) {
  const form = new FormData();
  form.append("file", new File([bytes], name, { type }));
  return fetch(url, { method: "PUT", body: form, headers: { Range: "bytes=0-" } });
}

beforeAll(async () => {
  stateDir = mkdtempSync(join(tmpdir(), "arcwright-uploads-"));
  appServer = createServer((request, response) => {
    toWebRequest(request, appUrl)
      .then((webRequest) => handler(webRequest))
      .then(async (webResponse) => {
        response.writeHead(webResponse.status, Object.fromEntries(webResponse.headers));
        response.end(Buffer.from(await webResponse.arrayBuffer()));
      })
      .catch((error: unknown) => {
        response.writeHead(500);
        response.end(String(error));
      });
  });
  await new Promise<void>((resolve) => appServer.listen(0, "127.0.0.1", resolve));
  appUrl = `http://127.0.0.1:${(appServer.address() as { port: number }).port}`;
  fake = await startUploadFake({ stateDir, appUrl, callbackTimeoutMs: CALLBACK_TIMEOUT_MS });
  // The SDK reads only these variables, as the app will; nothing is passed in code.
  for (const [name, value] of Object.entries(fake.env)) vi.stubEnv(name, value);
  vi.stubEnv("UPLOADTHING_LOG_LEVEL", "Fatal");
  handler = createRouteHandler({ router });
});

afterAll(async () => {
  vi.unstubAllEnvs();
  await fake?.stop();
  await new Promise((resolve) => appServer?.close(resolve));
  rmSync(stateDir, { recursive: true, force: true });
});

describe("upload through the route handler to the fake", () => {
  it("presign, PUT, signed callback: onUploadComplete gets the key and URL and its result returns to the uploader", async () => {
    const bytes = pngBytes(4096);
    const presigned = await requestPresigned("findingChart", { name: "field 12.png", size: bytes.length, type: "image/png" });
    expect(presigned.url.startsWith(`${fake.env.UPLOADTHING_INGEST_URL}/${presigned.key}?`)).toBe(true);

    const head = await fetch(presigned.url, { method: "HEAD" });
    expect(head.status).toBe(200);
    expect(head.headers.get("x-ut-range-start")).toBe("0");

    const put = await putFile(presigned.url, bytes, "field 12.png", "image/png");
    expect(put.status).toBe(200);
    const uploaded = (await put.json()) as { ufsUrl: string; fileHash: string; serverData: unknown };
    const md5 = createHash("md5").update(bytes).digest("hex");
    expect(uploaded.fileHash).toBe(md5);
    expect(uploaded.ufsUrl).toMatch(new RegExp(`^http://localhost:${fake.port}/a/[^/]+/${presigned.key}$`));
    expect(uploaded.serverData).toEqual({ storedKey: presigned.key });
    expect(completed).toContainEqual({ key: presigned.key, ufsUrl: uploaded.ufsUrl, name: "field 12.png", fileHash: md5, uploadedBy: "observer-7" });

    for (const url of [uploaded.ufsUrl, `http://127.0.0.1:${fake.port}/f/${presigned.key}`, `http://[::1]:${fake.port}/f/${presigned.key}`]) {
      const served = await fetch(url);
      expect(served.status).toBe(200);
      expect(served.headers.get("content-type")).toBe("image/png");
      expect(new Uint8Array(await served.arrayBuffer())).toEqual(bytes);
    }
  });

  it("a PUT that arrives before the app registered the key waits for the registration", async () => {
    let isRegistrationSent = false;
    // The app answers before its registration request is out, so the PUT overtakes it.
    const slowRegistration = createRouteHandler({
      router,
      config: {
        handleDaemonPromise: "void",
        fetch: async (input, init) => {
          const url = input instanceof Request ? input.url : String(input);
          if (url.endsWith("/route-metadata")) {
            await new Promise((resolve) => setTimeout(resolve, 500));
            isRegistrationSent = true;
          }
          return fetch(input, init);
        },
      },
    });
    const bytes = pngBytes(512);
    const presigned = await requestPresigned("findingChart", { name: "early.png", size: bytes.length, type: "image/png" }, slowRegistration);
    const put = putFile(presigned.url, bytes, "early.png", "image/png");
    expect(isRegistrationSent).toBe(false);
    const response = await put;
    expect(isRegistrationSent).toBe(true);
    expect(response.status).toBe(200);
    expect(((await response.json()) as { serverData: unknown }).serverData).toEqual({ storedKey: presigned.key });
  });

  it("refuses a presigned URL whose parameters or signature were altered (403)", async () => {
    const bytes = pngBytes(64);
    const presigned = await requestPresigned("findingChart", { name: "small.png", size: bytes.length, type: "image/png" });
    const biggerSize = presigned.url.replace(`x-ut-file-size=${bytes.length}`, "x-ut-file-size=900000");
    expect(biggerSize).not.toBe(presigned.url);
    const altered = await putFile(biggerSize, bytes, "small.png", "image/png");
    expect(altered.status).toBe(403);
    expect(((await altered.json()) as { error: string }).error).toMatch(/signature does not match/);

    const lastHexDigit = presigned.url.at(-1) === "0" ? "1" : "0";
    const forged = await fetch(`${presigned.url.slice(0, -1)}${lastHexDigit}`, { method: "HEAD" });
    expect(forged.status).toBe(403);

    const unsigned = await fetch(presigned.url.slice(0, presigned.url.lastIndexOf("&signature=")), { method: "HEAD" });
    expect(unsigned.status).toBe(403);
    // The untampered URL still works afterwards: the refusals left nothing behind.
    expect((await putFile(presigned.url, bytes, "small.png", "image/png")).status).toBe(200);
  });

  it("refuses a file larger than the size the app signed (413) and stores nothing", async () => {
    const presigned = await requestPresigned("findingChart", { name: "grown.png", size: 10, type: "image/png" });
    const response = await putFile(presigned.url, pngBytes(20), "grown.png", "image/png");
    expect(response.status).toBe(413);
    expect(((await response.json()) as { error: string }).error).toBe("The file is 20 bytes, more than the 10 bytes declared.");
    expect((await fetch(`http://127.0.0.1:${fake.port}/f/${presigned.key}`)).status).toBe(404);
  });

  it("answers 504 to the uploader when onUploadComplete throws and no callback result comes", async () => {
    const bytes = pngBytes(32);
    const presigned = await requestPresigned("failingRecord", { name: "lost.bin", size: bytes.length, type: "application/octet-stream" });
    const started = Date.now();
    const response = await putFile(presigned.url, bytes, "lost.bin", "application/octet-stream");
    expect(response.status).toBe(504);
    expect(((await response.json()) as { error: string }).error).toMatch(/did not confirm the upload/);
    expect(Date.now() - started).toBeGreaterThanOrEqual(CALLBACK_TIMEOUT_MS - 100);
  });

  it("serves a private file only through a URL signed with the api key", async () => {
    const bytes = new TextEncoder().encode("SIMPLE  =                    T");
    const presigned = await requestPresigned("privateSpectrum", { name: "spectrum.fits", size: bytes.length, type: "application/fits" });
    const put = await putFile(presigned.url, bytes, "spectrum.fits", "application/fits");
    expect(put.status).toBe(200);
    const { ufsUrl } = (await put.json()) as { ufsUrl: string };
    expect((await fetch(ufsUrl)).status).toBe(403);

    const utapi = new UTApi();
    const signed = await utapi.generateSignedURL(presigned.key, { expiresIn: 60 });
    const viaSigned = await fetch(signed.ufsUrl);
    expect(viaSigned.status).toBe(200);
    expect(new Uint8Array(await viaSigned.arrayBuffer())).toEqual(bytes);
    const granted = await utapi.getSignedURL(presigned.key, { expiresIn: 60 });
    expect((await fetch(granted.ufsUrl)).status).toBe(200);
    expect((await fetch(`${signed.ufsUrl.slice(0, -1)}${signed.ufsUrl.at(-1) === "0" ? "1" : "0"}`)).status).toBe(403);
  });

  it("refuses a private file to its raw URLs, to a signed URL without its signature and to an expired one, and never lets it be cached (a regression: files were public and immutable)", async () => {
    const bytes = pngBytes(128);
    const presigned = await requestPresigned("privateSpectrum", { name: "chart.png", size: bytes.length, type: "text/html" });
    expect((await putFile(presigned.url, bytes, "chart.png", "text/html")).status).toBe(200);
    const utapi = new UTApi();
    const signed = (await utapi.generateSignedURL(presigned.key, { expiresIn: 60 })).ufsUrl;
    const served = await fetch(signed);
    expect(served.status).toBe(200);
    expect(served.headers.get("cache-control")).toBe("private, no-store");

    const unsigned = signed.slice(0, signed.lastIndexOf("&signature="));
    const raw = [`http://127.0.0.1:${fake.port}/f/${presigned.key}`, `http://localhost:${fake.port}/f/${presigned.key}`, new URL(signed).origin + new URL(signed).pathname];
    for (const url of [...raw, unsigned, `${unsigned}&signature=`]) {
      const refused = await fetch(url);
      expect(refused.status, url).toBe(403);
      expect(refused.headers.get("cache-control") ?? "").not.toMatch(/public|immutable/);
    }

    // Signed ten minutes ago for one minute: the signature is the SDK's own, the time is past.
    vi.useFakeTimers({ toFake: ["Date"], now: Date.now() - 10 * 60_000 });
    const expired = (await utapi.generateSignedURL(presigned.key, { expiresIn: 60 })).ufsUrl;
    vi.useRealTimers();
    const late = await fetch(expired);
    expect(late.status).toBe(403);
    expect(((await late.json()) as { error: string }).error).toBe("The signed URL has expired.");
  });
});

describe("UTApi file management against the fake", () => {
  it("uploads from the server, lists, resolves URLs, renames, changes the ACL and deletes", async () => {
    const utapi = new UTApi();
    const bytes = new TextEncoder().encode("name,ra,dec\nQ0957+561,150.3,55.9\n");
    const upload = await utapi.uploadFiles(new UTFile([bytes], "candidates.csv", { customId: "import-41" }));
    expect(upload.error).toBeNull();
    const key = upload.data!.key;

    const listed = await utapi.listFiles();
    expect(listed.files).toContainEqual(expect.objectContaining({ key, name: "candidates.csv", size: bytes.length, customId: "import-41", status: "Uploaded" }));
    const firstPage = await utapi.listFiles({ limit: 1 });
    expect(firstPage.files).toHaveLength(1);
    expect(firstPage.hasMore).toBe(listed.files.length > 1);

    const urls = await utapi.getFileUrls(key);
    expect(urls.data).toEqual([{ key, url: upload.data!.ufsUrl }]);
    expect(new Uint8Array(await (await fetch(urls.data[0].url)).arrayBuffer())).toEqual(bytes);

    await utapi.renameFiles({ customId: "import-41", newName: "candidates-v2.csv" });
    expect((await utapi.listFiles()).files.find((file) => file.key === key)?.name).toBe("candidates-v2.csv");
    await utapi.updateACL(key, "private");
    expect((await fetch(upload.data!.ufsUrl)).status).toBe(403);

    await expect(utapi.deleteFiles(key)).resolves.toEqual({ success: true, deletedCount: 1 });
    expect((await fetch(upload.data!.ufsUrl)).status).toBe(404);
    expect((await utapi.listFiles()).files.map((file) => file.key)).not.toContain(key);
    // Deleting again is not an error, so the app may retry a delete that timed out.
    await expect(utapi.deleteFiles(key)).resolves.toEqual({ success: true, deletedCount: 0 });
  });

  it("answers 404 for a file key it does not hold", async () => {
    const unknownKey = "NoSuchKey0123456789abcdefghijklmnopqrstuvwxyz";
    expect((await fetch(`http://127.0.0.1:${fake.port}/f/${unknownKey}`)).status).toBe(404);
    const api = await fetch(`${fake.env.UPLOADTHING_API_URL}/v6/getFileUrl`, {
      method: "POST",
      headers: { "x-uploadthing-api-key": apiKeyOf(fake.env.UPLOADTHING_TOKEN), "content-type": "application/json" },
      body: JSON.stringify({ fileKeys: [unknownKey] }),
    });
    expect(api.status).toBe(404);
  });

  it("refuses API calls without the api key (401) or with another key (403)", async () => {
    const listUrl = `${fake.env.UPLOADTHING_API_URL}/v6/listFiles`;
    expect((await fetch(listUrl, { method: "POST", body: "{}" })).status).toBe(401);
    const wrongKey = await fetch(listUrl, { method: "POST", body: "{}", headers: { "x-uploadthing-api-key": "sk_someone_else" } });
    expect(wrongKey.status).toBe(403);
    const impostorToken = Buffer.from(JSON.stringify({ apiKey: "sk_someone_else", appId: "impostor", regions: ["local"] })).toString("base64");
    await expect(new UTApi({ token: impostorToken }).listFiles()).rejects.toThrow();
    const registration = await fetch(`${fake.env.UPLOADTHING_INGEST_URL}/route-metadata`, {
      method: "POST",
      headers: { "x-uploadthing-api-key": "sk_someone_else" },
      body: JSON.stringify({ fileKeys: ["abc"], callbackUrl: "http://127.0.0.1:1/", callbackSlug: "x" }),
    });
    expect(registration.status).toBe(403);
  });

  it("keeps files and credentials across a restart on the same state folder", async () => {
    const utapi = new UTApi();
    const bytes = pngBytes(256);
    const upload = await utapi.uploadFiles(new UTFile([bytes], "kept.png"));
    const { env, port } = fake;
    await fake.stop();
    fake = await startUploadFake({ stateDir, appUrl, port, callbackTimeoutMs: CALLBACK_TIMEOUT_MS });
    expect(fake.env).toEqual(env);
    const served = await fetch(upload.data!.ufsUrl);
    expect(served.status).toBe(200);
    expect(new Uint8Array(await served.arrayBuffer())).toEqual(bytes);
  });
});

function apiKeyOf(token: string): string {
  return (JSON.parse(Buffer.from(token, "base64").toString("utf8")) as { apiKey: string }).apiKey;
}
