// npm run bench:load: Eclipta as a separate process (seeded demo, fresh data dir, random port) under
// autocannon, 100 connections for 30 s on each of two routes: the stateless environment compute and
// a released case's JSON export, both with a signed-in session cookie. Fails unless every answer was
// a 2xx with no error or timeout; prints latency percentiles and the server's RSS before and after,
// and writes the figures into docs/RELIABILITY.md between the load markers.
import autocannon, { type Result } from 'autocannon';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { cpus, tmpdir } from 'node:os';
import path from 'node:path';
import { childSignIn, repoRoot, startChildServer } from '../tests/api/child-server';

const connections = Number(process.env['BENCH_CONNECTIONS'] ?? 100);
const durationS = Number(process.env['BENCH_DURATION_S'] ?? 30);

const computeBody = {
  bodyId: 'earth',
  orbit: { periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550, inclinationDeg: 97.6, raanDeg: 0, argPeriapsisDeg: 0 },
  epoch: '2027-03-20T12:00:00Z',
  steps: 360,
  surfaces: [{ name: 'nadir panel', normal: 'nadir', areaM2: 0.5, absorptivity: 0.25, emissivity: 0.85 }],
};

function rssMb(pid: number): number {
  const status = readFileSync(`/proc/${pid}/status`, 'utf8');
  const kb = Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? NaN);
  return Math.round(kb / 102.4) / 10;
}

interface Figures {
  name: string;
  result: Result;
  rssBeforeMb: number;
  rssAfterMb: number;
}

const dir = mkdtempSync(path.join(tmpdir(), 'eclipta-load-'));
const server = await startChildServer(path.join(dir, 'data'));
const figures: Figures[] = [];
try {
  const pid = server.child.pid ?? 0;
  const cookie = await childSignIn(server.url, 'viewer@kestrel.test');
  const cases = (await (await fetch(`${server.url}/api/v1/cases`, { headers: { cookie } })).json()) as { items?: { id: string; status: string }[] } | { id: string; status: string }[];
  const released = (Array.isArray(cases) ? cases : (cases.items ?? [])).find((c) => c.status === 'released');
  if (!released) throw new Error('the demo seed has no released case');
  const runs = [
    { name: 'POST /api/v1/environment/compute (360 steps, 1 surface)', method: 'POST' as const, url: `${server.url}/api/v1/environment/compute`, body: JSON.stringify(computeBody) },
    { name: 'GET /api/v1/cases/:id/export?format=json (released case)', method: 'GET' as const, url: `${server.url}/api/v1/cases/${released.id}/export?format=json` },
  ];
  for (const run of runs) {
    const rssBeforeMb = rssMb(pid);
    console.log(`\n${run.name}: ${connections} connections for ${durationS} s`);
    const result = await autocannon({
      url: run.url, method: run.method, connections, duration: durationS, timeout: 30,
      headers: { cookie, 'content-type': 'application/json' }, body: run.body,
    });
    const rssAfterMb = rssMb(pid);
    figures.push({ name: run.name, result, rssBeforeMb, rssAfterMb });
    const l = result.latency;
    console.log(`  requests ${result.requests.total} (${Math.round(result.requests.average)}/s), 2xx ${result['2xx']}, non-2xx ${result.non2xx}, errors ${result.errors}, timeouts ${result.timeouts}`);
    console.log(`  latency ms: p50 ${l.p50}, p90 ${l.p90}, p99 ${l.p99}, max ${l.max}`);
    console.log(`  server RSS: ${rssBeforeMb} MB before, ${rssAfterMb} MB after`);
  }
} finally {
  server.child.kill('SIGTERM');
  await server.exited;
  rmSync(dir, { recursive: true, force: true });
}

const failed = figures.filter((f) => f.result.errors > 0 || f.result.timeouts > 0 || f.result.non2xx > 0 || f.result['2xx'] === 0);
const rows = figures.map((f) => {
  const r = f.result;
  return `| ${f.name} | ${r.requests.total} | ${Math.round(r.requests.average)} | ${r.latency.p50} | ${r.latency.p90} | ${r.latency.p99} | ${r.latency.max} | ${r.errors + r.timeouts} | ${r.non2xx} | ${f.rssBeforeMb} → ${f.rssAfterMb} |`;
});
const section = [
  '<!-- load:begin (written by npm run bench:load) -->',
  `Run ${new Date().toISOString().slice(0, 16).replace('T', ' ')} UTC, Node ${process.versions.node}, ${cpus().length} CPU cores, ${connections} connections × ${durationS} s per route, server started by the script (seeded demo, session cookie of viewer@kestrel.test, request log at info level).`,
  '',
  '| route | requests | req/s | p50 ms | p90 ms | p99 ms | max ms | errors + timeouts | non-2xx | server RSS MB before → after |',
  '| --- | ---: | ---: | ---: | ---: | ---: | ---: | ---: | ---: | --- |',
  ...rows,
  '<!-- load:end -->',
].join('\n');
const doc = path.join(repoRoot, 'docs', 'RELIABILITY.md');
const text = readFileSync(doc, 'utf8');
const marked = /<!-- load:begin[\s\S]*?<!-- load:end -->/;
if (!marked.test(text)) throw new Error('docs/RELIABILITY.md has no load markers');
writeFileSync(doc, text.replace(marked, section));
console.log(`\nfigures written to docs/RELIABILITY.md`);
if (failed.length > 0) {
  console.error(`FAILED: errors, timeouts or non-2xx answers on ${failed.map((f) => f.name).join('; ')}`);
  process.exit(1);
}
