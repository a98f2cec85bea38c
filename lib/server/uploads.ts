import "server-only";
import { UTApi } from "uploadthing/server";
import { AppError } from "@/lib/errors";
import { serverEnv } from "@/lib/env";

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

/**
 * The bytes of a stored file, fetched by its key through the URL the SDK resolves (the service's
 * host is never stored). `maxBytes` bounds what is read, so a key cannot make the server buffer more.
 */
export async function fetchStoredBytes(key: string, maxBytes: number): Promise<Uint8Array> {
  const { data } = await uploadApi().getFileUrls(key);
  const url = data[0]?.url;
  if (!url) throw new AppError("not_found:file", "The uploaded file is no longer held by the upload service.");
  const response = await fetch(url);
  if (response.status === 404) throw new AppError("not_found:file", "The uploaded file is no longer held by the upload service.");
  if (!response.ok) throw new AppError("unavailable:uploads", `The upload service answered ${response.status}; try again shortly.`);
  const declared = Number(response.headers.get("content-length") ?? "0");
  if (declared > maxBytes) throw new AppError("payload_too_large:file", "The stored file is larger than this kind of upload allows.");
  const bytes = new Uint8Array(await response.arrayBuffer());
  if (bytes.length > maxBytes) throw new AppError("payload_too_large:file", "The stored file is larger than this kind of upload allows.");
  return bytes;
}

/** A short-lived URL for showing a stored file in the browser (signed locally, no network call). */
export async function viewUrlOf(key: string): Promise<string> {
  const { ufsUrl } = await uploadApi().generateSignedURL(key, { expiresIn: 60 * 10 });
  return ufsUrl;
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
