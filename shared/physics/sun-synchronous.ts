// The sun-synchronous inclination: the one whose J2 nodal drift keeps pace with the Sun's mean
// motion around the body (Earth: 360 deg per tropical year; other bodies: per their orbital period
// around the Sun, a moon per its planet's).
// Leaves out: higher harmonics and the Sun's uneven motion on an eccentric orbit. Source: Vallado ch. 9.
import type { Body } from './bodies';
import { nodalRateRadS, sunSynchronousInclinationRad } from './kepler';
import { defineOrbit } from './orbit-definition';
import { DEG } from './vector3';
import { SECONDS_PER_DAY } from './constants';
import { sunMotionSign } from './sun';

/** Sun-synchronous inclination in degrees for an orbit of semi-major axis aKm and eccentricity e. */
export function sunSynchronousInclinationDeg(body: Body, semiMajorAxisKm: number, eccentricity = 0): number {
  const requiredRateRadS = (sunMotionSign(body) * 2 * Math.PI) / (body.solarYearDays * SECONDS_PER_DAY);
  return (sunSynchronousInclinationRad(body, semiMajorAxisKm, eccentricity, requiredRateRadS) * 180) / Math.PI;
}

export interface SunSynchronousOrbit {
  bodyId: string;
  altitudeKm: number;
  semiMajorAxisKm: number;
  eccentricity: number;
  inclinationDeg: number;
  /** The node's J2 drift at that inclination: the Sun's mean motion around the body. */
  nodalRateDegPerDay: number;
  periodS: number;
}

/**
 * The sun-synchronous orbit at altitudeKm (semi-major axis minus the body's radius) and eccentricity,
 * or a PhysicsError saying why none exists (below the surface, too high, J2 too small).
 */
export function sunSynchronousOrbit(body: Body, altitudeKm: number, eccentricity = 0): SunSynchronousOrbit {
  const semiMajorAxisKm = body.radiusKm + altitudeKm;
  const orbit = defineOrbit({ semiMajorAxisKm, eccentricity }, body);
  const inclinationDeg = sunSynchronousInclinationDeg(body, semiMajorAxisKm, orbit.eccentricity);
  const rate = nodalRateRadS(body, semiMajorAxisKm, orbit.eccentricity, inclinationDeg * DEG);
  return {
    bodyId: body.id, altitudeKm, semiMajorAxisKm, eccentricity: orbit.eccentricity, inclinationDeg,
    nodalRateDegPerDay: (rate / DEG) * SECONDS_PER_DAY, periodS: orbit.periodS,
  };
}
