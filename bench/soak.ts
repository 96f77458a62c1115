// npm run bench:soak: the hostile-input properties of tests/api/hostile-input.test.ts, longer and
// with a fresh random seed: SOAK_RUNS bodies a route (default 10000) on every JSON route, then a
// summary. Prints the seed so a failure can be replayed (SOAK_SEED=<seed>).
import fc from 'fast-check';
import { readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { repoRoot } from '../tests/api/child-server';
import { hostileRequests, probe, startProbeScene } from '../tests/api/hostile-bodies';
import { concretePath, jsonRoutes, routeKey, sampleBody, validatesBody } from '../tests/api/route-samples';

process.env['NODE_ENV'] = 'test';
const runs = Number(process.env['SOAK_RUNS'] ?? 10_000);
const seed = Number(process.env['SOAK_SEED'] ?? Date.now() % 2 ** 31);

// Info level: every request's line (method, path, status) is kept, and grepped for 5xx below.
const probing = await startProbeScene({ ECLIPTA_LOG_LEVEL: 'info' });
const { t, scene, client } = probing;
const started = Date.now();
let total = 0;
const failures: string[] = [];
try {
  console.log(`soak: ${runs} hostile bodies on each JSON route, seed ${seed}`);
  for (const route of jsonRoutes(t.app)) {
    const key = routeKey(route);
    const target = { method: route.method, path: concretePath(route, scene.ids), headers: { cookie: scene.cookies['owner@kestrel.test'] ?? '' }, validatesBody: validatesBody(key) };
    const routeStarted = Date.now();
    const result = await fc.check(
      fc.asyncProperty(hostileRequests(sampleBody(key, scene.ids)), async (hostile) => {
        const problem = await probe(client, t.ctx.sqlite, target, hostile);
        if (problem) throw new Error(problem);
      }),
      { numRuns: runs, seed, endOnFailure: true },
    );
    total += result.numRuns;
    const ms = Date.now() - routeStarted;
    console.log(`  ${result.failed ? 'FAIL' : 'ok  '} ${key}: ${result.numRuns} bodies in ${(ms / 1000).toFixed(1)} s`);
    if (result.failed) failures.push(`${key}: ${String(result.errorInstance ?? '')} counterexample ${JSON.stringify(result.counterexample).slice(0, 500)}`);
  }
} finally {
  await probing.close();
}
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
