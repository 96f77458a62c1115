import type { SurfaceNormal } from '../../../shared/api/missions';
import { pointingWords } from '../../../shared/physics/pointing-words';

type NamedNormal = Extract<SurfaceNormal, string>;
type LocalName = Exclude<NamedNormal, 'sun'>;

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
/** The local-orbital directions a face, a drive axis or a spin axis can take (the Sun apart). */
export const LOCAL_NAMES = NAMED_NORMALS.filter((n): n is LocalName => n !== 'sun');

/** How a surface is pointed, as the editor offers it (shared/physics/pointing.ts has the physics). */
export const POINTING_KINDS = {
  local: 'Fixed in the local orbital frame',
  sun: 'Pointed at the Sun',
  inertial: 'Fixed in inertial space (right ascension, declination)',
  trackSun: 'Sun-tracking drive about one axis',
  both: 'Sun-tracking on two axes',
  spin: 'On a spinning body (loads averaged over a turn)',
  yaw: 'A face of a yaw-steered spacecraft',
} as const;
export type PointingKind = keyof typeof POINTING_KINDS;
export const POINTING_KIND_LIST = Object.keys(POINTING_KINDS) as PointingKind[];

/** What the spin axis is: the Sun, a local-orbital direction, or a direction fixed in inertial space. */
export type SpinAxisChoice = 'sun' | LocalName | 'inertial';

/** The editor's fields for a pointing: plain values, typed as the user types them. */
export interface PointingFields {
  kind: PointingKind;
  /** The face (local, yaw-steered): a name or "custom" for the x, y, z fields. */
  face: LocalName | 'custom';
  x: number;
  y: number;
  z: number;
  raDeg: string;
  decDeg: string;
  driveAxis: LocalName;
  spinAxis: SpinAxisChoice;
  angleDeg: string;
}

/** A short text for a table cell or a page: the pointing in words. */
export const describeNormal = (normal: SurfaceNormal): string => pointingWords(normal);

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

/** The editor's fields for a saved pointing (defaults where the form does not use a field). */
export function pointingFields(normal: SurfaceNormal | null): PointingFields {
  const f: PointingFields = { kind: 'local', face: 'nadir', x: 0, y: 0, z: 1, raDeg: '0', decDeg: '90', driveAxis: 'orbit-normal', spinAxis: 'sun', angleDeg: '90' };
  if (normal === null) return f;
  const setFace = (n: Extract<SurfaceNormal, string> | { x: number; y: number; z: number }) => {
    if (typeof n === 'string') f.face = n === 'sun' ? 'nadir' : n;
    else [f.face, f.x, f.y, f.z] = ['custom', n.x, n.y, n.z];
  };
  if (normal === 'sun') f.kind = 'sun';
  else if (typeof normal === 'string' || 'x' in normal) setFace(normal);
  else if ('inertial' in normal) [f.kind, f.raDeg, f.decDeg] = ['inertial', String(normal.inertial.raDeg), String(normal.inertial.decDeg)];
  else if ('trackSun' in normal) {
    const axis = normal.trackSun.axis;
    if (axis === 'both') f.kind = 'both';
    else {
      f.kind = 'trackSun';
      if (typeof axis === 'string') f.driveAxis = axis;
    }
  } else if ('yawSteered' in normal) {
    f.kind = 'yaw';
    setFace(normal.yawSteered.normal);
  } else {
    f.kind = 'spin';
    f.angleDeg = String(normal.spin.angleDeg);
    const axis = normal.spin.axis;
    if (typeof axis === 'string') f.spinAxis = axis;
    else if ('inertial' in axis) [f.spinAxis, f.raDeg, f.decDeg] = ['inertial', String(axis.inertial.raDeg), String(axis.inertial.decDeg)];
  }
  return f;
}

/** A typed angle within its range, or the sentence saying what is wrong. */
function angle(text: string, label: string, min: number, max: number): number | string {
  const v = Number(text.trim());
  if (text.trim() === '' || !Number.isFinite(v)) return `Give the ${label} in degrees.`;
  if (v < min || v > max) return `The ${label} is ${min} to ${max}°.`;
  return v;
}

export type PointingReading = { ok: true; normal: SurfaceNormal } | { ok: false; message: string };
type Local = Extract<SurfaceNormal, string> | { x: number; y: number; z: number };
type Direction = Exclude<SurfaceNormal, { spin: unknown }>;

/** The pointing the fields describe, or the sentence saying what is missing. */
export function pointingFromFields(f: PointingFields): PointingReading {
  const fail = (message: string): PointingReading => ({ ok: false, message });
  const ok = (normal: SurfaceNormal): PointingReading => ({ ok: true, normal });
  const face = (): Local | string => {
    if (f.face !== 'custom') return f.face;
    const d = customDirection(Number(f.x), Number(f.y), Number(f.z));
    return d ? { ...d.unit } : 'Give the direction: at least one of x, y and z must not be 0.';
  };
  const isFace = (n: Local | string): n is Local => typeof n !== 'string' || (LOCAL_NAMES as string[]).includes(n);
  const inertial = (): Direction | string => {
    const ra = angle(f.raDeg, 'right ascension', 0, 360);
    const dec = angle(f.decDeg, 'declination', -90, 90);
    if (typeof ra === 'string') return ra;
    if (typeof dec === 'string') return dec;
    return { inertial: { raDeg: ra, decDeg: dec } };
  };
  switch (f.kind) {
    case 'local': {
      const n = face();
      return isFace(n) ? ok(n) : fail(n);
    }
    case 'sun':
      return ok('sun');
    case 'inertial': {
      const n = inertial();
      return typeof n === 'string' ? fail(n) : ok(n);
    }
    case 'trackSun':
      return ok({ trackSun: { axis: f.driveAxis } });
    case 'both':
      return ok({ trackSun: { axis: 'both' } });
    case 'yaw': {
      const n = face();
      return isFace(n) ? ok({ yawSteered: { normal: n } }) : fail(n);
    }
    case 'spin': {
      const a = angle(f.angleDeg, 'angle from the spin axis', 0, 180);
      if (typeof a === 'string') return fail(a);
      if (f.spinAxis !== 'inertial') return ok({ spin: { axis: f.spinAxis, angleDeg: a } });
      const axis = inertial();
      return typeof axis === 'string' ? fail(axis) : ok({ spin: { axis, angleDeg: a } });
    }
  }
}
