// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';
import { widgetLoader } from './widget/integration.mjs';
import { estimateWorker } from './src/lib/server/estimates/worker-bundle.ts';
import { backgroundEntry } from './src/lib/server/boot/background-integration.mjs';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), tailwind({ applyBaseStyles: false }), widgetLoader(), estimateWorker(), backgroundEntry()],
  // The standalone server reads HOST and PORT at run time; these are the defaults.
  server: { host: '127.0.0.1', port: 4321 },
  // Without a trusted host list Astro 5 sees every request as http://localhost, and its own
  // origin check then refuses same-origin form posts.
  security: { allowedDomains: [{ hostname: '127.0.0.1' }, { hostname: 'localhost' }] },
  // A Content-Security-Policy header on every rendered page: script-src and style-src list the hash
  // of each script and style Astro emits (the islands' inline bootstrap included), so no other inline
  // script runs. src/middleware.ts adds frame-ancestors (src/lib/server/security-headers.ts).
  experimental: {
    csp: { directives: ["object-src 'none'", "base-uri 'self'", "form-action 'self'"] },
  },
  vite: {
    // piscina starts its threads from its own files, so it stays outside the bundle.
    ssr: { external: ['@node-rs/argon2', 'sharp', 'piscina'] },
  },
});
