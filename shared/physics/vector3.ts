// Three-vectors as plain tuples: the physics modules share them and they stay cheap in hot loops.
export type Vector3 = readonly [number, number, number];

export const dot = (a: Vector3, b: Vector3): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];

export const cross = (a: Vector3, b: Vector3): Vector3 => [
  a[1] * b[2] - a[2] * b[1],
  a[2] * b[0] - a[0] * b[2],
  a[0] * b[1] - a[1] * b[0],
];

// (the square root of the sum rather than Math.hypot, several times slower in V8; no vector here comes near overflow)
export const norm = (a: Vector3): number => Math.sqrt(a[0] * a[0] + a[1] * a[1] + a[2] * a[2]);

export const scale = (a: Vector3, k: number): Vector3 => [a[0] * k, a[1] * k, a[2] * k];

export const add = (a: Vector3, b: Vector3): Vector3 => [a[0] + b[0], a[1] + b[1], a[2] + b[2]];

export const subtract = (a: Vector3, b: Vector3): Vector3 => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];

export function unit(a: Vector3): Vector3 {
  const n = norm(a);
  if (n === 0) throw new RangeError('a zero vector has no direction');
  return [a[0] / n, a[1] / n, a[2] / n];
}

/** Unit vector from right ascension and declination (radians). */
export const fromSpherical = (raRad: number, decRad: number): Vector3 => [
  Math.cos(decRad) * Math.cos(raRad),
  Math.cos(decRad) * Math.sin(raRad),
  Math.sin(decRad),
];

export const DEG = Math.PI / 180;

/** An angle in degrees brought into [0, 360). */
export const wrapDeg = (deg: number): number => ((deg % 360) + 360) % 360;
