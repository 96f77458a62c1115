// The Sun seen from a body over a span of dates, for sweeps that need it thousands of times: the full
// VSOP87 position and the IAU pole at nodes a few days apart, cubic (four-point Lagrange)
// interpolation between them.
// Leaves out: nothing sunFromBody models; the interpolation adds an error of about 0.1 arcsec in
// direction and under 1e-6 AU in distance (flux within 2e-6) for Earth with nodes 4 days apart (the largest short-period term is
// Earth's monthly wobble about the Earth-Moon barycentre, about 6 arcsec; the four-point error is
// about (3/128) (omega h)^4 of it). Source: Abramowitz & Stegun 25.2.13 (four-point Lagrange
// interpolation); the interpolated values are checked against sunFromBody in sun-track.spec.ts.
import type { Body } from './bodies';
import { DEG } from './vector3';
import { bodyFrameAxes, eclipticToEquatorial, julianDateTT, toBodyFrame } from './sun';
import { vsop87Series } from './vsop87';

const DAY_MS = 86400e3;
export const SUN_TRACK_NODE_DAYS = 4;

export interface SunTrack {
  /**
   * The Sun at a UTC instant (ms since 1970) within the span: `out` receives the unit vector from
   * the body's centre to the Sun in the body's equatorial frame; the distance in AU is returned.
   * Writing into `out` keeps sweeps free of allocation.
   */
  at(ms: number, out: Float64Array): number;
  /** Instants (ms) of the nodes, for tests. */
  readonly firstNodeMs: number;
  readonly nodeMs: number;
}

/**
 * Node spacing for a body: 4 days, closer where the pole has a fast periodic term (the Moon's E3, E4
 * turn 13 deg/day) so that no term turns more than 0.25 rad between nodes.
 */
export function sunTrackNodeDays(body: Body): number {
  const fastestRadPerDay = Math.max(0, ...body.pole.terms.map((t) => Math.abs(t.rateDegPerDay) * DEG));
  return fastestRadPerDay > 0 ? Math.min(SUN_TRACK_NODE_DAYS, 0.25 / fastestRadPerDay) : SUN_TRACK_NODE_DAYS;
}

/** The Sun from the body between startMs and endMs (inclusive), UTC milliseconds since 1970. */
export function sunTrack(body: Body, startMs: number, endMs: number, nodeDays = sunTrackNodeDays(body)): SunTrack {
  if (!(endMs >= startMs) || !Number.isFinite(startMs) || !Number.isFinite(endMs)) {
    throw new RangeError(`a Sun track needs start <= end, got ${startMs} .. ${endMs}`);
  }
  const h = nodeDays * DAY_MS;
  // One node before the start and two past the end keep every instant inside a full four-point stencil.
  const first = startMs - h;
  const count = Math.floor((endMs - startMs) / h) + 4;
  const xs = new Float64Array(count);
  const ys = new Float64Array(count);
  const zs = new Float64Array(count);
  // The nodes are evenly spaced in time, so the VSOP87 sums run as series over the grid (vsop87Series).
  const jde0 = julianDateTT(new Date(first));
  const helio = vsop87Series(body.planetId, jde0, nodeDays, count);
  for (let i = 0; i < count; i++) {
    const jde = jde0 + i * nodeDays;
    const cosLat = Math.cos(helio.lat[i]);
    const range = helio.range[i];
    const towardSun = eclipticToEquatorial([
      -range * cosLat * Math.cos(helio.lon[i]), -range * cosLat * Math.sin(helio.lon[i]), -range * Math.sin(helio.lat[i]),
    ]);
    const [x, y, z] = toBodyFrame(bodyFrameAxes(body, jde), towardSun);
    xs[i] = x;
    ys[i] = y;
    zs[i] = z;
  }
  return {
    firstNodeMs: first,
    nodeMs: h,
    at(ms: number, out: Float64Array): number {
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
      const distanceAu = Math.sqrt(x * x + y * y + z * z);
      out[0] = x / distanceAu;
      out[1] = y / distanceAu;
      out[2] = z / distanceAu;
      return distanceAu;
    },
  };
}
