// Thermal solves run in worker threads (server/thermal/thermal-pool.ts), on a real server process
// (tests/api/child-server.ts): while a solve computes for seconds, /api/health still answers; a
// client that leaves ends its solve, and the pool answers the next one. Before the pool, the solve
// held the event loop and health waited for it (docs/RELIABILITY.md). Common practice, no source.
import { describe, expect, it } from 'vitest';
import { childSignIn } from './child-server';
import { childServerForSuite } from './child-server-suite';

const suite = childServerForSuite('eclipta-pool-', 'viewer@kestrel.test');

// 100 nodes × 5000 steps (the per-orbit work bound) whose thermostats, 0.3 K apart, cycle many times
// an orbit: tens of orbits before it settles, seconds of work (about 7 s on an idle core).
const n = 100;
const slowModel = {
  periodS: 5739, steps: 5000, start: 'initial', toleranceK: 1e-6,
  nodes: Array.from({ length: n }, (_, i) => ({ name: `n${i}`, capacitanceJK: 3e4, initialC: 60, absorbedW: i % 2 ? 0 : 50, radiatorAreaM2: 0.1, emissivity: 0.8 })),
  heaters: Array.from({ length: n }, (_, i) => ({ node: `n${i}`, powerW: 200, onC: 20, offC: 20.3 })),
  couplings: Array.from({ length: n - 1 }, (_, i) => ({ from: `n${i}`, to: `n${i + 1}`, conductanceWK: 0.5 })),
};
const smallModel = {
  periodS: 5739, steps: 36,
  nodes: [{ name: 'panel', capacitanceJK: 4000, initialC: 0, absorbedW: 87, radiatorAreaM2: 0.3, emissivity: 0.85 }],
};

const solve = (body: unknown, signal?: AbortSignal) => fetch(`${suite.server.url}/api/v1/thermal/solve`, {
  method: 'POST', headers: { cookie: suite.cookie, 'content-type': 'application/json' }, body: JSON.stringify(body), ...(signal ? { signal } : {}),
});

describe('thermal solves off the request thread', () => {
  it('answers /api/health while a long solve runs, ends the solve when its client leaves, and then solves the next model', async () => {
    const leave = new AbortController();
    let solveSettled = false;
    const slow = solve(slowModel, leave.signal).then(() => 'answered', (e: Error) => e.name).finally(() => (solveSettled = true));
    await new Promise((r) => setTimeout(r, 800));
    const health = await fetch(`${suite.server.url}/api/health`);
    expect(health.status).toBe(200);
    // Health answered before the solve did: the solve is not on the event loop.
    expect(solveSettled).toBe(false);
    leave.abort();
    expect(await slow).toBe('AbortError');
    const next = await solve(smallModel);
    expect(next.status).toBe(200);
    expect(((await next.json()) as { converged: boolean }).converged).toBe(true);
    // The server saw the client leave; nothing in its log is a 5xx.
    expect(suite.server.output.join('\n')).not.toMatch(/"status":5\d\d/);
  }, 60_000);

  it('answers a model that cannot settle with the same 422 not_converged from the worker', async () => {
    const res = await solve({ ...smallModel, maxOrbits: 1, start: 'initial', nodes: [{ ...smallModel.nodes[0], capacitanceJK: 1e8, initialC: 60 }] });
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { code: string; details: { path: string }[] } };
    expect(body.error.code).toBe('not_converged');
    // The error's own field crossed the thread: the node that did not settle.
    expect(body.error.details[0]?.path).toBe('nodes.0');
  }, 30_000);

  it('stops a distance study when its client leaves after the first distance: no further distance is computed', async () => {
    const { url } = suite.server;
    const thermal = await childSignIn(url, 'thermal@kestrel.test');
    const get = async <T>(p: string): Promise<T> => (await (await fetch(`${url}/api/v1/${p}`, { headers: { cookie: thermal } })).json()) as T;
    const missions = await get<{ items: { id: string; name: string }[] }>('missions');
    const mission = missions.items.find((m) => m.name.startsWith('Kestrel-1'))!;
    const models = await get<{ items: { id: string; name: string }[] }>(`missions/${mission.id}/thermal-models`);
    const model = models.items.find((m) => m.name === 'Kestrel-1 pumped loops, 2 loops')!;
    const cases = await get<{ items: { id: string; kind: string }[] }>(`cases?missionId=${mission.id}&status=released`);
    const leave = new AbortController();
    const res = await fetch(`${url}/api/v1/thermal-models/${model.id}/distance-study`, {
      method: 'POST', signal: leave.signal, headers: { cookie: thermal, 'content-type': 'application/json' },
      body: JSON.stringify({ caseId: cases.items.find((c) => c.kind === 'hot')!.id, node: 'hull radiator', distancesAu: Array.from({ length: 12 }, (_, i) => 0.7 + i * 0.1) }),
    });
    expect(res.status).toBe(200);
    const reader = res.body!.getReader();
    let text = '';
    while (!text.includes('"type":"point"')) text += new TextDecoder().decode((await reader.read()).value);
    leave.abort();
    const deadline = Date.now() + 20_000;
    let line: string | undefined;
    while (!(line = suite.server.output.find((l) => l.includes('distance study stopped'))) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 200));
    expect(line).toBeDefined();
    expect(Number(/"done":(\d+)/.exec(line ?? '')?.[1])).toBeLessThan(12);
  }, 60_000);
});
