import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['test/**/*.test.ts', 'rules/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: 'forks',
    // vitest's default is one worker fewer than the cores: one on CI's two. Most test files wait on
    // a child process, DuckDB or the browser, so two at once keep both cores busy
    maxWorkers: 2,
  },
});
