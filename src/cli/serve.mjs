// The HTTP front of the built server. It gives EVERY response the security headers (static files
// from public/ and dist/client/ never reach Astro's middleware), answers a URL that cannot be
// percent-decoded in the API's JSON form, fixes the client address, and hands the rest to Astro.
// Astro takes the first X-Forwarded-For value as the client address, whoever sent it; here the
// header is replaced by the address we trust, so every route (and the sign-in limits) sees the
// socket address unless TRUST_PROXY names the proxy.
import http from 'node:http';
import { pathToFileURL } from 'node:url';
import { resolve } from 'node:path';
import { SERVER_ENTRY } from './build-if-stale.mjs';
import { clientAddressFor, parseTrustedProxies } from './client-address.mjs';
import { hstsFromEnv, securityHeaders } from '../server/security-policy.mjs';

// The adapter's entry would otherwise start its own server on import.
process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler } = await import(pathToFileURL(resolve(SERVER_ENTRY)).href);

const headers = Object.entries(securityHeaders(hstsFromEnv(process.env)));
const trusted = parseTrustedProxies(process.env.TRUST_PROXY);
const host = process.env.HOST || 'localhost';
const port = Number(process.env.PORT || 4321);

function badUrl(req, res) {
  const api = (req.url ?? '').startsWith('/api/');
  const body = api
    ? JSON.stringify({ error: 'The address has a broken %-escape (such as %zz or an encoded half of a character); fix the link and try again.' })
    : 'The address has a broken %-escape; fix the link and try again.\n';
  res.writeHead(400, { 'content-type': api ? 'application/json; charset=utf-8' : 'text/plain; charset=utf-8', 'cache-control': 'no-store' });
  res.end(body);
}

const server = http.createServer((req, res) => {
  // Set before the app answers; a header the app writes itself (a page's own CSP with its
  // script hashes, a file's sandbox policy) takes precedence over these.
  for (const [name, value] of headers) res.setHeader(name, value);
  try {
    decodeURI(req.url ?? '/');
  } catch {
    return badUrl(req, res);
  }
  req.headers['x-forwarded-for'] = clientAddressFor(req.socket.remoteAddress, req.headers['x-forwarded-for'], trusted);
  handler(req, res);
});
server.listen(port, host, () => console.log(`[throwline] listening on http://${host}:${port}/`));
for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    server.close(() => process.exit(0));
    server.closeAllConnections();
  });
}
