import { mkdtempSync, rmSync } from "node:fs";
import { createServer, type IncomingMessage, type Server } from "node:http";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { vi } from "vitest";
import { createRouteHandler, UTApi } from "uploadthing/server";
import { makeUploadRouter, withSignInCheck } from "@/lib/server/upload-router";
import type { Actor } from "@/lib/server/actor";
import { startUploadFake, type UploadFake } from "@/scripts/fakes/uploads.mjs";

/**
 * The app's real upload route (file router, middleware, completion) served on loopback, with the
 * local fake of the upload service pointed at it through the UPLOADTHING_* variables, as `npm start`
 * does. `uploadAs` drives one upload the way the browser client does: presign, then multipart PUT.
 */
export interface UploadService {
  fake: UploadFake;
  /** `beforePut` runs between the presign (middleware) and the PUT, e.g. to remove the uploader. */
  uploadAs(
    actor: Actor | null,
    slug: "targetList" | "noteAttachment" | "eventPhotometry",
    input: Record<string, string>,
    file: { name: string; bytes: Uint8Array; type?: string; declaredSize?: number },
    beforePut?: () => Promise<void>,
  ): Promise<UploadAttempt>;
  /** Whether the fake still holds a stored key (a refused upload's bytes go a moment after the refusal). */
  isStored(key: string, settleMs?: number): Promise<boolean>;
  stop(): Promise<void>;
}

export type UploadAttempt =
  | { stage: "presign"; status: number; message: string }
  | { stage: "stored"; key: string; serverData: { ok: true; fileId: string } | { ok: false; message: string } };

function toWebRequest(request: IncomingMessage, origin: string): Promise<Request> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    request.on("data", (chunk: Buffer) => chunks.push(chunk));
    request.on("error", reject);
    request.on("end", () => {
      const headers = new Headers();
      for (const [name, value] of Object.entries(request.headers)) if (value !== undefined) headers.set(name, Array.isArray(value) ? value.join(", ") : value);
      const hasBody = request.method !== "GET" && request.method !== "HEAD";
      resolve(new Request(new URL(request.url ?? "/", origin), { method: request.method, headers, body: hasBody ? Buffer.concat(chunks) : undefined }));
    });
  });
}

const handlerFor = (actor: Actor | null) => {
  const getActor = async () => actor;
  return withSignInCheck(getActor, createRouteHandler({ router: makeUploadRouter(getActor) }));
};

export async function startUploadService(): Promise<UploadService> {
  const stateDir = mkdtempSync(join(tmpdir(), "arcwright-upload-service-"));
  // The service's completion callbacks carry no session; they reach the route as in production.
  const callbacks = handlerFor(null);
  let appUrl = "";
  const server: Server = createServer((request, response) => {
    toWebRequest(request, appUrl)
      .then(callbacks)
      .then(async (answer) => {
        response.writeHead(answer.status, Object.fromEntries(answer.headers));
        response.end(Buffer.from(await answer.arrayBuffer()));
      })
      .catch((error: unknown) => {
        response.writeHead(500);
        response.end(String(error));
      });
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  appUrl = `http://127.0.0.1:${(server.address() as { port: number }).port}`;
  const fake = await startUploadFake({ stateDir, appUrl, callbackTimeoutMs: 8_000 });
  for (const [name, value] of Object.entries(fake.env)) vi.stubEnv(name, value);
  vi.stubEnv("UPLOADTHING_LOG_LEVEL", "Fatal");

  return {
    fake,
    async uploadAs(actor, slug, input, file, beforePut) {
      const type = file.type ?? "application/octet-stream";
      const size = file.declaredSize ?? file.bytes.length;
      const presign = await handlerFor(actor)(
        new Request(`${appUrl}/api/uploadthing?actionType=upload&slug=${slug}`, {
          method: "POST",
          headers: { "content-type": "application/json" },
          body: JSON.stringify({ input, files: [{ name: file.name, size, type, lastModified: Date.now() }] }),
        }),
      );
      if (presign.status !== 200) {
        const body = (await presign.json()) as { message?: string; error?: { message: string } };
        return { stage: "presign", status: presign.status, message: body.message ?? body.error?.message ?? "" };
      }
      const [presigned] = (await presign.json()) as { url: string; key: string }[];
      await beforePut?.();
      const form = new FormData();
      form.append("file", new File([new Uint8Array(file.bytes)], file.name, { type }));
      const put = await fetch(presigned.url, { method: "PUT", body: form, headers: { Range: "bytes=0-" } });
      if (!put.ok) throw new Error(`upload PUT answered ${put.status}: ${await put.text()}`);
      const { serverData } = (await put.json()) as { serverData: Extract<UploadAttempt, { stage: "stored" }>["serverData"] };
      return { stage: "stored", key: presigned.key, serverData };
    },
    async isStored(key, settleMs = 0) {
      // Stored files are private: only a URL signed with the api key reads them.
      const isServed = async () => (await fetch((await new UTApi().generateSignedURL(key, { expiresIn: 60 })).ufsUrl)).status === 200;
      const deadline = Date.now() + settleMs;
      let isHeld = await isServed();
      while (isHeld && Date.now() < deadline) {
        await new Promise((resolve) => setTimeout(resolve, 100));
        isHeld = await isServed();
      }
      return isHeld;
    },
    async stop() {
      vi.unstubAllEnvs();
      await fake.stop();
      await new Promise((resolve) => server.close(resolve));
      rmSync(stateDir, { recursive: true, force: true });
    },
  };
}
