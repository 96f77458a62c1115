// What the thermal physics refuses, as the API's answers: a model that never settles into a
// periodic state is 422 "not_converged"; a sizing no design can meet is 422 "not_sizable".
// The schema catches malformed models first, so these are the well-formed but impossible ones.
import { DEFAULT_MAX_ORBITS, ThermalConvergenceError, ThermalModelError, type ThermalSolveInput } from '../../shared/physics/thermal-model';
import { ApiError } from '../errors';
import { limitWork, MAX_SAMPLES } from '../work-limit';

/**
 * The model, once its work is within what one request may ask for (413 otherwise): steps ×
 * substeps × nodes for one orbit, and that × maxOrbits for a model that never settles, against the
 * same limit times the default number of orbits (so only a maxOrbits above the default tightens it).
 */
export function boundedModel<M extends Pick<ThermalSolveInput, 'steps' | 'nodes' | 'substeps' | 'maxOrbits'>>(model: M): M {
  const substeps = model.substeps ?? 1;
  const factors = [{ name: 'steps', count: model.steps }, ...(substeps > 1 ? [{ name: 'substeps', count: substeps }] : []), { name: 'nodes', count: model.nodes.length }];
  limitWork(factors, 'steps', substeps > 1 ? 'use fewer steps, substeps or nodes' : 'use fewer steps or fewer nodes');
  const maxOrbits = model.maxOrbits ?? DEFAULT_MAX_ORBITS;
  limitWork([...factors, { name: 'maxOrbits', count: maxOrbits }], 'maxOrbits', `allow at most ${DEFAULT_MAX_ORBITS} orbits (maxOrbits) or make the model smaller`, MAX_SAMPLES * DEFAULT_MAX_ORBITS);
  return model;
}

export function answerThermal<T>(work: () => T, refusedCode = 'not_sizable'): T {
  try {
    return work();
  } catch (error) {
    throw asThermalAnswer(error, refusedCode);
  }
}

/** The same, for work done in the thermal pool (thermal-pool.ts). */
export async function answerThermalAsync<T>(work: Promise<T>, refusedCode = 'not_sizable'): Promise<T> {
  try {
    return await work;
  } catch (error) {
    throw asThermalAnswer(error, refusedCode);
  }
}

function asThermalAnswer(error: unknown, refusedCode: string): unknown {
  if (error instanceof ThermalConvergenceError) {
    // The message names the node, the time and the values; the detail points at the field to change.
    const settling = Number.isFinite(error.residualK) && error.orbits > 0;
    return new ApiError(422, 'not_converged', error.message, [{
      path: error.path ?? 'maxOrbits',
      message: settling ? `${error.orbits} orbits run; a node is still ${error.residualK.toFixed(3)} K from its periodic state` : error.message,
    }]);
  }
  if (error instanceof ThermalModelError) return new ApiError(422, refusedCode, error.message, [{ path: error.path, message: error.message }]);
  return error;
}
