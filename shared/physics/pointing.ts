// Where a surface faces over an orbit (the forms in words: pointing-words.ts): every pointing form of API.md "Environment computation" -
// a named or vector normal of the local orbital frame, the Sun, a direction fixed in inertial space,
// a one- or two-axis Sun-tracking drive, a plate on a spinning body and a face of a yaw-steered
// spacecraft. A surface's form is compiled once (`pointingPlan`), turned toward the orbit being
// computed (`orientPlan`: an inertial direction into the frame the caller's samples use), and at each
// sample gives its instantaneous local normal (`directionsAt`, the one rule every path uses: the
// compute route, the mission sweep, the trajectory and the case derivation through the compute
// route). From that normal the loads need two factors (`sunCosine` and `pointingViewFactor`;
// `pointingColumns` over an orbit): the positive part of the Sun's cosine on the plate and its view
// factor to the body (view-factors.ts, the Howell closed form). A spinner's factors are averaged over a turn: the Sun's cosine in closed form
// (the mean of max(0, a cos phi + b), elementary), the view factor in closed form over the arcs of
// the turn that see all or none of the body and by Gauss-Legendre quadrature over the arc between
// (spinViewFactor), and the cap quadrature of cap-radiance.ts with each ray's weight averaged over
// the turn in closed form (spinPlateNodes). The mission sweep reads view factors from a table by
// tilt, one per cone angle (viewFactorTables).
// Frames: the local orbital frame is x toward ram, y the orbit normal, z zenith. An inertial
// direction is given by right ascension and declination in the body's equatorial frame of J2000: its
// pole is the IAU WGCCRE pole of bodies.ts at J2000 and its x axis the ascending node of that equator
// on the ICRF equator (sun.ts bodyFrameAxes); for Earth this is EME2000 (the ICRF axes; the frame
// bias of milliarcseconds is ignored).
// Definitions (ours): trackSun about an axis turns a plate whose normal is perpendicular to the axis
// so that it faces the Sun as nearly as it can (normal = the Sun's direction with its part along the
// axis taken out); with the Sun on the axis the plate rests facing the direction perpendicular to the
// axis nearest zenith (nearest ram for a zenith or nadir axis). trackSun "both" is a two-axis drive:
// the normal is the Sun's direction, so its loads are those of "sun". yawSteered: the spacecraft turns
// about its zenith-nadir axis so that the Sun stays in its y-z plane on the +y side: the body axes are
// y_b = the Sun's horizontal direction, x_b = y_b x z, z_b = zenith; the -y face never sees the Sun
// and the +-x faces see it edge-on; with the Sun at zenith or nadir there is no yaw. The normal is
// given in the spacecraft frame before yaw (the local orbital frame's axes). Yaw does not tilt a
// normal from nadir, so its view factor and closed-form albedo and IR are those of the normal unyawed.
// Leaves out: gimbal limits and drive rates (the drive follows the Sun at once, also in the body's
// shadow, where solar is zero anyway), shadowing by the spacecraft's own parts, the spin's
// nutation and any spin-rate effect beyond the average over a turn.
// Sources: Howell catalogue (plate-to-sphere view factor, view-factors.ts); the spin average of
// max(0, cos) and of the view factor's fully visible part c / h^2 are elementary calculus (closed
// form); Gauss-Legendre quadrature (Press et al., Numerical Recipes sect. 4.5); the frames as in
// orbit-position.ts (Vallado ch. 2).
import { gaussLegendre01, meanPositiveCosine } from './cap-radiance';
import { J2000_JD } from './constants';
import { localNormal, type LocalVector, type NamedNormal } from './heat-loads';
import type { Body } from './bodies';
import type { GridShade, OrbitGrid } from './orbit-grid';
import type { OrbitBasis } from './orbit-position';
import { PhysicsError } from './physics-error';
import { bodyFrameAxes, julianDateTT, toBodyFrame } from './sun';
import { DEG, dot, fromSpherical, type Vector3 } from './vector3';
import { partlyVisibleViewFactor, plateToSphereViewFactor } from './view-factors';

