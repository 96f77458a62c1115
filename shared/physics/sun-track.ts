// The Sun seen from a body over a span of dates, for sweeps that need it thousands of times: the full
// VSOP87 position and the IAU pole at nodes a few days apart, cubic (four-point Lagrange)
// interpolation between them.
// Leaves out: nothing sunFromBody models; the interpolation adds an error of about 0.1 arcsec in
// direction and under 1e-6 AU in distance (flux within 2e-6) for Earth with nodes 4 days apart (the largest short-period term is
// Earth's monthly wobble about the Earth-Moon barycentre, about 6 arcsec; the four-point error is
// about (3/128) (omega h)^4 of it). Source: Abramowitz & Stegun 25.2.13 (four-point Lagrange
// interpolation); the interpolated values are checked against sunFromBody in mission-sweep.spec.ts.
// A moon's Sun adds the moon's offset from its planet at each instant (moon-ephemeris.ts), from a
// track of the moon's theory (nodes a sixteenth of a revolution apart, or 4 days for the fast moons),
// interpolated in the frame turning with the moon (the offset then errs by tens of km for the Moon
// and a few thousand km at most for the fast moons: under 1e-4 in their solar flux, checked in
// parent-shadow.spec.ts).
import type { Body, HeliocentricOrbit } from './bodies';
import { AU_KM, DAY_MS } from './constants';
import { moonTrack, type MoonTrack } from './moon-ephemeris';
import { DEG, type Vector3 } from './vector3';
import { bodyFrameAxes, eclipticToEquatorial, julianDateTT, toBodyFrame } from './sun';
import { vsop87Series } from './vsop87';
import { keplerHeliocentric } from './custom-bodies';

/** A custom body's Keplerian path (custom-bodies.ts) at the nodes, in vsop87Series's shape. */
function keplerSeries(orbit: HeliocentricOrbit, jde0: number, stepDays: number, count: number) {
  const series = { lon: new Float64Array(count), lat: new Float64Array(count), range: new Float64Array(count) };
  for (let i = 0; i < count; i++) {
    const p = keplerHeliocentric(orbit, jde0 + i * stepDays);
    [series.lon[i], series.lat[i], series.range[i]] = [p.lon, p.lat, p.range];
  }
  return series;
}

export const SUN_TRACK_NODE_DAYS = 4;

export interface SunTrack {
  /**
   * The Sun at a UTC instant (ms since 1970) within the span: `out` receives the unit vector from
   * the body's centre to the Sun in the body's equatorial frame; the distance in AU is returned.
   * Writing into `out` keeps sweeps free of allocation.
   */
  at(ms: number, out: Float64Array): number;
  /** The same in ICRF axes (the frame of a trajectory's positions). */
  atIcrf(ms: number, out: Float64Array): number;
  /** For a moon, its planet's Sun (the moon's offset left out) in ICRF; for a planet the same as atIcrf. */
  planetAtIcrf(ms: number, out: Float64Array): number;
  /** A moon's own coarse track (its offset for the Sun), null for a planet. */
  readonly moon: MoonTrack | null;
  /** Instants (ms) of the nodes, for tests. */
  readonly firstNodeMs: number;
  readonly nodeMs: number;
}

/**
 * Node spacing for a body: 4 days, closer where the pole has a fast periodic term (the Moon's E3, E4
 * turn 13 deg/day) so that no term turns more than 0.25 rad between nodes.
 */
export function sunTrackNodeDays(body: Body): number {
  // A moon's nodes hold its planet's Sun in ICRF; its own pole is applied at each instant.
  if (body.parentOrbit) return SUN_TRACK_NODE_DAYS;
  const fastestRadPerDay = Math.max(0, ...body.pole.terms.map((t) => Math.abs(t.rateDegPerDay) * DEG));
  return fastestRadPerDay > 0 ? Math.min(SUN_TRACK_NODE_DAYS, 0.25 / fastestRadPerDay) : SUN_TRACK_NODE_DAYS;
}

/** A sixteenth of the moon's revolution, or the Sun's 4 days for moons faster than 16 days (their offset's error stays a few thousand km). */
const moonSunNodeDays = (periodDays: number): number => (periodDays / 16 >= 1 ? periodDays / 16 : SUN_TRACK_NODE_DAYS);

