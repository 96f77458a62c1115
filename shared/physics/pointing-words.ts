// Every pointing form (pointing.ts) in words, for case exports, audit lines, assumptions and the
// pages. Imports types only, so the client can use it without the physics behind it.
import type { NamedNormal } from './heat-loads';
import type { DirectionNormal, LocalNormal, SurfaceNormal } from './pointing';

const NAMED_WORDS: Record<NamedNormal, string> = {
  nadir: 'nadir', zenith: 'zenith', ram: 'ram', wake: 'wake', 'orbit-normal': 'the orbit normal', 'anti-orbit-normal': 'the anti-orbit-normal', sun: 'the Sun',
};
const number = (v: number): string => String(Math.round(v * 1000) / 1000);
const localWords = (n: LocalNormal): string => (typeof n === 'string' ? NAMED_WORDS[n] : `(${number(n.x)}, ${number(n.y)}, ${number(n.z)}) in the local orbital frame`);

function directionWords(n: DirectionNormal): string {
  if (typeof n === 'string' || 'x' in n) return n === 'sun' ? 'pointed at the Sun' : `facing ${localWords(n)}`;
  if ('inertial' in n) return `fixed in inertial space at right ascension ${number(n.inertial.raDeg)}°, declination ${number(n.inertial.decDeg)}° (the body's equator of J2000)`;
  if ('trackSun' in n) {
    return n.trackSun.axis === 'both' ? 'tracking the Sun on two axes' : `turned about ${localWords(n.trackSun.axis)} to face the Sun (one-axis drive)`;
  }
  return `facing ${localWords(n.yawSteered.normal)} before yaw, on a spacecraft yaw-steered to keep the Sun off its −y face`;
}

/** A surface's pointing in words, for case exports, audit lines and assumptions. */
export function pointingWords(n: SurfaceNormal): string {
  if (typeof n === 'object' && 'spin' in n) {
    return `on a body spinning about ${axisWords(n.spin.axis)}, ${number(n.spin.angleDeg)}° from the spin axis (loads averaged over a turn)`;
  }
  return directionWords(n);
}

/** A spin axis in words: "the Sun", "nadir", "a direction fixed in inertial space at ...". */
function axisWords(axis: DirectionNormal): string {
  if (typeof axis === 'string' || 'x' in axis) return localWords(axis);
  if ('inertial' in axis) return `a direction ${directionWords(axis)}`;
  return `an axis ${directionWords(axis).replace(/^facing /, 'along ')}`;
}

/** The assumption lines for the pointing forms a set of surfaces uses (none for local-orbital and Sun-pointed plates alone). */
export function pointingAssumptions(normals: readonly SurfaceNormal[]): string[] {
  const uses = (test: (n: SurfaceNormal) => boolean) => normals.some(test);
  const object = (n: SurfaceNormal): n is Exclude<SurfaceNormal, string> => typeof n === 'object' && !('x' in n);
  const inertial = (n: SurfaceNormal): boolean => object(n) && ('inertial' in n || ('spin' in n && typeof n.spin.axis === 'object' && 'inertial' in n.spin.axis));
  const lines: string[] = [];
  if (uses(inertial)) lines.push("inertial pointing: right ascension and declination in the body's equatorial frame of J2000 (IAU pole; for Earth EME2000); with a beta angle given, the Sun is placed by that beta and the inertial plates see it there");
  if (uses((n) => object(n) && 'trackSun' in n)) lines.push('Sun-tracking drives follow the Sun at once, also in shadow; a one-axis drive turns a plate whose normal is perpendicular to its axis; no gimbal limits');
  if (uses((n) => object(n) && 'spin' in n)) lines.push("spinning plates: loads averaged over a turn, the Sun's cosine in closed form, the view factor in closed form over the part of the turn in which the plate sees all or none of the body and by Gauss-Legendre quadrature over the part in which it sees some of it, the cap integrals with each ray's weight averaged in closed form");
  if (uses((n) => object(n) && 'yawSteered' in n)) lines.push('yaw steering: the spacecraft turns about nadir so that the Sun stays in its y-z plane on the +y side (the -y face never sees it); no yaw-rate limit');
  return lines;
}
