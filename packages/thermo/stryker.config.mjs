// Mutation testing of the fitting code (`pnpm mutation` at the root; not part of `npm test`): StrykerJS changes
// the source one small edit at a time and reruns the related vitest tests; a change no test notices "survives".
// The whole folder takes hours on a shared 2-core machine, so the default run mutates the files listed here;
// pass `--mutate <glob>` to choose others. Results: packages/thermo/README.md ("Mutation testing").
/** @type {import('@stryker-mutator/api/core').PartialStrykerOptions} */
export default {
  testRunner: 'vitest',
  plugins: ['@stryker-mutator/vitest-runner'],
  vitest: { configFile: 'vitest.config.ts', related: true },
  mutate: ['src/fitting/outliers.ts', 'src/fitting/student-t.ts'],
  coverageAnalysis: 'perTest',
  concurrency: 1,
  timeoutMS: 60_000,
  reporters: ['clear-text', 'progress', 'html', 'json'],
  htmlReporter: { fileName: '../../.data/mutation/thermo.html' },
  jsonReporter: { fileName: '../../.data/mutation/thermo.json' },
  tempDirName: '.stryker-tmp',
  cleanTempDir: 'always',
}
