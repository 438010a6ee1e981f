// @ts-check
import { defineConfig } from 'astro/config';
import node from '@astrojs/node';
import react from '@astrojs/react';
import tailwind from '@astrojs/tailwind';
import { widgetLoader } from './widget/integration.mjs';
import { configCheck } from './scripts/lib/config-check.mjs';

export default defineConfig({
  output: 'server',
  adapter: node({ mode: 'standalone' }),
  integrations: [react(), tailwind({ applyBaseStyles: false }), widgetLoader(), configCheck()],
  // The standalone server reads HOST and PORT at run time; these are the defaults.
  server: { host: '127.0.0.1', port: 4321 },
  // Without a trusted host list Astro 5 sees every request as http://localhost, and its own
  // origin check then refuses same-origin form posts.
  security: { allowedDomains: [{ hostname: '127.0.0.1' }, { hostname: 'localhost' }] },
  vite: {
    ssr: { external: ['@node-rs/argon2', 'sharp'] },
  },
});
