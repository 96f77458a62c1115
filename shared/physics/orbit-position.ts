// Where the spacecraft is on a Keplerian orbit at a time after periapsis, and its local orbital
// frame (x along-track toward ram, y orbit normal, z zenith).
// Leaves out: perturbations within the orbit (the node's J2 drift is handled between orbits by
// beta-angle.ts). Source: Vallado ch. 2, perifocal-to-inertial rotation (PQW).
import { solveKepler, trueAnomalyFromEccentric } from './kepler';
import type { Orbit } from './orbit-definition';
import { cross, type Vector3 } from './vector3';

export interface OrbitBasis {
  /** Toward periapsis (toward the ascending node for a circular orbit). */
  p: Vector3;
  q: Vector3;
  /** Orbit normal (angular momentum direction). */
  w: Vector3;
}

/** Perifocal axes P, Q, W in the body's equatorial frame. */
export function orbitBasis(inclinationRad: number, raanRad: number, argPeriapsisRad: number): OrbitBasis {
  const [ci, si] = [Math.cos(inclinationRad), Math.sin(inclinationRad)];
  const [cO, sO] = [Math.cos(raanRad), Math.sin(raanRad)];
  const [cw, sw] = [Math.cos(argPeriapsisRad), Math.sin(argPeriapsisRad)];
  return {
    p: [cO * cw - sO * sw * ci, sO * cw + cO * sw * ci, sw * si],
    q: [-cO * sw - sO * cw * ci, -sO * sw + cO * cw * ci, cw * si],
    w: [sO * si, -cO * si, ci],
  };
}

export interface OrbitState {
  /** Position from the body's centre, km, body equatorial frame. */
  positionKm: Vector3;
  radiusKm: number;
  trueAnomalyRad: number;
  /** Local orbital frame unit vectors in the body frame. */
  ram: Vector3;
  normal: Vector3;
  zenith: Vector3;
}

/** A function of time since periapsis (s) giving the state; the basis is computed once. */
export function orbitSampler(orbit: Orbit, basis: OrbitBasis = orbitBasis(orbit.inclinationRad, orbit.raanRad, orbit.argPeriapsisRad)) {
  const { semiMajorAxisKm: a, eccentricity: e, meanMotionRadS: n } = orbit;
  const { p, q, w } = basis;
  return (tS: number): OrbitState => {
    const nu = e === 0 ? (n * tS) % (2 * Math.PI) : trueAnomalyFromEccentric(solveKepler(n * tS, e), e);
    // conic equation r = a (1 - e^2) / (1 + e cos nu)
    const r = (a * (1 - e * e)) / (1 + e * Math.cos(nu));
    const [c, s] = [Math.cos(nu), Math.sin(nu)];
    const zenith: Vector3 = [p[0] * c + q[0] * s, p[1] * c + q[1] * s, p[2] * c + q[2] * s];
    return {
      positionKm: [zenith[0] * r, zenith[1] * r, zenith[2] * r],
      radiusKm: r,
      trueAnomalyRad: nu,
      ram: cross(w, zenith),
      normal: w,
      zenith,
    };
  };
}
