// A workspace's own central bodies (shared/api/custom-bodies.ts): the definition as entered - GM,
// radius, J2, where it is, albedo/OLR and surface field ranges, a source per value - kept as one
// JSON document the shared schema validates; the name beside it for lists.
import { index, sqliteTable, text } from 'drizzle-orm/sqlite-core';
import type { CustomBodyDefinition } from '../../shared/physics/custom-bodies';
import { createdAt, id, updatedAt } from './columns';
import { users, workspaceRef } from './account-tables';

export const customBodies = sqliteTable(
  'custom_bodies',
  {
    /** A UUID; the API's body id is "custom-" and this. */
    id: id(),
    workspaceId: workspaceRef(),
    name: text('name').notNull(),
    /** Everything but the id and the name, in the physics' own shape. */
    definition: text('definition', { mode: 'json' }).$type<Omit<CustomBodyDefinition, 'id' | 'name'>>().notNull(),
    createdBy: text('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index('custom_bodies_workspace').on(t.workspaceId, t.name)],
);

export type CustomBodyRow = typeof customBodies.$inferSelect;
