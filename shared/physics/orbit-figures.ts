// The figures of one orbit a mission analyst reads off first: period, mean motion, the two apsides
// with their altitudes and speeds, the J2 drift of the node and of the periapsis, and the shortest
// period any orbit around the body can have.
// Leaves out: what orbit-definition.ts and kepler.ts leave out (two-body motion, first-order J2).
// Sources: Vallado ch. 2 (Kepler's third law, vis-viva) and ch. 9 (J2 secular rates).
import type { Body } from './bodies';
import { SECONDS_PER_DAY } from './constants';
import { apsidalRateRadS, degPerDay, periodS } from './kepler';
import { defineOrbit, type OrbitInput } from './orbit-definition';

export interface OrbitFigures {
  bodyId: string;
  periodS: number;
  meanMotionRadS: number;
  meanMotionRevPerDay: number;
  semiMajorAxisKm: number;
  eccentricity: number;
  periapsisAltitudeKm: number;
  apoapsisAltitudeKm: number;
  periapsisSpeedKmS: number;
  apoapsisSpeedKmS: number;
  nodalRateDegPerDay: number;
  apsidalRateDegPerDay: number;
  /** Period of a circular orbit at the surface: no closed orbit around the body is shorter. */
  minimumPeriodS: number;
}

export function orbitFigures(body: Body, input: OrbitInput): OrbitFigures {
  const orbit = defineOrbit(input, body);
  return {
    bodyId: body.id,
    periodS: orbit.periodS,
    meanMotionRadS: orbit.meanMotionRadS,
    meanMotionRevPerDay: SECONDS_PER_DAY / orbit.periodS,
    semiMajorAxisKm: orbit.semiMajorAxisKm,
    eccentricity: orbit.eccentricity,
    periapsisAltitudeKm: orbit.periapsisAltitudeKm,
    apoapsisAltitudeKm: orbit.apoapsisAltitudeKm,
    periapsisSpeedKmS: orbit.periapsisSpeedKmS,
    apoapsisSpeedKmS: orbit.apoapsisSpeedKmS,
    nodalRateDegPerDay: degPerDay(orbit.nodalRateRadS),
    apsidalRateDegPerDay: orbit.circular ? 0 : degPerDay(apsidalRateRadS(body, orbit.semiMajorAxisKm, orbit.eccentricity, orbit.inclinationRad)),
    // Kepler's third law with a = R: any eccentricity with periapsis at or above the surface has a larger a
    minimumPeriodS: periodS(body.radiusKm, body.gmKm3S2),
  };
}
