// The body id every request takes: one of the catalogue's (lowercase English names, API.md) or a
// workspace's own body, "custom-" and a UUID (shared/api/custom-bodies.ts), so the two never clash.
import { z } from 'zod';
import { bodyIds, type AnyBodyId } from '../physics/bodies';

const UUID = '[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}';
export const customBodyIdPattern = new RegExp(`^custom-${UUID}$`);
const anyBodyIdPattern = new RegExp(`^(${bodyIds.join('|')}|custom-${UUID})$`);

/** A body id in a request, named `field` in its message. */
export const anyBodyId = (field = 'bodyId') =>
  z
    .string({ message: `${field} is one of ${bodyIds.join(', ')} or one of the workspace's own bodies (custom-…)` })
    .regex(anyBodyIdPattern, `${field} is one of ${bodyIds.join(', ')} or one of the workspace's own bodies (custom-…)`)
    .describe(`a body of the catalogue (${bodyIds.join(', ')}) or a workspace's own body: "custom-" followed by a UUID`) as unknown as z.ZodType<AnyBodyId, string>;

/** A body id in an answer. */
export const anyBodyIdOut = z.string().describe('a body of the catalogue or a workspace\'s own body ("custom-" and a UUID)') as unknown as z.ZodType<AnyBodyId, string>;
