// One path for the per-day geometry a mission's scans need - the case derivation's daily scan
// (design-scan.ts) and the mission sweep (mission-sweep.ts) alike: the Sun from the body at each
// instant (sun-track.ts: VSOP87 at nodes, a moon's own offset from its planet added), the node and
// periapsis drifted under J2 from the orbit's epoch, the Sun in the orbit's perifocal frame, the beta
// angle, and, for a moon, the longest shadow its planet takes part in over each day.
// Leaves out: what sun-track.ts, parent-shadow.ts and the J2 secular rates leave out. Sources:
// Vallado ch. 2 (perifocal-to-inertial rotation) and ch. 9 (J2 secular rates); Gilmore Vol. I ch. 2
// (beta angle).
import type { AnyBodyId, Body, BodyId } from './bodies';
import { AU_KM } from './constants';
import { apsidalRateRadS } from './kepler';
import type { Orbit } from './orbit-definition';
import type { PerifocalSun } from './orbit-grid';
import { orbitBasis, type OrbitBasis } from './orbit-position';
import { parentShadow, type ParentShadow, type ShadowSpan } from './parent-shadow';
import { sunTrack } from './sun-track';
import { DEG, dot, type Vector3 } from './vector3';

export interface DayGeometry {
  ms: number;
  raanRad: number;
  argPeriapsisRad: number;
  /** The Sun in the orbit's perifocal frame and its distance. */
  sun: PerifocalSun;
  /** The orbit's perifocal axes P, Q, W in the body's equatorial frame of the date. */
  basis: OrbitBasis;
  betaDeg: number;
  solarDistanceAu: number;
}

export interface MissionDays {
  apsidalRateRadS: number;
  /** The geometry at a UTC instant (ms) within the span the scan was made for. */
  at(ms: number): DayGeometry;
  /** For a moon: the planet's shadows (the moon's own joined on) whose middle falls in [fromMs, toMs); [] for a planet. */
  parentSpans(fromMs: number, toMs: number): ShadowSpan[];
  /** The planet a moon orbits, null for a planet. */
  readonly parentId: BodyId | null;
}

/** RAAN in radians on a date, drifted from its value at the orbit's epoch at the J2 nodal rate. */
export const raanOnDateRad = (orbit: Orbit, orbitEpoch: Date, at: Date): number =>
  orbit.raanRad + orbit.nodalRateRadS * ((at.getTime() - orbitEpoch.getTime()) / 1000);

/** The shared daily scan for `orbit` about `body` between startMs and endMs (UTC ms), angles held at orbitEpochMs. */
export function missionDays(body: Body, orbit: Orbit, orbitEpochMs: number, startMs: number, endMs: number): MissionDays {
  const track = sunTrack(body, startMs, endMs);
  const apsidalRate = orbit.circular ? 0 : apsidalRateRadS(body, orbit.semiMajorAxisKm, orbit.eccentricity, orbit.inclinationRad);
  const sunVector = new Float64Array(3);
  let shadow: ParentShadow | null | undefined;
  const epoch = new Date(orbitEpochMs);
  return {
    apsidalRateRadS: apsidalRate,
    parentId: body.parentId,
    at(ms: number): DayGeometry {
      const distanceAu = track.at(ms, sunVector);
      const elapsedS = (ms - orbitEpochMs) / 1000;
      const raan = raanOnDateRad(orbit, epoch, new Date(ms));
      const argp = orbit.argPeriapsisRad + apsidalRate * elapsedS;
      // Sun components along P, Q, W (Vallado ch. 2, perifocal-to-inertial rotation)
      const basis = orbitBasis(orbit.inclinationRad, raan, argp);
      const v: Vector3 = [sunVector[0], sunVector[1], sunVector[2]];
      const sun: PerifocalSun = { sp: dot(v, basis.p), sq: dot(v, basis.q), sw: dot(v, basis.w), distanceKm: distanceAu * AU_KM };
      const betaDeg = Math.asin(Math.max(-1, Math.min(1, sun.sw))) / DEG;
      return { ms, raanRad: raan, argPeriapsisRad: argp, sun, basis, betaDeg, solarDistanceAu: distanceAu };
    },
    parentSpans(fromMs: number, toMs: number): ShadowSpan[] {
      if (shadow === undefined) shadow = parentShadow(body, orbit, orbitEpochMs, (ms, out) => track.planetAtIcrf(ms, out), track.moon);
      return shadow ? shadow.spans(fromMs, toMs) : [];
    },
  };
}

/** The longest darkness of a day: the body's own shadow over one orbit (edge to edge) or a span its planet takes part in. */
export function longestShadow(body: Body, ownShadowS: number, spans: readonly ShadowSpan[]): { durationS: number; castBy: AnyBodyId[]; startMs: number | null } {
  let best: { durationS: number; castBy: AnyBodyId[]; startMs: number | null } = { durationS: ownShadowS, castBy: ownShadowS > 0 ? [body.id] : [], startMs: null };
  for (const span of spans) if (span.durationS > best.durationS) best = { durationS: span.durationS, castBy: span.castBy, startMs: span.startMs };
  return best;
}