/** The Sun from the body between startMs and endMs (inclusive), UTC milliseconds since 1970. */
export function sunTrack(body: Body, startMs: number, endMs: number, nodeDays = sunTrackNodeDays(body)): SunTrack {
  if (!(endMs >= startMs) || !Number.isFinite(startMs) || !Number.isFinite(endMs)) {
    throw new RangeError(`a Sun track needs start <= end, got ${startMs} .. ${endMs}`);
  }
  const h = nodeDays * DAY_MS;
  // One node before the start and two past the end keep every instant inside a full four-point stencil.
  const first = startMs - h;
  const count = Math.floor((endMs - startMs) / h) + 4;
  // A planet's nodes hold the Sun in its own frame; a moon's hold its planet's Sun in ICRF, the
  // moon's offset and pole then applied at each instant.
  const moon: MoonTrack | null = body.parentOrbit ? moonTrack(body, moonSunNodeDays(body.parentOrbit.periodDays)) : null;
  const icrfNodes = moon !== null;
  const xs = new Float64Array(count);
  const ys = new Float64Array(count);
  const zs = new Float64Array(count);
  // The nodes are evenly spaced in time, so the VSOP87 sums run as series over the grid (vsop87Series).
  const jde0 = julianDateTT(new Date(first));
  const helio = body.heliocentric ? keplerSeries(body.heliocentric, jde0, nodeDays, count) : vsop87Series(body.planetId, jde0, nodeDays, count);
  for (let i = 0; i < count; i++) {
    const jde = jde0 + i * nodeDays;
    const cosLat = Math.cos(helio.lat[i]);
    const range = helio.range[i];
    const towardSun = eclipticToEquatorial([
      -range * cosLat * Math.cos(helio.lon[i]), -range * cosLat * Math.sin(helio.lon[i]), -range * Math.sin(helio.lat[i]),
    ]);
    const [x, y, z] = icrfNodes ? towardSun : toBodyFrame(bodyFrameAxes(body, jde), towardSun);
    xs[i] = x;
    ys[i] = y;
    zs[i] = z;
  }
  const offset = new Float64Array(3);
  const interpolated = new Float64Array(3);
  /** The planet's Sun at ms, AU (body frame for a planet, ICRF for a moon), into `into`. */
  const planetSun = (ms: number, into: Float64Array): void => {
    const s = (ms - first) / h;
    // stencil nodes j-1, j, j+1, j+2 around s in [j, j+1)
    const j = Math.min(count - 3, Math.max(1, Math.floor(s)));
    const u = s - j;
    // Abramowitz & Stegun 25.2.13, four-point Lagrange weights for nodes -1, 0, 1, 2
    const wm = (-u * (u - 1) * (u - 2)) / 6;
    const w0 = ((u + 1) * (u - 1) * (u - 2)) / 2;
    const w1 = (-(u + 1) * u * (u - 2)) / 2;
    const w2 = ((u + 1) * u * (u - 1)) / 6;
    const x = wm * xs[j - 1] + w0 * xs[j] + w1 * xs[j + 1] + w2 * xs[j + 2];
    const y = wm * ys[j - 1] + w0 * ys[j] + w1 * ys[j + 1] + w2 * ys[j + 2];
    const z = wm * zs[j - 1] + w0 * zs[j] + w1 * zs[j + 1] + w2 * zs[j + 2];
    into[0] = x;
    into[1] = y;
    into[2] = z;
  };
  /** Unit vector into `out`, its length returned. */
  const normalise = (x: number, y: number, z: number, out: Float64Array): number => {
    const distanceAu = Math.sqrt(x * x + y * y + z * z);
    out[0] = x / distanceAu;
    out[1] = y / distanceAu;
    out[2] = z / distanceAu;
    return distanceAu;
  };
  /** A moon's Sun in ICRF, AU, into `interpolated`. */
  const moonSunIcrf = (ms: number, track: MoonTrack): void => {
    planetSun(ms, interpolated);
    track.at(ms, offset);
    interpolated[0] -= offset[0] / AU_KM;
    interpolated[1] -= offset[1] / AU_KM;
    interpolated[2] -= offset[2] / AU_KM;
  };
  /** A planet's Sun in ICRF, AU, into `interpolated`. */
  const planetSunIcrf = (ms: number): void => {
    planetSun(ms, interpolated);
    const axes = bodyFrameAxes(body, julianDateTT(new Date(ms)));
    const v: Vector3 = [interpolated[0], interpolated[1], interpolated[2]];
    for (let i = 0; i < 3; i++) interpolated[i] = axes.x[i] * v[0] + axes.y[i] * v[1] + axes.z[i] * v[2];
  };
  return {
    moon,
    firstNodeMs: first,
    nodeMs: h,
    at(ms: number, out: Float64Array): number {
      if (!moon) {
        planetSun(ms, interpolated);
        return normalise(interpolated[0], interpolated[1], interpolated[2], out);
      }
      moonSunIcrf(ms, moon);
      const axes = bodyFrameAxes(body, julianDateTT(new Date(ms)));
      const v: Vector3 = [interpolated[0], interpolated[1], interpolated[2]];
      const [x, y, z] = toBodyFrame(axes, v);
      return normalise(x, y, z, out);
    },
    atIcrf(ms: number, out: Float64Array): number {
      if (moon) moonSunIcrf(ms, moon);
      else planetSunIcrf(ms);
      return normalise(interpolated[0], interpolated[1], interpolated[2], out);
    },
    planetAtIcrf(ms: number, out: Float64Array): number {
      if (moon) planetSun(ms, interpolated);
      else planetSunIcrf(ms);
      return normalise(interpolated[0], interpolated[1], interpolated[2], out);
    },
  };
}
