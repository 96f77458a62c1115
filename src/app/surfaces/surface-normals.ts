import type { SurfaceNormal } from '../../../shared/api/missions';

type NamedNormal = Exclude<SurfaceNormal, { x: number }>;

/** The named orientations of shared/physics/heat-loads.ts, described for the picker. */
export const NORMAL_LABELS: Readonly<Record<NamedNormal, string>> = {
  nadir: 'Nadir (faces the body)',
  zenith: 'Zenith (faces away from the body)',
  ram: 'Ram (faces the direction of flight)',
  wake: 'Wake (faces backward)',
  'orbit-normal': 'Orbit normal (+h side)',
  'anti-orbit-normal': 'Anti-orbit-normal (−h side)',
  sun: 'Sun-pointing',
};

export const NAMED_NORMALS = Object.keys(NORMAL_LABELS) as NamedNormal[];

/** A short text for a table cell: the name, or the vector in the local orbital frame. */
export function describeNormal(normal: SurfaceNormal): string {
  if (typeof normal === 'string') return normal;
  const f = (v: number) => (Math.round(v * 1000) / 1000).toString();
  return `(${f(normal.x)}, ${f(normal.y)}, ${f(normal.z)})`;
}

export interface CustomDirection {
  /** The direction scaled to length 1, as the server takes it. */
  readonly unit: { readonly x: number; readonly y: number; readonly z: number };
  /** The length as typed; 1 (within the server's 1 %) means nothing was changed. */
  readonly typedLength: number;
}

/** A typed direction scaled to length 1; null when it has no direction (all zero, or not numbers). */
export function customDirection(x: number, y: number, z: number): CustomDirection | null {
  const length = Math.hypot(x, y, z);
  if (!Number.isFinite(length) || length === 0) return null;
  return { unit: { x: x / length, y: y / length, z: z / length }, typedLength: length };
}
