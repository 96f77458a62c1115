// Surfaces made ready for an orbit grid: each fixed normal as a local unit vector with its
// plate-to-sphere view factor at every sample (it depends only on the radius and the tilt from
// nadir, so it is the same for every date of a sweep); a surface whose normal moves in the local
// frame (the Sun, inertial, tracking, spinning, yaw-steered: pointing.ts) keeps its compiled pointing,
// its inertial direction turned toward the orbit.
// Leaves out: what heat-loads.ts leaves out; the formulas are the same (direct solar S cos(incidence)
// times the sunlit share, albedo S a F cos(theta_subsolar) on the sunlit side, IR OLR F; DOMAIN.md,
// Howell catalogue). Source: API.md for absorbed = A (alpha (solar + albedo) + epsilon ir).
import type { Surface } from './heat-loads';
import type { OrbitGrid } from './orbit-grid';
import { fixedNormal, isInertial, orientPlan, pointingPlan, type PointingPlan } from './pointing';
import type { Vector3 } from './vector3';
import { plateToSphereViewFactor } from './view-factors';

export interface PreparedSurface {
  surface: Surface;
  /** Local unit normal (x ram, y orbit normal, z zenith); null for a surface whose normal moves in that frame (pointing.ts). */
  normal: readonly [number, number, number] | null;
  /** View factor to the body at each grid sample; empty for a moving surface. */
  viewFactor: Float64Array;
  /** A moving surface's pointing, its inertial direction in the orbit's perifocal frame (orientSurfaces); null for a fixed one. */
  plan: PointingPlan | null;
  /** The pointing as compiled, inertial directions in the body's equatorial frame of J2000. */
  source: PointingPlan;
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

/**
 * The surfaces made ready for a grid. `toOrbit` turns an inertial direction (body equatorial J2000)
 * into the orbit's perifocal components (pointing.ts j2000ToPerifocal); without it an inertial
 * direction is taken as already in them.
 */
export function prepareSurfaces(
  surfaces: readonly Surface[], grid: OrbitGrid, bodyRadiusKm: number, toOrbit: ((v: Vector3) => Vector3) | null = null,
): PreparedSurface[] {
  return surfaces.map((surface, i) => {
    const source = pointingPlan(surface.normal, `surfaces.${i}.normal`);
    const fixed = fixedNormal(source);
    if (!fixed) return { surface, normal: null, viewFactor: new Float64Array(0), source, plan: toOrbit ? orientPlan(source, toOrbit) : source };
    const [x, y, z] = fixed;
    // tilt from nadir: nadir is -z in the local frame
    const tiltRad = Math.acos(Math.max(-1, Math.min(1, -z)));
    return { surface, normal: [x, y, z], viewFactor: viewFactorsOnGrid(grid, bodyRadiusKm, tiltRad), source, plan: null };
  });
}

/** Turns the moving surfaces' inertial directions toward another orbit (a sweep's next day); true when any holds one. */
export function orientSurfaces(prepared: readonly PreparedSurface[], toOrbit: (v: Vector3) => Vector3): boolean {
  let any = false;
  for (const p of prepared) {
    if (p.plan && isInertial(p.source)) {
      p.plan = orientPlan(p.source, toOrbit);
      any = true;
    }
  }
  return any;
}
