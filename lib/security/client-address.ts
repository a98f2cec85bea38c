/**
 * The header scripts/lib/socket-address.mjs sets on every request from the TCP connection's peer,
 * after removing any header of that name the client sent (Next exposes no socket to route handlers).
 */
export const socketAddressHeader = "x-arcwright-socket-address";

/** What a request's address is called when it came in some other way than through our launcher. */
export const unknownAddress = "unknown";

type HeaderSource = Headers | Record<string, unknown> | undefined;

function headerOf(headers: HeaderSource, name: string): string | undefined {
  if (headers instanceof Headers) return headers.get(name) ?? undefined;
  const value = headers?.[name];
  return typeof value === "string" ? value : undefined;
}

/** One spelling per address: lower case, and an IPv4 address seen through an IPv6 socket as plain IPv4. */
function canonical(address: string): string {
  const lower = address.trim().toLowerCase();
  return lower.startsWith("::ffff:") && lower.includes(".") ? lower.slice("::ffff:".length) : lower;
}

const looksLikeIp = (address: string) => /^[\d.]+$/.test(address) || (address.includes(":") && /^[\da-f:.]+$/.test(address));

/**
 * The address a request came from, for rate limits: the socket's peer, unless that peer is one of
 * `trustedProxies`; then the nearest X-Forwarded-For entry (read from the right, the end the proxies
 * append to) that is no trusted proxy. Entries further left were written by the client and are never
 * believed (OWASP Cheat Sheet "Denial of Service", and MDN "X-Forwarded-For": security and privacy
 * concerns). Without the socket header (a request that did not come through scripts/serve.mjs),
 * "unknown".
 */
export function clientAddressOf(headers: HeaderSource, trustedProxies: readonly string[]): string {
  const socket = headerOf(headers, socketAddressHeader);
  if (socket === undefined || socket.trim() === "") return unknownAddress;
  const peer = canonical(socket);
  const trusted = new Set(trustedProxies.map(canonical));
  if (!trusted.has(peer)) return peer;
  const hops = (headerOf(headers, "x-forwarded-for") ?? "").split(",").map(canonical);
  for (let i = hops.length - 1; i >= 0; i--) {
    if (trusted.has(hops[i])) continue;
    // The proxy writes a well-formed address; anything else means the chain cannot be read.
    return looksLikeIp(hops[i]) ? hops[i] : peer;
  }
  return peer;
}
