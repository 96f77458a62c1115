// What the thermal physics refuses, as the API's answers: a model that never settles into a
// periodic state is 422 "not_converged"; a sizing no design can meet is 422 "not_sizable".
// The schema catches malformed models first, so these are the well-formed but impossible ones.
import { ThermalConvergenceError, ThermalModelError } from '../../shared/physics/thermal-model';
import { ApiError } from '../errors';

export function answerThermal<T>(work: () => T, refusedCode = 'not_sizable'): T {
  try {
    return work();
  } catch (error) {
    if (error instanceof ThermalConvergenceError) {
      // The message names the node, the time and the values; the detail points at the field to change.
      const settling = Number.isFinite(error.residualK) && error.orbits > 0;
      throw new ApiError(422, 'not_converged', error.message, [{
        path: error.path ?? 'maxOrbits',
        message: settling ? `${error.orbits} orbits run; a node is still ${error.residualK.toFixed(3)} K from its periodic state` : error.message,
      }]);
    }
    if (error instanceof ThermalModelError) throw new ApiError(422, refusedCode, error.message, [{ path: error.path, message: error.message }]);
    throw error;
  }
}
