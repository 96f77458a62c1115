// `npm test`: every test, in order of speed - unit and API (Vitest), client specs (ng test),
// then browser tests in Chromium (Playwright) against the built product. Stops at the first failing
// suite, says how long each suite took, and ends with one line counting every test that ran.
// `node scripts/test.mjs browser` (npm run test:browser) runs only the suites named (unit, client, browser).
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
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

const allSuites = [
  {
    key: 'unit',
    name: 'unit and API',
    command: ['npx', 'vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${reports}/vitest.json`],
    counts: () => vitestCounts(`${reports}/vitest.json`),
  },
  {
    key: 'client',
    name: 'client',
    command: ['npx', 'ng', 'test', '--watch=false', '--reporters=json', `--output-file=${reports}/client.json`, '--reporters=default'],
    counts: () => vitestCounts(`${reports}/client.json`),
  },
  {
    key: 'browser',
    name: 'browser',
    before: async () => {
      await buildClientIfStale();
      await buildServer();
    },
    command: ['npx', 'playwright', 'test', '--config', 'tests/browser/playwright.config.ts'],
    counts: () => playwrightCounts(`${reports}/browser.json`),
  },
];

const named = process.argv.slice(2);
const unknown = named.filter((key) => !allSuites.some((s) => s.key === key));
if (unknown.length > 0) {
  console.error(`no test suite named ${unknown.join(', ')}; the suites are ${allSuites.map((s) => s.key).join(', ')}`);
  process.exit(2);
}
const suites = named.length === 0 ? allSuites : allSuites.filter((s) => named.includes(s.key));

const seconds = (ms) => `${(ms / 1000).toFixed(1)} s`;
const total = { passed: 0, failed: 0 };
const durations = [];
let failure;
for (const suite of suites) {
  console.log(`\n=== ${suite.name} tests ===`);
  const started = performance.now();
  try {
    await suite.before?.();
    await run(suite.command[0], suite.command.slice(1), { env });
  } catch (error) {
    failure = `${suite.name} tests failed: ${error.message}`;
  }
  const counts = suite.counts();
  total.passed += counts.passed;
  total.failed += counts.failed;
  const took = performance.now() - started;
  durations.push(`${suite.name} ${seconds(took)}`);
  console.log(`${suite.name}: ${counts.passed} passed, ${counts.failed} failed in ${seconds(took)}`);
  if (failure) break;
}

console.log(`\nall: ${total.passed} passed, ${total.failed} failed (${durations.join(', ')})`);
if (failure) {
  console.error(failure);
  process.exit(1);
}
