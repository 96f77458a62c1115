// Surfaces made ready for an orbit grid: each fixed normal as a local unit vector with its
// plate-to-sphere view factor at every sample (it depends only on the radius and the tilt from
// nadir, so it is the same for every date of a sweep), and the load formulas of heat-loads.ts on
// that form.
// Leaves out: what heat-loads.ts leaves out; the formulas are the same (direct solar S cos(incidence)
// times the sunlit share, albedo S a F cos(theta_subsolar) on the sunlit side, IR OLR F; DOMAIN.md,
// Howell catalogue). Source: API.md for absorbed = A (alpha (solar + albedo) + epsilon ir).
import { localNormal, type Surface, type SurfaceLoad } from './heat-loads';
import type { OrbitGrid } from './orbit-grid';
import { plateToSphereViewFactor } from './view-factors';

export interface PreparedSurface {
  surface: Surface;
  /** Local unit normal (x ram, y orbit normal, z zenith); null for a Sun-pointed surface. */
  normal: readonly [number, number, number] | null;
  /** View factor to the body at each grid sample; empty for a Sun-pointed surface (its tilt moves). */
  viewFactor: Float64Array;
}

/** View factors of a fixed normal at every sample; a circular orbit has one radius, so one evaluation. */
function viewFactorsOnGrid(grid: OrbitGrid, bodyRadiusKm: number, tiltRad: number): Float64Array {
  const out = new Float64Array(grid.steps);
  const radii = grid.radiusKm;
  const r0 = radii[0];
  let constant = true;
  for (let k = 1; k < grid.steps && constant; k++) constant = radii[k] === r0;
  if (constant) out.fill(plateToSphereViewFactor(r0, bodyRadiusKm, tiltRad));
  else for (let k = 0; k < grid.steps; k++) out[k] = plateToSphereViewFactor(grid.radiusKm[k], bodyRadiusKm, tiltRad);
  return out;
}

export function prepareSurfaces(surfaces: readonly Surface[], grid: OrbitGrid, bodyRadiusKm: number): PreparedSurface[] {
  return surfaces.map((surface, i) => {
    if (surface.normal === 'sun') return { surface, normal: null, viewFactor: new Float64Array(0) };
    const [x, y, z] = localNormal(surface.normal, [0, 0, 1], `surfaces.${i}.normal`);
    // tilt from nadir: nadir is -z in the local frame
    const tiltRad = Math.acos(Math.max(-1, Math.min(1, -z)));
    return { surface, normal: [x, y, z], viewFactor: viewFactorsOnGrid(grid, bodyRadiusKm, tiltRad) };
  });
}

/** Cosine of the Sun's incidence on the surface and its view factor at sample k, with the Sun (cx, cy, cz) in the local frame. */
export function incidence(p: PreparedSurface, k: number, cx: number, cy: number, cz: number, radiusKm: number, bodyRadiusKm: number): [number, number] {
  if (p.normal === null) {
    const tiltRad = Math.acos(Math.max(-1, Math.min(1, -cz)));
    return [cx * cx + cy * cy + cz * cz, plateToSphereViewFactor(radiusKm, bodyRadiusKm, tiltRad)];
  }
  const n = p.normal;
  return [n[0] * cx + n[1] * cy + n[2] * cz, p.viewFactor[k]];
}

/** Incident fluxes and absorbed power on one prepared surface at sample k (same formulas as surfaceLoad). */
export function loadAt(
  p: PreparedSurface, k: number, cx: number, cy: number, cz: number, sunlit: number,
  radiusKm: number, bodyRadiusKm: number, solarFluxWm2: number, albedo: number, olrWm2: number,
): SurfaceLoad {
  const [cosSun, viewFactor] = incidence(p, k, cx, cy, cz, radiusKm, bodyRadiusKm);
  const solarWm2 = cosSun > 0 ? solarFluxWm2 * sunlit * cosSun : 0;
  // cos of the Sun's zenith angle at the sub-spacecraft point is the Sun's z component
  const albedoWm2 = cz > 0 ? solarFluxWm2 * albedo * viewFactor * cz : 0;
  const irWm2 = olrWm2 * viewFactor;
  const s = p.surface;
  return { name: s.name, solarWm2, albedoWm2, irWm2, absorbedW: s.areaM2 * (s.absorptivity * (solarWm2 + albedoWm2) + s.emissivity * irWm2) };
}
