// Look-ups the mission, orbit, surface and sweep tests share: demo rows by name, audit events, a
// user who belongs to two workspaces, and a personal API token.
import type request from 'supertest';
import type { TestApp } from './test-app';

export const kestrelOne = 'Kestrel-1 imaging smallsat';
export const kestrelLunar = 'Kestrel Lunar pathfinder';
export const ploverRelay = 'Plover Mars relay';

export function missionIdOf(t: TestApp, name: string): string {
  const row = t.ctx.sqlite.prepare('SELECT id FROM missions WHERE name = ?').get(name) as { id: string } | undefined;
  if (!row) throw new Error(`no mission ${name}`);
  return row.id;
}

export function orbitIdOf(t: TestApp, missionId: string, name: string): string {
  const row = t.ctx.sqlite.prepare('SELECT id FROM orbits WHERE mission_id = ? AND name = ?').get(missionId, name) as { id: string } | undefined;
  if (!row) throw new Error(`no orbit ${name}`);
  return row.id;
}

export function countRows(t: TestApp, table: 'missions' | 'orbits' | 'surfaces' | 'materials', where = '1 = 1', ...params: string[]): number {
  return (t.ctx.sqlite.prepare(`SELECT count(*) AS n FROM ${table} WHERE ${where}`).get(...params) as { n: number }).n;
}

export interface AuditRow {
  action: string;
  summary: string;
  workspace_id: string | null;
  target_id: string | null;
}

export function auditFor(t: TestApp, targetId: string): AuditRow[] {
  return t.ctx.sqlite
    .prepare('SELECT action, summary, workspace_id, target_id FROM audit_events WHERE target_id = ? ORDER BY at, rowid')
    .all(targetId) as AuditRow[];
}

export function libraryMaterialIdOf(t: TestApp, name: string): string {
  const row = t.ctx.sqlite.prepare('SELECT id FROM materials WHERE workspace_id IS NULL AND name = ?').get(name) as { id: string } | undefined;
  if (!row) throw new Error(`no library material ${name}`);
  return row.id;
}

/** A personal API token of the agent's user; read-only when asked. */
export async function tokenOf(agent: request.Agent, readOnly: boolean): Promise<string> {
  const res = await agent.post('/api/v1/tokens').send({ name: readOnly ? 'read-only script' : 'script', readOnly });
  if (res.status !== 201) throw new Error(`token creation answered ${res.status}: ${JSON.stringify(res.body)}`);
  return (res.body as { secret: string }).secret;
}

/** Adds a user (demo password) who is analyst in Kestrel and viewer in Plover. */
export function addTwoWorkspaceUser(t: TestApp, email: string): void {
  const hash = (t.ctx.sqlite.prepare("SELECT password_hash AS h FROM users WHERE email = 'analyst@kestrel.test'").get() as { h: string }).h;
  const id = crypto.randomUUID();
  const now = new Date().toISOString();
  t.ctx.sqlite.prepare('INSERT INTO users (id, email, name, password_hash, is_admin, created_at) VALUES (?, ?, ?, ?, 0, ?)').run(id, email, 'Two Teams', hash, now);
  const add = t.ctx.sqlite.prepare('INSERT INTO memberships (id, user_id, workspace_id, role, created_at) VALUES (?, ?, (SELECT id FROM workspaces WHERE name = ?), ?, ?)');
  add.run(crypto.randomUUID(), id, 'Kestrel', 'analyst', now);
  add.run(crypto.randomUUID(), id, 'Plover', 'viewer', now);
}

export interface KestrelAgents {
  owner: request.Agent;
  analyst: request.Agent;
  thermal: request.Agent;
  viewer: request.Agent;
}

/** A signed-in agent for each demo role of the Kestrel workspace. */
export async function kestrelAgents(t: TestApp): Promise<KestrelAgents> {
  const [owner, analyst, thermal, viewer] = await Promise.all(
    ['owner@kestrel.test', 'analyst@kestrel.test', 'thermal@kestrel.test', 'viewer@kestrel.test'].map((e) => t.signIn(e)),
  );
  return { owner: owner!, analyst: analyst!, thermal: thermal!, viewer: viewer! };
}
