// Configuration (view) factor from a small flat plate to a sphere, for any tilt of the plate's
// normal from the direction to the sphere's centre, including the regime where the plate's own
// plane cuts the sphere and only part of it is seen.
// Leaves out: the plate's finite size (a differential element), anything between plate and sphere,
// and non-spherical bodies. Source: Howell, A Catalog of Radiation Heat Transfer Configuration
// Factors, differential planar element to sphere, element tilted (the closed form below is recalled
// from memory and checked in view-factors.spec.ts against a numerical integration over the visible cap).

/**
 * View factor from a plate at distance rKm from the centre of a sphere of radius radiusKm, its normal
 * tilted tiltRad from the direction to the centre (0 = facing the centre, i.e. nadir).
 */
// At module level: a closure inside the function would be rebuilt on every call of this hot path.
const clamp = (v: number): number => Math.max(-1, Math.min(1, v));

export function plateToSphereViewFactor(rKm: number, radiusKm: number, tiltRad: number): number {
  const h = rKm / radiusKm;
  if (!(h > 1)) throw new RangeError(`the plate must be outside the sphere: r/R = ${h}`);
  const lambda = Math.abs(tiltRad) % (2 * Math.PI);
  const tilt = lambda > Math.PI ? 2 * Math.PI - lambda : lambda;
  const cosL = Math.cos(tilt);
  const sinL = Math.sin(tilt);
  // The sphere fills a cone of half-angle asin(1/H); the plate sees all of it while tilt <= acos(1/H).
  const fullLimit = Math.acos(1 / h);
  // Howell catalogue, plate-to-sphere, fully visible: F = cos(lambda) / H^2
  if (tilt <= fullLimit) return cosL / (h * h);
  if (tilt >= Math.PI - fullLimit) return 0;
  return partlyVisibleViewFactor(h, cosL, sinL);
}

/**
 * The Howell partly-visible form at r/R = h for a plate whose normal makes an angle of cosine cosL
 * (sine sinL) with the direction to the centre, valid for -1/h < cosL < 1/h (where the plate's plane
 * cuts the sphere); the caller keeps to that range. pointing.ts integrates it over a spinner's turn.
 */
export function partlyVisibleViewFactor(h: number, cosL: number, sinL: number): number {
  const x = Math.sqrt(h * h - 1);
  // Howell catalogue, plate-to-sphere, tilted, partly visible:
  // F = 1/2 - asin(X / (H sin l)) / pi + [cos l acos(-X cot l) - X sqrt(1 - H^2 cos^2 l)] / (pi H^2)
  const f = 0.5 - Math.asin(clamp(x / (h * sinL))) / Math.PI
    + (cosL * Math.acos(clamp((-x * cosL) / sinL)) - x * Math.sqrt(Math.max(0, 1 - h * h * cosL * cosL))) / (Math.PI * h * h);
  return Math.max(0, f);
}
