// The answer of auth/me, sign-in and invitation acceptance: the user, their workspaces, how they came in.
import { asc, eq } from 'drizzle-orm';
import type { MeResponse, MembershipSummary } from '../../shared/api/auth';
import type { Db } from '../db/database';
import { memberships, workspaces, type UserRow } from '../db/schema';

export function userWorkspaces(db: Db, userId: string): MembershipSummary[] {
  return db
    .select({ workspaceId: workspaces.id, workspaceName: workspaces.name, role: memberships.role })
    .from(memberships)
    .innerJoin(workspaces, eq(workspaces.id, memberships.workspaceId))
    .where(eq(memberships.userId, userId))
    .orderBy(asc(workspaces.name))
    .all();
}

export function meResponse(db: Db, user: UserRow, auth: MeResponse['auth']): MeResponse {
  return {
    user: { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin },
    workspaces: userWorkspaces(db, user.id),
    auth,
  };
}
