// What needs a member in one workspace (issue 15 item 7), built from the case list the member may
// see, the review conversation and their subscriptions: no rule of its own beyond picking.
import { eq } from 'drizzle-orm';
import type { WorkspaceOverview } from '../../shared/api/cases';
import type { AppContext } from '../app-context';
import { caseSubscriptions } from '../db/schema';
import { caseEditors } from './case-access';
import { commentsOf, listCases } from './case-views';
import type { Role } from '../../shared/api/workspaces';

const FOLLOWED_LIMIT = 10;

export function workspaceOverview(ctx: AppContext, userId: string, workspaceId: string, role: Role): WorkspaceOverview {
  const cases = listCases(ctx, userId, {}).filter((c) => c.workspaceId === workspaceId);
  const reviewer = caseEditors.includes(role);
  const waitingForReview = reviewer ? cases.filter((c) => c.status === 'review' && c.author?.id !== userId) : [];
  const returnedToMe = cases
    .filter((c) => c.status === 'draft' && c.author?.id === userId)
    .flatMap((c) => {
      const comment = commentsOf(ctx.db, c.seriesId).findLast((m) => m.kind === 'returned' && m.revision === c.revision);
      return comment ? [{ case: c, comment }] : [];
    });
  const followedSeries = new Set(
    ctx.db.select({ s: caseSubscriptions.caseSeriesId }).from(caseSubscriptions).where(eq(caseSubscriptions.userId, userId)).all().map((r) => r.s),
  );
  const followed = cases
    .filter((c) => followedSeries.has(c.seriesId))
    .sort((a, b) => (b.releasedAt ?? b.updatedAt).localeCompare(a.releasedAt ?? a.updatedAt))
    .slice(0, FOLLOWED_LIMIT);
  const stale = cases.filter((c) => c.status === 'released' && c.inputsChanged);
  return { waitingForReview, returnedToMe, followed, stale };
}
