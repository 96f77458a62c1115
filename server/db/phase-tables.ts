// A mission's attitude modes and phases (shared/api/phases.ts). A mode's pointing refers to the
// mission's surfaces by id (JSON: [{surfaceId, normal}]); a phase flies one mode (a mode that a
// phase flies cannot be deleted) and keeps its nodes' dissipation as JSON.
import { index, integer, sqliteTable, text } from 'drizzle-orm/sqlite-core';
import type { PhaseDissipation } from '../../shared/api/phases';
import type { SurfaceNormal } from '../../shared/api/missions';
import { createdAt, id, updatedAt } from './columns';
import { missionRef } from './mission-tables';

export const attitudeModes = sqliteTable(
  'attitude_modes',
  {
    id: id(),
    missionId: missionRef(),
    name: text('name').notNull(),
    description: text('description').notNull().default(''),
    yawSteering: integer('yaw_steering', { mode: 'boolean' }).notNull().default(false),
    pointing: text('pointing', { mode: 'json' }).$type<{ surfaceId: string; normal: SurfaceNormal }[]>().notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('attitude_modes_mission').on(t.missionId)],
);

export const missionPhases = sqliteTable(
  'mission_phases',
  {
    id: id(),
    missionId: missionRef(),
    name: text('name').notNull(),
    description: text('description').notNull().default(''),
    startDate: text('start_date').notNull(),
    endDate: text('end_date').notNull(),
    modeId: text('mode_id')
      .notNull()
      .references(() => attitudeModes.id),
    dissipation: text('dissipation', { mode: 'json' }).$type<PhaseDissipation[]>().notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('mission_phases_mission').on(t.missionId)],
);

export type AttitudeModeRow = typeof attitudeModes.$inferSelect;
export type MissionPhaseRow = typeof missionPhases.$inferSelect;
