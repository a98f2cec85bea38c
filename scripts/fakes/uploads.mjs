// A local stand-in for the hosted file-upload service that the uploadthing SDK talks to. The app keeps
// the real SDK on every path; the variables in `env` only change where it points. What the SDK sends
// and expects was read from the built code of uploadthing 7.7.4 and @uploadthing/shared 7.1.10:
//
// - It speaks the service's production mode: the app registers file keys (`POST /route-metadata`
//   with `x-uploadthing-api-key`; dev mode, `isDev: true`, is refused), the browser HEADs then PUTs a
//   multipart body (one field `file`) to a presigned URL, the fake calls the app back
//   (`POST <callbackUrl>?slug=<slug>`, `uploadthing-hook: callback`, `x-uploadthing-signature:
//   hmac-sha256=<hex of HMAC(apiKey, body)>`) and waits for `POST /callback-result` before it answers
//   the PUT. A PUT may overtake the registration of its key; it waits for it, bounded.
// - A presigned URL is `<ingest>/<key>?expires=<ms>&x-ut-identifier=<appId>&x-ut-file-name=..&
//   x-ut-file-size=..&x-ut-file-type=..&x-ut-slug=..&x-ut-custom-id=..&x-ut-content-disposition=..&
//   x-ut-acl=..&signature=hmac-sha256%3D<hex>`: the HMAC-SHA256, keyed by the api key, of the whole URL
//   before `&signature=`; each x-ut-* value is URL-encoded twice. The ACL comes from the route config.
// - Files are served at `/f/<key>` and `/a/<appId>/<key>`. A private file (`x-ut-acl=private`) is
//   served only to a URL signed the same way (`UTApi.generateSignedURL` signs locally,
//   `UTApi.getSignedURL` asks `/v6/requestFileAccess`) before its `expires`, and never as cacheable;
//   without a valid signature, or after expiry, it answers 403. A public file is served to anyone.
// - UTApi's calls are `POST /v6/<name>` with the api key header.
//
// Bytes and file records live under `stateDir`, so files survive a restart; the fake's credentials
// are kept there too so that stored file URLs and keys stay valid.
import { createHash, createHmac, randomBytes, randomUUID, timingSafeEqual } from "node:crypto";
import { mkdirSync, readdirSync, readFileSync, renameSync, rmSync, writeFileSync } from "node:fs";
import { createServer } from "node:http";
import { join } from "node:path";

const SIGNATURE_PREFIX = "hmac-sha256=";
// File keys are sqids from the SDK; anything else could name a path outside the store.
const FILE_KEY_PATTERN = /^[A-Za-z0-9_-]{1,128}$/;
const JSON_BODY_LIMIT_BYTES = 1024 * 1024;
// A multipart body carries boundaries and part headers around the file itself.
const MULTIPART_OVERHEAD_BYTES = 64 * 1024;
// The SDK's default presigned-URL lifetime; registrations older than that can no longer be used.
const REGISTRATION_TTL_MS = 60 * 60 * 1000;
const LIST_LIMIT_MAX = 500;
const ACLS = ["public-read", "private"];

class HttpError extends Error {
  constructor(status, message) {
    super(message);
    this.status = status;
  }
}

/** The fake's api key and app id: made once per state folder and kept, so stored URLs and keys stay valid. */
function loadOrCreateCredentials(stateDir) {
  const file = join(stateDir, "credentials.json");
  try {
    return JSON.parse(readFileSync(file, "utf8"));
  } catch (error) {
    if (error.code !== "ENOENT") throw error;
  }
  const credentials = {
    apiKey: `sk_local_${randomBytes(24).toString("hex")}`,
    appId: `local${randomBytes(6).toString("hex")}`,
    region: "local",
  };
  writeAtomically(file, JSON.stringify(credentials, null, 2), 0o600);
  return credentials;
}

/** Writes through a temporary name, so a reader (or a restart) never sees half a file. */
function writeAtomically(path, data, mode = 0o644) {
  const temporary = `${path}.${process.pid}.tmp`;
  writeFileSync(temporary, data, { mode });
  renameSync(temporary, path);
}

