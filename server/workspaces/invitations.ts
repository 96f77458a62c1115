// Invitations: an owner invites an e-mail address with a role; the mail carries a single-use link
// valid for seven days; accepting creates the account if needed and adds the membership.
import { and, desc, eq, isNull } from 'drizzle-orm';
import type { InvitationAccept, InvitationPreview } from '../../shared/api/auth';
import type { Invitation, InvitationCreate } from '../../shared/api/workspaces';
import { roleLabels } from '../../shared/api/plain-lists';
import type { AppContext } from '../app-context';
import { recordAudit } from '../audit/audit-log';
import { hashPassword, verifyPassword } from '../auth/passwords';
import { newSecret, sha256Hex } from '../auth/secret-tokens';
import { passwordCheckLimits, RateLimiter } from '../auth/rate-limiter';
import { invitations, memberships, users, workspaces, type InvitationRow, type UserRow } from '../db/schema';
import { ApiError, badRequest, conflict, notFound } from '../errors';
import { invitationMail } from '../mail/messages';

const invitationValidMs = 7 * 24 * 60 * 60 * 1000;

function inviterName(ctx: AppContext, userId: string | null): string {
  if (!userId) return 'A former member';
  const inviter = ctx.db.select({ name: users.name }).from(users).where(eq(users.id, userId)).get();
  return inviter?.name ?? 'A former member';
}

function toInvitation(ctx: AppContext, row: InvitationRow): Invitation {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    invitedBy: inviterName(ctx, row.invitedBy),
    createdAt: row.createdAt,
    expiresAt: row.expiresAt,
    acceptedAt: row.acceptedAt,
  };
}

export function listInvitations(ctx: AppContext, workspaceId: string): Invitation[] {
  return ctx.db
    .select()
    .from(invitations)
    .where(eq(invitations.workspaceId, workspaceId))
    .orderBy(desc(invitations.createdAt))
    .all()
    .map((row) => toInvitation(ctx, row));
}

export async function createInvitation(
  ctx: AppContext,
  workspaceId: string,
  input: InvitationCreate,
  inviter: UserRow,
): Promise<Invitation> {
  const workspace = ctx.db.select().from(workspaces).where(eq(workspaces.id, workspaceId)).get();
  if (!workspace) throw notFound(`No workspace with id ${JSON.stringify(workspaceId)}.`);
  const { secret, hash } = newSecret();
  const expiresAt = new Date(Date.now() + invitationValidMs).toISOString();
  const row = ctx.db.transaction((tx) => {
    const alreadyMember = tx
      .select({ id: memberships.id })
      .from(memberships)
      .innerJoin(users, eq(users.id, memberships.userId))
      .where(and(eq(memberships.workspaceId, workspaceId), eq(users.email, input.email)))
      .get();
    if (alreadyMember) throw conflict(`${input.email} is already a member of this workspace.`, 'already_member');
    // A new invitation replaces an open one for the same address, so only the newest link works.
    tx.delete(invitations)
      .where(and(eq(invitations.workspaceId, workspaceId), eq(invitations.email, input.email), isNull(invitations.acceptedAt)))
      .run();
    const created = tx
      .insert(invitations)
      .values({ workspaceId, email: input.email, role: input.role, tokenHash: hash, invitedBy: inviter.id, expiresAt })
      .returning()
      .get();
    recordAudit(tx, {
      workspaceId,
      actorUserId: inviter.id,
      action: 'invitation.created',
      targetType: 'invitation',
      targetId: created.id,
      summary: `${input.email} invited as ${roleLabels[input.role]}.`,
    });
    return created;
  });
  try {
    await ctx.mailer.send(
      invitationMail({
        to: input.email,
        workspaceName: workspace.name,
        role: input.role,
        invitedBy: inviter.name,
        link: `${ctx.config.publicUrl}/invite/${secret}`,
        expiresAt,
      }),
    );
  } catch (err) {
    // An invitation nobody received only confuses the list; take it back and say so.
    ctx.db.delete(invitations).where(eq(invitations.id, row.id)).run();
    ctx.logger.error('invitation mail failed', { error: err instanceof Error ? err : String(err) });
    throw new ApiError(502, 'mail_failed', `The invitation e-mail to ${input.email} could not be sent, so no invitation was made.`);
  }
  return toInvitation(ctx, row);
}

