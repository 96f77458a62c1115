// A surface's pointing, as the compute route, saved surfaces and cases take it (API.md "Environment
// computation"; the forms and their physics in shared/physics/pointing.ts):
//   "nadir" | "zenith" | "ram" | "wake" | "orbit-normal" | "anti-orbit-normal" | "sun"
//   {x, y, z}                                          a unit vector in the local orbital frame
//   {"inertial": {"raDeg", "decDeg"}}                  fixed in the body's equatorial frame of J2000
//   {"trackSun": {"axis": <local normal but "sun">}}   one-axis Sun-tracking drive about that axis
//   {"trackSun": {"axis": "both"}}                     two-axis Sun tracking (faces the Sun)
//   {"yawSteered": {"normal": <local normal>}}         a face of a spacecraft yaw-steered about nadir
//   {"spin": {"axis": <any form above>, "angleDeg"}}   a plate on a spinner, loads averaged over a turn
// A union's own message names the form that was meant and its first wrong field, so a 400 says
// "inertial.decDeg: ..." rather than "no form matched".
import { z } from 'zod';
import { namedNormals } from '../physics/heat-loads';
import type { SurfaceNormal } from '../physics/pointing';

const finite = (label: string) => z.number({ message: `${label} must be a number` });

export const localVector = z
  .strictObject({ x: finite('x'), y: finite('y'), z: finite('z') })
  .refine((v) => Math.abs(Math.hypot(v.x, v.y, v.z) - 1) <= 0.01, {
    message: 'a custom normal is a unit vector {x, y, z} (x ram, y orbit normal, z zenith); its length must be 1',
  });

const named = z.enum(namedNormals, { message: `a named normal is one of ${namedNormals.join(', ')}` });
const driveAxes = ['nadir', 'zenith', 'ram', 'wake', 'orbit-normal', 'anti-orbit-normal'] as const;
const localNormal = z.union([named, localVector], {
  message: `a local-orbital normal is one of ${namedNormals.join(', ')} or a unit vector {x, y, z}`,
});

const inertial = z.strictObject({
  inertial: z.strictObject({
    raDeg: finite('raDeg').min(0, 'raDeg (right ascension) is 0..360 deg').max(360, 'raDeg (right ascension) is 0..360 deg'),
    decDeg: finite('decDeg').min(-90, 'decDeg (declination) is -90..90 deg').max(90, 'decDeg (declination) is -90..90 deg'),
  }, { message: 'inertial is {"raDeg", "decDeg"}' }),
}).meta({ description: "Fixed in the body's equatorial frame of J2000 (for Earth EME2000): right ascension and declination, deg." });

const trackSun = z.strictObject({
  trackSun: z.strictObject({
    axis: z.union([z.enum(['both', ...driveAxes]), localVector], {
      message: `the drive axis is one of ${driveAxes.join(', ')}, a unit vector {x, y, z}, or "both" for two-axis tracking (a drive cannot turn about the Sun)`,
    }),
  }, { message: 'trackSun is {"axis"}' }),
}).meta({ description: 'A Sun-tracking drive: the plate (normal perpendicular to the axis) turns about `axis` of the local orbital frame to face the Sun as nearly as it can; "both": two-axis tracking, the plate faces the Sun.' });

const yawSteered = z.strictObject({
  yawSteered: z.strictObject({ normal: localNormal }, { message: 'yawSteered is {"normal"}' }),
}).meta({ description: 'A face of a spacecraft turned about nadir so that the Sun stays in its y-z plane on the +y side (the -y face never sees the Sun); `normal` in the spacecraft frame before yaw (the local orbital frame).' });

/** Which option of a union an object meant: the option whose single key it carries. */
function formError(keys: readonly string[], fallback: string) {
  return (issue: { code?: string; input?: unknown; errors?: unknown }): string => {
    const input = issue.input;
    const errors = issue.errors as { path: PropertyKey[]; message: string }[][] | undefined;
    if (issue.code === 'invalid_union' && errors && typeof input === 'object' && input !== null) {
      const index = keys.findIndex((k) => k in input);
      const inner = index >= 0 ? errors[index]?.[0] : undefined;
      if (inner) return inner.path.length > 0 ? `${inner.path.map(String).join('.')}: ${inner.message}` : inner.message;
    }
    return fallback;
  };
}

const FORMS = 'a normal is one of nadir, zenith, ram, wake, orbit-normal, anti-orbit-normal, sun, a unit vector {x, y, z}, {"inertial": ...}, {"trackSun": ...}, {"yawSteered": ...} or {"spin": ...}';

/** Every form that gives one direction at each instant: a spin's axis is one of these. */
const direction = z.union([named, localVector, inertial, trackSun, yawSteered], { error: formError(['', 'x', 'inertial', 'trackSun', 'yawSteered'], FORMS) });

const spin = z.strictObject({
  spin: z.strictObject({
    axis: direction,
    angleDeg: finite('angleDeg').min(0, 'angleDeg (from the spin axis) is 0..180 deg').max(180, 'angleDeg (from the spin axis) is 0..180 deg'),
  }, { message: 'spin is {"axis", "angleDeg"}' }),
}).meta({ description: 'A plate on a body spinning about `axis` (any other form), its normal `angleDeg` from the axis; its loads are averaged over a turn.' });

/** A surface's normal in every form (API.md). */
export const surfaceNormal = z.union([named, localVector, inertial, trackSun, yawSteered, spin], {
  error: formError(['', 'x', 'inertial', 'trackSun', 'yawSteered', 'spin'], FORMS),
});

// The schema's type must be the physics' own; this fails to compile if they drift apart.
export const asSurfaceNormal = (parsed: z.infer<typeof surfaceNormal>): SurfaceNormal => parsed;
export const fromSurfaceNormal = (normal: SurfaceNormal): z.infer<typeof surfaceNormal> => normal;
