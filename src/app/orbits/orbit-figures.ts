// The figures the orbit editor derives while the user types, from the compute route's answer.
import type { BodySummaryResponse, EnvironmentResponse } from '../../../shared/api/environment';

export interface OrbitFigures {
  readonly periodS: number;
  readonly periapsisAltitudeKm: number;
  readonly apoapsisAltitudeKm: number;
  readonly periapsisSpeedKmS: number;
  readonly apoapsisSpeedKmS: number;
  /** Beta at the epoch's Sun, deg. */
  readonly betaDeg: number;
  readonly eclipseFraction: number;
  readonly eclipseDurationS: number;
}

// Vis-viva: v^2 = GM (2/r - 1/a) (Vallado, "Fundamentals of Astrodynamics", eq. 1-31).
function visVivaKmS(gmKm3S2: number, radiusKm: number, semiMajorAxisKm: number): number {
  return Math.sqrt(gmKm3S2 * (2 / radiusKm - 1 / semiMajorAxisKm));
}

export function orbitFigures(answer: EnvironmentResponse, body: BodySummaryResponse): OrbitFigures {
  const a = answer.semiMajorAxisKm;
  return {
    periodS: answer.periodS,
    periapsisAltitudeKm: answer.periapsisAltitudeKm,
    apoapsisAltitudeKm: answer.apoapsisAltitudeKm,
    periapsisSpeedKmS: visVivaKmS(body.gmKm3S2, body.radiusKm + answer.periapsisAltitudeKm, a),
    apoapsisSpeedKmS: visVivaKmS(body.gmKm3S2, body.radiusKm + answer.apoapsisAltitudeKm, a),
    betaDeg: answer.epochBetaDeg ?? answer.betaDeg,
    eclipseFraction: answer.eclipseFraction,
    eclipseDurationS: answer.eclipseDurationS,
  };
}

/** Altitude of a circular orbit with the same semi-major axis, for the sun-synchronous helper. */
export function meanAltitudeKm(orbit: { periapsisAltitudeKm?: number; apoapsisAltitudeKm?: number; semiMajorAxisKm?: number; periodS?: number }, body: BodySummaryResponse): number | null {
  if (orbit.periapsisAltitudeKm !== undefined && orbit.apoapsisAltitudeKm !== undefined) {
    return (orbit.periapsisAltitudeKm + orbit.apoapsisAltitudeKm) / 2;
  }
  if (orbit.semiMajorAxisKm !== undefined) return orbit.semiMajorAxisKm - body.radiusKm;
  if (orbit.periodS !== undefined) {
    // Kepler's third law: a = (GM T^2 / 4 pi^2)^(1/3).
    const a = Math.cbrt((body.gmKm3S2 * orbit.periodS ** 2) / (4 * Math.PI ** 2));
    return a - body.radiusKm;
  }
  return null;
}
