// Builds the Angular client into dist/client/browser (and its .br/.gz copies) unless the build is newer than every source file.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { compressClient } from './compress-client.mjs';
import { run } from './run.mjs';

const output = 'dist/client/browser/index.html';
const inputs = ['src', 'shared', 'angular.json', 'tsconfig.json', 'tsconfig.app.json', 'package-lock.json'];

function newestMtime(path) {
  if (!existsSync(path)) return 0;
  const stat = statSync(path);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(path)) {
    if (entry.endsWith('.spec.ts')) continue;
    newest = Math.max(newest, newestMtime(join(path, entry)));
  }
  return newest;
}

export async function buildClientIfStale() {
  const builtAt = existsSync(output) ? statSync(output).mtimeMs : 0;
  const changedAt = Math.max(...inputs.map(newestMtime));
  if (builtAt > changedAt) {
    console.log('client build is up to date');
    return;
  }
  console.log('building the client (about a minute)');
  await run('npx', ['ng', 'build'], { env: { ...process.env, NG_CLI_ANALYTICS: 'false' } });
  compressClient();
}
