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
