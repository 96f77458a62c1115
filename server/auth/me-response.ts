// The answer of auth/me, sign-in and invitation acceptance: the user, their workspaces, how they came in.
import { asc, eq, sql } from 'drizzle-orm';
import type { MeResponse, MembershipSummary } from '../../shared/api/auth';
import type { Workspace } from '../../shared/api/workspaces';
import type { Db } from '../db/database';
import { preparedPer } from '../db/prepared';
import { memberships, workspaces, type UserRow } from '../db/schema';

const workspacesOfUser = preparedPer((db: Db) =>
  db
    .select({ workspaceId: workspaces.id, workspaceName: workspaces.name, role: memberships.role })
    .from(memberships)
    .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
    .where(eq(memberships.userId, sql.placeholder('userId')))
    .orderBy(asc(workspaces.name))
    .prepare(),
);

export function userWorkspaces(db: Db, userId: string): MembershipSummary[] {
  return workspacesOfUser(db).all({ userId });
}

/** The user's workspaces as GET /workspaces lists them. */
export function workspacesOf(db: Db, userId: string): Workspace[] {
  return userWorkspaces(db, userId).map((m) => ({ id: m.workspaceId, name: m.workspaceName, role: m.role }));
}

export function meResponse(db: Db, user: UserRow, auth: MeResponse['auth']): MeResponse {
  return {
    user: { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin },
    workspaces: userWorkspaces(db, user.id),
    auth,
  };
}
