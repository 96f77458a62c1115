// Albedo and planetary IR on a flat plate from a body whose exitance varies over its surface, by
// numerical quadrature over the cap the plate sees: sunlight reflected by a Lambertian surface
// (exitance a S cos z on the lit side) and, for an airless body, the heat of a surface in
// radiative equilibrium with the Sun (exitance S (1 - A) cos z on the day side, never below the
// night floor eps sigma T_night^4). The plate's flux is (1/pi) times the integral of the exitance
// over the projected solid angle of the body's disk, clipped by the plate's own horizon.
// The nodes are fixed for a radius (rays from the spacecraft through a Gauss-Legendre grid in
// rho^2 and an even grid in azimuth over the disk, rho = sin of the nadir angle) and weighted per
// plate once; each sample is then one pass over the nodes with the Sun's local direction.
// Leaves out: thermal inertia (the surface answers the Sun at once: no warm dusk or cold dawn),
// latitude and terrain, non-Lambertian reflection and emission, the Sun's finite size at the
// terminator, and the body's oblateness. Sources: Howell catalogue introduction (the differential
// view-factor integral; with uniform exitance these weights sum to the plate-to-sphere factor,
// view-factors.ts); radiative equilibrium T = [S (1 - A) cos z / (eps sigma)]^(1/4) as in Vasavada
// et al. 1999 / 2012 (the zero-inertia limit of their models, from memory).
import { STEFAN_BOLTZMANN } from './constants';

/** Quadrature nodes over the body's disk seen from a radius: the ground point each ray meets and its ray. */
export interface CapNodes {
  count: number;
  /** Ground point hit by each ray, a unit vector from the body's centre, local frame (x ram, y orbit normal, z zenith). */
  ux: Float64Array;
  uy: Float64Array;
  uz: Float64Array;
  /** Unit ray direction from the spacecraft, local frame. */
  rx: Float64Array;
  ry: Float64Array;
  rz: Float64Array;
  /** Projected-solid-angle weight over pi of each node for a nadir-facing plate; they sum to (R/r)^2. */
  base: Float64Array;
}

/** Nodes of one plate: the ground points it sees and their weights (the plate's cosine included). */
export interface PlateNodes {
  count: number;
  ux: Float64Array;
  uy: Float64Array;
  uz: Float64Array;
  weight: Float64Array;
}

/** The airless surface's temperature field. */
export interface SurfaceField {
  bondAlbedo: number;
  emissivity: number;
  nightFloorK: number;
}

export const RADIAL_NODES = 20;
export const AZIMUTH_NODES = 48;

/** Gauss-Legendre nodes and weights on [0, 1] (Newton on P_n; Press et al., Numerical Recipes sect. 4.5). */
export function gaussLegendre01(n: number): { x: Float64Array; w: Float64Array } {
  const x = new Float64Array(n);
  const w = new Float64Array(n);
  for (let i = 0; i < Math.ceil(n / 2); i++) {
    let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
    let dp = 0;
    for (let it = 0; it < 100; it++) {
      let p0 = 1;
      let p1 = 0;
      for (let j = 0; j < n; j++) {
        const p2 = p1;
        p1 = p0;
        p0 = ((2 * j + 1) * z * p1 - j * p2) / (j + 1);
      }
      dp = (n * (z * p0 - p1)) / (z * z - 1);
      const dz = p0 / dp;
      z -= dz;
      if (Math.abs(dz) < 1e-15) break;
    }
    const weight = 2 / ((1 - z * z) * dp * dp);
    x[i] = (1 - z) / 2;
    x[n - 1 - i] = (1 + z) / 2;
    w[i] = w[n - 1 - i] = weight / 2;
  }
  return { x, w };
}