/** A normal of the local orbital frame: a name or a unit vector. */
export type LocalNormal = NamedNormal | LocalVector;
/** Fixed in the body's equatorial frame of J2000 (for Earth EME2000). */
export interface InertialNormal {
  inertial: { raDeg: number; decDeg: number };
}
/** A drive axis: any local-orbital normal but the Sun. */
export type DriveAxis = Exclude<NamedNormal, 'sun'> | LocalVector;
/** A Sun-tracking drive about one axis of the local orbital frame, or "both" for two-axis tracking. */
export interface TrackSunNormal {
  trackSun: { axis: DriveAxis | 'both' };
}
/** A face of a yaw-steered spacecraft; `normal` in the spacecraft frame before yaw. */
export interface YawSteeredNormal {
  yawSteered: { normal: LocalNormal };
}
/** Every form that gives one direction at each instant (a spin's axis is one of these). */
export type DirectionNormal = LocalNormal | InertialNormal | TrackSunNormal | YawSteeredNormal;
/** A plate on a body spinning about `axis`, its normal `angleDeg` from the axis: loads averaged over a turn. */
export interface SpinNormal {
  spin: { axis: DirectionNormal; angleDeg: number };
}
export type SurfaceNormal = DirectionNormal | SpinNormal;

/** A compiled direction. `v`: the fixed normal, the inertial direction, the drive axis or the face before yaw. */
export type Direction =
  | { kind: 'fixed'; v: Vector3 }
  | { kind: 'sun' }
  | { kind: 'inertial'; v: Vector3 }
  | { kind: 'track'; v: Vector3; rest: Vector3 }
  | { kind: 'yaw'; v: Vector3 };

export interface PointingPlan {
  direction: Direction;
  /** The cone angle's cosine and sine from the spin axis; null for a plate that does not spin. */
  spin: { cos: number; sin: number } | null;
  /**
   * The cosine of the normal's (a spinner's axis's) tilt from nadir when it is the same at every
   * instant - a fixed normal, a yaw-steered face (yaw turns about nadir), a drive about the zenith-nadir
   * axis - so its view factor depends on the radius alone; null when it moves.
   */
  tilt: number | null;
}

function tiltOf(d: Direction): number | null {
  if (d.kind === 'fixed' || d.kind === 'yaw') return -d.v[2];
  if (d.kind === 'track' && Math.abs(d.v[2]) === 1) return 0;
  return null;
}

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null;

/** The unit direction perpendicular to the axis nearest zenith (nearest ram for a zenith or nadir axis). */
function restingNormal(a: Vector3): Vector3 {
  for (const e of [[0, 0, 1], [1, 0, 0]] as const) {
    const c = dot(e, a);
    const p: Vector3 = [e[0] - c * a[0], e[1] - c * a[1], e[2] - c * a[2]];
    const n = Math.hypot(p[0], p[1], p[2]);
    if (n > 1e-6) return [p[0] / n, p[1] / n, p[2] / n];
  }
  return [0, 0, 1];
}

function directionPlan(normal: DirectionNormal, path: string): Direction {
  if (normal === 'sun') return { kind: 'sun' };
  if (typeof normal === 'string' || 'x' in normal) return { kind: 'fixed', v: localNormal(normal, [0, 0, 1], path) };
  if ('inertial' in normal) {
    const { raDeg, decDeg } = normal.inertial;
    return { kind: 'inertial', v: fromSpherical(raDeg * DEG, decDeg * DEG) };
  }
  if ('trackSun' in normal) {
    const axis = normal.trackSun.axis;
    if (axis === 'both') return { kind: 'sun' };
    if ((axis as string) === 'sun') {
      throw new PhysicsError('invalid_surface', 'a Sun-tracking drive turns about an axis of the spacecraft, not about the Sun; use "both" for two-axis tracking', [
        { path: `${path}.trackSun.axis`, message: 'the axis cannot be "sun"' },
      ]);
    }
    const v = localNormal(axis, [0, 0, 1], `${path}.trackSun.axis`);
    return { kind: 'track', v, rest: restingNormal(v) };
  }
  const face = normal.yawSteered.normal;
  // A Sun-pointed plate stays Sun-pointed whatever the yaw.
  if (face === 'sun') return { kind: 'sun' };
  return { kind: 'yaw', v: localNormal(face, [0, 0, 1], `${path}.yawSteered.normal`) };
}

/** A surface's pointing compiled once; throws PhysicsError (naming `path`) for a direction that has none. */
export function pointingPlan(normal: SurfaceNormal, path = 'normal'): PointingPlan {
  if (typeof normal === 'object' && 'spin' in normal) {
    const { axis, angleDeg } = normal.spin;
    if (isObject(axis) && 'spin' in axis) {
      throw new PhysicsError('invalid_surface', 'a spin axis is a direction, not another spin', [{ path: `${path}.spin.axis`, message: 'a spin inside a spin' }]);
    }
    const direction = directionPlan(axis, `${path}.spin.axis`);
    return { direction, spin: { cos: Math.cos(angleDeg * DEG), sin: Math.sin(angleDeg * DEG) }, tilt: tiltOf(direction) };
  }
  const direction = directionPlan(normal, path);
  return { direction, spin: null, tilt: tiltOf(direction) };
}

