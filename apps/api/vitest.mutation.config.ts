import { defineConfig } from 'vitest/config'
import base from './vitest.config'

/**
 * The tests the mutation run (stryker.config.mjs) reruns for each mutant. By default only the pure unit tests of the
 * services (`src/services/*.test.ts`, fake repositories, no database): well under a second per mutant.
 * MUTATION_API_TESTS=1 adds the integration files below (or give a comma-separated list of test files instead of 1),
 * which drive the same decisions through the HTTP API against PostgreSQL (DATABASE_URL; the global setup drops and
 * migrates its schema once per run). They cost a minute or more per mutant on the shared 2-core machine, so that mode
 * suits a `--mutate` of a few lines. MUTATION_UNIT_TESTS=0 leaves the unit tests out (what the integration tests
 * alone catch).
 */
const API_TESTS = [
  'test/lab-stale-results.test.ts',
  'test/lab-signed-flags.test.ts',
  'test/lab-returned.test.ts',
  'test/lab-story.test.ts',
  'test/lab-joint-fit.test.ts',
]
const api = process.env.MUTATION_API_TESTS ?? ''
const apiTests = api === '1' ? API_TESTS : api.split(',').filter((f) => f.trim() !== '' && f !== '0')
const unitTests = process.env.MUTATION_UNIT_TESTS === '0' ? [] : ['src/services/**/*.test.ts']

export default defineConfig({
  ...base,
  test: {
    ...base.test,
    include: [...unitTests, ...apiTests],
    globalSetup: apiTests.length ? base.test?.globalSetup : [],
    // instrumented code is slower
    testTimeout: 60_000,
  },
})
