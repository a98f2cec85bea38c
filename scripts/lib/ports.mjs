// A wait until a loopback server answers. Free ports come from the `get-port` package.
//
// Kept our own rather than `wait-on`: this is one fetch loop on Node's own fetch, which the
// package would replace with axios, joi, lodash and rxjs (and axios honours HTTP(S)_PROXY settings,
// which must never route a loopback health check).

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
