// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import mdx from '@astrojs/mdx';
import tailwindcss from '@tailwindcss/vite';
import auth from 'auth-astro';
import { CSP_DIRECTIVES, SCRIPT_SOURCES, STYLE_SOURCES } from './src/server/security-policy.mjs';
import { precompress } from './src/cli/precompress.mjs';
import { searchWorkerBuild } from './src/cli/search-worker-build.mjs';

export default defineConfig({
  output: 'server',
  // Lets several working copies of the test suite build side by side (see DEVELOPERS.md).
  outDir: process.env.THROWLINE_BUILD_DIR ?? './dist',
  // Middleware mode: src/cli/serve.mjs puts static files, compression and the security headers
  // in front of it.
  adapter: node({ mode: 'middleware' }),
  integrations: [react(), mdx(), auth({ configFile: './src/auth.config.ts', injectEndpoints: false }), precompress(), searchWorkerBuild()],
  // The node adapter ignores the Host header unless it matches allowedDomains, and the URL's
  // origin then reads "localhost". The server is meant to run behind whatever name the venue
  // gives it, so any host is accepted here. Astro's own origin check covers only form posts and
  // answers in plain text; src/server/origin-check.ts applies one rule to every write instead.
  security: {
    checkOrigin: false,
    allowedDomains: [{ protocol: 'http' }, { protocol: 'https' }],
  },
  // Astro hashes every script it puts in a page and sends the policy as a header, so no inline
  // script runs unless it is one of ours. Stylesheets stay files: an inlined one would add a
  // style hash, and a hash switches 'unsafe-inline' off for the editor's style attributes.
  experimental: {
    csp: {
      algorithm: 'SHA-256',
      directives: CSP_DIRECTIVES,
      scriptDirective: { resources: SCRIPT_SOURCES },
      styleDirective: { resources: STYLE_SOURCES },
    },
  },
  build: { inlineStylesheets: 'never' },
  devToolbar: { enabled: false },
  vite: {
    plugins: [tailwindcss()],
    build: { assetsInlineLimit: 0 },
  },
});
