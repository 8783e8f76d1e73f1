import { defineConfig } from 'vitest/config';

// Nightly validation files (tests/**/*.nightly.ts): too long for `npm test`, run by their own
// npm scripts (validate:coverage).
export default defineConfig({
  test: {
    include: ['tests/**/*.nightly.ts'],
    testTimeout: 60_000,
    hookTimeout: 180_000,
    pool: 'forks',
    maxWorkers: 1,
  },
});
