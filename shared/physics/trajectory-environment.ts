// The environment along a given trajectory (an uploaded ephemeris) rather than a Keplerian orbit:
// at every point the Sun from that point's epoch, the conical shadow of the central body, the
// plate-to-sphere view factors from that point's altitude and every surface's loads in the local
// orbital frame built from r and v (v by finite differences when the file gave none).
// Leaves out: what eclipse.ts, heat-loads.ts and sun.ts leave out; the Sun's direction is
// interpolated linearly between evaluations an hour apart (it moves about 0.04 deg an hour as seen
// from the Earth). Positions are in an ICRF-aligned frame centred on the body (EME2000/J2000 differ
// from ICRF by milliarcseconds, ignored). Source: API.md's load definitions; the frame as in
// orbit-position.ts (x ram, y orbit normal, z zenith).
import type { Body } from './bodies';
import { shadowGeometry, sunlitFraction } from './eclipse';
import { localNormal, surfaceLoad, type Surface, type SurfaceLoad } from './heat-loads';
import { AU_KM } from './constants';
import { PhysicsError } from './physics-error';
import { solarFluxWm2, sunFromBody } from './sun';
import { cross, DEG, dot, norm, scale, subtract, type Vector3 } from './vector3';

export interface TrajectorySample {
  /** ms since the Unix epoch, UTC. */
  tMs: number;
  positionKm: Vector3;
  /** null when the ephemeris has no velocities. */
  velocityKmS: Vector3 | null;
}

export interface TrajectoryPointLoads {
  tMs: number;
  altitudeKm: number;
  sunlit: number;
  surfaces: SurfaceLoad[];
}

export interface TrajectoryEnvironmentOptions {
  body: Body;
  surfaces: readonly Surface[];
  /** Defaults to the body's nominal values. */
  albedo?: number;
  olrWm2?: number;
  /** Which rows (0-based, with their epochs) to return as points; every row counts in the averages. Default: all. */
  keep?: (index: number, tMs: number) => boolean;
}

export interface TrajectoryEnvironment {
  rows: number;
  albedo: number;
  olrWm2: number;
  points: TrajectoryPointLoads[];
  /** Time-weighted (trapezoidal) over the whole span. */
  averages: { sunlitFraction: number; surfaces: SurfaceLoad[] };
  peaks: { surfaces: SurfaceLoad[] };
  /** The largest sum of every surface's absorbed power at one row, W. */
  peakTotalAbsorbedW: number;
  /** Time (trapezoidal weights, s) in umbra (sunlit 0) and in penumbra (between 0 and 1), and the whole span. */
  umbraS: number;
  penumbraS: number;
  spanS: number;
  /** Time-weighted means: beta (the Sun's angle above the orbit plane from r x v), deg, and the solar flux, W/m^2. */
  meanBetaDeg: number;
  meanSolarFluxWm2: number;
}

const SUN_NODE_MS = 3600_000;

interface SunState {
  directionIcrf: Vector3;
  distanceAu: number;
}

/** The Sun seen from the body, evaluated on the hour and interpolated between (VSOP87 is costly per row). */
function sunInterpolator(body: Body): (tMs: number) => SunState {
  const nodes = new Map<number, SunState>();
  const node = (k: number): SunState => {
    let s = nodes.get(k);
    if (!s) {
      if (nodes.size > 64) nodes.clear();
      const sun = sunFromBody(body, new Date(k * SUN_NODE_MS));
      s = { directionIcrf: sun.directionIcrf, distanceAu: sun.distanceAu };
      nodes.set(k, s);
    }
    return s;
  };
  return (tMs) => {
    const k = Math.floor(tMs / SUN_NODE_MS);
    const f = tMs / SUN_NODE_MS - k;
    const [a, b] = [node(k), node(k + 1)];
    const d: Vector3 = [
      a.directionIcrf[0] + f * (b.directionIcrf[0] - a.directionIcrf[0]),
      a.directionIcrf[1] + f * (b.directionIcrf[1] - a.directionIcrf[1]),
      a.directionIcrf[2] + f * (b.directionIcrf[2] - a.directionIcrf[2]),
    ];
    return { directionIcrf: scale(d, 1 / norm(d)), distanceAu: a.distanceAu + f * (b.distanceAu - a.distanceAu) };
  };
}

const zeroLoad = (name: string): SurfaceLoad => ({ name, solarWm2: 0, albedoWm2: 0, irWm2: 0, absorbedW: 0 });

/** Velocity from the neighbours: central difference inside, one-sided at the ends (km/s). */
function differencedVelocity(prev: TrajectorySample | null, cur: TrajectorySample, next: TrajectorySample | null): Vector3 {
  const a = prev ?? cur;
  const b = next ?? cur;
  const dtS = (b.tMs - a.tMs) / 1000;
  if (!(dtS > 0)) throw new PhysicsError('invalid_trajectory', 'a trajectory needs at least two points at different epochs to find its velocity');
  return scale(subtract(b.positionKm, a.positionKm), 1 / dtS);
}