/** Whether the plate's normal is the same local vector at every sample (a named or vector normal, no spin). */
export const fixedNormal = (plan: PointingPlan): Vector3 | null => (plan.direction.kind === 'fixed' && plan.spin === null ? plan.direction.v : null);

/** Whether the plan holds an inertial direction (it must be oriented to each orbit). */
export const isInertial = (plan: PointingPlan): boolean => plan.direction.kind === 'inertial';

/** The plan with its inertial direction (body equatorial J2000) turned by `rotate` into the caller's frame. */
export function orientPlan(plan: PointingPlan, rotate: (v: Vector3) => Vector3): PointingPlan {
  const d = plan.direction;
  return d.kind === 'inertial' ? { ...plan, direction: { kind: 'inertial', v: rotate(d.v) } } : plan;
}

const fromBodyFrame = (axes: { x: Vector3; y: Vector3; z: Vector3 }, v: Vector3): Vector3 => [
  axes.x[0] * v[0] + axes.y[0] * v[1] + axes.z[0] * v[2],
  axes.x[1] * v[0] + axes.y[1] * v[1] + axes.z[1] * v[2],
  axes.x[2] * v[0] + axes.y[2] * v[1] + axes.z[2] * v[2],
];

/** A direction in the body's equatorial frame of J2000, in ICRF axes. */
export function j2000ToIcrf(body: Body): (v: Vector3) => Vector3 {
  const axes = bodyFrameAxes(body, J2000_JD);
  return (v) => fromBodyFrame(axes, v);
}

/**
 * A direction in the body's equatorial frame of J2000 as components along an orbit's perifocal axes
 * P, Q, W, the orbit's elements being referred to the body's equatorial frame at `date` (the frame the
 * Sun is given in, sun.ts); without a date the frame of J2000.
 */
export function j2000ToPerifocal(body: Body, basis: OrbitBasis, date: Date | null): (v: Vector3) => Vector3 {
  const toIcrf = j2000ToIcrf(body);
  const axes = date === null ? null : bodyFrameAxes(body, julianDateTT(date));
  return (v) => {
    const d = axes ? toBodyFrame(axes, toIcrf(v)) : v;
    return [dot(d, basis.p), dot(d, basis.q), dot(d, basis.w)];
  };
}

/**
 * The rule: the instantaneous local unit normal (the spin axis for a spinner) at samples 0..count-1,
 * written into (nx, ny, nz), and its cosine with the Sun into `cs`: (sx, sy, sz) is the Sun's local
 * unit direction at each sample, (ix, iy, iz) the local components of the oriented inertial direction
 * (read for an inertial plan only). One loop per kind, so the sweep's millions of samples make no
 * call per sample.
 */
