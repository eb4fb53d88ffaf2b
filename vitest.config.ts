import { defineConfig } from 'vitest/config';

/**
 * Two projects. `site` holds the tests that read the example site built once by the global setup;
 * `unit` holds everything else and builds nothing up front, so a change can be tested in seconds
 * with `npm run test:unit` (or `npx vitest run --project unit test/...`).
 */
const SITE_TESTS = ['test/site/archive.test.ts', 'test/site/languages.test.ts', 'test/site/gates.test.ts'];

export default defineConfig({
  test: {
    // No per-test time limit: a loaded CI machine must not fail a test on speed (CI has its own overall limit).
    testTimeout: 0,
    hookTimeout: 0,
    pool: 'forks',
    projects: [
      { extends: true, test: { name: 'unit', include: ['test/**/*.test.ts'], exclude: SITE_TESTS } },
      { extends: true, test: { name: 'site', include: SITE_TESTS, globalSetup: ['test/support/globalSetup.ts'] } },
    ],
  },
});