export function withdrawInvitation(ctx: AppContext, workspaceId: string, id: string, actorUserId: string): void {
  ctx.db.transaction((tx) => {
    const row = tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.id, id), eq(invitations.workspaceId, workspaceId)))
      .get();
    if (!row) throw notFound(`No invitation with id ${JSON.stringify(id.slice(0, 80))} in this workspace.`);
    if (row.acceptedAt) throw conflict('This invitation was already accepted; remove the member instead.', 'already_accepted');
    tx.delete(invitations).where(eq(invitations.id, id)).run();
    recordAudit(tx, {
      workspaceId,
      actorUserId,
      action: 'invitation.withdrawn',
      targetType: 'invitation',
      targetId: id,
      summary: `Invitation of ${row.email} as ${roleLabels[row.role]} withdrawn.`,
    });
  });
}

const invalidLink = () =>
  notFound('This invitation link is not valid: it was used, withdrawn or has expired.', 'invitation_not_found');

function openInvitation(ctx: AppContext, token: string): InvitationRow {
  const row = ctx.db.select().from(invitations).where(eq(invitations.tokenHash, sha256Hex(token))).get();
  if (!row || row.acceptedAt || Date.parse(row.expiresAt) <= Date.now()) throw invalidLink();
  return row;
}

export function previewInvitation(ctx: AppContext, token: string): InvitationPreview {
  const row = openInvitation(ctx, token);
  const workspace = ctx.db.select().from(workspaces).where(eq(workspaces.id, row.workspaceId)).get();
  const existing = ctx.db.select({ id: users.id }).from(users).where(eq(users.email, row.email)).get();
  return {
    email: row.email,
    workspaceName: workspace?.name ?? '',
    role: row.role,
    invitedBy: inviterName(ctx, row.invitedBy),
    expiresAt: row.expiresAt,
    existingUser: existing !== undefined,
  };
}

/**
 * Accepts an invitation and answers the user to sign in as. For an existing account the password
 * check counts against the sign-in limits of that account and of the client (`client`), so an
 * invitation link is no way around them.
 */
export async function acceptInvitation(ctx: AppContext, token: string, input: InvitationAccept, client: string): Promise<UserRow> {
  const invitation = openInvitation(ctx, token);
  const existing = ctx.db.select().from(users).where(eq(users.email, invitation.email)).get();
  let newPasswordHash: string | null = null;
  if (existing) {
    const limits = passwordCheckLimits(new RateLimiter(ctx.db), existing.email, client);
    limits.check();
    if (!(await verifyPassword(input.password, existing.passwordHash))) {
      limits.failed();
      throw new ApiError(401, 'invalid_credentials', `The password is not right for ${existing.email}.`);
    }
    limits.succeeded();
  } else {
    if (!input.name) throw badRequest('Enter your name to create your account.', [{ path: 'name', message: 'enter your name (got nothing)' }]);
    newPasswordHash = await hashPassword(input.password, ctx.config.bcryptCost);
  }
  const now = new Date().toISOString();
  return ctx.db.transaction((tx) => {
    const claimed = tx
      .update(invitations)
      .set({ acceptedAt: now })
      .where(and(eq(invitations.id, invitation.id), isNull(invitations.acceptedAt)))
      .run();
    if (claimed.changes !== 1) throw invalidLink();
    const user =
      existing ??
      tx
        .insert(users)
        .values({ email: invitation.email, name: input.name ?? invitation.email, passwordHash: newPasswordHash ?? '' })
        .returning()
        .get();
    const member = tx
      .select({ id: memberships.id })
      .from(memberships)
      .where(and(eq(memberships.userId, user.id), eq(memberships.workspaceId, invitation.workspaceId)))
      .get();
    if (member) throw conflict('You are already a member of this workspace.', 'already_member');
    tx.insert(memberships).values({ userId: user.id, workspaceId: invitation.workspaceId, role: invitation.role }).run();
    recordAudit(tx, {
      workspaceId: invitation.workspaceId,
      actorUserId: user.id,
      action: 'member.joined',
      targetType: 'user',
      targetId: user.id,
      summary: `${user.email} accepted the invitation and joined as ${roleLabels[invitation.role]}.`,
    });
    return user;
  });
}
