// Loopback ports: a free one (from the `get-port` package) and a wait until a server answers.
//
// Kept our own rather than `wait-on`: this is one fetch loop on Node's own fetch, which the
// package would replace with axios, joi, lodash and rxjs (and axios honours HTTP(S)_PROXY settings,
// which must never route a loopback health check).

/**
 * A TCP port on 127.0.0.1 that nothing listens on right now, from `get-port`. The package is loaded on
 * first use: the entry scripts import this module before `npm ci` has installed it on a fresh clone.
 */
export async function freePort() {
  const { default: getPort } = await import("get-port");
  return getPort({ host: "127.0.0.1" });
}

/** Polls `url` until it answers with `expectStatus`, or fails after `timeoutMs`. */
export async function waitForHttp(url, { timeoutMs = 60_000, expectStatus = 200 } = {}) {
  const deadline = Date.now() + timeoutMs;
  let last = "no answer";
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url, { signal: AbortSignal.timeout(5_000) });
      if (response.status === expectStatus) return;
      last = `status ${response.status}`;
    } catch (error) {
      last = error.cause?.code ?? error.message;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not answer ${expectStatus} within ${timeoutMs} ms (last: ${last})`);
}
