// The demo team: the fictional "Kestrel" small-satellite workspace and a separate "Plover" one.
// Every demo user has the demo password (ECLIPTA_DEMO_PASSWORD).
import type { Role } from '../../shared/api/workspaces';
import type { Db } from '../db/database';
import { memberships, users, workspaces, type UserRow, type WorkspaceRow } from '../db/schema';

export interface DemoTeam {
  kestrel: WorkspaceRow;
  plover: WorkspaceRow;
  /** By e-mail address. */
  users: Record<string, UserRow>;
}

const demoUsers: { email: string; name: string; isAdmin: boolean; workspace: 'kestrel' | 'plover'; role: Role }[] = [
  { email: 'owner@kestrel.test', name: 'Ines Varga', isAdmin: true, workspace: 'kestrel', role: 'owner' },
  { email: 'analyst@kestrel.test', name: 'Tomas Reyl', isAdmin: false, workspace: 'kestrel', role: 'analyst' },
  { email: 'thermal@kestrel.test', name: 'Maren Oduya', isAdmin: false, workspace: 'kestrel', role: 'thermal' },
  { email: 'viewer@kestrel.test', name: 'Piet Calloway', isAdmin: false, workspace: 'kestrel', role: 'viewer' },
  { email: 'owner@plover.test', name: 'Sela Quenby', isAdmin: false, workspace: 'plover', role: 'owner' },
];

/** Runs inside the seed transaction; the password hash is computed once by the caller. */
export function seedDemoTeam(tx: Pick<Db, 'insert'>, passwordHash: string): DemoTeam {
  const kestrel = tx.insert(workspaces).values({ name: 'Kestrel' }).returning().get();
  const plover = tx.insert(workspaces).values({ name: 'Plover' }).returning().get();
  const byEmail: Record<string, UserRow> = {};
  for (const demo of demoUsers) {
    const user = tx
      .insert(users)
      .values({ email: demo.email, name: demo.name, isAdmin: demo.isAdmin, passwordHash })
      .returning()
      .get();
    byEmail[demo.email] = user;
    const workspace = demo.workspace === 'kestrel' ? kestrel : plover;
    tx.insert(memberships).values({ userId: user.id, workspaceId: workspace.id, role: demo.role }).run();
  }
  return { kestrel, plover, users: byEmail };
}
