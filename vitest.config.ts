import { defineConfig } from 'vitest/config';

/**
 * Three projects, each runnable alone:
 * - `unit` (`npm run test:unit`): functions called in this process; no child process, no
 *   bulletin built end to end, nothing built up front. The loop for a one-line change.
 * - `system` (`npm run test:system`): the tool as a user runs it: the CLI in child processes,
 *   small bulletins built and published, builds killed at every step, the worker pool on a
 *   national-size inventory.
 * - `site` (`npm run test:site`): the example built once by the global setup, then the gates.
 * `npm test` runs all three.
 */
const SITE_TESTS = ['test/site/archive.test.ts', 'test/site/languages.test.ts', 'test/site/gates.test.ts'];
const SYSTEM_TESTS = [
  'test/security/**/*.test.ts',
  'test/cli/**/*.test.ts',
  'test/site/publish.test.ts',
  'test/render/escape.test.ts',
  'test/render/wording.test.ts',
  'test/render/longNames.test.ts',
  'test/model/pool.test.ts',
  'test/model/estimateSimulation.test.ts',
];

export default defineConfig({
  test: {
    // No per-test time limit: a loaded CI machine must not fail a test on speed (CI has its own overall limit).
    testTimeout: 0,
    hookTimeout: 0,
    pool: 'forks',
    projects: [
      // isolate: false: the unit files share one module graph per worker, so the tree is imported
      // twice, not 47 times (54.7 s to 18.9 s wall here); a unit test leaves no mocks or state behind.
      { extends: true, test: { name: 'unit', isolate: false, include: ['test/**/*.test.ts'], exclude: [...SITE_TESTS, ...SYSTEM_TESTS] } },
      { extends: true, test: { name: 'system', include: SYSTEM_TESTS } },
      { extends: true, test: { name: 'site', include: SITE_TESTS, globalSetup: ['test/support/globalSetup.ts'] } },
    ],
  },
});
