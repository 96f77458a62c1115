// The mission sweep: NDJSON lines that parse with sweepLine, day-by-day beta consistent with the
// compute route (node drifted by the J2 rate it reports), CSV with units in the header, limits,
// isolation, and a long sweep that lets other requests through and stops when the client leaves.
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { sweepLine, type SweepLine } from '../../shared/api/missions';
import { kestrelOne, missionIdOf, orbitIdOf, tokenOf } from './mission-fixtures';
import { createTestApp, type TestApp } from './test-app';

let t: TestApp;
let viewer: request.Agent;
let plover: request.Agent;
let sweepPath: string;

beforeAll(async () => {
  t = await createTestApp();
  [viewer, plover] = await Promise.all([t.signIn('viewer@kestrel.test'), t.signIn('owner@plover.test')]);
  const missionId = missionIdOf(t, kestrelOne);
  sweepPath = `/api/v1/missions/${missionId}/orbits/${orbitIdOf(t, missionId, 'Operational SSO 540 km')}/sweep`;
});
afterAll(() => t.close());

const lines = (text: string): SweepLine[] => text.trim().split('\n').map((l) => sweepLine.parse(JSON.parse(l)));

describe('GET /api/v1/missions/:id/orbits/:orbitId/sweep', () => {
  it('streams start, one line per day and end, each parsing with sweepLine', async () => {
    const res = await viewer.get(`${sweepPath}?from=2027-06-01&to=2027-06-10`).buffer(true).parse((r, done) => {
      let text = '';
      r.on('data', (c: Buffer) => (text += c.toString()));
      r.on('end', () => done(null, text));
    }).expect(200);
    expect(res.headers['content-type']).toMatch(/^application\/x-ndjson/);
    const parsed = lines(res.body as string);
    expect(parsed[0]).toMatchObject({ type: 'start', days: 10, from: '2027-06-01', to: '2027-06-10', stepDays: 1 });
    // the models in words and the preliminary-design caution (DOMAIN.md, last section)
    const start = parsed[0] as { assumptions?: string[] };
    expect(start.assumptions?.join(' ')).toContain('planetary IR');
    expect(start.assumptions?.join(' ')).toContain('preliminary-design estimate');
    expect(parsed.at(-1)).toEqual({ type: 'end', days: 10 });
    const days = parsed.filter((l) => l.type === 'day');
    expect(days.map((d) => d.date)).toEqual(Array.from({ length: 10 }, (_, i) => `2027-06-${String(i + 1).padStart(2, '0')}`));
    expect(days[0]?.surfaces.map((s) => s.name)).toContain('Zenith radiator');
  });

  it("matches POST /environment/compute at the first day's date, with the node drifted at its J2 rate", async () => {
    const { body: detail } = await viewer.get(sweepPath.replace(/\/orbits\/.*$/, '')).expect(200);
    const saved = detail.orbits.find((o: { name: string }) => o.name === 'Operational SSO 540 km');
    const orbitBase = { semiMajorAxisKm: saved.semiMajorAxisKm, eccentricity: saved.eccentricity, inclinationDeg: saved.inclinationDeg };
    const at = '2028-02-14T12:00:00Z';
    const radiator = detail.surfaces.find((x: { name: string }) => x.name === 'Zenith radiator');
    const materials = (await viewer.get('/api/v1/materials')).body.items as { id: string; absorptivityBol: number; emissivityBol: number }[];
    const fep = materials.find((m) => m.id === radiator.materialId);
    const surfaces = [{ name: 'Zenith radiator', normal: radiator.normal, areaM2: radiator.areaM2, absorptivity: fep?.absorptivityBol, emissivity: fep?.emissivityBol }];
    const probe = await viewer.post('/api/v1/environment/compute').send({ bodyId: 'earth', epoch: at, steps: 12, orbit: { ...orbitBase, raanDeg: saved.raanDeg }, surfaces }).expect(200);
    const days = (Date.parse(at) - Date.parse(saved.epoch)) / 86_400_000;
    const raanDeg = (saved.raanDeg + probe.body.nodalRateDegPerDay * days) % 360;
    const compute = await viewer.post('/api/v1/environment/compute').send({ bodyId: 'earth', epoch: at, steps: 360, orbit: { ...orbitBase, raanDeg }, surfaces }).expect(200);

    const res = await viewer.get(`${sweepPath}?from=2028-02-14&to=2028-03-14&stepDays=7`).buffer(true).parse((r, done) => {
      let text = '';
      r.on('data', (c: Buffer) => (text += c.toString()));
      r.on('end', () => done(null, text));
    }).expect(200);
    const [first] = lines(res.body as string).filter((l) => l.type === 'day');
    if (first?.type !== 'day') throw new Error('no day line');
    expect(first.betaDeg).toBeCloseTo(compute.body.betaDeg, 6);
    expect(first.eclipseFraction).toBeCloseTo(compute.body.eclipseFraction, 6);
    expect(first.solarFluxWm2).toBeCloseTo(compute.body.solarFluxWm2, 6);
    const sweptRadiator = first.surfaces.find((x) => x.name === 'Zenith radiator');
    expect(sweptRadiator?.absorbedW).toBeCloseTo(compute.body.orbitAverage.surfaces[0].absorbedW, 6);
    // Sun-synchronous: the node turns once per tropical year, 360 / 365.2422 deg/day (Vallado ch. 9).
    expect(Math.abs(probe.body.nodalRateDegPerDay - 360 / 365.2422)).toBeLessThan(0.01);
    expect(lines(res.body as string).filter((l) => l.type === 'day').map((d) => d.type === 'day' && d.date)).toEqual(['2028-02-14', '2028-02-21', '2028-02-28', '2028-03-06', '2028-03-13']);
  });

  it('answers CSV (RFC 4180, CRLF) with units in the header and an attachment name', async () => {
    const res = await viewer.get(`${sweepPath}?from=2027-06-01&to=2027-06-03&format=csv&properties=eol`).expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?Kestrel-1-imaging-smallsat_Operational-SSO-540-km_sweep_2027-06-01_2027-06-03_eol\.csv"?$/);
    const rows = (res.text).split('\r\n');
    expect(rows.at(-1)).toBe('');
    expect(rows).toHaveLength(5);
    const header = rows[0] ?? '';
    for (const unit of ['beta (deg)', 'eclipse duration (s)', 'solar distance (AU)', 'solar flux (W/m^2)', 'Zenith radiator absorbed, orbit average (W)']) expect(header).toContain(unit);
    expect(header).toContain('"Ram face blanket absorbed, orbit average (W)"');
    expect(rows[1]?.startsWith('2027-06-01,')).toBe(true);
  });

  it.each([
    ['from=2027-01-01&to=2067-01-02', 'to', '40 years'],
    ['from=2028-01-02&to=2028-01-01', 'to', 'before it starts'],
    ['from=2028-02-30', 'from', '"2028-02-30"'],
    ['stepDays=0', 'stepDays', 'stepDays is 1..365'],
    ['properties=mol', 'properties', '"mol"'],
    ['format=xlsx', 'format', '"xlsx"'],
  ])('refuses ?%s with 400 naming %s', async (query, path, message) => {
    const res = await viewer.get(`${sweepPath}?${query}`).expect(400);
    expect(res.body.error.details[0].path).toBe(path);
    expect(res.body.error.message).toContain(message);
  });

  it("names the day's longest shadow and who cast it: Jupiter's over the Europa demo, every 3.55 days (Jupiter satellite phenomena; from memory)", async () => {
    const missionId = missionIdOf(t, 'Kestrel Europa orbiter (concept)');
    const path = `/api/v1/missions/${missionId}/orbits/${orbitIdOf(t, missionId, 'Polar mapping orbit 200 km')}/sweep`;
    const res = await viewer.get(`${path}?from=2034-03-01&to=2034-03-10`).buffer(true).parse((r, done) => {
      let text = '';
      r.on('data', (c: Buffer) => (text += c.toString()));
      r.on('end', () => done(null, text));
    }).expect(200);
    const days = lines(res.body as string).flatMap((l) => (l.type === 'day' ? [l] : []));
    const shadowed = days.filter((d) => d.longestShadowCastBy.includes('jupiter'));
    // Europa passes behind Jupiter every 3.554 d: two or three of these ten days
    expect(shadowed.length).toBeGreaterThanOrEqual(2);
    expect(shadowed.length).toBeLessThanOrEqual(3);
    for (const d of shadowed) {
      expect(d.longestShadowS / 3600).toBeGreaterThan(2.4);
      expect(d.longestShadowStart?.slice(0, 10)).toBe(d.date);
    }
    const csv = await viewer.get(`${path}?from=2034-03-03&to=2034-03-03&format=csv`).expect(200);
    const [header, row] = csv.text.split('\r\n');
    expect(header).toMatch(/longest shadow \(s\),longest shadow cast by,caution$/);
    expect(row).toMatch(/,(Jupiter|jupiter|[^,]* and Jupiter),/);
  });

  it('is 404 to another workspace', async () => {
    await plover.get(`${sweepPath}?from=2027-06-01&to=2027-06-02`).expect(404);
  });

  it('serves other requests while a long sweep streams, and stops when the client leaves', async () => {
    const server: Server = await new Promise((resolve) => {
      const s = t.app.listen(0, () => resolve(s));
    });
    try {
      const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
      const auth = { Authorization: `Bearer ${await tokenOf(viewer, true)}` };
      const abort = new AbortController();
      const sweep = await fetch(`${base}${sweepPath}?from=2027-01-01&to=2066-12-31`, { headers: auth, signal: abort.signal });
      expect(sweep.status).toBe(200);
      const reader = sweep.body?.getReader();
      const firstChunk = await reader?.read();
      expect(new TextDecoder().decode(firstChunk?.value)).toContain('"type":"start"');
      // 40 years of days take seconds; a list of missions answers meanwhile. Order, not speed (speed
      // belongs to bench/): the list answers while the sweep is unfinished, as the stop below shows.
      const other = await fetch(`${base}/api/v1/missions`, { headers: auth });
      expect(other.status).toBe(200);
      expect(t.logLines.some((l) => l.includes('mission sweep stopped'))).toBe(false);
      abort.abort();
      // a deadline for a loaded machine, not a measure: the stop comes at the next chunk
      const stopped = await vi.waitFor(() => {
        const line = t.logLines.find((l) => l.includes('mission sweep stopped'));
        if (!line) throw new Error('the sweep has not stopped yet');
        return line;
      }, { timeout: 15_000, interval: 50 });
      // stopped before its last day: the sweep was still running when the list answered
      expect(JSON.parse(stopped).daysWritten).toBeLessThan(14610);
    } finally {
      await new Promise((resolve) => server.close(resolve));
    }
  });
});