/** Quadrature nodes over the body's disk seen from r / R = h (> 1). */
export function capNodes(h: number, radial = RADIAL_NODES, azimuth = AZIMUTH_NODES): CapNodes {
  if (!(h > 1)) throw new RangeError(`the spacecraft must be outside the body: r/R = ${h}`);
  const count = radial * azimuth;
  const arrays = () => new Float64Array(count);
  const nodes: CapNodes = { count, ux: arrays(), uy: arrays(), uz: arrays(), rx: arrays(), ry: arrays(), rz: arrays(), base: arrays() };
  const { x, w } = gaussLegendre01(radial);
  const rhoMax2 = 1 / (h * h);
  let k = 0;
  for (let i = 0; i < radial; i++) {
    // rho^2 = v / h^2: even in projected area, so a nadir plate's weights are all alike
    const rho = Math.sqrt(x[i] * rhoMax2);
    const cosEta = Math.sqrt(1 - rho * rho);
    // distance along the ray to the ground: t^2 - 2 h t cos(eta) + h^2 - 1 = 0, nearer root
    const t = h * cosEta - Math.sqrt(Math.max(0, 1 - h * h * rho * rho));
    // (1/pi) rho drho dphi = (1/pi) (dv / (2 h^2)) dphi, with v's Gauss weight and dphi = 2 pi / azimuth
    const weight = (w[i] * rhoMax2) / azimuth;
    for (let j = 0; j < azimuth; j++, k++) {
      const phi = ((j + 0.5) * 2 * Math.PI) / azimuth;
      const rx = rho * Math.cos(phi);
      const ry = rho * Math.sin(phi);
      nodes.rx[k] = rx;
      nodes.ry[k] = ry;
      nodes.rz[k] = -cosEta;
      nodes.ux[k] = t * rx;
      nodes.uy[k] = t * ry;
      nodes.uz[k] = h - t * cosEta;
      nodes.base[k] = weight;
    }
  }
  return nodes;
}

/** The nodes a plate of unit normal (nx, ny, nz) sees, each weighted by its cosine on the plate; those behind it dropped. */
export function plateNodes(cap: CapNodes, nx: number, ny: number, nz: number): PlateNodes {
  return weightedNodes(cap, (rx, ry, rz) => {
    const c = nx * rx + ny * ry + nz * rz;
    return c > 0 ? c : 0;
  });
}

/**
 * The nodes of a plate on a body spinning about the unit axis (ax, ay, az), its normal at cone angle
 * (cos, sin) from the axis: each ray's cosine on the plate averaged over a turn, in closed form (the
 * mean of max(0, sin sin(psi) cos(phi) + cos cos(psi)), psi the ray's angle from the axis).
 */
export function spinPlateNodes(cap: CapNodes, ax: number, ay: number, az: number, cos: number, sin: number): PlateNodes {
  return weightedNodes(cap, (rx, ry, rz) => {
    const c = ax * rx + ay * ry + az * rz;
    return meanPositiveCosine(sin * Math.sqrt(Math.max(0, 1 - c * c)), cos * c);
  });
}

/** The nodes whose ray has a positive (mean) cosine on the plate, weighted by it. */
function weightedNodes(cap: CapNodes, cosineOf: (rx: number, ry: number, rz: number) => number): PlateNodes {
  const keep: number[] = [];
  const weights: number[] = [];
  for (let k = 0; k < cap.count; k++) {
    const cosPlate = cosineOf(cap.rx[k], cap.ry[k], cap.rz[k]);
    // the base weight is per projected solid angle on a nadir plate (cos eta = -rz); the plate's own cosine replaces it
    if (cosPlate > 0) {
      keep.push(k);
      weights.push((cap.base[k] * cosPlate) / -cap.rz[k]);
    }
  }
  const count = keep.length;
  const out: PlateNodes = { count, ux: new Float64Array(count), uy: new Float64Array(count), uz: new Float64Array(count), weight: Float64Array.from(weights) };
  keep.forEach((k, i) => {
    out.ux[i] = cap.ux[k];
    out.uy[i] = cap.uy[k];
    out.uz[i] = cap.uz[k];
  });
  return out;
}

/**
 * Albedo and IR flux (W/m^2) on a plate from its nodes, with the Sun's unit direction (sx, sy, sz)
 * in the local frame. `reflectedWm2` = a S, the exitance of ground under a zenith Sun; `dayWm2` =
 * S (1 - A), the equilibrium exitance under a zenith Sun, and `floorWm2` the night floor's
 * exitance (dayWm2 = 0 and floorWm2 = OLR gives a uniform OLR). Writes [albedo, ir] into `out`.
 */
