// `npm run bench`: runs every bench/*.bench.ts in name order (or only those whose name contains an
// argument: `npm run bench -- environment`) and prints each one's table. A bench file's default
// export is an async function answering rows (bench/bench-table.ts).
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { formatTable, type Bench } from './bench-table';

const here = path.dirname(fileURLToPath(import.meta.url));
const filters = process.argv.slice(2);
const files = readdirSync(here)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => filters.length === 0 || filters.some((want) => f.includes(want)))
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
