// Incident and absorbed environmental heat on flat surfaces: direct solar, albedo (sunlight the body
// reflects) and planetary IR (the body's outgoing long-wave radiation), for surfaces fixed in the
// local orbital frame, or at each instant for any pointing (pointing.ts).
// Leaves out: the angular (non-Lambertian) reflection of real albedo, the correction for high solar
// zenith angles (NASA/TM-2001-211221), spatial variation of albedo and OLR, shadowing between
// surfaces and IR exchange with the spacecraft itself. Albedo is S a F cos(theta_subsolar) on the
// sunlit side: a common engineering approximation (DOMAIN.md [P]); planetary IR is OLR F with the
// plate-to-sphere view factor F (Howell catalogue); solar is S cos(incidence) times the sunlit share.
import { PhysicsError } from './physics-error';
import { plateToSphereViewFactor } from './view-factors';
import type { SurfaceNormal } from './pointing';
import type { Vector3 } from './vector3';

export const namedNormals = ['nadir', 'zenith', 'ram', 'wake', 'orbit-normal', 'anti-orbit-normal', 'sun'] as const;
export type NamedNormal = (typeof namedNormals)[number];
/** A unit vector in the local orbital frame: x toward ram, y toward the orbit normal, z toward zenith. */
export interface LocalVector {
  x: number;
  y: number;
  z: number;
}
/** Every pointing form (pointing.ts): the local-orbital ones above and those that move in that frame. */
export type { SurfaceNormal } from './pointing';

export interface Surface {
  name: string;
  normal: SurfaceNormal;
  areaM2: number;
  absorptivity: number;
  emissivity: number;
}

export interface SurfaceLoad {
  name: string;
  solarWm2: number;
  albedoWm2: number;
  irWm2: number;
  absorbedW: number;
}

/** The environment at one point of the orbit, with the Sun in the local orbital frame. */
export interface LoadPoint {
  /** Unit vector toward the Sun, local orbital frame. */
  sunLocal: Vector3;
  /** 1 in full sun, 0 in umbra. */
  sunlit: number;
  solarFluxWm2: number;
  albedo: number;
  olrWm2: number;
  radiusKm: number;
  bodyRadiusKm: number;
}

const fixedNormals: Record<Exclude<NamedNormal, 'sun'>, Vector3> = {
  nadir: [0, 0, -1], zenith: [0, 0, 1], ram: [1, 0, 0], wake: [-1, 0, 0],
  'orbit-normal': [0, 1, 0], 'anti-orbit-normal': [0, -1, 0],
};

/** The surface normal as a unit vector in the local orbital frame (custom vectors are normalised). */
export function localNormal(normal: NamedNormal | LocalVector, sunLocal: Vector3, path = 'normal'): Vector3 {
  if (normal === 'sun') return sunLocal;
  if (typeof normal === 'string') return fixedNormals[normal];
  const length = Math.hypot(normal.x, normal.y, normal.z);
  if (!(length > 1e-9) || !Number.isFinite(length)) {
    throw new PhysicsError('invalid_surface', `a surface normal needs a direction; {x: ${normal.x}, y: ${normal.y}, z: ${normal.z}} has none`, [
      { path, message: 'the normal vector has zero length' },
    ]);
  }
  return [normal.x / length, normal.y / length, normal.z / length];
}

/** absorbed = A (alpha (solar + albedo) + epsilon ir), in W (API.md). */
export const absorbedW = (surface: Surface, solarWm2: number, albedoWm2: number, irWm2: number): number =>
  surface.areaM2 * (surface.absorptivity * (solarWm2 + albedoWm2) + surface.emissivity * irWm2);

/** Incident fluxes and absorbed power on one surface at one point. `n` is the local unit normal. */
export function surfaceLoad(surface: Surface, n: Vector3, point: LoadPoint): SurfaceLoad {
  const s = point.sunLocal;
  const cosSun = n[0] * s[0] + n[1] * s[1] + n[2] * s[2];
  // Tilt from nadir: nadir is -z in the local frame.
  const tiltRad = Math.acos(Math.max(-1, Math.min(1, -n[2])));
  return loadFromFactors(surface, cosSun, plateToSphereViewFactor(point.radiusKm, point.bodyRadiusKm, tiltRad), point);
}

/**
 * The loads from the plate's two factors: the cosine of the Sun on it (only its positive part counts;
 * a spinner's average over a turn) and its view factor to the body (a spinner's average).
 */
export function loadFromFactors(surface: Surface, cosSun: number, viewFactor: number, point: LoadPoint): SurfaceLoad {
  const s = point.sunLocal;
  const solarWm2 = cosSun > 0 ? point.solarFluxWm2 * point.sunlit * cosSun : 0;
  // cos of the Sun's zenith angle at the sub-spacecraft point is the Sun's z component
  const cosSubsolar = s[2];
  const albedoWm2 = cosSubsolar > 0 ? point.solarFluxWm2 * point.albedo * viewFactor * cosSubsolar : 0;
  const irWm2 = point.olrWm2 * viewFactor;
  return { name: surface.name, solarWm2, albedoWm2, irWm2, absorbedW: absorbedW(surface, solarWm2, albedoWm2, irWm2) };
}
