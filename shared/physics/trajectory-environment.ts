// The environment along a given trajectory (an uploaded ephemeris) rather than a Keplerian orbit:
// at every point the Sun from that point's epoch, the conical shadow of the central body (and, about a
// moon, of its planet: parent-shadow.ts's model), the plate-to-sphere view factors from that point's
// altitude and every surface's loads in the local orbital frame built from r and v (v by finite
// differences when the file gave none); a surface that moves in that frame (pointing.ts) takes its
// normal at each row, an inertial direction turned from the body's equatorial J2000 frame into ICRF.
// Albedo and planetary IR take the compute route's models (cap-loads.ts chooseCapModels, on the
// file's highest altitude): an airless body's surface temperature field and the Lambertian albedo
// integral by cap quadrature at every row (the coarser COARSE_CAP_NODES grid, its nodes rebuilt when
// the radius moves by more than 1e-4 of itself), else the closed forms of heat-loads.ts.
// Leaves out: what eclipse.ts, heat-loads.ts and sun-track.ts leave out (the Sun comes from the same
// track the sweeps use). Positions are in an ICRF-aligned frame centred on the body (EME2000/J2000 differ
// from ICRF by milliarcseconds, ignored). Source: API.md's load definitions; the frame as in
// orbit-position.ts (x ram, y orbit normal, z zenith).
import { getBody, type Body } from './bodies';
import { shadowGeometry, sunlitFraction } from './eclipse';
import { absorbedW, loadFromFactors, type Surface, type SurfaceLoad } from './heat-loads';
import { capExitances, chooseCapModels, COARSE_CAP_NODES, needsCap, pointingPlateNodes, reportedOlrWm2, type CapModelChoice, type CapModelRequest } from './cap-loads';
import { capNodes, plateFluxes, plateNodes, type PlateNodes } from './cap-radiance';
import { AU_KM, DAY_MS } from './constants';
import { PhysicsError } from './physics-error';
import { moonTrack } from './moon-ephemeris';
import { directionAt, fixedNormal, j2000ToIcrf, orientPlan, pointingPlan, pointingViewFactor, sunCosine, type PointingPlan } from './pointing';
import { combinedSunlit } from './parent-shadow';
import { solarFluxWm2 } from './sun';
import { sunTrack, type SunTrack } from './sun-track';
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
  /** About a moon: the share of the Sun's disk past its planet alone (1 clear of the planet's shadow). */
  parentSunlit?: number;
  surfaces: SurfaceLoad[];
}

export interface TrajectoryEnvironmentOptions extends CapModelRequest {
  body: Body;
  surfaces: readonly Surface[];
  /** Defaults to the body's nominal values (an OLR given for an airless body asks for the uniform model, as in the compute route). */
  albedo?: number | undefined;
  olrWm2?: number | undefined;
  /** The trajectory's highest altitude, km, for the choice of albedo model (cap-loads.ts); 0 when not known. */
  maxAltitudeKm?: number | undefined;
  /** Which rows (0-based, with their epochs) to return as points; every row counts in the averages. Default: all. */
  keep?: (index: number, tMs: number) => boolean;
}

