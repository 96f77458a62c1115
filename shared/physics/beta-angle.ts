// The beta angle: the Sun's elevation above the orbit plane, at an epoch and over a date range
// with the node drifting under J2 and the Sun moving along the body's orbit.
// Leaves out: drift of inclination (none at first order) and the Sun's motion within one orbit.
// Source: Gilmore, Spacecraft Thermal Control Handbook Vol. I, ch. 2 (beta-angle formula);
// Vallado ch. 9 (J2 nodal regression).
import type { Body } from './bodies';
import type { Orbit } from './orbit-definition';
import { orbitBasis } from './orbit-position';
import { sunFromBody } from './sun';
import { dot, type Vector3 } from './vector3';

/** Beta angle in radians from the Sun's right ascension and declination in the body's equatorial frame. */
// sin beta = cos(dec_sun) sin i sin(RAAN - RA_sun) + sin(dec_sun) cos i  (Gilmore ch. 2)
export function betaAngleRad(sunRaRad: number, sunDecRad: number, inclinationRad: number, raanRad: number): number {
  const s = Math.cos(sunDecRad) * Math.sin(inclinationRad) * Math.sin(raanRad - sunRaRad) + Math.sin(sunDecRad) * Math.cos(inclinationRad);
  return Math.asin(Math.max(-1, Math.min(1, s)));
}

/** Beta angle in radians as the complement of the angle between orbit normal and Sun direction. */
export const betaFromVectorsRad = (orbitNormal: Vector3, sunDirection: Vector3): number =>
  Math.asin(Math.max(-1, Math.min(1, dot(orbitNormal, sunDirection))));

/** The beta above which a circular orbit of radius rKm sees no eclipse (cylindrical shadow). */
// beta* = asin(R / (R + h))  (Gilmore ch. 2)
export const noEclipseBetaRad = (bodyRadiusKm: number, orbitRadiusKm: number): number => Math.asin(bodyRadiusKm / orbitRadiusKm);

export interface BetaSample {
  epoch: string;
  betaDeg: number;
  raanDeg: number;
}

/**
 * Beta over [start, end] every stepS seconds, with RAAN drifting from its value at orbitEpoch
 * at the orbit's J2 nodal rate.
 */
export function betaHistory(body: Body, orbit: Orbit, orbitEpoch: Date, start: Date, end: Date, stepS: number): BetaSample[] {
  if (!(stepS > 0)) throw new RangeError(`the beta history step must be positive, got ${stepS} s`);
  const samples: BetaSample[] = [];
  const count = Math.floor((end.getTime() - start.getTime()) / 1000 / stepS);
  if (count > 100000) throw new RangeError(`a beta history of ${count + 1} samples is too long; use a larger step`);
  for (let k = 0; k <= count; k++) {
    const epoch = new Date(start.getTime() + k * stepS * 1000);
    const raanRad = orbit.raanRad + orbit.nodalRateRadS * ((epoch.getTime() - orbitEpoch.getTime()) / 1000);
    const { w } = orbitBasis(orbit.inclinationRad, raanRad, 0);
    const beta = betaFromVectorsRad(w, sunFromBody(body, epoch).direction);
    const raanDeg = ((raanRad * 180) / Math.PI) % 360;
    samples.push({ epoch: epoch.toISOString(), betaDeg: (beta * 180) / Math.PI, raanDeg: raanDeg < 0 ? raanDeg + 360 : raanDeg });
  }
  return samples;
}
