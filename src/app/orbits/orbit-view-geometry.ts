// The orbit view's geometry: the orbit seen from above its plane (looking down the orbit normal),
// periapsis along +x, the body at the focus. Pure functions of the environment answer's profile.
// Conic equation r = a (1 − e²) / (1 + e cos ν) (Vallado, "Fundamentals of Astrodynamics", ch. 2).
import type { EnvironmentResponse } from '../../../shared/api/environment';
import { wrapDeg } from '../../../shared/physics/vector3';

type Profile = EnvironmentResponse['profile'];

export interface PlanePoint {
  /** km in the orbit plane, +x toward periapsis, +y along the motion at periapsis. */
  x: number;
  y: number;
}

const rad = (deg: number): number => (deg * Math.PI) / 180;
const deg = (r: number): number => (r * 180) / Math.PI;

/** The spacecraft's place in the orbit plane at true anomaly ν (deg). */
export function orbitPoint(semiMajorAxisKm: number, eccentricity: number, trueAnomalyDeg: number): PlanePoint {
  const nu = rad(trueAnomalyDeg);
  const r = (semiMajorAxisKm * (1 - eccentricity * eccentricity)) / (1 + eccentricity * Math.cos(nu));
  return { x: r * Math.cos(nu), y: r * Math.sin(nu) };
}

/** The whole ellipse as a closed SVG path through `steps` points (km; the caller scales). */
export function orbitOutline(semiMajorAxisKm: number, eccentricity: number, steps = 180): PlanePoint[] {
  return Array.from({ length: steps }, (_, k) => orbitPoint(semiMajorAxisKm, eccentricity, (360 * k) / steps));
}

/**
 * The Sun's direction projected on the orbit plane, as an angle from periapsis along the motion
 * (deg): read from the answer's sunDirection (perifocal frame, x toward periapsis or, circular,
 * the ascending node, where trueAnomalyDeg counts from), so exact for every orbit, shaded or not.
 */
export const sunAzimuthDeg = (sunDirection: EnvironmentResponse['sunDirection']): number =>
  wrapDeg(deg(Math.atan2(sunDirection.y, sunDirection.x)));

/**
 * The body's shadow where it crosses the orbit plane (cylindrical, Sun at infinity), as a polygon in
 * km. In coordinates along the Sun's in-plane direction u (x′) and across it (y′), the shadowed
 * points are x′ < 0 with x′² sin²β + y′² < R²: a half-ellipse of semi-axes R/|sin β| and R, an
 * endless strip of width 2R at β = 0 (cut at `reachKm`).
 */
export function shadowOutline(radiusKm: number, betaDeg: number, azimuthDeg: number, reachKm: number, steps = 48): PlanePoint[] {
  const sb = Math.abs(Math.sin(rad(betaDeg)));
  const length = sb * reachKm > radiusKm ? radiusKm / sb : reachKm;
  const [c, s] = [Math.cos(rad(azimuthDeg)), Math.sin(rad(azimuthDeg))];
  const toPlane = (xp: number, yp: number): PlanePoint => ({ x: xp * c - yp * s, y: xp * s + yp * c });
  const half = (sign: number) =>
    Array.from({ length: steps + 1 }, (_, k) => {
      const xp = -(length * k) / steps;
      return toPlane(xp, sign * Math.sqrt(Math.max(0, radiusKm * radiusKm - xp * xp * sb * sb)));
    });
  return [...half(1), ...half(-1).reverse()];
}

/** True when a point of the orbit plane lies in the cylindrical shadow (same closed form as shadowOutline). */
export function inShadow(point: PlanePoint, radiusKm: number, betaDeg: number, azimuthDeg: number): boolean {
  const [c, s] = [Math.cos(rad(azimuthDeg)), Math.sin(rad(azimuthDeg))];
  const xp = point.x * c + point.y * s;
  const yp = -point.x * s + point.y * c;
  const sb = Math.sin(rad(betaDeg));
  return xp < 0 && xp * xp * sb * sb + yp * yp < radiusKm * radiusKm;
}

export type ArcKind = 'sunlit' | 'eclipse' | 'parent-shadow';

/** Each sample's kind, as the plots' bands name them: the planet's shadow first, then any eclipse. */
export const sampleKind = (p: Profile[number]): ArcKind =>
  (p.parentSunlit ?? 1) < 1 ? 'parent-shadow' : p.sunlit < 1 ? 'eclipse' : 'sunlit';

/**
 * The shaded runs of the orbit as polylines (km), each widened by half a step at both ends like
 * the plots' bands, so a single shaded sample still draws a short arc.
 */
export function shadedArcs(profile: Profile, semiMajorAxisKm: number, eccentricity: number): { kind: Exclude<ArcKind, 'sunlit'>; points: PlanePoint[] }[] {
  const arcs: { kind: Exclude<ArcKind, 'sunlit'>; points: PlanePoint[] }[] = [];
  const n = profile.length;
  const anomaly = (k: number): number => profile[k].trueAnomalyDeg;
  const mid = (i: number, j: number): number => {
    const a = anomaly(i);
    let b = anomaly(j);
    while (b < a) b += 360;
    return (a + b) / 2;
  };
  let i = 0;
  while (i < n) {
    const kind = sampleKind(profile[i]);
    if (kind === 'sunlit') {
      i++;
      continue;
    }
    let j = i;
    while (j + 1 < n && sampleKind(profile[j + 1]) === kind) j++;
    const from = i === 0 ? anomaly(0) : mid(i - 1, i);
    let to = j === n - 1 ? anomaly(n - 1) : mid(j, j + 1);
    while (to < from) to += 360;
    const steps = Math.max(2, Math.ceil((to - from) / 2));
    arcs.push({ kind, points: Array.from({ length: steps + 1 }, (_, k) => orbitPoint(semiMajorAxisKm, eccentricity, from + ((to - from) * k) / steps)) });
    i = j + 1;
  }
  return arcs;
}

/** An SVG path through points (already in px), closed or not. */
export const pathThrough = (points: readonly PlanePoint[], closed = false): string =>
  points.length === 0 ? '' : 'M' + points.map((p) => `${p.x.toFixed(1)},${p.y.toFixed(1)}`).join('L') + (closed ? 'Z' : '');
