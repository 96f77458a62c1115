// Load cases (shared/api/cases.ts): each row one revision of a case series; a series groups the
// revisions of the same case, and subscribers follow a series. Inputs and results are JSON
// snapshots so a released revision stays exactly what it was, whatever happens to the mission.
import { index, integer, real, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import type { CaseInputs, CaseResultsContent } from '../../shared/api/case-content';
import { caseKinds, caseStatuses } from '../../shared/api/case-content';
import { createdAt, id, updatedAt } from './columns';
import { missionRef } from './mission-tables';
import { users, workspaceRef } from './account-tables';

export const loadCases = sqliteTable(
  'load_cases',
  {
    id: id(),
    missionId: missionRef(),
    workspaceId: workspaceRef(),
    /** Shared by every revision of one case. */
    seriesId: text('series_id').notNull(),
    revision: integer('revision').notNull(),
    name: text('name').notNull(),
    kind: text('kind', { enum: caseKinds }).notNull(),
    status: text('status', { enum: caseStatuses }).notNull().default('draft'),
    /** Counts every change of the row: an edit names the version it started from (If-Match) and a stale one is refused. */
    version: integer('version').notNull().default(1),
    inputs: text('inputs', { mode: 'json' }).$type<CaseInputs>().notNull(),
    results: text('results', { mode: 'json' }).$type<CaseResultsContent>().notNull(),
    /**
     * Copies of results.total.orbitAverageAbsorbedW and results.betaDeg, written with the results
     * (`resultSummary`), so a list of cases need not read and parse each case's results (~0.3 ms each).
     */
    orbitAverageAbsorbedW: real('orbit_average_absorbed_w'),
    betaDeg: real('beta_deg'),
    /** SHA-256 hex of the canonical content, set at release. */
    checksum: text('checksum'),
    authorId: text('author_id').references(() => users.id, { onDelete: 'set null' }),
    submittedBy: text('submitted_by').references(() => users.id, { onDelete: 'set null' }),
    submittedAt: text('submitted_at'),
    releasedBy: text('released_by').references(() => users.id, { onDelete: 'set null' }),
    releasedAt: text('released_at'),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [
    index('load_cases_mission').on(t.missionId),
    index('load_cases_workspace').on(t.workspaceId),
    uniqueIndex('load_cases_series_revision').on(t.seriesId, t.revision),
  ],
);

export const caseSubscriptions = sqliteTable(
  'case_subscriptions',
  {
    id: id(),
    caseSeriesId: text('case_series_id').notNull(),
    userId: text('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: createdAt(),
  },
  (t) => [uniqueIndex('case_subscriptions_series_user').on(t.caseSeriesId, t.userId)],
);

export type LoadCaseRow = typeof loadCases.$inferSelect;
export type CaseSubscriptionRow = typeof caseSubscriptions.$inferSelect;

/**
 * The review conversation of a case series: comments on a revision, and the reviewer's reason when a
 * revision in review was returned to its author. Kept with the revision it was written on.
 */
export const caseComments = sqliteTable(
  'case_comments',
  {
    id: id(),
    caseId: text('case_id')
      .notNull()
      .references(() => loadCases.id, { onDelete: 'cascade' }),
    seriesId: text('series_id').notNull(),
    revision: integer('revision').notNull(),
    kind: text('kind', { enum: ['comment', 'returned'] }).notNull(),
    text: text('text').notNull(),
    authorId: text('author_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('case_comments_series').on(t.seriesId)],
);

export type CaseCommentRow = typeof caseComments.$inferSelect;
