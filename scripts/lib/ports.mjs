// Loopback ports: a free one for throwaway servers, and a wait until a server answers.
import { createServer } from "node:net";

/** A TCP port on 127.0.0.1 that nothing listens on right now. */
export function freePort() {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.unref();
    server.on("error", reject);
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address();
      server.close(() => resolve(port));
    });
  });
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
