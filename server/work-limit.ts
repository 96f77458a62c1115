// The most work one request may ask for. Per-step results cost time and memory in proportion to
// steps × surfaces (or ephemeris rows × surfaces, sweep days × surfaces, steps × thermal nodes): an
// environment of 100,000 steps × 50 surfaces took 1.5 GB and stalled every other request for
// seconds before failing (issue 12, item 7). Every route that computes such a product checks it
// here, before the work starts, and is refused with 413 naming both factors and the limit.
// At the limit the compute route answers in about a second with the server's RSS near 300 MB
// (docs/RELIABILITY.md, "Outside attack findings").
import { ApiError } from './errors';

/** Samples (steps × surfaces, rows × surfaces, days × surfaces, steps × substeps × nodes) one request may compute. */
export const MAX_SAMPLES = 500_000;
/**
 * Steps × surfaces of one load case: a case keeps seven series per surface, a derivation computes
 * two cases, and both go to the database and back in the answer; at this limit a derivation takes
 * about two seconds on a busy two-core machine.
 */
export const MAX_CASE_SAMPLES = 50_000;

export interface WorkFactor {
  /** The field or the thing counted, as the user knows it: "steps", "surfaces", "rows of the window". */
  name: string;
  count: number;
}

const grouped = (n: number): string => n.toLocaleString('en-US');

/**
 * Throws 413 too_much_work when the product of the factors is over `limit`. `path` is the request
 * field the user can change; `remedy` says how ("use fewer steps").
 */
export function limitWork(factors: WorkFactor[], path: string, remedy: string, limit = MAX_SAMPLES): void {
  const samples = factors.reduce((product, f) => product * f.count, 1);
  if (samples <= limit) return;
  const product = `${factors.map((f) => f.name).join(' × ')} = ${factors.map((f) => grouped(f.count)).join(' × ')} = ${grouped(samples)} samples`;
  const message = `${product}, more than the ${grouped(limit)} one ${limit === MAX_CASE_SAMPLES ? 'load case may hold' : 'request may compute'}; ${remedy}`;
  throw new ApiError(413, 'too_much_work', `${message[0]?.toUpperCase()}${message.slice(1)}.`, [{ path, message }]);
}
