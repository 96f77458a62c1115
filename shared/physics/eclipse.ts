// Shadow of the central body: conical umbra and penumbra from the Sun's finite disk, the sunlit
// fraction at a point (the share of the solar disk not covered by the body's disk), and the
// eclipse fraction and duration over one orbit.
// Leaves out: the atmosphere (refraction, extinction: the Earth's shadow is a few tens of km wider
// in effect), limb darkening (the disk is uniform), oblateness of the body, and shadows of other
// bodies (a moon's planet). Sources: the conical shadow model with the apparent-disk overlap of two
// circles (Montenbruck & Gill, Satellite Orbits, 2000, sect. 3.4.2, from memory); the cylindrical
// formula from Gilmore, Spacecraft Thermal Control Handbook Vol. I, ch. 2.
import { SUN_RADIUS_KM } from './constants';
import type { OrbitState } from './orbit-position';
import type { Vector3 } from './vector3';

export interface ShadowGeometry {
  /** Apparent radius of the Sun, radians. */
  sunRadiusRad: number;
  /** Apparent radius of the body, radians. */
  bodyRadiusRad: number;
  /** Angle between the Sun's and the body's centres, radians. */
  separationRad: number;
}

/** Apparent disks of Sun and body seen from positionKm (body-centred); sunDirection is a unit vector from the body's centre. */
export function shadowGeometry(positionKm: Vector3, sunDirection: Vector3, sunDistanceKm: number, bodyRadiusKm: number): ShadowGeometry {
  const [x, y, z] = positionKm;
  return shadowGeometryInto(
    x, y, z, sunDirection[0] * sunDistanceKm - x, sunDirection[1] * sunDistanceKm - y, sunDirection[2] * sunDistanceKm - z, bodyRadiusKm,
    { sunRadiusRad: 0, bodyRadiusRad: 0, separationRad: 0 },
  );
}

/**
 * The same from the point (x, y, z) (body-centred, km) and the vector (tx, ty, tz) from it to the
 * Sun's centre, written into `out` (no allocation, for scans of many instants).
 */
export function shadowGeometryInto(x: number, y: number, z: number, tx: number, ty: number, tz: number, bodyRadiusKm: number, out: ShadowGeometry): ShadowGeometry {
  const dSun = Math.sqrt(tx * tx + ty * ty + tz * tz);
  const r = Math.sqrt(x * x + y * y + z * z);
  const cosSep = -(tx * x + ty * y + tz * z) / (dSun * r);
  out.sunRadiusRad = Math.asin(Math.min(1, SUN_RADIUS / dSun));
  out.bodyRadiusRad = Math.asin(Math.min(1, bodyRadiusKm / r));
  out.separationRad = Math.acos(Math.max(-1, Math.min(1, cosSep)));
  return out;
}
// a local copy: an imported binding may be read through a getter on every use
const SUN_RADIUS = SUN_RADIUS_KM;

/** Share of the Sun's disk (0..1) left visible by the body's disk. */
// area of intersection of two circles (lens), radii a (Sun) and b (body), centres c apart
export function sunlitFraction({ sunRadiusRad: a, bodyRadiusRad: b, separationRad: c }: ShadowGeometry): number {
  if (c >= a + b) return 1;
  if (c <= b - a) return 0;
  if (c <= a - b) return 1 - (b * b) / (a * a);
  const alpha = Math.acos(Math.max(-1, Math.min(1, (c * c + a * a - b * b) / (2 * c * a))));
  const beta = Math.acos(Math.max(-1, Math.min(1, (c * c + b * b - a * a) / (2 * c * b))));
  const lens = a * a * alpha + b * b * beta - 0.5 * Math.sqrt(Math.max(0, (-c + a + b) * (c + a - b) * (c - a + b) * (c + a + b)));
  return Math.max(0, Math.min(1, 1 - lens / (Math.PI * a * a)));
}

export interface EclipseSummary {
  /** Umbra plus half of penumbra, as a fraction of the period. */
  eclipseFraction: number;
  /** eclipseFraction times the period, s. */
  eclipseDurationS: number;
  umbraS: number;
  penumbraS: number;
}

/** Time (s) within [0, periodS) where f < 0: a scan of `samples` intervals, each sign change refined by bisection. */
function timeWhereNegative(f: (tS: number) => number, periodS: number, samples: number): number {
  const dt = periodS / samples;
  let total = 0;
  let t0 = 0;
  let f0 = f(0);
  for (let k = 1; k <= samples; k++) {
    const t1 = k * dt;
    const f1 = f(t1);
    if (f0 < 0 && f1 < 0) total += dt;
    else if ((f0 < 0) !== (f1 < 0)) {
      let [lo, hi] = [t0, t1];
      for (let i = 0; i < 48 && hi - lo > 1e-6; i++) {
        const mid = (lo + hi) / 2;
        if ((f(mid) < 0) === (f0 < 0)) lo = mid;
        else hi = mid;
      }
      total += f0 < 0 ? lo - t0 : t1 - hi;
    }
    t0 = t1;
    f0 = f1;
  }
  return total;
}

/**
 * Eclipse fraction and duration over one orbit; the Sun is held fixed for the orbit.
 * Penumbra is the time the Sun's disk is partly covered (including an annular transit).
 */
export function eclipseSummary(
  stateAt: (tS: number) => OrbitState,
  periodS: number,
  sunDirection: Vector3,
  sunDistanceKm: number,
  bodyRadiusKm: number,
  samples = 2048,
): EclipseSummary {
  const geometry = (t: number) => shadowGeometry(stateAt(t).positionKm, sunDirection, sunDistanceKm, bodyRadiusKm);
  const shadowS = timeWhereNegative((t) => {
    const g = geometry(t);
    return g.separationRad - (g.sunRadiusRad + g.bodyRadiusRad);
  }, periodS, samples);
  const umbraS = timeWhereNegative((t) => {
    const g = geometry(t);
    return g.separationRad - (g.bodyRadiusRad - g.sunRadiusRad);
  }, periodS, samples);
  const penumbraS = Math.max(0, shadowS - umbraS);
  const eclipseDurationS = umbraS + penumbraS / 2;
  return { eclipseFraction: eclipseDurationS / periodS, eclipseDurationS, umbraS, penumbraS };
}

/** Eclipse fraction of a circular orbit in a cylindrical shadow. */
// f = acos( sqrt(h^2 + 2 R h) / ((R + h) cos beta) ) / pi  (Gilmore ch. 2)
export function cylindricalEclipseFraction(bodyRadiusKm: number, altitudeKm: number, betaRad: number): number {
  const x = Math.sqrt(altitudeKm * altitudeKm + 2 * bodyRadiusKm * altitudeKm) / ((bodyRadiusKm + altitudeKm) * Math.cos(betaRad));
  return x >= 1 ? 0 : Math.acos(x) / Math.PI;
}
