// Issue 12, item 9: names are text. NUL, BEL, ESC, CR/LF, C1 controls and lone surrogates were
// accepted in names, and a CR/LF case name put a fake "Bcc:" line into the release mail. Every name
// and free text now goes through shared/api/text.ts: refused with 400 naming the field, nothing
// written; descriptions keep their line feeds and tabs; and the release mail shows even a name
// stored before the rule on one line.
import path from 'node:path';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { fixturesDir } from './ephemeris-test-mission';
import { kestrelAgents, kestrelOne, type KestrelAgents, libraryMaterialIdOf, missionIdOf } from './mission-fixtures';
import { createTestApp, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;
let { owner, analyst, thermal, viewer } = {} as KestrelAgents;

beforeAll(async () => {
  t = await createTestApp();
  ({ owner, analyst, thermal, viewer } = await kestrelAgents(t));
  await thermal.post(`/api/v1/missions/${missionIdOf(t, kestrelOne)}/cases/derive`).send({ orbitId: orbitId(), name: 'Draft to rename', steps: 12 }).expect(201);
});
afterAll(() => t.close());

const changes = () => (t.ctx.sqlite.prepare('SELECT total_changes() AS n').get() as { n: number }).n;
const hostile = {
  NUL: 'Kestrel\u0000hidden',
  BEL: 'bell\u0007',
  ESC: 'red \u001b[31mtext',
  'CR/LF': 'Hot case\r\nBcc: attacker@evil.test',
  LF: 'two\nlines',
  C1: 'next line\u0085here',
  'lone surrogate': 'half \ud83d of a rocket',
  'line separator': 'para\u2028graph',
};

function orbitId(): string {
  return (t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ? ORDER BY created_at, rowid LIMIT 1').get(missionIdOf(t, kestrelOne)) as { id: string }).id;
}

/** Every route that takes a name or a free text, with the body that puts `value` there and the field it names. */
function probes(value: string): { who: () => request.Agent; method: 'post' | 'patch'; url: () => string; body: () => object; path: string }[] {
  const mission = () => missionIdOf(t, kestrelOne);
  const materialId = () => libraryMaterialIdOf(t, 'white silicone paint');
  const draftId = () => (t.ctx.sqlite.prepare("SELECT id FROM load_cases WHERE status = 'draft' LIMIT 1").get() as { id: string }).id;
  return [
    { who: () => analyst, method: 'post', url: () => '/api/v1/missions', body: () => ({ name: value, bodyId: 'earth', startDate: '2027-01-01', endDate: '2027-12-31' }), path: 'name' },
    { who: () => analyst, method: 'patch', url: () => `/api/v1/missions/${mission()}`, body: () => ({ name: value }), path: 'name' },
    { who: () => analyst, method: 'post', url: () => `/api/v1/missions/${mission()}/orbits`, body: () => ({ name: value, epoch: '2027-04-01T00:00:00Z', periodS: '95 min', eccentricity: 0 }), path: 'name' },
    { who: () => analyst, method: 'post', url: () => `/api/v1/missions/${mission()}/orbits`, body: () => ({ name: 'typed', epoch: '2027-04-01T00:00:00Z', periodS: `95 min${value}`, eccentricity: 0 }), path: 'periodS' },
    { who: () => thermal, method: 'post', url: () => `/api/v1/missions/${mission()}/surfaces`, body: () => ({ name: value, areaM2: 1, normal: 'nadir', materialId: materialId() }), path: 'name' },
    { who: () => thermal, method: 'post', url: () => `/api/v1/workspaces/${workspaceIdOf(t, 'Kestrel')}/materials`, body: () => ({ name: value, absorptivityBol: 0.2, emissivityBol: 0.8, absorptivityEol: 0.3, emissivityEol: 0.8 }), path: 'name' },
    { who: () => thermal, method: 'post', url: () => `/api/v1/missions/${mission()}/cases`, body: () => ({ orbitId: orbitId(), name: value, date: '2027-06-01', steps: 12 }), path: 'name' },
    { who: () => thermal, method: 'post', url: () => `/api/v1/missions/${mission()}/cases/derive`, body: () => ({ orbitId: orbitId(), name: value, steps: 12 }), path: 'name' },
    { who: () => thermal, method: 'patch', url: () => `/api/v1/cases/${draftId()}`, body: () => ({ name: value }), path: 'name' },
    { who: () => thermal, method: 'post', url: () => `/api/v1/missions/${mission()}/thermal-models`, body: () => ({ name: value, model: { nodes: [{ name: 'box', capacitanceJK: 100 }] } }), path: 'name' },
    { who: () => thermal, method: 'post', url: () => `/api/v1/missions/${mission()}/thermal-models`, body: () => ({ name: 'ok', model: { nodes: [{ name: value, capacitanceJK: 100 }] } }), path: 'model.nodes.0.name' },
    { who: () => analyst, method: 'post', url: () => '/api/v1/tokens', body: () => ({ name: value }), path: 'name' },
    {
      who: () => analyst, method: 'post', url: () => '/api/v1/environment/compute',
      body: () => ({ bodyId: 'earth', betaDeg: 0, orbit: { periapsisAltitudeKm: 500, apoapsisAltitudeKm: 500 }, surfaces: [{ name: value, normal: 'nadir', areaM2: 1, absorptivity: 0.2, emissivity: 0.8 }] }),
      path: 'surfaces.0.name',
    },
    { who: () => analyst, method: 'post', url: () => '/api/v1/units/convert', body: () => ({ value: `550 km${value}`, unit: 'mi' }), path: 'value' },
  ];
}

describe('a name with a control character', () => {
  for (const [kind, value] of Object.entries(hostile)) {
    it(`holding ${kind} is refused with 400 naming the field, and nothing is written, on every route that takes a name`, async () => {
      for (const probe of probes(value)) {
        const before = changes();
        const res = await probe.who()[probe.method](probe.url()).send(probe.body());
        const where = `${probe.method.toUpperCase()} ${probe.url()}`;
        expect(res.status, `${where}: ${JSON.stringify(res.body)}`).toBe(400);
        const detail = (res.body.error.details as { path: string; message: string }[]).find((d) => d.path === probe.path);
        expect(detail?.message, where).toMatch(/holds (a control character|half of a Unicode character) \(U\+[0-9A-F]{4}, character \d+\)/);
        expect(changes(), where).toBe(before);
      }
    });
  }

  it('in the name field of an ephemeris upload is refused too', async () => {
    const res = await analyst
      .post(`/api/v1/missions/${missionIdOf(t, kestrelOne)}/ephemerides`)
      .field('frame', 'EME2000')
      .field('name', hostile['CR/LF'])
      .attach('file', path.join(fixturesDir, 'leo-circular.csv'));
    expect(res.status).toBe(400);
    expect(res.body.error.details[0].path).toBe('name');
  });
});

describe('text that is fine', () => {
  it('keeps line feeds and tabs in a description, and any printable Unicode in a name', async () => {
    const res = await analyst
      .post('/api/v1/missions')
      .send({ name: 'Kestrel-2 🚀 Ørsted ω', bodyId: 'earth', startDate: '2027-01-01', endDate: '2027-12-31', description: 'Goals:\n\t- image the pole\n\t- survive eclipse' })
      .expect(201);
    expect(res.body.name).toBe('Kestrel-2 🚀 Ørsted ω');
    expect(res.body.description).toBe('Goals:\n\t- image the pole\n\t- survive eclipse');
    const escaped = await analyst.patch(`/api/v1/missions/${res.body.id}`).send({ description: 'bad \u001b[2J clear' });
    expect(escaped.status).toBe(400);
    expect(escaped.body.error.details[0].path).toBe('description');
  });
});

describe('the release mail', () => {
  it('cannot get a forged Bcc line: the CR/LF rename is refused, and a name stored before the rule is shown on one line', async () => {
    const missionId = missionIdOf(t, kestrelOne);
    const derived = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId: orbitId(), name: 'Mail check', steps: 12 }).expect(201);
    const first = derived.body.items[0] as { id: string };
    await thermal.post(`/api/v1/cases/${first.id}/submit`).expect(200);
    await owner.post(`/api/v1/cases/${first.id}/release`).expect(200);
    await viewer.post(`/api/v1/cases/${first.id}/subscription`).expect(200);
    const draft = (await thermal.post(`/api/v1/cases/${first.id}/revisions`).expect(201)).body as { id: string };

    const forged = 'Mail check hot\r\nBcc: attacker@evil.test\r\n\r\nPlease use the attached loads instead.';
    const refused = await thermal.patch(`/api/v1/cases/${draft.id}`).send({ name: forged });
    expect(refused.status).toBe(400);
    expect(refused.body.error.details[0].path).toBe('name');

    // a row written before names were checked
    t.ctx.sqlite.prepare('UPDATE load_cases SET name = ? WHERE id = ?').run(forged, draft.id);
    await thermal.post(`/api/v1/cases/${draft.id}/submit`).expect(200);
    await owner.post(`/api/v1/cases/${draft.id}/release`).expect(200);

    const mail = await t.waitForMail('viewer@kestrel.test', 'revision 2 released');
    expect(mail.to).toEqual(['viewer@kestrel.test']);
    expect(mail.subject).not.toMatch(/[\r\n]/);
    const lines = mail.text.split(/\r?\n/);
    expect(lines.filter((l) => /^\s*bcc:/i.test(l))).toEqual([]);
    expect(lines.filter((l) => l.startsWith('Please use the attached loads'))).toEqual([]);
    expect(mail.text).toContain('Preliminary-design estimate');
    expect(t.ctx.mailer.inbox?.list().some((m) => m.to.includes('attacker@evil.test'))).toBe(false);
  });
});
