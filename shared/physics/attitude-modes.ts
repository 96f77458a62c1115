// A spacecraft's attitude modes (issue 19 item 2): each surface is defined once with its own normal
// in the spacecraft's local frame; a mode gives the surfaces it lists another pointing (any normal
// form the compute route takes), the rest keep their own. Yaw steering (turning about nadir so the
// Sun stays off one face) is a mode option: it wraps each local-orbital normal of the mode -- a named
// local direction other than "sun", or a vector of the local frame -- as {yawSteered: {normal}}, the
// compute route's form for it (API.md "Attitudes beyond the local orbital frame"); Sun-pointed,
// inertial, Sun-tracking and spinning normals are left as they are, yaw steering does not move them.
// Pure: no schema here; the server checks the pointed normals against the shared schema.
import type { NamedNormal } from './heat-loads';

/** The named directions fixed in the local orbital frame (all of heat-loads' names but "sun"). */
const localNames: readonly string[] = ['nadir', 'zenith', 'ram', 'wake', 'orbit-normal', 'anti-orbit-normal'] satisfies Exclude<NamedNormal, 'sun'>[];

const isLocalVector = (n: unknown): n is { x: number; y: number; z: number } =>
  typeof n === 'object' && n !== null && !Array.isArray(n) && Object.keys(n).sort().join() === 'x,y,z';

/** True for a normal fixed in the local orbital frame: a named local direction or an {x, y, z} vector. */
export const isLocalOrbitalNormal = (n: unknown): boolean => (typeof n === 'string' && localNames.includes(n)) || isLocalVector(n);

/** The one place yaw steering is applied: a local-orbital normal wrapped as {yawSteered: {normal}}, any other form unchanged. */
export function yawSteeredNormal(normal: unknown, yawSteering: boolean): unknown {
  return yawSteering && isLocalOrbitalNormal(normal) ? { yawSteered: { normal } } : normal;
}

export interface ModePointingLike {
  yawSteering: boolean;
  pointing: readonly { surfaceId: string; normal: unknown }[];
}

/**
 * The normal each surface computes with in a mode: the mode's pointing where it lists the surface,
 * else the surface's own; with yaw steering, local-orbital normals wrapped (yawSteeredNormal).
 */
export function pointedNormals(surfaces: readonly { id: string; normal: unknown }[], mode: ModePointingLike): unknown[] {
  const byId = new Map(mode.pointing.map((p) => [p.surfaceId, p.normal]));
  return surfaces.map((s) => yawSteeredNormal(byId.has(s.id) ? byId.get(s.id) : s.normal, mode.yawSteering));
}
