// Preloaded into every `next start` (and `next dev`) with `node --import`: stamps each request with
// the address of the TCP peer it came from, in the `x-arcwright-socket-address` header, because Next
// gives route handlers only headers and never the socket. Any header of that name the client sent is
// removed first, from both views Node keeps (`headers` and `rawHeaders`), so the value the app reads
// is always the socket's: tests/integration/socket-address.test.ts sends a forged one and sees it
// replaced. lib/server/client-address.ts reads it (and X-Forwarded-For only when this peer is one of
// the proxies named in ARCWRIGHT_TRUSTED_PROXY).
import http from "node:http";

export const socketAddressHeader = "x-arcwright-socket-address";

/** Replaces whatever the client sent under the header's name with the socket's peer address. */
function stampSocketAddress(request) {
  delete request.headers[socketAddressHeader];
  const raw = request.rawHeaders;
  for (let i = raw.length - 2; i >= 0; i -= 2) {
    if (raw[i].toLowerCase() === socketAddressHeader) raw.splice(i, 2);
  }
  const address = request.socket.remoteAddress ?? "";
  request.headers[socketAddressHeader] = address;
  raw.push(socketAddressHeader, address);
}

const createServer = http.createServer;
// Next creates its server with http.createServer(listener); ours runs first, before any of Next's code
// sees the request.
http.createServer = function createServerStampingSocketAddress(...args) {
  const server = createServer.apply(this, args);
  server.prependListener("request", stampSocketAddress);
  return server;
};
