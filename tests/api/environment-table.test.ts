// A workspace's own environment table: members read it, owners and thermal engineers replace it
// (audited, all or nothing), and case derivation uses its pairs in place of the built-in provisional
// ones, naming the row and its source in "why this case". The values are invented for the test.
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { kestrelOne, missionIdOf, orbitIdOf } from './mission-fixtures';
import { createTestApp, workspaceIdOf, type TestApp } from './test-app';

let t: TestApp;
let thermal: request.Agent;
let analyst: request.Agent;
let viewer: request.Agent;
let plover: request.Agent;
let workspaceId: string;

const row = (averagingTimeS: number, hotAlbedo: number, source: string) => ({
  bodyId: 'earth', inclinationMinDeg: 60, inclinationMaxDeg: 90, averagingTimeS,
  hot: { albedo: hotAlbedo, olrWm2: 262 }, cold: { albedo: 0.18, olrWm2: 190 }, source,
});

beforeAll(async () => {
  t = await createTestApp();
  [thermal, analyst, viewer, plover] = await Promise.all(['thermal@kestrel.test', 'analyst@kestrel.test', 'viewer@kestrel.test', 'owner@plover.test'].map((e) => t.signIn(e)));
  workspaceId = workspaceIdOf(t, 'Kestrel');
});
afterAll(() => t.close());

describe('the workspace environment table', () => {
  const url = () => `/api/v1/workspaces/${workspaceId}/environment-table`;

  it('starts empty; a thermal engineer saves it, a viewer reads it, an analyst may not change it, another workspace sees nothing', async () => {
    expect((await viewer.get(url()).expect(200)).body).toEqual({ workspaceId, rows: [], updatedAt: null });
    const saved = await thermal.put(url()).send({ rows: [row(16, 0.42, 'team transcription A'), row(896, 0.31, 'team transcription B')] }).expect(200);
    expect(saved.body.rows).toHaveLength(2);
    expect((await viewer.get(url()).expect(200)).body.rows[1].source).toBe('team transcription B');
    await analyst.put(url()).send({ rows: [] }).expect(403);
    await plover.get(url()).expect(404);
    const audit = t.ctx.sqlite.prepare("SELECT summary FROM audit_events WHERE action = 'environment_table.replaced'").all() as { summary: string }[];
    expect(audit.map((a) => a.summary)).toEqual(['Environment table saved: 2 row(s) (before: 0).']);
  });

  it('refuses a bad row with a 400 naming the field and changes nothing', async () => {
    const res = await thermal.put(url()).send({ rows: [row(16, 0.42, 'ok'), { ...row(60, 1.4, 'bad'), inclinationMaxDeg: 10 }] }).expect(400);
    const paths = (res.body.error.details as { path: string }[]).map((d) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['rows.1.hot.albedo', 'rows.1.inclinationMaxDeg']));
    expect((await viewer.get(url()).expect(200)).body.rows).toHaveLength(2);
  });

  it('case derivation uses the row of the orbit\'s band and averaging time and names it in why this case', async () => {
    const missionId = missionIdOf(t, kestrelOne);
    const orbitId = orbitIdOf(t, missionId, 'Operational SSO 540 km');
    // 97.6 deg retrograde falls in the 60..90 deg band (180 - i); 900 s is nearest the 896 s row
    const res = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'Table', steps: 24, averagingTimeS: 900 }).expect(201);
    const [hot, cold] = res.body.items as { inputs: { conditions: { albedo: number; olrWm2: number }; rationale: string[]; provisional: boolean; environmentSource: string } }[];
    expect([hot!.inputs.conditions.albedo, hot!.inputs.conditions.olrWm2]).toEqual([0.31, 262]);
    expect([cold!.inputs.conditions.albedo, cold!.inputs.conditions.olrWm2]).toEqual([0.18, 190]);
    expect(hot!.inputs.provisional).toBe(false);
    expect(hot!.inputs.rationale.join(' ')).toMatch(/workspace's environment table: Earth, inclination 60\.\.90 deg, averaging 14\.93 min .*team transcription B/);
    // without a time constant, the band's shortest averaging time (the most extreme pair)
    const shortest = await thermal.post(`/api/v1/missions/${missionId}/cases/derive`).send({ orbitId, name: 'Table short', steps: 24 }).expect(201);
    expect(shortest.body.items[0].inputs.conditions.albedo).toBe(0.42);
    expect(shortest.body.items[0].inputs.environmentSource).toMatch(/shortest averaging time/);
  });
});
