import { defineConfig } from 'vitest/config';

// Browser journeys against a running stack (scripts/test.mjs starts it and sets E2E_BASE_URL).
export default defineConfig({
  test: {
    root: new URL('.', import.meta.url).pathname,
    include: ['**/*.e2e.ts'],
    environment: 'node',
    testTimeout: 120_000,
    hookTimeout: 120_000,
    fileParallelism: false,
    setupFiles: ['./support/csp-setup.ts'],
    reporters: ['default'],
  },
});
