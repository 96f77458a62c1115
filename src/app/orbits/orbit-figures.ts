// The figures the orbit editor derives while the user types, from the compute route's answer.
import type { BodySummaryResponse, EnvironmentResponse } from '../../../shared/api/environment';
import { semiMajorAxisForPeriodKm, speedKmS } from '../../../shared/physics/kepler';

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

export function orbitFigures(answer: EnvironmentResponse, body: BodySummaryResponse): OrbitFigures {
  const a = answer.semiMajorAxisKm;
  return {
    periodS: answer.periodS,
    periapsisAltitudeKm: answer.periapsisAltitudeKm,
    apoapsisAltitudeKm: answer.apoapsisAltitudeKm,
    periapsisSpeedKmS: speedKmS(body.radiusKm + answer.periapsisAltitudeKm, a, body.gmKm3S2),
    apoapsisSpeedKmS: speedKmS(body.radiusKm + answer.apoapsisAltitudeKm, a, body.gmKm3S2),
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
  if (orbit.periodS !== undefined) return semiMajorAxisForPeriodKm(orbit.periodS, body.gmKm3S2) - body.radiusKm;
  return null;
}