/** Loads on every surface at every row of the trajectory, with time-weighted averages and peaks. */
export function trajectoryEnvironment(samples: Iterable<TrajectorySample>, options: TrajectoryEnvironmentOptions): TrajectoryEnvironment {
  const { body, surfaces } = options;
  const albedo = options.albedo ?? body.albedo.nominal;
  const olrWm2 = options.olrWm2 ?? body.olrWm2.nominal;
  const keep = options.keep ?? (() => true);
  const sunAt = sunInterpolator(body);
  const fixed = surfaces.map((s, i) => (s.normal === 'sun' ? null : localNormal(s.normal, [0, 0, 1], `surfaces.${i}.normal`)));
  const sums = surfaces.map((s) => zeroLoad(s.name));
  const peaks = surfaces.map((s) => zeroLoad(s.name));
  const points: TrajectoryPointLoads[] = [];
  let sunlitSum = 0;
  let totalS = 0;
  let umbraS = 0;
  let penumbraS = 0;
  let betaSum = 0;
  let fluxSum = 0;
  let peakTotalAbsorbedW = 0;
  let index = 0;

  const visit = (prev: TrajectorySample | null, cur: TrajectorySample, next: TrajectorySample | null): void => {
    const r = cur.positionKm;
    const radiusKm = norm(r);
    const v = cur.velocityKmS ?? differencedVelocity(prev, cur, next);
    const h = cross(r, v);
    const hNorm = norm(h);
    if (!(hNorm > 1e-9 * radiusKm)) {
      throw new PhysicsError('invalid_trajectory', `row ${index + 1}: the velocity is along the position, so the orbit plane (and the local frame) is undefined`);
    }
    // local orbital frame: z zenith along r, y along the angular momentum, x = y × z toward ram
    const zenith = scale(r, 1 / radiusKm);
    const normal = scale(h, 1 / hNorm);
    const ram = cross(normal, zenith);
    const sun = sunAt(cur.tMs);
    const sunLocal: Vector3 = [dot(sun.directionIcrf, ram), dot(sun.directionIcrf, normal), dot(sun.directionIcrf, zenith)];
    const sunlit = sunlitFraction(shadowGeometry(r, sun.directionIcrf, sun.distanceAu * AU_KM, body.radiusKm));
    const point = { sunLocal, sunlit, solarFluxWm2: solarFluxWm2(sun.distanceAu), albedo, olrWm2, radiusKm, bodyRadiusKm: body.radiusKm };
    // trapezoidal weight: half of each neighbouring interval, s
    const weightS = ((next ? next.tMs - cur.tMs : 0) + (prev ? cur.tMs - prev.tMs : 0)) / 2000;
    totalS += weightS;
    sunlitSum += sunlit * weightS;
    if (sunlit <= 0) umbraS += weightS;
    else if (sunlit < 1) penumbraS += weightS;
    betaSum += Math.asin(Math.max(-1, Math.min(1, sunLocal[1]))) * weightS;
    fluxSum += point.solarFluxWm2 * weightS;
    const loads = surfaces.map((surface, i) => {
      const load = surfaceLoad(surface, fixed[i] ?? sunLocal, point);
      const [sum, peak] = [sums[i], peaks[i]];
      sum.solarWm2 += load.solarWm2 * weightS; sum.albedoWm2 += load.albedoWm2 * weightS;
      sum.irWm2 += load.irWm2 * weightS; sum.absorbedW += load.absorbedW * weightS;
      peak.solarWm2 = Math.max(peak.solarWm2, load.solarWm2); peak.albedoWm2 = Math.max(peak.albedoWm2, load.albedoWm2);
      peak.irWm2 = Math.max(peak.irWm2, load.irWm2); peak.absorbedW = Math.max(peak.absorbedW, load.absorbedW);
      return load;
    });
    let totalW = 0;
    for (const load of loads) totalW += load.absorbedW;
    peakTotalAbsorbedW = Math.max(peakTotalAbsorbedW, totalW);
    if (keep(index, cur.tMs)) points.push({ tMs: cur.tMs, altitudeKm: radiusKm - body.radiusKm, sunlit, surfaces: loads });
    index++;
  };

  let prev: TrajectorySample | null = null;
  let cur: TrajectorySample | null = null;
  for (const next of samples) {
    if (cur) visit(prev, cur, next);
    prev = cur;
    cur = next;
  }
  if (cur) visit(prev, cur, null);
  if (index < 2 || !(totalS > 0)) {
    throw new PhysicsError('invalid_trajectory', `a trajectory needs at least two points at increasing epochs; this one has ${index}`);
  }
  const average = (l: SurfaceLoad): SurfaceLoad => ({
    name: l.name, solarWm2: l.solarWm2 / totalS, albedoWm2: l.albedoWm2 / totalS, irWm2: l.irWm2 / totalS, absorbedW: l.absorbedW / totalS,
  });
  return {
    rows: index,
    albedo,
    olrWm2,
    points,
    averages: { sunlitFraction: sunlitSum / totalS, surfaces: sums.map(average) },
    peaks: { surfaces: peaks },
    peakTotalAbsorbedW,
    umbraS,
    penumbraS,
    spanS: totalS,
    meanBetaDeg: betaSum / totalS / DEG,
    meanSolarFluxWm2: fluxSum / totalS,
  };
}
