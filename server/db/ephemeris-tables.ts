// Uploaded ephemerides (trajectories from the analysts' own propagators) and their points.
// Epochs are kept as ms since the Unix epoch (UTC, doubles so sub-millisecond OEM epochs survive);
// positions in km and velocities in km/s in the declared inertial frame centred on the mission's body.
import { blob, index, integer, primaryKey, real, sqliteTable, text } from 'drizzle-orm/sqlite-core';
import { createdAt, id } from './columns';
import { missionRef } from './mission-tables';
import { users } from './account-tables';

export const ephemerides = sqliteTable(
  'ephemerides',
  {
    id: id(),
    missionId: missionRef(),
    name: text('name').notNull(),
    /** The declared inertial frame, upper case (EME2000, ICRF, GCRF, J2000). */
    frame: text('frame').notNull(),
    format: text('format', { enum: ['csv', 'oem'] }).notNull(),
    rows: integer('rows').notNull(),
    startEpoch: text('start_epoch').notNull(),
    endEpoch: text('end_epoch').notNull(),
    /** Median step between rows, s. */
    stepS: real('step_s').notNull(),
    minAltitudeKm: real('min_altitude_km').notNull(),
    maxAltitudeKm: real('max_altitude_km').notNull(),
    /** Whether the file gave velocities; without them they are found by finite differences. */
    hasVelocity: integer('has_velocity', { mode: 'boolean' }).notNull(),
    /** SHA-256 hex of the uploaded bytes, so a load case can name exactly which file it came from. */
    sha256: text('sha256').notNull(),
    /** The client's file name, cleaned, for display only; the stored file never used it. */
    fileName: text('file_name').notNull(),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
  },
  (t) => [index('ephemerides_mission').on(t.missionId)],
);

/**
 * An ephemeris' points, BLOCK_POINTS consecutive points a row (server/ephemerides/point-blocks.ts
 * has the layout of `data`): block k holds the points first_seq .. first_seq + points - 1.
 */
export const ephemerisPointBlocks = sqliteTable(
  'ephemeris_point_blocks',
  {
    ephemerisId: text('ephemeris_id')
      .notNull()
      .references(() => ephemerides.id, { onDelete: 'cascade' }),
    /** 0-based block number, in file order. */
    block: integer('block').notNull(),
    /** 0-based order in the file of the block's first point. */
    firstSeq: integer('first_seq').notNull(),
    points: integer('points').notNull(),
    data: blob('data', { mode: 'buffer' }).notNull(),
  },
  (t) => [primaryKey({ columns: [t.ephemerisId, t.block] })],
);

export type EphemerisRow = typeof ephemerides.$inferSelect;
