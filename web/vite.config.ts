import { fileURLToPath, URL } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vitest/config';

// The contracts package is consumed as TypeScript source: Vite compiles it like our own
// code, so web and api share one schema file without a CommonJS/ESM bridge.
export default defineConfig({
  plugins: [react()],
  resolve: {
    alias: {
      '@': fileURLToPath(new URL('./src', import.meta.url)),
      '@shuntwise/contracts': fileURLToPath(new URL('../contracts/src/index.ts', import.meta.url)),
    },
  },
  build: {
    outDir: 'dist',
    sourcemap: false,
    // Read by scripts/measure-bundle.mjs to add up what the sign-in page downloads.
    manifest: true,
    // Every browser we serve supports <link rel=modulepreload>; the polyfill would only add to the sign-in download.
    modulePreload: { polyfill: false },
    chunkSizeWarningLimit: 1500,
  },
  server: {
    proxy: { '/api': 'http://127.0.0.1:8080' },
  },
  test: {
    environment: 'jsdom',
    globals: true,
    setupFiles: ['./src/testing/setup-tests.ts'],
    include: ['src/**/*.test.{ts,tsx}'],
    css: false,
    // Rendering Mantine in jsdom on a busy two-core machine can take seconds per test; a limit, not a measurement.
    testTimeout: 30_000,
  },
});
