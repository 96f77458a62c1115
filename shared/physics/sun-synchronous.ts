// The sun-synchronous inclination: the one whose J2 nodal drift keeps pace with the Sun's mean
// motion around the body (Earth: 360 deg per tropical year; other bodies: per their orbital period
// around the Sun, a moon per its planet's).
// Leaves out: higher harmonics and the Sun's uneven motion on an eccentric orbit. Source: Vallado ch. 9.
import type { Body } from './bodies';
import { sunSynchronousInclinationRad } from './kepler';
import { SECONDS_PER_DAY } from './constants';
import { sunMotionSign } from './sun';

/** Sun-synchronous inclination in degrees for an orbit of semi-major axis aKm and eccentricity e. */
export function sunSynchronousInclinationDeg(body: Body, semiMajorAxisKm: number, eccentricity = 0): number {
  const requiredRateRadS = (sunMotionSign(body) * 2 * Math.PI) / (body.solarYearDays * SECONDS_PER_DAY);
  return (sunSynchronousInclinationRad(body, semiMajorAxisKm, eccentricity, requiredRateRadS) * 180) / Math.PI;
}
