import { defineConfig } from 'vitest/config';

// `npm run fuzz`: the fuzz suite alone, 10,000 cases unless FUZZ_RUNS says otherwise (FUZZ_SEED sets the seed)
export default defineConfig({
  test: {
    include: ['test/fuzz/**/*.test.ts'],
    env: { FUZZ_RUNS: process.env.FUZZ_RUNS ?? '10000' },
    testTimeout: 0,
    pool: 'forks',
  },
});
