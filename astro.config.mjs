// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import preact from '@astrojs/preact';
import tailwind from '@astrojs/tailwind';
import auth from 'auth-astro';
import modulePreloads from './scripts/lib/module-preloads.mjs';
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
  integrations: [preact({ compat: true }), tailwind({ applyBaseStyles: false }), auth(), modulePreloads(), precompress()],
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
    build: {
      assetsInlineLimit: (file) => (file.endsWith('.js') ? false : undefined),
      // Shared chunks under 5 KB are merged into a chunk loaded with them: over HTTP/1.1 a phone
      // opens six connections, and on slow 4G each request costs about 0.6 s, far more than a few
      // KB more to download. Halves the checklist's and the queue's script files (`npm run
      // bench:pages`, README).
      rollupOptions: { output: { experimentalMinChunkSize: 5_000 } },
    },
  },
});
