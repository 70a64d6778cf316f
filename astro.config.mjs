// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwindcss from '@tailwindcss/vite';

const publicUrl = new URL(process.env.PUBLIC_BASE_URL ?? 'http://127.0.0.1:4321');

/**
 * Host names the server answers for. Without them Astro takes every request to come from
 * "localhost", and its same-origin check refuses the site's own forms. Read at build time.
 */
const allowedHosts = new Set(['127.0.0.1', 'localhost', publicUrl.hostname]);
for (const host of (process.env.LAGWISE_ALLOWED_HOSTS ?? '').split(',')) if (host.trim()) allowedHosts.add(host.trim());

// Pages are prerendered unless they opt out with `export const prerender = false`;
// endpoints under src/pages/api opt out and run on demand in the standalone server.
export default defineConfig({
  site: publicUrl.origin,
  output: 'static',
  // Our server (src/server/serve.ts) runs the built handler; the static pages' CSP goes to a
  // headers file the handler sends with each page.
  adapter: node({ mode: 'standalone', experimentalStaticHeaders: true }),
  integrations: [react()],
  server: {
    host: process.env.HOST ?? '127.0.0.1',
    port: Number(process.env.PORT ?? 4321),
  },
  security: { checkOrigin: true, allowedDomains: [...allowedHosts].map((hostname) => ({ hostname })) },
  // Astro hashes every script and style it emits into the page's Content-Security-Policy; no
  // inline code runs without its hash. The server adds frame-ancestors and friends as a header.
  experimental: {
    csp: {
      directives: [
        "default-src 'self'",
        "img-src 'self' data: blob:",
        "font-src 'self'",
        "connect-src 'self'",
        "object-src 'none'",
        "base-uri 'none'",
        "form-action 'self'",
      ],
    },
  },
  vite: {
    plugins: [tailwindcss()],
    build: {
      // terser packs the islands' code a little tighter than the default minifier (the estimate
      // page's first load is held to 110 kB gzip).
      minify: 'terser',
      rollupOptions: {
        // The engine's and the contracts' modules do nothing on import but declare constants and
        // schemas; saying so lets a page that needs one list from them leave the rest (and the
        // validation library) out of its first load.
        treeshake: { moduleSideEffects: (id) => !/[\\/]src[\\/](engine|schemas)[\\/]/.test(id) },
      },
    },
  },
});
