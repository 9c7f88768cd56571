import { defineConfig } from 'vitest/config';

// Time limits are ceilings for a busy 2-core machine, not waits: each test waits for its own conditions.

export default defineConfig({
  test: { include: ['test/**/*.test.ts', 'src/**/*.test.ts'], testTimeout: 90_000, hookTimeout: 90_000, pool: 'forks' },
});
