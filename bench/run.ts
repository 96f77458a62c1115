// `npm run bench`: the headline table of bench/headline.ts (every issue-16 figure beside its anchor
// and target, one run). `npm run bench -- environment` runs the bench/*.bench.ts whose name
// contains an argument, `npm run bench -- all` every one, in name order, printing each one's table.
// A bench file's default export is an async function answering rows (bench/bench-table.ts).
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { formatTable, type Bench } from './bench-table';

const here = path.dirname(fileURLToPath(import.meta.url));
const filters = process.argv.slice(2);
const files = filters.length === 0
  ? ['headline.ts']
  : readdirSync(here)
    .filter((f) => f.endsWith('.bench.ts'))
    .filter((f) => filters.includes('all') || filters.some((want) => f.includes(want)))
    .sort();

if (files.length === 0) {
  console.log(`no bench/*.bench.ts${filters.length ? ` matching ${filters.join(', ')}` : ''}`);
}
let failed = false;
for (const file of files) {
  console.log(`\n== ${file}`);
  const module = (await import(pathToFileURL(path.join(here, file)).href)) as { default?: unknown };
  if (typeof module.default !== 'function') {
    console.log('   skipped: no default export function');
    continue;
  }
  try {
    const rows = await (module.default as Bench)();
    console.log(formatTable(rows));
  } catch (error) {
    failed = true;
    console.log(`   failed: ${error instanceof Error ? error.stack ?? error.message : String(error)}`);
  }
}
if (failed) process.exitCode = 1;
