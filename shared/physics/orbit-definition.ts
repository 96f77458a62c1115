// The three ways API.md lets a user define an orbit, turned into one set of canonical elements,
// with the physically impossible refused in words that say why and by how much.
// Leaves out: hyperbolic and parabolic trajectories, and checks against the body's sphere of
// influence (a very high orbit around a moon is accepted). Source: Vallado ch. 2 (conic geometry).
import type { Body } from './bodies';
import { meanMotionRadS, nodalRateRadS, periodS, semiMajorAxisForPeriodKm, speedKmS } from './kepler';
import { PhysicsError } from './physics-error';
import { DEG } from './vector3';

export interface OrbitInput {
  periapsisAltitudeKm?: number;
  apoapsisAltitudeKm?: number;
  semiMajorAxisKm?: number;
  eccentricity?: number;
  periodS?: number;
  inclinationDeg?: number;
  raanDeg?: number;
  argPeriapsisDeg?: number;
}

export interface Orbit {
  semiMajorAxisKm: number;
  eccentricity: number;
  inclinationRad: number;
  raanRad: number;
  /** Zero for a circular orbit: time and anomaly then count from the ascending node. */
  argPeriapsisRad: number;
  circular: boolean;
  periapsisKm: number;
  apoapsisKm: number;
  periapsisAltitudeKm: number;
  apoapsisAltitudeKm: number;
  periodS: number;
  meanMotionRadS: number;
  periapsisSpeedKmS: number;
  apoapsisSpeedKmS: number;
  /** J2 secular drift of the node, rad/s. */
  nodalRateRadS: number;
}

// Below this an orbit is treated as circular (its periapsis direction is meaningless).
const CIRCULAR_E = 1e-9;

const fmt = (v: number, digits = 1): string => (Math.abs(v) >= 100 ? v.toFixed(0) : v.toFixed(digits));

const impossible = (path: string, message: string): PhysicsError =>
  new PhysicsError('impossible_orbit', message, [{ path, message }]);

function requireFinite(path: string, value: number | undefined, label: string): number {
  if (value === undefined || !Number.isFinite(value)) {
    throw new PhysicsError('invalid_orbit_definition', `${label} must be a finite number, got ${String(value)}`, [
      { path, message: `must be a finite number, got ${String(value)}` },
    ]);
  }
  return value;
}

function requireNonNegative(path: string, value: number | undefined, label: string): number {
  const v = requireFinite(path, value, label);
  if (v < 0) throw impossible(path, `${label} cannot be negative, got ${v}`);
  return v;
}

function checkEccentricity(value: number | undefined): number {
  const e = requireNonNegative('orbit.eccentricity', value, 'eccentricity');
  if (e >= 1) {
    throw impossible('orbit.eccentricity', `eccentricity ${e} is not a closed orbit: e must be below 1 (e >= 1 escapes)`);
  }
  return e;
}

function belowSurface(path: string, body: Body, radiusKm: number, what: string): PhysicsError {
  return impossible(path, `${what} is ${fmt(body.radiusKm - radiusKm)} km below the surface of ${body.name}`);
}

/** Which of the three definitions the input uses; exactly one is allowed. */
function definitionOf(input: OrbitInput): 'altitudes' | 'axis' | 'period' {
  const used: ('altitudes' | 'axis' | 'period')[] = [];
  if (input.periapsisAltitudeKm !== undefined || input.apoapsisAltitudeKm !== undefined) used.push('altitudes');
  if (input.semiMajorAxisKm !== undefined) used.push('axis');
  if (input.periodS !== undefined) used.push('period');
  if (used.length !== 1) {
    const message = used.length === 0
      ? 'define the orbit by periapsisAltitudeKm + apoapsisAltitudeKm, semiMajorAxisKm + eccentricity, or periodS + eccentricity'
      : `define the orbit one way only; got ${used.join(' and ')}`;
    throw new PhysicsError('invalid_orbit_definition', message, [{ path: 'orbit', message }]);
  }
  const [definition] = used;
  if (definition === 'altitudes' && input.eccentricity !== undefined) {
    const message = 'eccentricity follows from the two altitudes; leave it out';
    throw new PhysicsError('invalid_orbit_definition', message, [{ path: 'orbit.eccentricity', message }]);
  }
  return definition;
}

