import { defineConfig } from 'vitest/config';

// Browser tests: headless Debian chromium through playwright-core, against a
// server started on a free port with its own temporary SQLite file.
export default defineConfig({
  test: {
    include: ['tests/e2e/**/*.e2e.ts'],
    environment: 'node',
    testTimeout: 90_000,
    hookTimeout: 180_000,
    fileParallelism: false,
    pool: 'forks',
  },
});
