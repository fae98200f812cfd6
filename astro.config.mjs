// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import mdx from '@astrojs/mdx';
import tailwindcss from '@tailwindcss/vite';
import auth from 'auth-astro';
import { precompress } from './src/cli/precompress.mjs';

export default defineConfig({
  output: 'server',
  // Lets several working copies of the test suite build side by side (see DEVELOPERS.md).
  outDir: process.env.THROWLINE_BUILD_DIR ?? './dist',
  // Middleware mode: src/cli/serve.mjs puts static files and compression in front of it.
  adapter: node({ mode: 'middleware' }),
  integrations: [react(), mdx(), auth({ configFile: './src/auth.config.ts', injectEndpoints: false }), precompress()],
  // The node adapter ignores the Host header unless it matches allowedDomains, and the
  // cross-site form check then compares Origin against "localhost". The server is meant to
  // run behind whatever name the venue gives it, so any host is accepted here; the origin
  // check itself stays on and still refuses a form posted from another site.
  security: {
    checkOrigin: true,
    allowedDomains: [{ protocol: 'http' }, { protocol: 'https' }],
  },
  devToolbar: { enabled: false },
  vite: {
    plugins: [tailwindcss()],
    build: { assetsInlineLimit: 0 },
  },
});