/** File records and bytes on disk: `<key>` holds the bytes, `<key>.json` the record (written last). */
class FileStore {
  constructor(dir) {
    this.dir = dir;
    mkdirSync(dir, { recursive: true });
    this.records = new Map();
    for (const name of readdirSync(dir)) {
      if (!name.endsWith(".json")) continue;
      const record = JSON.parse(readFileSync(join(dir, name), "utf8"));
      this.records.set(record.key, record);
    }
  }

  get(key) {
    return this.records.get(key);
  }

  findByCustomId(customId) {
    for (const record of this.records.values()) if (record.customId === customId) return record;
    return undefined;
  }

  bytes(key) {
    return readFileSync(join(this.dir, key));
  }

  put(record, bytes) {
    writeAtomically(join(this.dir, record.key), bytes);
    this.update(record);
  }

  update(record) {
    writeAtomically(join(this.dir, `${record.key}.json`), JSON.stringify(record));
    this.records.set(record.key, record);
  }

  remove(key) {
    rmSync(join(this.dir, `${key}.json`), { force: true });
    rmSync(join(this.dir, key), { force: true });
    this.records.delete(key);
  }

  /** Oldest first, as the service lists them. */
  list() {
    return [...this.records.values()].sort((a, b) => a.uploadedAt - b.uploadedAt);
  }
}

const hmacHex = (secret, payload) => createHmac("sha256", secret).update(payload).digest("hex");

/** Compares a `hmac-sha256=<hex>` value with the HMAC of `payload`, in constant time. */
function isValidSignature(secret, payload, signature) {
  if (typeof signature !== "string" || !signature.startsWith(SIGNATURE_PREFIX)) return false;
  const given = Buffer.from(signature.slice(SIGNATURE_PREFIX.length), "hex");
  const expected = Buffer.from(hmacHex(secret, payload), "hex");
  return given.length === expected.length && timingSafeEqual(given, expected);
}

/**
 * Checks a URL the SDK signed: the signature is the HMAC of the whole URL before `&signature=` was
 * appended, so it is recomputed over the base the SDK was given plus the raw path and query as sent.
 */
function verifySignedUrl(secret, base, rawUrl) {
  const at = rawUrl.lastIndexOf("&signature=");
  if (at < 0) throw new HttpError(403, "The URL carries no signature.");
  let signature;
  try {
    signature = decodeURIComponent(rawUrl.slice(at + "&signature=".length));
  } catch {
    throw new HttpError(403, "The URL's signature is malformed.");
  }
  if (!isValidSignature(secret, `${base}${rawUrl.slice(0, at)}`, signature)) {
    throw new HttpError(403, "The URL's signature does not match.");
  }
  const expires = Number(new URL(rawUrl, base).searchParams.get("expires"));
  if (!Number.isFinite(expires) || expires < Date.now()) throw new HttpError(403, "The signed URL has expired.");
}

/** A signed URL in the SDK's own form: `expires` (ms since the epoch), then the signature. */
function signUrl(secret, url, ttlSeconds) {
  const signed = new URL(url);
  signed.searchParams.append("expires", String(Date.now() + ttlSeconds * 1000));
  signed.searchParams.append("signature", `${SIGNATURE_PREFIX}${hmacHex(secret, signed.toString())}`);
  return signed.href;
}

/** Reads the whole body, refusing more than `limitBytes` with 413 as soon as it is exceeded. */
function readBody(request, limitBytes) {
  return new Promise((resolve, reject) => {
    const chunks = [];
    let length = 0;
    request.on("data", (chunk) => {
      length += chunk.length;
      if (length > limitBytes) {
        // Stop reading; the answer goes out with `connection: close`, which ends the rest.
        request.pause();
        reject(new HttpError(413, `The request body is larger than the ${limitBytes} bytes allowed.`));
        return;
      }
      chunks.push(chunk);
    });
    request.on("end", () => resolve(Buffer.concat(chunks)));
    request.on("error", reject);
  });
}

async function readJson(request) {
  const body = await readBody(request, JSON_BODY_LIMIT_BYTES);
  try {
    const value = JSON.parse(body.toString("utf8") || "{}");
    if (value === null || typeof value !== "object" || Array.isArray(value)) throw new Error("not an object");
    return value;
  } catch {
    throw new HttpError(400, "The request body is not a JSON object.");
  }
}

