// The per-sample load profile of one orbit in columns: for every surface, the incident solar,
// albedo and IR flux and the absorbed power at every sample in Float64Arrays, with the orbit sums
// and peaks taken in the same pass. This is the physics the compute route answers; the API's shape
// (one object per surface per sample, API.md) is built from these columns by profilePoints, apart,
// because at 3600 samples x 20 surfaces building 72,000 objects costs several times the physics.
// Leaves out: nothing of heat-loads.ts's surfaceLoad; the formulas are the same (direct solar S
// cos(incidence) times the sunlit share, albedo S a F cos(theta_subsolar) on the sunlit side, IR OLR F),
// with a moving surface's cosine and view factor per sample from pointing.ts.
import type { CapColumns } from './cap-loads';
import type { SurfaceLoad } from './heat-loads';
import type { GridShade, OrbitGrid } from './orbit-grid';
import { pointingColumns } from './pointing';
import type { PreparedSurface } from './surface-grid';
import { DEG } from './vector3';

/** One load component per surface: `values[j]` holds surface j's value at every sample. */
export interface LoadColumns {
  solarWm2: Float64Array[];
  albedoWm2: Float64Array[];
  irWm2: Float64Array[];
  absorbedW: Float64Array[];
}

/** One number per surface for each load component (orbit sums, averages or peaks). */
export interface LoadTotals {
  solarWm2: Float64Array;
  albedoWm2: Float64Array;
  irWm2: Float64Array;
  absorbedW: Float64Array;
}

export interface ProfileColumns extends LoadColumns {
  steps: number;
  names: string[];
  /** Orbit sums (divide by the steps for the average) and peaks, per surface. */
  sums: LoadTotals;
  peaks: LoadTotals;
}

const totals = (count: number): LoadTotals => ({
  solarWm2: new Float64Array(count), albedoWm2: new Float64Array(count), irWm2: new Float64Array(count), absorbedW: new Float64Array(count),
});

/**
 * Loads of every prepared surface at every sample; `sunW` is the Sun's orbit-normal component,
 * constant over the orbit. `cap` holds albedo and IR columns from the cap quadrature (cap-loads.ts)
 * that replace the closed forms where given.
 */
export function profileColumns(
  prepared: readonly PreparedSurface[], grid: OrbitGrid, shade: GridShade, sunW: number,
  bodyRadiusKm: number, solarFluxWm2: number, albedo: number, olrWm2: number, cap: CapColumns | null = null,
): ProfileColumns {
  const steps = grid.steps;
  const count = prepared.length;
  // One buffer for all four components of all surfaces; each column is a view into it.
  const buffer = new Float64Array(4 * count * steps);
  const column = (c: number, j: number) => buffer.subarray((c * count + j) * steps, (c * count + j + 1) * steps);
  const out: ProfileColumns = {
    steps, names: prepared.map((p) => p.surface.name),
    solarWm2: [], albedoWm2: [], irWm2: [], absorbedW: [], sums: totals(count), peaks: totals(count),
  };
  for (let j = 0; j < count; j++) {
    const p = prepared[j];
    out.solarWm2.push(column(0, j));
    out.albedoWm2.push(column(1, j));
    out.irWm2.push(column(2, j));
    out.absorbedW.push(column(3, j));
    // A moving surface's tilt from nadir moves: its cosine and view factor per sample first (pointing.ts).
    const moving = p.plan ? pointingColumns(p.plan, grid, shade, sunW, bodyRadiusKm) : null;
    const [cosSun, viewFactor] = moving ? [moving.sunCos, moving.viewFactor] : [null, p.viewFactor];
    const [nx, ny, nz] = p.normal ?? [0, 0, 0];
    fillSurface(out, j, shade, cosSun, nx, nz, ny * sunW, viewFactor, p, solarFluxWm2, albedo, olrWm2, cap?.albedoWm2?.[j] ?? null, cap?.irWm2?.[j] ?? null);
  }
  return out;
}

/**
 * Surface j's columns, sums and peaks. The cosine of incidence is `cosSun` per sample where given
 * (a moving surface), else nx cx + nz cz + fromNormal (a fixed normal; its y part is constant).
 */
