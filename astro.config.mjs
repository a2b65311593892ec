// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import preact from '@astrojs/preact';
import tailwind from '@astrojs/tailwind';
import auth from 'auth-astro';
import precompress from './scripts/lib/precompress.mjs';

// Astro builds request URLs as http://localhost unless the host is listed here, and then
// refuses every form POST from 127.0.0.1 as cross-site. List the hosts we serve on.
const appHost = process.env.APP_URL ? new URL(process.env.APP_URL).hostname : null;
const hosts = [...new Set(['127.0.0.1', 'localhost', ...(appHost ? [appHost] : [])])];

export default defineConfig({
  output: 'server',
  // `npm test` builds into a folder of its own so it never disturbs a running `npm start`.
  outDir: process.env.GROUNDWORK_OUT_DIR ?? './dist',
  // Middleware mode: scripts/server.mjs owns the HTTP server (compression, static files, timeouts).
  adapter: node({ mode: 'middleware' }),
  // Islands are written against React's API and run on Preact's compatibility layer: the same
  // components for about a tenth of React DOM's 67 KB (gzipped) on every page with an island.
  integrations: [preact({ compat: true }), tailwind({ applyBaseStyles: false }), auth(), precompress()],
  security: {
    checkOrigin: true,
    allowedDomains: hosts.map((hostname) => ({ hostname })),
  },
  server: { host: '127.0.0.1', port: Number(process.env.PORT ?? 4321) },
  devToolbar: { enabled: false },
  vite: {
    ssr: {
      external: ['sharp', '@node-rs/argon2', 'pdfkit'],
      // Bundled for server rendering too, so their `import 'react'` reaches preact/compat.
      noExternal: ['react-hook-form', '@hookform/resolvers', '@tanstack/react-table', '@uppy/react'],
    },
    // Page scripts stay files under /_astro/, never inlined: the Content-Security-Policy allows
    // scripts from our origin and, by hash, only Astro's own island loaders
    // (src/lib/server/security-headers.server.ts).
    build: { assetsInlineLimit: (file) => (file.endsWith('.js') ? false : undefined) },
  },
});
