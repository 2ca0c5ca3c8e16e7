// Mutation testing of the services' decision logic (`pnpm mutation` at the root runs thermo's, then this one; not
// part of `npm test`): StrykerJS changes the source one small edit at a time and reruns the tests that reach the
// change (vitest.mutation.config.ts says which); a change no test notices "survives". The whole of src/services would
// take many hours on a shared 2-core machine, so the default run mutates the files listed here, against the pure
// unit tests of the services (no database). Results and how to read them: apps/api/MUTATION.md.
//
//   pnpm --filter @ebullio/api mutation                                   the default set, unit tests only
//   cd apps/api && npx stryker run stryker.config.mjs --mutate 'src/services/workflow.service.ts:100-140'
//
// MUTATION_API_TESTS=1 (or a comma-separated list of test files) adds the integration files of
// vitest.mutation.config.ts, which need the test database (MUTATION_UNIT_TESTS=0 leaves the unit tests out):
//   TEST_PG_PORT=54329 node scripts/test-db.mjs start        (prints DATABASE_URL=…)
//   cd apps/api && MUTATION_API_TESTS=1 DATABASE_URL=postgres://postgres@127.0.0.1:54329/ebullio_test \
//     npx stryker run stryker.config.mjs --mutate 'src/services/stale-results.ts'
// The API test global setup then drops and migrates that database's schema (its name must contain "test"), so do not
// point it at a database another run is using. About a minute per mutant there: keep `--mutate` small.
if (process.env.MUTATION_API_TESTS && !process.env.DATABASE_URL)
  throw new Error(
    'MUTATION_API_TESTS runs the API integration tests, which need the test database: start it with `node scripts/test-db.mjs start` and set DATABASE_URL to the URL it prints.',
  )

/** @type {import('@stryker-mutator/api/core').PartialStrykerOptions} */
export default {
  testRunner: 'vitest',
  plugins: ['@stryker-mutator/vitest-runner'],
  vitest: { configFile: 'vitest.mutation.config.ts', related: true },
  mutate: [
    'src/services/lab-access.ts',
    'src/services/outliers.ts',
    'src/services/stale-results.ts',
    'src/services/point-set.ts',
    'src/services/contributors.ts',
    'src/services/digest.ts',
    'src/services/workflow.service.ts',
    // the signing half, jointFitContributors to returnJointFit (re-check the range when the file changes); the signed
    // content and the engineer's curve are left out
    'src/services/joint-fit-signing.ts:122-303',
  ],
  coverageAnalysis: 'perTest',
  concurrency: 1,
  timeoutMS: 60_000,
  // the initial run of the integration files takes over ten minutes on a loaded machine
  dryRunTimeoutMinutes: 30,
  reporters: ['clear-text', 'progress', 'html', 'json'],
  htmlReporter: { fileName: '../../.data/mutation/api.html' },
  jsonReporter: { fileName: '../../.data/mutation/api.json' },
  // Two levels below the repository root (not apps/api/.stryker-tmp) so that the tests' paths relative to the
  // repository (`../../..` to db/migrate.ts, docs/examples) resolve from inside the sandbox as from apps/api.
  tempDirName: '../../.stryker-tmp',
  // Stryker rewrites the `extends` of this file for a sandbox inside apps/api; from the sandbox above the original
  // `../../tsconfig.base.json` is already right, so no file of this name exists and nothing is rewritten.
  tsconfigFile: 'tsconfig.stryker-keep.json',
  cleanTempDir: 'always',
}