export interface TrajectoryEnvironment {
  rows: number;
  albedo: number;
  /** The OLR used, or an airless body's whole-body mean exitance at the mean solar flux. */
  olrWm2: number;
  /** The albedo and IR models used. */
  models: CapModelChoice;
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

const SUN_CHUNK_MS = 30 * DAY_MS;

interface SunState {
  directionIcrf: Vector3;
  distanceAu: number;
  /** About a moon: the sunlit share past its planet at the spacecraft (1 for a planet). */
  planetSunlit: (positionKm: Vector3) => number;
}

/**
 * The Sun seen from the body through the sweeps' own Sun track (sun-track.ts: VSOP87 at nodes, a
 * moon's offset added), built a month at a time as the trajectory advances; about a moon, also the
 * planet's shadow at the spacecraft (the moon placed by moon-ephemeris.ts).
 */
function sunInterpolator(body: Body): (tMs: number) => SunState {
  const tracks = new Map<number, SunTrack>();
  const moon = body.parentId ? moonTrack(body) : null;
  const parentRadiusKm = body.parentId ? getBody(body.parentId).radiusKm : 0;
  const out = new Float64Array(3);
  const planetOut = new Float64Array(3);
  const moonOut = new Float64Array(3);
  return (tMs) => {
    const chunk = Math.floor(tMs / SUN_CHUNK_MS);
    let track = tracks.get(chunk);
    if (!track) {
      if (tracks.size > 4) tracks.clear();
      track = sunTrack(body, chunk * SUN_CHUNK_MS, (chunk + 1) * SUN_CHUNK_MS);
      tracks.set(chunk, track);
    }
    const distanceAu = track.atIcrf(tMs, out);
    const directionIcrf: Vector3 = [out[0], out[1], out[2]];
    if (!moon) return { directionIcrf, distanceAu, planetSunlit: () => 1 };
    const planetDistanceAu = track.planetAtIcrf(tMs, planetOut);
    const planetSun: Vector3 = [planetOut[0], planetOut[1], planetOut[2]];
    moon.at(tMs, moonOut);
    return {
      directionIcrf, distanceAu,
      planetSunlit: (r) => sunlitFraction(shadowGeometry([r[0] + moonOut[0], r[1] + moonOut[1], r[2] + moonOut[2]], planetSun, planetDistanceAu * AU_KM, parentRadiusKm)),
    };
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

/**
 * The cap quadrature at one row: replaces the closed-form albedo and/or IR of a surface's load with the
 * chosen models' (its plate nodes kept while the radius stays within 1e-4 of itself).
 */
function capLoads(models: CapModelChoice, surfaces: readonly Surface[], plans: readonly PointingPlan[], bodyRadiusKm: number, albedo: number) {
  const fixed = plans.map(fixedNormal);
  let radiusKm = Number.NaN;
  let cap = capNodes(2, COARSE_CAP_NODES.radial, COARSE_CAP_NODES.azimuth);
  let plates: (PlateNodes | null)[] = [];
  const out = new Float64Array(2);
  return (load: SurfaceLoad, i: number, r: number, sun: Vector3, fluxWm2: number, n: Float64Array): SurfaceLoad => {
    if (!(Math.abs(r - radiusKm) <= 1e-4 * r)) {
      radiusKm = r;
      cap = capNodes(r / bodyRadiusKm, COARSE_CAP_NODES.radial, COARSE_CAP_NODES.azimuth);
      const nodes = cap;
      plates = fixed.map((n) => (n ? plateNodes(nodes, n[0], n[1], n[2]) : null));
    }
    const { reflected, day, floor } = capExitances(models, fluxWm2, albedo);
    // a moving plate's nodes follow its normal (a spinner's axis) at this row
    plateFluxes(plates[i] ?? pointingPlateNodes(plans[i], cap, n[0], n[1], n[2]), sun[0], sun[1], sun[2], reflected, day, floor, out);
    const albedoWm2 = models.albedoModel === 'lambertian' ? out[0] : load.albedoWm2;
    const irWm2 = models.field ? out[1] : load.irWm2;
    return { ...load, albedoWm2, irWm2, absorbedW: absorbedW(surfaces[i], load.solarWm2, albedoWm2, irWm2) };
  };
}

/** Loads on every surface at every row of the trajectory, with time-weighted averages and peaks. */
export function trajectoryEnvironment(samples: Iterable<TrajectorySample>, options: TrajectoryEnvironmentOptions): TrajectoryEnvironment {
  const { body, surfaces } = options;
  const albedo = options.albedo ?? body.albedo.nominal;
  const olrWm2 = options.olrWm2 ?? body.olrWm2.nominal;
  const keep = options.keep ?? (() => true);
  const models = chooseCapModels(body, options, albedo, options.maxAltitudeKm ?? 0);
  // inertial directions in ICRF, the frame of the trajectory's positions
  const toIcrf = j2000ToIcrf(body);
  const plans = surfaces.map((s, i) => orientPlan(pointingPlan(s.normal, `surfaces.${i}.normal`), toIcrf));
  const capAt = needsCap(models) ? capLoads(models, surfaces, plans, body.radiusKm, albedo) : null;
  const sunAt = sunInterpolator(body);
  const n = new Float64Array(3);
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
    const parentSunlit = sun.planetSunlit(r);
    const sunlit = combinedSunlit(sunlitFraction(shadowGeometry(r, sun.directionIcrf, sun.distanceAu * AU_KM, body.radiusKm)), parentSunlit);
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
      const plan = plans[i];
      const d = plan.direction;
      const inertial = d.kind === 'inertial' ? d.v : ram;
      // the surface's normal (a spinner's axis) at this row (pointing.ts), and its two load factors
      directionAt(d, sunLocal[0], sunLocal[1], sunLocal[2], dot(inertial, ram), dot(inertial, normal), dot(inertial, zenith), n);
      const closed = loadFromFactors(surface, sunCosine(plan, n[0], n[1], n[2], sunLocal[0], sunLocal[1], sunLocal[2]), pointingViewFactor(plan, radiusKm, body.radiusKm, -n[2]), point);
      const load = capAt ? capAt(closed, i, radiusKm, sunLocal, point.solarFluxWm2, n) : closed;
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
    if (keep(index, cur.tMs)) points.push({ tMs: cur.tMs, altitudeKm: radiusKm - body.radiusKm, sunlit, ...(body.parentId ? { parentSunlit } : {}), surfaces: loads });
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
    olrWm2: reportedOlrWm2(models, fluxSum / totalS, olrWm2),
    models,
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
