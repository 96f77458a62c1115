// The two failures the physics core reports. PhysicsError: the input is well formed but physically
// impossible (the route answers 422). ConvergenceError: a numerical method gave up (a 500, our fault).
export interface PhysicsErrorDetail {
  path: string;
  message: string;
}

export type PhysicsErrorCode =
  | 'impossible_orbit'
  | 'invalid_orbit_definition'
  | 'no_sun_synchronous_orbit'
  | 'unknown_body'
  | 'invalid_quantity'
  | 'invalid_surface'
  | 'missing_sun_geometry'
  | 'invalid_trajectory';

export class PhysicsError extends Error {
  override readonly name = 'PhysicsError';

  constructor(
    readonly code: PhysicsErrorCode,
    message: string,
    readonly details: PhysicsErrorDetail[] = [],
  ) {
    super(message);
  }
}

export class ConvergenceError extends Error {
  override readonly name = 'ConvergenceError';

  constructor(
    readonly solver: string,
    message: string,
  ) {
    super(`${solver}: ${message}`);
  }
}
