// The per-sample load profile the compute route answers (one object per surface per sample, as
// API.md shapes it), with the orbit sums and peaks taken in the same pass. An orbit of 3600 samples
// and 20 surfaces is 72,000 objects: they are built directly as plain literals of one shape, with no
// intermediate per-sample arrays, closures or copies, because building them is most of the
// computation's time.
// Leaves out: nothing of surface-grid.ts's loadAt; the formulas are the same (direct solar S
// cos(incidence) times the sunlit share, albedo S a F cos(theta_subsolar) on the sunlit side, IR OLR F).
import type { SurfaceLoad } from './heat-loads';
import type { GridShade, OrbitGrid } from './orbit-grid';
import type { PreparedSurface } from './surface-grid';
import { DEG } from './vector3';
import { plateToSphereViewFactor } from './view-factors';

export interface ProfileSample {
  tS: number;
  trueAnomalyDeg: number;
  sunlit: number;
  surfaces: SurfaceLoad[];
}

export interface ProfileLoads {
  points: ProfileSample[];
  /** Orbit sums (divide by the steps for the average) and peaks, per surface. */
  sums: SurfaceLoad[];
  peaks: SurfaceLoad[];
}

/** Loads of every prepared surface at every sample; `sunW` is the Sun's orbit-normal component, constant over the orbit. */
export function profileLoads(
  prepared: readonly PreparedSurface[], grid: OrbitGrid, shade: GridShade, sunW: number,
  bodyRadiusKm: number, solarFluxWm2: number, albedo: number, olrWm2: number,
): ProfileLoads {
  const steps = grid.steps;
  const count = prepared.length;
  const { cx, cz, sunlit } = shade;
  // Per-surface constants, hoisted into flat arrays the inner loop reads by index.
  const nx = new Float64Array(count);
  const nz = new Float64Array(count);
  const fromNormal = new Float64Array(count);
  const area = new Float64Array(count);
  const absorptivity = new Float64Array(count);
  const emissivity = new Float64Array(count);
  const names: string[] = new Array(count);
  const sums = new Float64Array(4 * count);
  const peaks = new Float64Array(4 * count);
  for (let j = 0; j < count; j++) {
    const p = prepared[j];
    const n = p.normal;
    if (n !== null) {
      nx[j] = n[0];
      nz[j] = n[2];
      fromNormal[j] = n[1] * sunW;
    }
    area[j] = p.surface.areaM2;
    absorptivity[j] = p.surface.absorptivity;
    emissivity[j] = p.surface.emissivity;
    names[j] = p.surface.name;
  }
  const solarAlbedo = solarFluxWm2 * albedo;
  const points: ProfileSample[] = new Array(steps);
  for (let k = 0; k < steps; k++) {
    const x = cx[k];
    const z = cz[k];
    const lit = sunlit[k];
    const surfaces: SurfaceLoad[] = new Array(count);
    for (let j = 0; j < count; j++) {
      const p = prepared[j];
      let cosSun: number;
      let viewFactor: number;
      if (p.normal === null) {
        cosSun = x * x + sunW * sunW + z * z;
        viewFactor = plateToSphereViewFactor(grid.radiusKm[k], bodyRadiusKm, Math.acos(Math.max(-1, Math.min(1, -z))));
      } else {
        cosSun = nx[j] * x + nz[j] * z + fromNormal[j];
        viewFactor = p.viewFactor[k];
      }
      const solarWm2 = cosSun > 0 ? solarFluxWm2 * lit * cosSun : 0;
      const albedoWm2 = z > 0 ? solarAlbedo * viewFactor * z : 0;
      const irWm2 = olrWm2 * viewFactor;
      const absorbedW = area[j] * (absorptivity[j] * (solarWm2 + albedoWm2) + emissivity[j] * irWm2);
      surfaces[j] = { name: names[j], solarWm2, albedoWm2, irWm2, absorbedW };
      const at = 4 * j;
      sums[at] += solarWm2;
      sums[at + 1] += albedoWm2;
      sums[at + 2] += irWm2;
      sums[at + 3] += absorbedW;
      if (solarWm2 > peaks[at]) peaks[at] = solarWm2;
      if (albedoWm2 > peaks[at + 1]) peaks[at + 1] = albedoWm2;
      if (irWm2 > peaks[at + 2]) peaks[at + 2] = irWm2;
      if (absorbedW > peaks[at + 3]) peaks[at + 3] = absorbedW;
    }
    points[k] = { tS: grid.tS[k], trueAnomalyDeg: grid.trueAnomalyRad[k] / DEG, sunlit: lit, surfaces };
  }
  const asLoads = (values: Float64Array): SurfaceLoad[] => names.map((name, j) => ({
    name, solarWm2: values[4 * j], albedoWm2: values[4 * j + 1], irWm2: values[4 * j + 2], absorbedW: values[4 * j + 3],
  }));
  return { points, sums: asLoads(sums), peaks: asLoads(peaks) };
}
