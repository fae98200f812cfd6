// Which address a request comes from, decided once at the edge of the server so the sign-in
// limits cannot be reset by sending a made-up X-Forwarded-For. Plain JS: the server entry loads it
// before any TypeScript is compiled.

/** "10.0.0.2, 10.0.0.3" → a set of addresses; IPv4-mapped IPv6 addresses compare as IPv4. */
export function parseTrustedProxies(setting) {
  return new Set(
    String(setting ?? '')
      .split(',')
      .map((s) => normalise(s.trim()))
      .filter(Boolean),
  );
}

function normalise(address) {
  return address.startsWith('::ffff:') ? address.slice(7) : address;
}

/**
 * The client address: the socket's peer, unless that peer is a proxy named in TRUST_PROXY; then
 * the right-most X-Forwarded-For hop that is not itself a trusted proxy (hops to the left of it
 * were written by the client and prove nothing).
 */
export function clientAddressFor(socketAddress, forwardedFor, trusted) {
  const peer = normalise(socketAddress ?? '');
  if (!trusted.has(peer)) return peer;
  const header = Array.isArray(forwardedFor) ? forwardedFor.join(',') : (forwardedFor ?? '');
  const hops = header
    .split(',')
    .map((h) => normalise(h.trim()))
    .filter(Boolean);
  for (let i = hops.length - 1; i >= 0; i--) if (!trusted.has(hops[i])) return hops[i];
  return peer;
}
