/// <reference types="vitest/config" />
import { getViteConfig } from 'astro/config';

// Astro's own Vite config, so tests compile exactly like the app (decorators, import.meta.glob).
export default getViteConfig({
  test: {
    environment: 'node',
    include: ['src/**/*.test.ts', 'src/**/*.test.tsx', 'tests/unit/**/*.test.ts', 'tests/integration/**/*.test.ts'],
    exclude: ['tests/e2e/**', 'node_modules/**', 'dist/**'],
    // A test fails when it writes error output it did not declare.
    setupFiles: ['tests/setup/error-output.ts'],
    testTimeout: 20_000,
    hookTimeout: 30_000,
  },
});
