import "server-only";
import { UTApi } from "uploadthing/server";
import { AppError } from "@/lib/errors";
import { serverEnv } from "@/lib/env";
import { formatMebibytes } from "@/lib/imports/import-table";

let client: UTApi | undefined;

/**
 * The upload service's file API. The SDK reads its configuration (UPLOADTHING_*) from the process
 * environment itself; `serverEnv()` validates those variables first so a bad one fails with its name.
 */
export function uploadApi(): UTApi {
  serverEnv();
  client ??= new UTApi();
  return client;
}

// Files are stored private (the route config's `acl: "private"`): the service serves them only to a
// URL signed with the api key, which the SDK's `generateSignedURL` makes locally as
// `<file host>/a/<appId>/<key>?expires=<ms>&signature=hmac-sha256=<hex>`. Such a URL is used once, by
// this server, right away; it never reaches a browser, so a minute is plenty.
const SIGNED_URL_TTL_SECONDS = 60;

const goneError = () => new AppError("not_found:file", "The uploaded file is no longer held by the upload service.");

/** The service's answer for a stored file, fetched through a freshly signed, short-lived URL. */
async function fetchStored(key: string): Promise<Response> {
  const { ufsUrl } = await uploadApi().generateSignedURL(key, { expiresIn: SIGNED_URL_TTL_SECONDS });
  let response: Response;
  try {
    response = await fetch(ufsUrl, { cache: "no-store" });
  } catch (error) {
    console.error(`upload service: could not fetch stored file ${key}.`, error);
    throw new AppError("unavailable:uploads", "The upload service cannot be reached; try again shortly.");
  }
  if (response.status === 404) throw goneError();
  if (!response.ok || !response.body) throw new AppError("unavailable:uploads", `The upload service answered ${response.status}; try again shortly.`);
  return response;
}

/**
 * The bytes of a stored file, by its key (the service's host is never stored). `maxBytes` bounds what
 * is read, so a key cannot make the server buffer more.
 */
export async function fetchStoredBytes(key: string, maxBytes: number): Promise<Uint8Array> {
  const response = await fetchStored(key);
  const declared = Number(response.headers.get("content-length") ?? "0");
  if (declared > maxBytes) throw new AppError("payload_too_large:file", "The stored file is larger than this kind of upload allows.");
  const bytes = new Uint8Array(await response.arrayBuffer());
  if (bytes.length > maxBytes) throw new AppError("payload_too_large:file", "The stored file is larger than this kind of upload allows.");
  return bytes;
}

export interface StoredFileStream {
  /** At least the first `headBytes` bytes (fewer only when the file is shorter), to read its type from. */
  head: Uint8Array;
  /** The whole file, head included, streamed from the service as it is read. */
  body: ReadableStream<Uint8Array>;
  /** As the service declared it; null when it did not. */
  sizeBytes: number | null;
}

/** A stored file as a stream, after reading its first `headBytes` bytes (so its type can be told first). */
export async function openStoredFile(key: string, headBytes: number): Promise<StoredFileStream> {
  const response = await fetchStored(key);
  const reader = response.body!.getReader();
  const chunks: Uint8Array[] = [];
  let length = 0;
  while (length < headBytes) {
    const { done, value } = await reader.read();
    if (done) break;
    chunks.push(value);
    length += value.length;
  }
  const head = new Uint8Array(length);
  chunks.reduce((at, chunk) => (head.set(chunk, at), at + chunk.length), 0);
  const body = new ReadableStream<Uint8Array>({
    start(controller) {
      for (const chunk of chunks) controller.enqueue(chunk);
    },
    async pull(controller) {
      const { done, value } = await reader.read();
      if (done) controller.close();
      else controller.enqueue(value);
    },
    cancel(reason) {
      return reader.cancel(reason);
    },
  });
  const declared = response.headers.get("content-length");
  return { head, body, sizeBytes: declared === null ? null : Number(declared) };
}

/**
 * Deletes stored files. Called after the database change that forgot them has committed, so a
 * failure here can only leave an unreferenced file behind, never a record without its file; that
 * failure is logged with the keys (for a later clean-up) and reported to the caller, not thrown.
 */
export async function deleteStoredFiles(keys: readonly string[]): Promise<boolean> {
  if (keys.length === 0) return true;
  try {
    await uploadApi().deleteFiles([...keys]);
    return true;
  } catch (error) {
    console.error(`upload service: could not delete stored files ${keys.join(", ")}; they are unreferenced now.`, error);
    return false;
  }
}

/** How long a refused upload's bytes outlive the completion step that refused them. */
const REFUSED_FILE_DELAY_MS = 1_000;

/**
 * Deletes the bytes of an upload refused in its completion step, shortly after that step returns:
 * the SDK reports the step's result to the service for the file's key, and the service refuses a
 * result for a key that no longer exists, so deleting at once would lose the refusal's message.
 */
export function deleteRefusedUpload(key: string): void {
  setTimeout(() => void deleteStoredFiles([key]), REFUSED_FILE_DELAY_MS).unref?.();
}

/** Refuses before upload a file whose declared size is over the limit (checked again on the bytes). */
export function refuseOversize(files: readonly { size: number }[], maxBytes: number, code: `payload_too_large:${string}`, what: string): void {
  const tooLarge = files.find((file) => file.size > maxBytes);
  if (tooLarge) throw new AppError(code, `The file is larger than ${formatMebibytes(maxBytes)}, the limit for ${what}.`);
  if (files.some((file) => file.size === 0)) throw new AppError(`bad_request:${code.split(":")[1]}`, "The file is empty.");
}
