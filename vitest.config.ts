import { defineConfig } from 'vitest/config';

export default defineConfig({
  test: {
    include: ['tests/**/*.test.ts'],
    // CLI and runner tests spawn real child processes against the compiled build.
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: 'forks',
  },
});
