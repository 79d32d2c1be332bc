import { defineConfig } from 'vitest/config';

/**
 * Browser tests against a running Morrowline (MORROWLINE_URL). They drive one Chromium each
 * and share the server's sign-in rate limit, so files run one after another.
 */
export default defineConfig({
  test: {
    environment: 'node',
    include: ['e2e/**/*.e2e.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    fileParallelism: false,
  },
});
