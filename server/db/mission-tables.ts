// Missions, their orbits and spacecraft surfaces, and the material library (shared/api/missions.ts).
// An orbit keeps what the user typed (input, with units) beside the canonical values.
import { index, integer, real, sqliteTable, text } from 'drizzle-orm/sqlite-core';
import type { AnyBodyId } from '../../shared/physics/bodies';
import { orbitDefinitions } from '../../shared/api/missions';
import type { SurfaceNormal } from '../../shared/physics/pointing';
import { createdAt, id, updatedAt } from './columns';
import { users, workspaceRef, workspaces } from './account-tables';

export const missions = sqliteTable(
  'missions',
  {
    id: id(),
    workspaceId: workspaceRef(),
    name: text('name').notNull(),
    bodyId: text('body_id').$type<AnyBodyId>().notNull(),
    description: text('description').notNull().default(''),
    startDate: text('start_date').notNull(),
    endDate: text('end_date').notNull(),
    crewed: integer('crewed', { mode: 'boolean' }).notNull().default(false),
    archivedAt: text('archived_at'),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('missions_workspace').on(t.workspaceId)],
);

/** A row that belongs to one mission and goes with it. */
export const missionRef = () =>
  text('mission_id')
    .notNull()
    .references(() => missions.id, { onDelete: 'cascade' });

export const orbits = sqliteTable(
  'orbits',
  {
    id: id(),
    missionId: missionRef(),
    name: text('name').notNull(),
    definition: text('definition', { enum: orbitDefinitions }).notNull(),
    /** JSON of the fields as typed, e.g. {"periapsisAltitudeKm": "550 km"}. */
    input: text('input', { mode: 'json' }).$type<Record<string, number | string>>().notNull(),
    epoch: text('epoch').notNull(),
    periapsisAltitudeKm: real('periapsis_altitude_km').notNull(),
    apoapsisAltitudeKm: real('apoapsis_altitude_km').notNull(),
    semiMajorAxisKm: real('semi_major_axis_km').notNull(),
    eccentricity: real('eccentricity').notNull(),
    periodS: real('period_s').notNull(),
    inclinationDeg: real('inclination_deg').notNull(),
    raanDeg: real('raan_deg').notNull(),
    argPeriapsisDeg: real('arg_periapsis_deg').notNull(),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('orbits_mission').on(t.missionId)],
);

export const materials = sqliteTable(
  'materials',
  {
    id: id(),
    /** null: the built-in library seeded from DOMAIN.md's table; otherwise a workspace's own. */
    workspaceId: text('workspace_id').references(() => workspaces.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    absorptivityBol: real('absorptivity_bol').notNull(),
    emissivityBol: real('emissivity_bol').notNull(),
    absorptivityEol: real('absorptivity_eol').notNull(),
    emissivityEol: real('emissivity_eol').notNull(),
    source: text('source').notNull(),
    createdAt: createdAt(),
  },
  (t) => [index('materials_workspace').on(t.workspaceId)],
);

export const surfaces = sqliteTable(
  'surfaces',
  {
    id: id(),
    missionId: missionRef(),
    name: text('name').notNull(),
    areaM2: real('area_m2').notNull(),
    /** The pointing as JSON: a named normal ("nadir"), a unit vector {"x":..,"y":..,"z":..} or another form of shared/api/pointing.ts. */
    normal: text('normal', { mode: 'json' }).$type<SurfaceNormal>().notNull(),
    materialId: text('material_id')
      .notNull()
      .references(() => materials.id, { onDelete: 'restrict' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('surfaces_mission').on(t.missionId)],
);

export type MissionRow = typeof missions.$inferSelect;
export type OrbitRow = typeof orbits.$inferSelect;
export type MaterialRow = typeof materials.$inferSelect;
export type SurfaceRow = typeof surfaces.$inferSelect;