export function plateFluxes(
  p: PlateNodes, sx: number, sy: number, sz: number, reflectedWm2: number, dayWm2: number, floorWm2: number, out: Float64Array,
): void {
  const { ux, uy, uz, weight } = p;
  let lit = 0;
  let emitted = 0;
  for (let k = 0; k < p.count; k++) {
    const mu = ux[k] * sx + uy[k] * sy + uz[k] * sz;
    const w = weight[k];
    if (mu > 0) lit += w * mu;
    const day = dayWm2 * mu;
    emitted += w * (day > floorWm2 ? day : floorWm2);
  }
  out[0] = reflectedWm2 * lit;
  out[1] = emitted;
}

/** Exitance of the night floor, eps sigma T^4, W/m^2. */
export const floorExitanceWm2 = (field: SurfaceField): number => field.emissivity * STEFAN_BOLTZMANN * field.nightFloorK ** 4;

/** Surface temperature of the field at a solar zenith angle (cos z), K: radiative equilibrium on the day side, the floor at night. */
export function surfaceTemperatureK(field: SurfaceField, solarFluxWm2: number, cosZenith: number): number {
  const day = cosZenith > 0 ? ((solarFluxWm2 * (1 - field.bondAlbedo) * cosZenith) / (field.emissivity * STEFAN_BOLTZMANN)) ** 0.25 : 0;
  return Math.max(day, field.nightFloorK);
}

/** The field's exitance averaged over the whole body (day-side mean S (1 - A) / 4 where above the floor, the floor elsewhere), W/m^2. */
export function meanExitanceWm2(field: SurfaceField, solarFluxWm2: number): number {
  const day = solarFluxWm2 * (1 - field.bondAlbedo);
  const floor = floorExitanceWm2(field);
  // over the sphere mu = cos z is uniform on [-1, 1]: mean of max(day mu, floor) = (1/2) int_{-1}^{1}
  const c0 = day > 0 ? Math.min(1, floor / day) : 1;
  return 0.5 * (floor * (1 + c0) + (day * (1 - c0 * c0)) / 2);
}

/** Mean over a full turn of max(A cos(theta) + b, 0), A >= 0 (elementary integral). */
export function meanPositiveCosine(a: number, b: number): number {
  if (b >= a) return b;
  if (b <= -a) return 0;
  return (b * Math.acos(-b / a) + Math.sqrt(a * a - b * b)) / Math.PI;
}

/**
 * The time average over one circular orbit of plateFluxes for a plate fixed in the local frame: the
 * Sun turns about the orbit normal (y) once per orbit, so at a node mu = A cos(theta - phi) + B with
 * A = sqrt(ux^2 + uz^2) sqrt(1 - sy^2) and B = uy sy, and the means of the albedo's max(mu, 0) and
 * the field's max(day mu, floor) over theta are elementary: exact in time, one pass over the nodes.
 * Writes [albedo, ir] into `out`.
 */
export function plateOrbitMeanFluxes(p: PlateNodes, sy: number, reflectedWm2: number, dayWm2: number, floorWm2: number, out: Float64Array): void {
  const { ux, uy, uz, weight } = p;
  const across = Math.sqrt(Math.max(0, 1 - sy * sy));
  const shift = dayWm2 > 0 ? floorWm2 / dayWm2 : 0;
  let lit = 0;
  let emitted = 0;
  for (let k = 0; k < p.count; k++) {
    const a = Math.sqrt(ux[k] * ux[k] + uz[k] * uz[k]) * across;
    const b = uy[k] * sy;
    const w = weight[k];
    lit += w * meanPositiveCosine(a, b);
    // max(day mu, floor) = floor + day max(mu - floor / day, 0)
    emitted += w * (floorWm2 + (dayWm2 > 0 ? dayWm2 * meanPositiveCosine(a, b - shift) : 0));
  }
  out[0] = reflectedWm2 * lit;
  out[1] = emitted;
}
