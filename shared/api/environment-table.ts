// A workspace's own environment table (physics/environment-table.ts).
//   GET /api/v1/workspaces/:workspaceId/environment-table   -> environmentTable     (any member)
//   PUT /api/v1/workspaces/:workspaceId/environment-table   environmentTablePut -> environmentTable (owner, thermal)
// The PUT replaces the whole table in one transaction.
import { z } from 'zod';
import { bodyIds } from '../physics/bodies';
import type { EnvironmentTableRow } from '../physics/environment-table';

const num = (label: string) => z.number({ message: `${label} must be a number` });
const albedo = num('albedo').min(0, 'albedo is 0..1').max(1, 'albedo is 0..1');
const olr = num('OLR').min(0, 'OLR cannot be negative').max(20000, 'OLR is at most 20000 W/m²');
const pair = z.strictObject({ albedo, olrWm2: olr });

export const environmentTableRow = z
  .strictObject({
    bodyId: z.enum(bodyIds, { message: `bodyId is one of ${bodyIds.join(', ')}` }),
    inclinationMinDeg: num('lowest inclination').min(0, 'inclination is 0..180 deg').max(180, 'inclination is 0..180 deg'),
    inclinationMaxDeg: num('highest inclination').min(0, 'inclination is 0..180 deg').max(180, 'inclination is 0..180 deg'),
    averagingTimeS: num('averaging time').positive('the averaging time must be above 0 s').max(1e7, 'the averaging time is at most 10,000,000 s'),
    hot: pair,
    cold: pair,
    source: z.string().trim().min(1, 'say where the values come from').max(300, 'a source has at most 300 characters'),
  })
  .refine((r) => r.inclinationMinDeg <= r.inclinationMaxDeg, { path: ['inclinationMaxDeg'], message: 'the band ends below where it starts' });

export const environmentTablePut = z.strictObject({
  rows: z.array(environmentTableRow).max(200, 'at most 200 rows'),
});

export const environmentTable = z.object({
  workspaceId: z.string(),
  rows: z.array(environmentTableRow),
  /** ISO 8601 UTC of the last change; null for a table never saved. */
  updatedAt: z.string().nullable(),
});

export type EnvironmentTablePut = z.infer<typeof environmentTablePut>;
export type EnvironmentTableResponse = z.infer<typeof environmentTable>;

// The stored row must be what the physics takes; fails to compile if they drift apart.
export const asTableRow = (r: z.infer<typeof environmentTableRow>): EnvironmentTableRow => r;
