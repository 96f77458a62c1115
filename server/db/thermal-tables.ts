// Saved thermal models (shared/api/thermal-models.ts), one mission each, and the last run of each
// model against each load case. The model is one JSON document: its tables refer to each other by
// node name and are only ever replaced together.
import { index, integer, sqliteTable, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import type { ThermalModelContent, ThermalRunResponse } from '../../shared/api/thermal-models';
import { createdAt, id, updatedAt } from './columns';
import { loadCases } from './case-tables';
import { missionRef } from './mission-tables';
import { users, workspaceRef } from './account-tables';

export const thermalModels = sqliteTable(
  'thermal_models',
  {
    id: id(),
    missionId: missionRef(),
    workspaceId: workspaceRef(),
    name: text('name').notNull(),
    description: text('description').notNull().default(''),
    model: text('model', { mode: 'json' }).$type<ThermalModelContent>().notNull(),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('thermal_models_mission').on(t.missionId)],
);

export const thermalRuns = sqliteTable(
  'thermal_runs',
  {
    id: id(),
    modelId: text('model_id')
      .notNull()
      .references(() => thermalModels.id, { onDelete: 'cascade' }),
    caseId: text('case_id')
      .notNull()
      .references(() => loadCases.id, { onDelete: 'cascade' }),
    pass: integer('pass', { mode: 'boolean' }).notNull(),
    /** The model's updatedAt when it ran, to tell a stale result. */
    modelUpdatedAt: text('model_updated_at').notNull(),
    result: text('result', { mode: 'json' }).$type<Omit<ThermalRunResponse, 'stale'>>().notNull(),
    ranBy: text('ran_by').references(() => users.id, { onDelete: 'set null' }),
    ranAt: text('ran_at').notNull(),
  },
  (t) => [uniqueIndex('thermal_runs_model_case').on(t.modelId, t.caseId)],
);

export type ThermalModelRow = typeof thermalModels.$inferSelect;
export type ThermalRunRow = typeof thermalRuns.$inferSelect;
