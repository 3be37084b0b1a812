import { defineConfig } from 'vitest/config';

export default defineConfig({
  // The sources import Kysely and zod as #kysely and #zod (package.json "imports"): the
  // compiled CLI loads one-file bundles of them (scripts/bundle-vendor.mjs); tests of the
  // TypeScript sources use the packages themselves, as they are.
  resolve: { alias: { '#kysely': 'kysely', '#zod': 'zod' } },
  test: {
    include: ['tests/**/*.test.ts'],
    // CLI and runner tests spawn real child processes against the compiled build.
    testTimeout: 60_000,
    hookTimeout: 60_000,
    pool: 'forks',
  },
});
