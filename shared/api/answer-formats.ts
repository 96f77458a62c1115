// How a per-step answer is asked for in another layout (API.md "Answer formats"): ?layout=columns
// for columnar JSON; the Arrow stream is asked for with the Accept header, not here.
import { z } from 'zod';

export const answerLayout = z.enum(['columns'], { message: 'layout is "columns" (or leave it out for the default JSON)' }).optional();

/** The query of a route that has no query of its own but answers per-step results. */
export const answerLayoutQuery = z.object({ layout: answerLayout });