export function directionsAt(
  d: Direction, count: number, sx: Float64Array, sy: Float64Array, sz: Float64Array, ix: Float64Array, iy: Float64Array, iz: Float64Array,
  nx: Float64Array, ny: Float64Array, nz: Float64Array, cs: Float64Array,
): void {
  switch (d.kind) {
    case 'fixed': {
      const [x, y, z] = d.v;
      nx.fill(x, 0, count); ny.fill(y, 0, count); nz.fill(z, 0, count);
      for (let k = 0; k < count; k++) cs[k] = x * sx[k] + y * sy[k] + z * sz[k];
      return;
    }
    case 'inertial': {
      // the oriented direction's local components are the normal (pointingColumns writes them in place)
      if (nx !== ix) { nx.set(ix.subarray(0, count)); ny.set(iy.subarray(0, count)); nz.set(iz.subarray(0, count)); }
      for (let k = 0; k < count; k++) cs[k] = nx[k] * sx[k] + ny[k] * sy[k] + nz[k] * sz[k];
      return;
    }
    case 'sun':
      nx.set(sx.subarray(0, count)); ny.set(sy.subarray(0, count)); nz.set(sz.subarray(0, count));
      cs.fill(1, 0, count);
      return;
    case 'track': {
      // the Sun with its part along the axis taken out; at rest when the Sun is on the axis
      const a = d.v;
      const r = d.rest;
      for (let k = 0; k < count; k++) {
        const x = sx[k];
        const y = sy[k];
        const z = sz[k];
        const c = a[0] * x + a[1] * y + a[2] * z;
        const px = x - c * a[0];
        const py = y - c * a[1];
        const pz = z - c * a[2];
        const n = Math.sqrt(px * px + py * py + pz * pz);
        // below 1e-6 the Sun is on the axis to within 0.2 arcsec: the plate rests (and sees it edge-on)
        if (n > 1e-6) {
          const inverse = 1 / n;
          nx[k] = px * inverse; ny[k] = py * inverse; nz[k] = pz * inverse;
          // (p / |p|) . s = |p|
          cs[k] = n;
        } else {
          nx[k] = r[0]; ny[k] = r[1]; nz[k] = r[2];
          cs[k] = r[0] * x + r[1] * y + r[2] * z;
        }
      }
      return;
    }
    case 'yaw': {
      const v = d.v;
      for (let k = 0; k < count; k++) {
        const x = sx[k];
        const y = sy[k];
        const z = sz[k];
        const h = Math.sqrt(x * x + y * y);
        if (h > 1e-12) {
          // x_b = (sy, -sx, 0) / h, y_b = (sx, sy, 0) / h, z_b = zenith: the Sun is (0, h, sz) in the body frame
          const inverse = 1 / h;
          nx[k] = (v[0] * y + v[1] * x) * inverse;
          ny[k] = (v[1] * y - v[0] * x) * inverse;
          cs[k] = v[1] * h + v[2] * z;
        } else {
          // the Sun at zenith or nadir: no yaw
          nx[k] = v[0];
          ny[k] = v[1];
          cs[k] = v[2] * z;
        }
        nz[k] = v[2];
      }
      return;
    }
  }
}

const one = () => new Float64Array(1);
const single = { sx: one(), sy: one(), sz: one(), ix: one(), iy: one(), iz: one(), nx: one(), ny: one(), nz: one(), cs: one() };

/** directionsAt at one instant (the trajectory's rows): the normal into `out`. */
export function directionAt(d: Direction, sx: number, sy: number, sz: number, ix: number, iy: number, iz: number, out: Float64Array): void {
  const a = single;
  [a.sx[0], a.sy[0], a.sz[0], a.ix[0], a.iy[0], a.iz[0]] = [sx, sy, sz, ix, iy, iz];
  directionsAt(d, 1, a.sx, a.sy, a.sz, a.ix, a.iy, a.iz, a.nx, a.ny, a.nz, a.cs);
  [out[0], out[1], out[2]] = [a.nx[0], a.ny[0], a.nz[0]];
}

/** Gauss-Legendre nodes over the part of a turn in which a spinning plate sees part of the body. */
export const SPIN_PARTIAL_NODES = 16;
const PARTIAL = gaussLegendre01(SPIN_PARTIAL_NODES);

/**
 * The view factor to the body of a plate on a spinner, averaged over a turn: the plate's normal is
 * at cone angle (cos, sin) from the axis, the axis tilted from nadir by the angle of cosine `u`.
 * Over the turn the normal's cosine with nadir is c(phi) = a + b cos(phi), a = cos * u,
 * b = sin * sqrt(1 - u^2), and the mean is (1/pi) times the integral over phi in [0, pi] of F(c(phi)), F the Howell form of
 * view-factors.ts. F is c / h^2 where the plate sees the whole body (c >= 1/h) and 0 where it sees none
 * (c <= -1/h): on those arcs, cut off at the phases where c(phi) crosses +-1/h, the integral is
 * elementary; on the arc between, where F is the partly-visible form, SPIN_PARTIAL_NODES-point
 * Gauss-Legendre. F's departure from those two forms grows as the 5/2 power of the distance from the
 * crossings (seen numerically in the Howell form), so the quadrature meets no kink: within 2e-7 of
 * the nadir plate's factor 1/h^2 of a brute-force average over 20,000 phases of the turn for every
 * radius, tilt and cone angle (pointing.spec.ts; 5e-8 the worst seen, near the body's surface),
 * where the midpoint rule over 64 evenly spaced phases, used before, was off by up to 7e-6 at about
 * four times the cost.
 */
