// Members of a workspace: listing, role changes and removal, never leaving a workspace without an owner.
import { and, asc, count, eq, inArray } from 'drizzle-orm';
import type { Member, Role } from '../../shared/api/workspaces';
import { roleLabels } from '../../shared/api/plain-lists';
import { recordAudit } from '../audit/audit-log';
import type { Db, Tx } from '../db/database';
import { caseSubscriptions, loadCases, memberships, users } from '../db/schema';
import { conflict, notFound } from '../errors';

const memberColumns = {
  userId: users.id,
  email: users.email,
  name: users.name,
  role: memberships.role,
  joinedAt: memberships.createdAt,
};

export function listMembers(db: Db, workspaceId: string): Member[] {
  return db
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.workspaceId, workspaceId))
    .orderBy(asc(users.name), asc(users.email))
    .all();
}


function findMember(tx: Tx, workspaceId: string, userId: string): Member {
  const member = tx
    .select(memberColumns)
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)))
    .get();
  if (!member) throw notFound(`No member with user id ${JSON.stringify(userId.slice(0, 80))} in this workspace.`);
  return member;
}

function ownerCount(tx: Tx, workspaceId: string): number {
  const row = tx
    .select({ n: count() })
    .from(memberships)
    .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.role, 'owner')))
    .get();
  return row?.n ?? 0;
}

const lastOwner = () => conflict('A workspace needs at least one owner.', 'last_owner');

export function changeMemberRole(db: Db, workspaceId: string, userId: string, role: Role, actorUserId: string): Member {
  return db.transaction((tx) => {
    const member = findMember(tx, workspaceId, userId);
    if (member.role === role) return member;
    if (member.role === 'owner' && ownerCount(tx, workspaceId) <= 1) throw lastOwner();
    tx.update(memberships)
      .set({ role })
      .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)))
      .run();
    recordAudit(tx, {
      workspaceId,
      actorUserId,
      action: 'member.role_changed',
      targetType: 'user',
      targetId: userId,
      summary: `Role of ${member.email} changed from ${roleLabels[member.role]} to ${roleLabels[role]}.`,
    });
    return { ...member, role };
  });
}

export function removeMember(db: Db, workspaceId: string, userId: string, actorUserId: string): void {
  db.transaction((tx) => {
    const member = findMember(tx, workspaceId, userId);
    if (member.role === 'owner' && ownerCount(tx, workspaceId) <= 1) throw lastOwner();
    tx.delete(memberships)
      .where(and(eq(memberships.workspaceId, workspaceId), eq(memberships.userId, userId)))
      .run();
    // Leaving a workspace ends its mail: no more release notices of its cases.
    const workspaceSeries = tx.selectDistinct({ seriesId: loadCases.seriesId }).from(loadCases).where(eq(loadCases.workspaceId, workspaceId));
    const ended = tx
      .delete(caseSubscriptions)
      .where(and(eq(caseSubscriptions.userId, userId), inArray(caseSubscriptions.caseSeriesId, workspaceSeries)))
      .run().changes;
    const subscriptions = ended === 0 ? '' : ` Their ${ended} case subscription${ended === 1 ? '' : 's'} ended with it.`;
    recordAudit(tx, {
      workspaceId,
      actorUserId,
      action: 'member.removed',
      targetType: 'user',
      targetId: userId,
      summary: `${member.email} (${roleLabels[member.role]}) was removed from the workspace.${subscriptions}`,
    });
  });
}
