// The server process: Astro's standalone handler behind a plain node:http server whose only
// job is to fix the client address. Astro takes the first X-Forwarded-For value as the client
// address, whoever sent it; here the header is replaced by the address we trust, so every
// route (and the sign-in limits) sees the socket address unless TRUST_PROXY names the proxy.
import http from 'node:http';
import { resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { SERVER_ENTRY } from './build-if-stale.mjs';
import { clientAddressFor, parseTrustedProxies } from './client-address.mjs';

process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler } = await import(pathToFileURL(resolve(SERVER_ENTRY)).href);
const trusted = parseTrustedProxies(process.env.TRUST_PROXY);

const server = http.createServer((req, res) => {
  req.headers['x-forwarded-for'] = clientAddressFor(req.socket.remoteAddress, req.headers['x-forwarded-for'], trusted);
  handler(req, res);
});
const host = process.env.HOST || 'localhost';
const port = Number(process.env.PORT || 4321);
server.listen(port, host, () => console.log(`Throwline is listening on http://${host}:${port}/`));
for (const signal of ['SIGINT', 'SIGTERM']) process.on(signal, () => server.close(() => process.exit(0)));