export function spinViewFactor(rKm: number, bodyRadiusKm: number, u: number, cos: number, sin: number): number {
  const h = rKm / bodyRadiusKm;
  const a = cos * u;
  const b = sin * Math.sqrt(Math.max(0, 1 - u * u));
  // no turn of the normal (no cone angle, or the axis at nadir or zenith): the plate's own factor
  if (!(b > 1e-12)) return plateToSphereViewFactor(rKm, bodyRadiusKm, Math.acos(Math.max(-1, Math.min(1, a))));
  if (!(h > 1)) throw new RangeError(`the plate must be outside the sphere: r/R = ${h}`);
  const k = 1 / h;
  const h2 = h * h;
  // all of the turn sees the whole body (the mean of c is a) or none of it
  if (a - b >= k) return a / h2;
  if (a + b <= -k) return 0;
  // (clamped: a ratio within rounding of -1 or 1 may fall just outside)
  const from = a + b > k ? Math.acos(Math.max(-1, Math.min(1, (k - a) / b))) : 0;
  const to = a - b < -k ? Math.acos(Math.max(-1, Math.min(1, (-k - a) / b))) : Math.PI;
  const length = to - from;
  let partly = 0;
  const { x, w } = PARTIAL;
  for (let i = 0; i < SPIN_PARTIAL_NODES; i++) {
    const c = a + b * Math.cos(from + length * x[i]);
    partly += w[i] * partlyVisibleViewFactor(h, c, Math.sqrt(Math.max(0, 1 - c * c)));
  }
  return ((a * from + b * Math.sin(from)) / h2 + length * partly) / Math.PI;
}

/** The view factor of a plan's plate (its spin average for a spinner), the normal (or axis) tilted from nadir by the angle of cosine `u`. */
export function pointingViewFactor(plan: PointingPlan, rKm: number, bodyRadiusKm: number, u: number): number {
  const spin = plan.spin;
  return spin ? spinViewFactor(rKm, bodyRadiusKm, u, spin.cos, spin.sin) : plateToSphereViewFactor(rKm, bodyRadiusKm, Math.acos(Math.max(-1, Math.min(1, u))));
}

/** The positive part of the Sun's cosine on the plate (its average over a turn for a spinner), from the normal or axis n and the Sun s. */
export function sunCosine(plan: PointingPlan, nx: number, ny: number, nz: number, sx: number, sy: number, sz: number): number {
  const c = nx * sx + ny * sy + nz * sz;
  const spin = plan.spin;
  // pointingColumns writes the same in its loop
  if (!spin) return c > 0 ? c : 0;
  return meanPositiveCosine(spin.sin * Math.sqrt(Math.max(0, 1 - c * c)), spin.cos * c);
}

/**
 * The view factor as a function of the cosine u of the normal's (a spinner's axis's) tilt from nadir at
 * one radius, tabulated at `intervals` + 1 points for linear interpolation: for paths that evaluate it
 * millions of times (the mission sweep of a circular orbit). pointing.spec.ts holds it to the direct form.
 */
export interface ViewFactorTable {
  values: Float64Array;
  intervals: number;
}

export function viewFactorTable(plan: PointingPlan, rKm: number, bodyRadiusKm: number, intervals = 2048): ViewFactorTable {
  const values = new Float64Array(intervals + 2);
  for (let i = 0; i <= intervals; i++) values[i] = pointingViewFactor(plan, rKm, bodyRadiusKm, -1 + (2 * i) / intervals);
  values[intervals + 1] = values[intervals];
  return { values, intervals };
}

/**
 * viewFactorTable at one radius for any number of plans, made once per cone angle: the table depends
 * on a plan's spin alone (u is its argument), so plates that spin alike share one and every plate that
 * does not spin shares one. `kept` holds the tables across calls (keyed by radius too), e.g. across
 * the chunks of days one sweep is computed in.
 */
export function viewFactorTables(
  rKm: number, bodyRadiusKm: number, kept = new Map<string, ViewFactorTable>(),
): (plan: PointingPlan) => ViewFactorTable {
  return (plan) => {
    const key = `${rKm} ${bodyRadiusKm} ${plan.spin ? `${plan.spin.cos} ${plan.spin.sin}` : 'no spin'}`;
    let table = kept.get(key);
    if (table === undefined) kept.set(key, (table = viewFactorTable(plan, rKm, bodyRadiusKm)));
    return table;
  };
}

/** The table's value at u (linear interpolation). */
export function tableViewFactor(table: ViewFactorTable, u: number): number {
  const values = table.values;
  const intervals = table.intervals;
  const x = (u + 1) * (intervals / 2);
  const i = x <= 0 ? 0 : x >= intervals ? intervals : x | 0;
  const f = x - i;
  return values[i] + (values[i + 1] - values[i]) * (f > 0 ? f : 0);
}

