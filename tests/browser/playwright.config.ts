// Browser tests: Debian's Chromium (no downloaded browser) against the bundled server on a spare port,
// with a fresh database and data dir each run (tests/browser/serve.mjs).
import { execFileSync } from 'node:child_process';
import { defineConfig } from '@playwright/test';

// A port of its own per run, so that two runs on one machine don't meet; the test workers inherit it.
// The system picks a free one (a random 4400-4899 could be a port a developer's server already holds).
process.env['ECLIPTA_TEST_PORT'] ??= execFileSync(process.execPath, [
  '-e', "const s = require('node:net').createServer().listen(0, '127.0.0.1', () => { process.stdout.write(String(s.address().port)); s.close(); });",
]).toString();
export const browserTestPort = Number(process.env['ECLIPTA_TEST_PORT']);

export default defineConfig({
  testDir: '.',
  testMatch: '**/*.spec.ts',
  outputDir: '../../tmp/browser-results',
  fullyParallel: false,
  workers: 1,
  retries: 0,
  timeout: 60_000,
  expect: { timeout: 10_000 },
  reporter: [['list'], ['json', { outputFile: '../../tmp/test-reports/browser.json' }]],
  use: {
    baseURL: `http://127.0.0.1:${browserTestPort}`,
    screenshot: 'only-on-failure',
    trace: 'off',
    launchOptions: {
      executablePath: '/usr/bin/chromium',
      args: [
        '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
        '--disable-background-networking', '--disable-component-update', '--disable-sync',
      ],
    },
  },
  webServer: {
    command: 'node tests/browser/serve.mjs',
    cwd: '../..',
    url: `http://127.0.0.1:${browserTestPort}/api/health`,
    reuseExistingServer: false,
    timeout: 60_000,
    stdout: 'ignore',
    stderr: 'pipe',
    env: { PORT: String(browserTestPort) },
  },
});
