// `npm test`: every test, in order of speed - unit and API (Vitest), client specs (ng test),
// then browser tests in Chromium (Playwright) against the built product. Stops at the first failing
// suite, and ends with one line counting every test that ran.
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { run } from './run.mjs';
import { buildServer } from './build-server.mjs';
import { buildClientIfStale } from './client-build.mjs';

const reports = 'tmp/test-reports';
rmSync(reports, { recursive: true, force: true });
mkdirSync(reports, { recursive: true });
const env = { ...process.env, NG_CLI_ANALYTICS: 'false' };

function vitestCounts(file) {
  if (!existsSync(file)) return { passed: 0, failed: 0 };
  const report = JSON.parse(readFileSync(file, 'utf8'));
  return { passed: report.numPassedTests, failed: report.numFailedTests };
}

function playwrightCounts(file) {
  if (!existsSync(file)) return { passed: 0, failed: 0 };
  const { stats } = JSON.parse(readFileSync(file, 'utf8'));
  return { passed: stats.expected + stats.flaky, failed: stats.unexpected };
}

const suites = [
  {
    name: 'unit and API',
    command: ['npx', 'vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${reports}/vitest.json`],
    counts: () => vitestCounts(`${reports}/vitest.json`),
  },
  {
    name: 'client',
    command: ['npx', 'ng', 'test', '--watch=false', '--reporters=json', `--output-file=${reports}/client.json`, '--reporters=default'],
    counts: () => vitestCounts(`${reports}/client.json`),
  },
  {
    name: 'browser',
    before: async () => {
      await buildClientIfStale();
      await buildServer();
    },
    command: ['npx', 'playwright', 'test', '--config', 'tests/browser/playwright.config.ts'],
    counts: () => playwrightCounts(`${reports}/browser.json`),
  },
];

const total = { passed: 0, failed: 0 };
let failure;
for (const suite of suites) {
  console.log(`\n=== ${suite.name} tests ===`);
  try {
    await suite.before?.();
    await run(suite.command[0], suite.command.slice(1), { env });
  } catch (error) {
    failure = `${suite.name} tests failed: ${error.message}`;
  }
  const counts = suite.counts();
  total.passed += counts.passed;
  total.failed += counts.failed;
  console.log(`${suite.name}: ${counts.passed} passed, ${counts.failed} failed`);
  if (failure) break;
}

console.log(`\nall: ${total.passed} passed, ${total.failed} failed`);
if (failure) {
  console.error(failure);
  process.exit(1);
}
