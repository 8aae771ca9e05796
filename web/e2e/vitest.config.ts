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
    // Server round trips on a busy two-core machine take longer than expect.poll's default second.
    expect: { poll: { timeout: 15_000 } },
    setupFiles: ['./support/csp-setup.ts'],
    reporters: ['default'],
  },
});