/** Per sample: the Sun's cosine factor, the view factor, and the local normal (the axis for a spinner). */
export interface PointingColumns {
  sunCos: Float64Array;
  viewFactor: Float64Array;
  nx: Float64Array;
  ny: Float64Array;
  nz: Float64Array;
  /** With sunlit shares given: the orbit sums of sunlit x the Sun's factor, F x max(0, cos subsolar), F. */
  sums: Float64Array;
  /** Work column: the Sun's orbit-normal part. */
  sy: Float64Array;
}

export function pointingColumnsFor(steps: number): PointingColumns {
  const a = () => new Float64Array(steps);
  return { sunCos: a(), viewFactor: a(), nx: a(), ny: a(), nz: a(), sums: new Float64Array(3), sy: a() };
}

/**
 * The columns of an oriented plan over an orbit grid (its inertial direction in the orbit's perifocal
 * frame), with the Sun of `shade` and `sunW`. The view factor comes from `table` where given (one
 * radius), else the direct form at each sample's radius. Given the sunlit shares, `out.sums` receives
 * the orbit sums of sunlit x the Sun's factor, of F x max(0, cos subsolar) and of F (the sweep's).
 * The sweep calls this for every moving plate on every date (millions of samples), so the passes
 * over the samples are few and plain: the view factor has one loop per case (one value, a table, the
 * direct form), and an inertial direction's local components go straight into the normal's columns.
 */
export function pointingColumns(
  plan: PointingPlan, grid: OrbitGrid, shade: GridShade, sunW: number, bodyRadiusKm: number,
  out: PointingColumns = pointingColumnsFor(grid.steps), table: ViewFactorTable | null = null, sunlit: Float64Array | null = null,
): PointingColumns {
  const d = plan.direction;
  const spin = plan.spin;
  const steps = grid.steps;
  const { cx, cz } = shade;
  const { sunCos, viewFactor, nx, ny, nz, sy } = out;
  sy.fill(sunW, 0, steps);
  if (d.kind === 'inertial') {
    // the inertial direction in the local frame, as the Sun's in orbit-grid.ts shadeGrid, written
    // straight into the normal's columns: directionsAt reads each sample there before it writes it
    const [dp, dq, dw] = d.v;
    const { cosNu, sinNu } = grid;
    for (let k = 0; k < steps; k++) {
      const c = cosNu[k];
      const s = sinNu[k];
      nx[k] = dq * c - dp * s;
      nz[k] = dp * c + dq * s;
    }
    ny.fill(dw, 0, steps);
  }
  directionsAt(d, steps, cx, sy, cz, nx, ny, nz, nx, ny, nz, sunCos);
  // The view factor: one value, a table read (tableViewFactor written inline: a call that returns a
  // number per sample costs an allocation per sample where the compiler does not inline it), or the
  // direct form at each radius.
  if (table && plan.tilt !== null) viewFactor.fill(tableViewFactor(table, plan.tilt), 0, steps);
  else if (table) {
    const { values, intervals } = table;
    const half = intervals / 2;
    for (let k = 0; k < steps; k++) {
      const x = (1 - nz[k]) * half;
      const i = x <= 0 ? 0 : x >= intervals ? intervals : x | 0;
      const t = x - i;
      viewFactor[k] = values[i] + (values[i + 1] - values[i]) * (t > 0 ? t : 0);
    }
  } else for (let k = 0; k < steps; k++) viewFactor[k] = pointingViewFactor(plan, grid.radiusKm[k], bodyRadiusKm, -nz[k]);
  // The Sun's factor (a spinner's: cap-radiance.ts meanPositiveCosine written inline) and the sums.
  const [cos, sin] = spin ? [spin.cos, spin.sin] : [1, 0];
  let solar = 0;
  let albedo = 0;
  let ir = 0;
  for (let k = 0; k < steps; k++) {
    const c = sunCos[k];
    let factor: number;
    if (spin) {
      const a = sin * Math.sqrt(Math.max(0, 1 - c * c));
      const b = cos * c;
      factor = b >= a ? b : b <= -a ? 0 : (b * Math.acos(-b / a) + Math.sqrt(a * a - b * b)) / Math.PI;
    } else factor = c > 0 ? c : 0;
    sunCos[k] = factor;
    if (sunlit) {
      const f = viewFactor[k];
      const z = cz[k];
      solar += sunlit[k] * factor;
      if (z > 0) albedo += f * z;
      ir += f;
    }
  }
  out.sums[0] = solar;
  out.sums[1] = albedo;
  out.sums[2] = ir;
  return out;
}
