// npm run bench:soak: the hostile-input properties of tests/api/hostile-input.test.ts, longer and
// with a fresh random seed: SOAK_RUNS bodies a route (default 10000) on every JSON route, then a
// summary. Prints the seed so a failure can be replayed (SOAK_SEED=<seed>).
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { repoRoot } from '../tests/api/child-server';
import { probeEveryRoute, startProbeScene, type RouteProbing } from '../tests/api/hostile-bodies';
import { jsonRoutes } from '../tests/api/route-samples';

process.env['NODE_ENV'] = 'test';
const runs = Number(process.env['SOAK_RUNS'] ?? 10_000);
const seed = Number(process.env['SOAK_SEED'] ?? Date.now() % 2 ** 31);

// Info level: every request's line (method, path, status) is kept, and grepped for 5xx below.
const probing = await startProbeScene({ ECLIPTA_LOG_LEVEL: 'info' });
const { t } = probing;
const started = Date.now();
let run: RouteProbing;
try {
  console.log(`soak: ${runs} hostile bodies on each JSON route, seed ${seed}`);
  run = await probeEveryRoute(probing, runs, seed, (key, sent, ms, failed) => {
    console.log(`  ${failed ? 'FAIL' : 'ok  '} ${key}: ${sent} bodies in ${(ms / 1000).toFixed(1)} s`);
  });
} finally {
  await probing.close();
}
const { total, failures } = run;
// The server's own log of the run: no answer of 5xx, no unhandled error.
const serverErrors = t.logLines.filter((line) => line.includes('"status":5') || line.includes('unhandled error'));
const seconds = (Date.now() - started) / 1000;
console.log(`soak: ${total} requests in ${seconds.toFixed(0)} s (${Math.round(total / seconds)}/s), ${failures.length} failing routes, ${serverErrors.length} log lines of a 5xx or an unhandled error, seed ${seed}`);
for (const f of failures) console.error(`  ${f}`);
for (const line of serverErrors.slice(0, 20)) console.error(`  log: ${line.slice(0, 400)}`);
const doc = path.join(repoRoot, 'docs', 'RELIABILITY.md');
const marked = /<!-- soak:begin[\s\S]*?<!-- soak:end -->/;
const text = readFileSync(doc, 'utf8');
if (marked.test(text)) {
  const line = `Last soak (${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC): \`SOAK_RUNS=${runs} SOAK_SEED=${seed} npm run bench:soak\` — ${total} hostile requests on ${jsonRoutes(t.app).length} routes in ${seconds.toFixed(0)} s, ${failures.length} failing routes; the server log holds ${serverErrors.length} lines with \`"status":5\` or "unhandled error".`;
  writeFileSync(doc, text.replace(marked, `<!-- soak:begin (written by npm run bench:soak) -->\n${line}\n<!-- soak:end -->`));
}
process.exit(failures.length > 0 || serverErrors.length > 0 ? 1 : 0);