function shapeOf(input: OrbitInput, body: Body): { a: number; e: number } {
  switch (definitionOf(input)) {
    case 'altitudes': {
      const hp = requireFinite('orbit.periapsisAltitudeKm', input.periapsisAltitudeKm, 'periapsis altitude');
      const ha = requireFinite('orbit.apoapsisAltitudeKm', input.apoapsisAltitudeKm, 'apoapsis altitude');
      if (hp < 0) throw belowSurface('orbit.periapsisAltitudeKm', body, body.radiusKm + hp, 'periapsis');
      if (ha < hp) {
        throw impossible('orbit.apoapsisAltitudeKm', `apoapsis altitude ${ha} km is below periapsis altitude ${hp} km; apoapsis is the highest point`);
      }
      const rp = body.radiusKm + hp;
      const ra = body.radiusKm + ha;
      return { a: (rp + ra) / 2, e: (ra - rp) / (ra + rp) };
    }
    case 'axis': {
      const a = requireFinite('orbit.semiMajorAxisKm', input.semiMajorAxisKm, 'semi-major axis');
      if (a <= 0) throw impossible('orbit.semiMajorAxisKm', `semi-major axis must be positive, got ${a} km`);
      const e = checkEccentricity(input.eccentricity ?? 0);
      const rp = a * (1 - e);
      if (rp < body.radiusKm) throw belowSurface('orbit.semiMajorAxisKm', body, rp, 'periapsis');
      return { a, e };
    }
    case 'period': {
      const t = requireFinite('orbit.periodS', input.periodS, 'period');
      if (t <= 0) throw impossible('orbit.periodS', `period must be positive, got ${t} s`);
      const e = checkEccentricity(input.eccentricity ?? 0);
      // The shortest orbit at this eccentricity just grazes the surface: a = R / (1 - e).
      const minimumS = periodS(body.radiusKm / (1 - e), body.gmKm3S2);
      if (t < minimumS) {
        throw impossible(
          'orbit.periodS',
          `a period of ${fmt(t)} s (${fmt(t / 60)} min) is shorter than the shortest possible orbit around ${body.name}` +
            ` at eccentricity ${e}: ${fmt(minimumS)} s (${fmt(minimumS / 60)} min), with periapsis at the surface`,
        );
      }
      return { a: semiMajorAxisForPeriodKm(t, body.gmKm3S2), e };
    }
  }
}

function angleRad(path: string, value: number | undefined, label: string): number {
  return requireFinite(path, value ?? 0, label) * DEG;
}

/** Canonical elements and derived quantities from any of the three definitions. Angles default to 0. */
export function defineOrbit(input: OrbitInput, body: Body): Orbit {
  const { a, e: rawE } = shapeOf(input, body);
  const inclinationDeg = requireFinite('orbit.inclinationDeg', input.inclinationDeg ?? 0, 'inclination');
  if (inclinationDeg < 0 || inclinationDeg > 180) {
    throw new PhysicsError('invalid_orbit_definition', `inclination must be 0..180 deg, got ${inclinationDeg}`, [
      { path: 'orbit.inclinationDeg', message: `must be 0..180 deg, got ${inclinationDeg}` },
    ]);
  }
  const circular = rawE < CIRCULAR_E;
  const e = circular ? 0 : rawE;
  const inclinationRad = inclinationDeg * DEG;
  const rp = a * (1 - e);
  const ra = a * (1 + e);
  return {
    semiMajorAxisKm: a,
    eccentricity: e,
    inclinationRad,
    raanRad: angleRad('orbit.raanDeg', input.raanDeg, 'RAAN'),
    argPeriapsisRad: circular ? 0 : angleRad('orbit.argPeriapsisDeg', input.argPeriapsisDeg, 'argument of periapsis'),
    circular,
    periapsisKm: rp,
    apoapsisKm: ra,
    periapsisAltitudeKm: rp - body.radiusKm,
    apoapsisAltitudeKm: ra - body.radiusKm,
    periodS: periodS(a, body.gmKm3S2),
    meanMotionRadS: meanMotionRadS(a, body.gmKm3S2),
    periapsisSpeedKmS: speedKmS(rp, a, body.gmKm3S2),
    apoapsisSpeedKmS: speedKmS(ra, a, body.gmKm3S2),
    nodalRateRadS: nodalRateRadS(body, a, e, inclinationRad),
  };
}
