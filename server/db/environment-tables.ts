// A workspace's own environment table: paired hot/cold albedo and OLR by body, inclination band and
// averaging time, each row with its source (shared/api/environment-table.ts).
import { index, integer, real, sqliteTable, text } from 'drizzle-orm/sqlite-core';
import { bodyIds } from '../../shared/physics/bodies';
import { createdAt, id } from './columns';
import { workspaceRef } from './account-tables';

export const environmentTableRows = sqliteTable(
  'environment_table_rows',
  {
    id: id(),
    workspaceId: workspaceRef(),
    /** The row's place in the table as the user ordered it. */
    position: integer('position').notNull(),
    bodyId: text('body_id', { enum: bodyIds }).notNull(),
    inclinationMinDeg: real('inclination_min_deg').notNull(),
    inclinationMaxDeg: real('inclination_max_deg').notNull(),
    averagingTimeS: real('averaging_time_s').notNull(),
    hotAlbedo: real('hot_albedo').notNull(),
    hotOlrWm2: real('hot_olr_wm2').notNull(),
    coldAlbedo: real('cold_albedo').notNull(),
    coldOlrWm2: real('cold_olr_wm2').notNull(),
    source: text('source').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('environment_table_rows_workspace').on(t.workspaceId, t.position)],
);

export type EnvironmentTableDbRow = typeof environmentTableRows.$inferSelect;
