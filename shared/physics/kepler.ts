// Two-body orbits: Kepler's third law, vis-viva, Kepler's equation, J2 secular nodal precession and
// the sun-synchronous inclination.
// Leaves out: drag, third bodies, J2 short-period terms and higher harmonics; secular J2 rates use
// the first-order formulas. Source: Vallado, Fundamentals of Astrodynamics and Applications
// (chapters 2 and 9), Curtis, Orbital Mechanics for Engineering Students (ch. 4).
import { SECONDS_PER_DAY } from './constants';
import { ConvergenceError, PhysicsError } from './physics-error';
import { DEG } from './vector3';

const TWO_PI = 2 * Math.PI;

/** Orbital period in seconds. */
// Kepler's third law
export const periodS = (semiMajorAxisKm: number, gmKm3S2: number): number =>
  TWO_PI * Math.sqrt(semiMajorAxisKm ** 3 / gmKm3S2);

/** Semi-major axis in km for a period in seconds. */
// Kepler's third law, inverted
export const semiMajorAxisForPeriodKm = (periodSeconds: number, gmKm3S2: number): number =>
  Math.cbrt(gmKm3S2 * (periodSeconds / TWO_PI) ** 2);

/** A rate in rad/s as degrees a day (the node's and the periapsis's drift). */
export const degPerDay = (radS: number): number => (radS / DEG) * SECONDS_PER_DAY;

/** Mean motion in rad/s. */
export const meanMotionRadS = (semiMajorAxisKm: number, gmKm3S2: number): number =>
  Math.sqrt(gmKm3S2 / semiMajorAxisKm ** 3);

/** Speed in km/s at distance rKm from the centre. */
// vis-viva: v^2 = mu (2/r - 1/a)
export const speedKmS = (rKm: number, semiMajorAxisKm: number, gmKm3S2: number): number =>
  Math.sqrt(gmKm3S2 * (2 / rKm - 1 / semiMajorAxisKm));

/**
 * Eccentric anomaly (radians) for a mean anomaly (radians) and eccentricity 0 <= e < 1.
 * Newton's method from E0 = M + e sin M (or pi for e > 0.8, Vallado Algorithm 2); fails loudly.
 */
export function solveKepler(meanAnomalyRad: number, eccentricity: number): number {
  if (!(eccentricity >= 0 && eccentricity < 1) || !Number.isFinite(meanAnomalyRad)) {
    throw new ConvergenceError('Kepler solver', `needs 0 <= e < 1 and a finite mean anomaly, got e = ${eccentricity}, M = ${meanAnomalyRad}`);
  }
  const m = meanAnomalyRad - TWO_PI * Math.floor(meanAnomalyRad / TWO_PI);
  let e = eccentricity > 0.8 ? Math.PI : m + eccentricity * Math.sin(m);
  for (let i = 0; i < 50; i++) {
    // Kepler's equation M = E - e sin E, Newton step
    const f = e - eccentricity * Math.sin(e) - m;
    const step = f / (1 - eccentricity * Math.cos(e));
    e -= step;
    if (Math.abs(step) < 1e-13) return e;
  }
  throw new ConvergenceError('Kepler solver', `no convergence in 50 Newton steps for M = ${meanAnomalyRad} rad, e = ${eccentricity}`);
}

/** True anomaly (radians, 0..2pi) from the eccentric anomaly. */
export function trueAnomalyFromEccentric(eccentricAnomalyRad: number, eccentricity: number): number {
  const nu = 2 * Math.atan2(
    Math.sqrt(1 + eccentricity) * Math.sin(eccentricAnomalyRad / 2),
    Math.sqrt(1 - eccentricity) * Math.cos(eccentricAnomalyRad / 2),
  );
  return nu < 0 ? nu + TWO_PI : nu;
}

export interface J2Body {
  gmKm3S2: number;
  radiusKm: number;
  j2: number;
}

/** Secular drift of the ascending node in rad/s (negative: westward for a prograde orbit). */
// J2 nodal regression: dOmega/dt = -(3/2) n J2 (R/p)^2 cos i  (Vallado eq. 9-41)
export function nodalRateRadS(body: J2Body, semiMajorAxisKm: number, eccentricity: number, inclinationRad: number): number {
  const p = semiMajorAxisKm * (1 - eccentricity * eccentricity);
  const n = meanMotionRadS(semiMajorAxisKm, body.gmKm3S2);
  return -1.5 * n * body.j2 * (body.radiusKm / p) ** 2 * Math.cos(inclinationRad);
}

/** Secular drift of the argument of periapsis in rad/s (zero at the critical inclination 63.4 deg). */
// J2 apsidal rotation: domega/dt = (3/4) n J2 (R/p)^2 (4 - 5 sin^2 i)  (Vallado eq. 9-41)
export function apsidalRateRadS(body: J2Body, semiMajorAxisKm: number, eccentricity: number, inclinationRad: number): number {
  const p = semiMajorAxisKm * (1 - eccentricity * eccentricity);
  const n = meanMotionRadS(semiMajorAxisKm, body.gmKm3S2);
  const sinI = Math.sin(inclinationRad);
  return 0.75 * n * body.j2 * (body.radiusKm / p) ** 2 * (4 - 5 * sinI * sinI);
}

/**
 * Inclination (radians) whose J2 nodal drift equals requiredRateRadS (the Sun's mean motion as seen
 * in the body's equatorial frame, signed). Throws when no inclination can reach it.
 */
export function sunSynchronousInclinationRad(
  body: J2Body & { name: string },
  semiMajorAxisKm: number,
  eccentricity: number,
  requiredRateRadS: number,
): number {
  const p = semiMajorAxisKm * (1 - eccentricity * eccentricity);
  const n = meanMotionRadS(semiMajorAxisKm, body.gmKm3S2);
  const ratePerCosI = -1.5 * n * body.j2 * (body.radiusKm / p) ** 2;
  const cosI = requiredRateRadS / ratePerCosI;
  if (!(Math.abs(cosI) <= 1)) {
    const altitudeKm = semiMajorAxisKm - body.radiusKm;
    // The drift is largest for an orbit grazing the surface; if even that falls short, no altitude works.
    const surfaceRate = 1.5 * meanMotionRadS(body.radiusKm, body.gmKm3S2) * Math.abs(body.j2);
    const why = surfaceRate < Math.abs(requiredRateRadS) ? ` (${body.name}'s J2 is too small at any altitude)` : ' (the orbit is too high)';
    throw new PhysicsError(
      'no_sun_synchronous_orbit',
      `no sun-synchronous orbit exists at ${altitudeKm.toFixed(0)} km above ${body.name}: J2 turns the node at most ` +
        `${degPerDay(Math.abs(ratePerCosI)).toPrecision(3)} deg/day there, and ${degPerDay(Math.abs(requiredRateRadS)).toPrecision(3)} deg/day are needed${why}`,
      [{ path: 'orbit', message: `sun-synchronous needs cos i = ${cosI.toFixed(3)}, outside -1..1` }],
    );
  }
  return Math.acos(cosI);
}