function decodeTwice(value) {
  // The SDK URL-encodes each x-ut-* value before URLSearchParams encodes it again.
  if (value === null) return undefined;
  try {
    return decodeURIComponent(value);
  } catch {
    throw new HttpError(400, "A presigned URL parameter is malformed.");
  }
}

function fileKeysOf(body, field) {
  const keys = body[field];
  if (!Array.isArray(keys) || keys.some((key) => typeof key !== "string")) return undefined;
  return keys;
}

/**
 * Starts the fake on loopback (127.0.0.1 and ::1, the same port).
 * @param {{ stateDir: string, appUrl: string, port?: number, registrationTimeoutMs?: number,
 *   callbackTimeoutMs?: number }} options
 *   registrationTimeoutMs: how long a PUT that arrives before `/route-metadata` waits for it (10 s);
 *   callbackTimeoutMs: how long a PUT waits for the app's callback and `/callback-result` (15 s).
 * @returns {Promise<{ env: Record<string, string>, port: number, stop: () => Promise<void> }>}
 */
export async function startUploadFake({ stateDir, appUrl, port, registrationTimeoutMs = 10_000, callbackTimeoutMs = 15_000 }) {
  mkdirSync(stateDir, { recursive: true });
  const { apiKey, appId, region } = loadOrCreateCredentials(stateDir);
  const store = new FileStore(join(stateDir, "files"));
  const registrations = new Map();
  const registrationWaiters = new Map();
  const pendingResults = new Map();
  const uploadsInFlight = new Set();
  const timers = new Set();

  let ingestOrigin;
  let ufsHost;

  function delay(ms, onTimeout) {
    const timer = setTimeout(() => {
      timers.delete(timer);
      onTimeout();
    }, ms);
    timers.add(timer);
    return () => {
      clearTimeout(timer);
      timers.delete(timer);
    };
  }

  function requireApiKey(request) {
    const given = request.headers["x-uploadthing-api-key"];
    if (typeof given !== "string") throw new HttpError(401, "The x-uploadthing-api-key header is missing.");
    const a = Buffer.from(given);
    const b = Buffer.from(apiKey);
    if (a.length !== b.length || !timingSafeEqual(a, b)) throw new HttpError(403, "The api key is not this app's.");
  }

  const ufsUrlOf = (key) => `http://${ufsHost}/a/${appId}/${key}`;
  const urlsOf = (key) => ({ url: `http://${ufsHost}/f/${key}`, appUrl: ufsUrlOf(key), ufsUrl: ufsUrlOf(key) });

  function recordFor(selector) {
    if (typeof selector.fileKey === "string") return store.get(selector.fileKey);
    if (typeof selector.customId === "string") return store.findByCustomId(selector.customId);
    throw new HttpError(400, "Each entry names a fileKey or a customId.");
  }

  function register(body) {
    if (body.isDev === true) {
      throw new HttpError(400, "This fake speaks the service's production mode only; set UPLOADTHING_IS_DEV=false.");
    }
    const fileKeys = fileKeysOf(body, "fileKeys");
    if (!fileKeys || fileKeys.length === 0 || !fileKeys.every((key) => FILE_KEY_PATTERN.test(key))) {
      throw new HttpError(400, "fileKeys must be a non-empty list of file keys.");
    }
    let callbackUrl;
    try {
      callbackUrl = new URL(body.callbackUrl);
    } catch {
      throw new HttpError(400, "callbackUrl must be an absolute URL.");
    }
    if (typeof body.callbackSlug !== "string" || body.callbackSlug === "") throw new HttpError(400, "callbackSlug is missing.");
    const now = Date.now();
    for (const [key, registration] of registrations) {
      if (now - registration.registeredAt > REGISTRATION_TTL_MS) registrations.delete(key);
    }
    callbackUrl.searchParams.set("slug", body.callbackSlug);
    const registration = {
      callbackUrl: callbackUrl.href,
      metadata: body.metadata ?? {},
      awaitServerData: body.awaitServerData !== false,
      registeredAt: now,
    };
    for (const key of fileKeys) {
      registrations.set(key, registration);
      for (const wake of registrationWaiters.get(key) ?? []) wake();
      registrationWaiters.delete(key);
    }
  }

  /** A PUT may overtake the app's registration of its key; it waits (bounded) for it. */
  function waitForRegistration(key) {
    const existing = registrations.get(key);
    if (existing) return Promise.resolve(existing);
    return new Promise((resolve, reject) => {
      const waiters = registrationWaiters.get(key) ?? new Set();
      registrationWaiters.set(key, waiters);
      const wake = () => {
        cancel();
        resolve(registrations.get(key));
      };
      const cancel = delay(registrationTimeoutMs, () => {
        waiters.delete(wake);
        reject(new HttpError(404, `No upload is registered for file key ${key}.`));
      });
      waiters.add(wake);
    });
  }

  function expectCallbackResult(key) {
    let settle;
    const result = new Promise((resolve, reject) => {
      const cancel = delay(callbackTimeoutMs, () => {
        pendingResults.delete(key);
        reject(new HttpError(504, `The app did not confirm the upload of ${key} within ${callbackTimeoutMs} ms.`));
      });
      settle = (outcome) => {
        cancel();
        pendingResults.delete(key);
        resolve(outcome);
      };
    });
    // The timeout may fire while the callback request is still out, before anyone awaits `result`.
    result.catch(() => {});
    pendingResults.set(key, settle);
    return { result, abandon: () => settle({ abandoned: true }) };
  }

  /** Calls the app back as the service does and returns what its onUploadComplete returned. */
  async function completeWithApp(registration, record) {
    const payload = JSON.stringify({
      status: "uploaded",
      file: {
        name: record.name,
        size: record.size,
        type: record.type,
        customId: record.customId,
        key: record.key,
        ...urlsOf(record.key),
        fileHash: record.fileHash,
      },
      origin: ingestOrigin,
      metadata: registration.metadata,
    });
    const expected = registration.awaitServerData ? expectCallbackResult(record.key) : undefined;
    try {
      const response = await fetch(registration.callbackUrl, {
        method: "POST",
        headers: {
          "content-type": "application/json",
          "uploadthing-hook": "callback",
          "x-uploadthing-signature": `${SIGNATURE_PREFIX}${hmacHex(apiKey, payload)}`,
        },
        body: payload,
        signal: AbortSignal.timeout(callbackTimeoutMs),
      });
      await response.arrayBuffer();
      if (!response.ok) throw new HttpError(502, `The app refused the upload callback (HTTP ${response.status}).`);
    } catch (error) {
      expected?.abandon();
      if (error instanceof HttpError) throw error;
      throw new HttpError(502, `The app's upload callback failed: ${error.message}`);
    }
    if (!expected) return null;
    const outcome = await expected.result;
    if (typeof outcome.error === "string") throw new HttpError(502, `The app reported an error for the upload: ${outcome.error}`);
    return outcome.callbackData ?? null;
  }

  function presignedUpload(request) {
    verifySignedUrl(apiKey, ingestOrigin, request.url);
    const url = new URL(request.url, ingestOrigin);
    const key = url.pathname.slice(1);
    if (!FILE_KEY_PATTERN.test(key)) throw new HttpError(404, "No such file key.");
    const params = url.searchParams;
    if (decodeTwice(params.get("x-ut-identifier")) !== appId) throw new HttpError(403, "The URL was signed for another app.");
    const size = Number(decodeTwice(params.get("x-ut-file-size")));
    if (!Number.isSafeInteger(size) || size < 0) throw new HttpError(400, "The presigned URL declares no file size.");
    const acl = decodeTwice(params.get("x-ut-acl")) ?? "public-read";
    if (!ACLS.includes(acl)) throw new HttpError(400, `Unknown ACL ${acl}.`);
    return {
      key,
      size,
      acl,
      name: decodeTwice(params.get("x-ut-file-name")) ?? key,
      type: decodeTwice(params.get("x-ut-file-type")) ?? "application/octet-stream",
      slug: decodeTwice(params.get("x-ut-slug")),
      customId: decodeTwice(params.get("x-ut-custom-id")) ?? null,
      contentDisposition: decodeTwice(params.get("x-ut-content-disposition")) ?? "inline",
    };
  }

  async function handlePut(request, response) {
    const upload = presignedUpload(request);
    if (store.get(upload.key) || uploadsInFlight.has(upload.key)) throw new HttpError(409, `File key ${upload.key} is already uploaded.`);
    uploadsInFlight.add(upload.key);
    try {
      // Uploads from the app's own server (UTApi.uploadFiles) carry no slug and have no callback.
      const registration = upload.slug === undefined ? undefined : await waitForRegistration(upload.key);
      const range = request.headers.range ?? "bytes=0-";
      if (range !== "bytes=0-") throw new HttpError(416, "This service offers no partial uploads; start at byte 0.");
      const body = await readBody(request, upload.size + MULTIPART_OVERHEAD_BYTES);
      let form;
      try {
        form = await new Response(body, { headers: { "content-type": request.headers["content-type"] ?? "" } }).formData();
      } catch {
        throw new HttpError(400, "The upload is not a multipart/form-data body.");
      }
      const file = form.get("file");
      if (!(file instanceof Blob)) throw new HttpError(400, "The multipart body has no `file` field.");
      if (file.size > upload.size) {
        throw new HttpError(413, `The file is ${file.size} bytes, more than the ${upload.size} bytes declared.`);
      }
      if (file.size < upload.size) throw new HttpError(400, `The file is ${file.size} bytes, fewer than the ${upload.size} declared.`);
      const bytes = Buffer.from(await file.arrayBuffer());
      const record = {
        key: upload.key,
        id: randomUUID(),
        name: upload.name,
        size: upload.size,
        type: upload.type,
        customId: upload.customId,
        acl: upload.acl,
        contentDisposition: upload.contentDisposition,
        fileHash: createHash("md5").update(bytes).digest("hex"),
        uploadedAt: Date.now(),
        status: "Uploaded",
      };
      store.put(record, bytes);
      registrations.delete(upload.key);
      let serverData = null;
      if (registration?.awaitServerData) {
        serverData = await completeWithApp(registration, record);
      } else if (registration) {
        completeWithApp(registration, record).catch((error) => console.error(`[uploads fake] ${error.message}`));
      }
      sendJson(response, 200, { ...urlsOf(record.key), fileHash: record.fileHash, serverData });
    } finally {
      uploadsInFlight.delete(upload.key);
    }
  }

  function handleHead(request, response) {
    presignedUpload(request);
    // The fake keeps no partial uploads, so every upload starts at byte 0.
    response.writeHead(200, { "x-ut-range-start": "0" });
    response.end();
  }

  /** `/f/<key>` and `/a/<appId>/<key>`; private files need a URL signed with the api key. */
  function serveFile(request, response, url) {
    const parts = url.pathname.split("/").filter(Boolean);
    const key = parts[0] === "f" && parts.length === 2 ? parts[1] : parts[0] === "a" && parts.length === 3 && parts[1] === appId ? parts[2] : undefined;
    const record = key !== undefined && FILE_KEY_PATTERN.test(key) ? store.get(key) : undefined;
    if (!record) throw new HttpError(404, "No such file.");
    if (record.acl === "private") verifySignedUrl(apiKey, `http://${ufsHost}`, request.url);
    const bytes = store.bytes(key);
    response.writeHead(200, {
      "content-type": record.type,
      "content-length": String(bytes.length),
      "content-disposition": `${record.contentDisposition === "attachment" ? "attachment" : "inline"}; filename*=UTF-8''${encodeURIComponent(record.name)}`,
      "x-content-type-options": "nosniff",
      "cache-control": record.acl === "private" ? "private, no-store" : "public, max-age=31536000, immutable",
    });
    response.end(request.method === "HEAD" ? undefined : bytes);
  }

  /** The file-management calls of UTApi: `POST /v6/<name>` with the api key. */
  const apiCalls = {
    listFiles(body) {
      const limit = body.limit ?? LIST_LIMIT_MAX;
      const offset = body.offset ?? 0;
      if (!Number.isInteger(limit) || limit < 1 || limit > LIST_LIMIT_MAX) throw new HttpError(400, `limit must be 1..${LIST_LIMIT_MAX}.`);
      if (!Number.isInteger(offset) || offset < 0) throw new HttpError(400, "offset must be a whole number ≥ 0.");
      const all = store.list();
      const files = all.slice(offset, offset + limit).map(({ id, customId, key, name, size, status, uploadedAt }) => ({
        id,
        customId,
        key,
        name,
        size,
        status,
        uploadedAt,
      }));
      return { hasMore: offset + limit < all.length, files };
    },
    deleteFiles(body) {
      const fileKeys = fileKeysOf(body, "fileKeys");
      const customIds = fileKeysOf(body, "customIds");
      if (!fileKeys && !customIds) throw new HttpError(400, "Give fileKeys or customIds.");
      // Deleting what is already gone is not an error: the app retries deletes after failures.
      const records = fileKeys ? fileKeys.map((key) => store.get(key)) : customIds.map((id) => store.findByCustomId(id));
      const found = records.filter(Boolean);
      for (const record of found) store.remove(record.key);
      return { success: true, deletedCount: found.length };
    },
    getFileUrl(body) {
      const fileKeys = fileKeysOf(body, "fileKeys");
      const customIds = fileKeysOf(body, "customIds");
      if (!fileKeys && !customIds) throw new HttpError(400, "Give fileKeys or customIds.");
      const selectors = fileKeys ? fileKeys.map((fileKey) => ({ fileKey })) : customIds.map((customId) => ({ customId }));
      const data = selectors.map((selector) => {
        const record = recordFor(selector);
        if (!record) throw new HttpError(404, `No file ${selector.fileKey ?? selector.customId}.`);
        return { key: record.key, url: ufsUrlOf(record.key) };
      });
      return { data };
    },
    renameFiles(body) {
      if (!Array.isArray(body.updates)) throw new HttpError(400, "updates must be a list.");
      const renamed = body.updates.map((update) => {
        const record = recordFor(update);
        if (!record) throw new HttpError(404, `No file ${update.fileKey ?? update.customId}.`);
        if (typeof update.newName !== "string" || update.newName === "") throw new HttpError(400, "newName is missing.");
        return { ...record, name: update.newName };
      });
      for (const record of renamed) store.update(record);
      return { success: true };
    },
    updateACL(body) {
      if (!Array.isArray(body.updates)) throw new HttpError(400, "updates must be a list.");
      const changed = body.updates.map((update) => {
        const record = recordFor(update);
        if (!record) throw new HttpError(404, `No file ${update.fileKey ?? update.customId}.`);
        if (!ACLS.includes(update.acl)) throw new HttpError(400, `acl must be one of ${ACLS.join(", ")}.`);
        return { ...record, acl: update.acl };
      });
      for (const record of changed) store.update(record);
      return { success: true };
    },
    requestFileAccess(body) {
      const record = recordFor(body);
      if (!record) throw new HttpError(404, `No file ${body.fileKey ?? body.customId}.`);
      const expiresInSeconds = body.expiresIn ?? 3600;
      if (!Number.isFinite(expiresInSeconds) || expiresInSeconds <= 0) throw new HttpError(400, "expiresIn is a positive number of seconds.");
      const ufsUrl = signUrl(apiKey, ufsUrlOf(record.key), expiresInSeconds);
      return { url: ufsUrl, ufsUrl };
    },
  };

  async function route(request, response) {
    const url = new URL(request.url, ingestOrigin);
    const method = request.method;
    if (method === "OPTIONS") {
      response.writeHead(204);
      response.end();
      return;
    }
    if (method === "POST" && url.pathname === "/route-metadata") {
      requireApiKey(request);
      register(await readJson(request));
      sendJson(response, 200, { ok: true });
      return;
    }
    if (method === "POST" && url.pathname === "/callback-result") {
      requireApiKey(request);
      const body = await readJson(request);
      if (typeof body.fileKey !== "string" || !store.get(body.fileKey)) throw new HttpError(404, "No such file key.");
      pendingResults.get(body.fileKey)?.(body);
      sendJson(response, 200, { ok: true });
      return;
    }
    if (method === "POST" && url.pathname.startsWith("/v6/")) {
      requireApiKey(request);
      const call = Object.hasOwn(apiCalls, url.pathname.slice(4)) ? apiCalls[url.pathname.slice(4)] : undefined;
      if (!call) throw new HttpError(404, `This service has no call ${url.pathname}.`);
      sendJson(response, 200, call(await readJson(request)));
      return;
    }
    if ((method === "GET" || method === "HEAD") && (url.pathname.startsWith("/f/") || url.pathname.startsWith("/a/"))) {
      serveFile(request, response, url);
      return;
    }
    if (method === "HEAD") return handleHead(request, response);
    if (method === "PUT") return handlePut(request, response);
    throw new HttpError(404, `Nothing at ${method} ${url.pathname}.`);
  }

  function handle(request, response) {
    // The browser PUTs to the presigned URL and loads images from another origin than the app's.
    response.setHeader("access-control-allow-origin", request.headers.origin ?? "*");
    response.setHeader("vary", "Origin");
    response.setHeader("access-control-allow-methods", "GET, HEAD, PUT, POST, OPTIONS");
    response.setHeader("access-control-allow-headers", request.headers["access-control-request-headers"] ?? "content-type");
    response.setHeader("access-control-expose-headers", "x-ut-range-start");
    response.setHeader("access-control-max-age", "600");
    route(request, response).catch((error) => {
      const status = error instanceof HttpError ? error.status : 500;
      if (status === 500) console.error("[uploads fake]", error);
      if (response.headersSent) {
        response.destroy();
        return;
      }
      // An unread request body would otherwise keep the connection busy after the answer.
      response.setHeader("connection", "close");
      sendJson(response, status, { error: status === 500 ? "Internal error in the upload service." : error.message });
    });
  }

  const servers = await listenOnLoopback(handle, port);
  const boundPort = servers[0].address().port;
  ingestOrigin = `http://127.0.0.1:${boundPort}`;
  // The SDK writes http:// file URLs only for a host containing "local".
  ufsHost = `localhost:${boundPort}`;

  const token = Buffer.from(JSON.stringify({ apiKey, appId, regions: [region] })).toString("base64");
  return {
    port: boundPort,
    env: {
      UPLOADTHING_TOKEN: token,
      UPLOADTHING_INGEST_URL: ingestOrigin,
      UPLOADTHING_API_URL: ingestOrigin,
      UPLOADTHING_UFS_HOST: ufsHost,
      UPLOADTHING_UFS_APP_ID_LOCATION: "path",
      UPLOADTHING_CALLBACK_URL: `${appUrl.replace(/\/$/, "")}/api/uploadthing`,
      UPLOADTHING_IS_DEV: "false",
    },
    stop: async () => {
      for (const timer of timers) clearTimeout(timer);
      timers.clear();
      await Promise.all(
        servers.map(
          (server) =>
            new Promise((resolve) => {
              server.close(() => resolve());
              server.closeAllConnections();
            }),
        ),
      );
    },
  };
}

function sendJson(response, status, body) {
  const text = JSON.stringify(body);
  response.writeHead(status, { "content-type": "application/json", "content-length": String(Buffer.byteLength(text)) });
  response.end(text);
}

function listen(server, port, host) {
  return new Promise((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, host, () => {
      server.off("error", reject);
      resolve();
    });
  });
}

/**
 * One port on both loopback addresses: "localhost" in the file URLs resolves to either. With no port
 * given, a port free on 127.0.0.1 may be taken on ::1, so it tries a few.
 */
async function listenOnLoopback(handler, port) {
  for (let attempt = 0; attempt < 5; attempt += 1) {
    const v4 = createServer(handler);
    await listen(v4, port ?? 0, "127.0.0.1");
    const v6 = createServer(handler);
    try {
      await listen(v6, v4.address().port, "::1");
      return [v4, v6];
    } catch (error) {
      await new Promise((resolve) => v4.close(resolve));
      if (error.code !== "EADDRINUSE" || port !== undefined) throw error;
    }
  }
  throw new Error("No port was free on both 127.0.0.1 and ::1 after 5 attempts.");
}
