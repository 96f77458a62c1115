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
      throw new ApiError(422, 'not_converged', error.message, [{ path: 'maxOrbits', message: `${error.orbits} orbits done; still ${error.residualK} K from a periodic state` }]);
    }
    if (error instanceof ThermalModelError) throw new ApiError(422, refusedCode, error.message, [{ path: error.path, message: error.message }]);
    throw error;
  }
}
