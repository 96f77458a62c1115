// Classical orbital elements from a position and velocity (the osculating orbit at that instant),
// the RV2COE algorithm. Angles in degrees in [0, 360); a circular orbit's argument of periapsis is 0
// and its anomaly counts from the ascending node, an equatorial orbit's node is at the x axis, as
// orbit-definition.ts takes them. Source: Vallado, Fundamentals of Astrodynamics and Applications,
// Algorithm 9 (RV2COE).
import { cross, DEG, dot, norm, scale, subtract, wrapDeg, type Vector3 } from './vector3';

export interface StateElements {
  semiMajorAxisKm: number;
  eccentricity: number;
  inclinationDeg: number;
  raanDeg: number;
  argPeriapsisDeg: number;
  trueAnomalyDeg: number;
  /** Semi-latus rectum, km. */
  pKm: number;
}

/** Below this eccentricity (or sine of inclination) the orbit is taken as circular (equatorial). */
const SMALL = 1e-9;
const angle = (cos: number): number => Math.acos(Math.max(-1, Math.min(1, cos)));
const turn = (rad: number): number => wrapDeg(rad / DEG);

export function elementsFromState(positionKm: Vector3, velocityKmS: Vector3, gmKm3S2: number): StateElements {
  const r = norm(positionKm);
  const v = norm(velocityKmS);
  const h = cross(positionKm, velocityKmS);
  const hNorm = norm(h);
  const node: Vector3 = [-h[1], h[0], 0];
  const nodeNorm = norm(node);
  const eVector = scale(subtract(scale(positionKm, v * v - gmKm3S2 / r), scale(velocityKmS, dot(positionKm, velocityKmS))), 1 / gmKm3S2);
  const e = norm(eVector);
  const energy = (v * v) / 2 - gmKm3S2 / r;
  const a = -gmKm3S2 / (2 * energy);
  const p = (hNorm * hNorm) / gmKm3S2;
  const i = angle(h[2] / hNorm);
  const equatorial = nodeNorm < SMALL * hNorm;
  const circular = e < SMALL;
  // the node, measured in the equator from x; for an equatorial orbit the x axis stands in for it
  const raan = equatorial ? 0 : node[1] >= 0 ? angle(node[0] / nodeNorm) : 2 * Math.PI - angle(node[0] / nodeNorm);
  const nodeUnit: Vector3 = equatorial ? [1, 0, 0] : scale(node, 1 / nodeNorm);
  let argp = 0;
  let nu: number;
  if (circular) {
    // the argument of latitude from the node (true longitude for an equatorial orbit)
    const u = angle(dot(nodeUnit, positionKm) / r);
    const ahead = equatorial ? positionKm[1] * Math.sign(h[2] || 1) >= 0 : positionKm[2] >= 0;
    nu = ahead ? u : 2 * Math.PI - u;
  } else {
    const w = angle(dot(nodeUnit, eVector) / e);
    const ahead = equatorial ? eVector[1] * Math.sign(h[2] || 1) >= 0 : eVector[2] >= 0;
    argp = ahead ? w : 2 * Math.PI - w;
    const anomaly = angle(dot(eVector, positionKm) / (e * r));
    nu = dot(positionKm, velocityKmS) >= 0 ? anomaly : 2 * Math.PI - anomaly;
  }
  return {
    semiMajorAxisKm: a,
    eccentricity: e,
    inclinationDeg: i / DEG,
    raanDeg: turn(raan),
    argPeriapsisDeg: turn(argp),
    trueAnomalyDeg: turn(nu),
    pKm: p,
  };
}