function fillSurface(
  out: ProfileColumns, j: number, shade: GridShade, cosSun: Float64Array | null, nx: number, nz: number, fromNormal: number,
  viewFactor: Float64Array, p: PreparedSurface, solarFluxWm2: number, albedo: number, olrWm2: number,
  capAlbedo: Float64Array | null, capIr: Float64Array | null,
): void {
  const { cx, cz, sunlit } = shade;
  const { areaM2, absorptivity, emissivity } = p.surface;
  const solar = out.solarWm2[j];
  const albedoColumn = out.albedoWm2[j];
  const ir = out.irWm2[j];
  const absorbed = out.absorbedW[j];
  const solarAlbedo = solarFluxWm2 * albedo;
  let sumSolar = 0;
  let sumAlbedo = 0;
  let sumIr = 0;
  let sumAbsorbed = 0;
  let peakSolar = 0;
  let peakAlbedo = 0;
  let peakIr = 0;
  let peakAbsorbed = 0;
  const steps = solar.length;
  for (let k = 0; k < steps; k++) {
    const z = cz[k];
    const cosine = cosSun === null ? nx * cx[k] + nz * z + fromNormal : cosSun[k];
    const f = viewFactor[k];
    const solarWm2 = cosine > 0 ? solarFluxWm2 * sunlit[k] * cosine : 0;
    const albedoWm2 = capAlbedo !== null ? capAlbedo[k] : z > 0 ? solarAlbedo * f * z : 0;
    const irWm2 = capIr !== null ? capIr[k] : olrWm2 * f;
    const absorbedW = areaM2 * (absorptivity * (solarWm2 + albedoWm2) + emissivity * irWm2);
    solar[k] = solarWm2;
    albedoColumn[k] = albedoWm2;
    ir[k] = irWm2;
    absorbed[k] = absorbedW;
    sumSolar += solarWm2;
    sumAlbedo += albedoWm2;
    sumIr += irWm2;
    sumAbsorbed += absorbedW;
    if (solarWm2 > peakSolar) peakSolar = solarWm2;
    if (albedoWm2 > peakAlbedo) peakAlbedo = albedoWm2;
    if (irWm2 > peakIr) peakIr = irWm2;
    if (absorbedW > peakAbsorbed) peakAbsorbed = absorbedW;
  }
  const { sums, peaks } = out;
  sums.solarWm2[j] = sumSolar;
  sums.albedoWm2[j] = sumAlbedo;
  sums.irWm2[j] = sumIr;
  sums.absorbedW[j] = sumAbsorbed;
  peaks.solarWm2[j] = peakSolar;
  peaks.albedoWm2[j] = peakAlbedo;
  peaks.irWm2[j] = peakIr;
  peaks.absorbedW[j] = peakAbsorbed;
}

/** Per-surface totals (averages, peaks) as the API's load objects. */
export function surfaceLoads(names: readonly string[], values: LoadTotals): SurfaceLoad[] {
  return names.map((name, j) => ({
    name, solarWm2: values.solarWm2[j], albedoWm2: values.albedoWm2[j], irWm2: values.irWm2[j], absorbedW: values.absorbedW[j],
  }));
}

export interface ProfilePoint {
  tS: number;
  trueAnomalyDeg: number;
  sunlit: number;
  surfaces: SurfaceLoad[];
}

/** The profile in the API's shape: one object per sample, one per surface in it, all plain literals of one shape. */
export function profilePoints(columns: ProfileColumns, tS: Float64Array, trueAnomalyRad: Float64Array, sunlit: Float64Array): ProfilePoint[] {
  const { steps, names, solarWm2, albedoWm2, irWm2, absorbedW } = columns;
  const count = names.length;
  const points: ProfilePoint[] = new Array(steps);
  for (let k = 0; k < steps; k++) {
    const surfaces: SurfaceLoad[] = new Array(count);
    for (let j = 0; j < count; j++) {
      surfaces[j] = { name: names[j], solarWm2: solarWm2[j][k], albedoWm2: albedoWm2[j][k], irWm2: irWm2[j][k], absorbedW: absorbedW[j][k] };
    }
    points[k] = { tS: tS[k], trueAnomalyDeg: trueAnomalyRad[k] / DEG, sunlit: sunlit[k], surfaces };
  }
  return points;
}
