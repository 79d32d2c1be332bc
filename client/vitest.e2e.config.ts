import { fileURLToPath } from 'node:url';
import { defineConfig } from 'vitest/config';

/**
 * Browser tests against a running Morrowline (MORROWLINE_URL). They drive one Chromium each
 * and share the server's sign-in rate limit, so files run one after another.
 */
export default defineConfig({
  resolve: {
    alias: { '@morrowline/shared': fileURLToPath(new URL('../shared/src/index.ts', import.meta.url)) },
  },
  test: {
    environment: 'node',
    include: ['e2e/**/*.e2e.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    fileParallelism: false,
  },
});
