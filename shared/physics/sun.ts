// The Sun as seen from a central body at an epoch: direction in the body's own equatorial frame
// (from its IAU pole) and distance, from the VSOP87B heliocentric theory of the planets; the solar
// flux by the inverse-square law.
// A moon's Sun is its planet's moved by the moon's own offset (moon-ephemeris.ts): the Moon sits up
// to 0.0027 AU from Earth, 0.5 % in flux at full and new moon.
// Leaves out: light time, aberration and nutation (arcseconds).
// Sources: Bretagnon & Francou 1988 (VSOP87) with astronomia's tables (vsop87.ts); Meeus, Astronomical
// Algorithms, ch. 25 and 32; IAU WGCCRE 2015 for the poles.
import { solarDistanceRangeAu, type Body, type HeliocentricOrbit, type PlanetId } from './bodies';
import { keplerHeliocentric } from './custom-bodies';
import {
  AU_KM, DAYS_PER_JULIAN_CENTURY, J2000_JD, OBLIQUITY_J2000_DEG, SECONDS_PER_DAY, SOLAR_CONSTANT_WM2, TT_MINUS_UTC_S,
} from './constants';
import { moonOffsetKm } from './moon-ephemeris';
import { cross, DEG, dot, fromSpherical, norm, scale, subtract, unit, type Vector3 } from './vector3';
import { vsop87Position } from './vsop87';

/** Julian ephemeris date (TT) of a UTC instant. */
export function julianDateTT(epoch: Date): number {
  const ms = epoch.getTime();
  if (!Number.isFinite(ms)) throw new RangeError('the epoch is not a valid date');
  // 1970-01-01T00:00Z is JD 2440587.5
  return 2440587.5 + (ms / 1000 + TT_MINUS_UTC_S) / SECONDS_PER_DAY;
}

const SIN_EPS = Math.sin(OBLIQUITY_J2000_DEG * DEG);
const COS_EPS = Math.cos(OBLIQUITY_J2000_DEG * DEG);

/** Ecliptic J2000 -> equatorial J2000 (rotation about x by the obliquity). */
export const eclipticToEquatorial = ([x, y, z]: Vector3): Vector3 => [x, y * COS_EPS - z * SIN_EPS, y * SIN_EPS + z * COS_EPS];

/** Heliocentric position of a planet in AU, J2000 ecliptic and equinox (VSOP87B). */
export function heliocentricEclipticAu(id: PlanetId, jde: number): Vector3 {
  const { lon, lat, range } = vsop87Position(id, jde);
  return scale(fromSpherical(lon, lat), range);
}

/** The same for a custom body's Keplerian path about the Sun. */
export function keplerHeliocentricAu(orbit: HeliocentricOrbit, jde: number): Vector3 {
  const { lon, lat, range } = keplerHeliocentric(orbit, jde);
  return scale(fromSpherical(lon, lat), range);
}

/** The body's north pole (IAU rotational elements) at a date, as right ascension and declination in radians. */
export function poleRaDecRad(body: Body, jde: number): { raRad: number; decRad: number } {
  const days = jde - J2000_JD;
  const t = days / DAYS_PER_JULIAN_CENTURY;
  const { pole } = body;
  let ra = pole.alpha0Deg + pole.alphaRateDegPerCentury * t;
  let dec = pole.delta0Deg + pole.deltaRateDegPerCentury * t;
  for (const term of pole.terms) {
    const arg = (term.phaseDeg + term.rateDegPerDay * days) * DEG;
    ra += term.raAmpDeg * Math.sin(arg);
    dec += term.decAmpDeg * Math.cos(arg);
  }
  return { raRad: ra * DEG, decRad: dec * DEG };
}

/** Axes of the body's equatorial frame in ICRF: z the pole, x the ascending node of the body's equator on the ICRF equator. */
export function bodyFrameAxes(body: Body, jde: number): { x: Vector3; y: Vector3; z: Vector3 } {
  const { raRad, decRad } = poleRaDecRad(body, jde);
  const z = fromSpherical(raRad, decRad);
  const nodeDirection = cross([0, 0, 1], z);
  // A pole on the ICRF pole (Earth) has no node: keep the ICRF axes, x at the J2000 equinox.
  const x: Vector3 = norm(nodeDirection) < 1e-12 ? [1, 0, 0] : unit(nodeDirection);
  return { x, y: cross(z, x), z };
}

export const toBodyFrame = (axes: { x: Vector3; y: Vector3; z: Vector3 }, v: Vector3): Vector3 => [
  dot(axes.x, v), dot(axes.y, v), dot(axes.z, v),
];

export interface SunGeometry {
  /** Unit vector from the body's centre to the Sun, body equatorial frame. */
  direction: Vector3;
  /** The same in ICRF (J2000 equator). */
  directionIcrf: Vector3;
  distanceAu: number;
  /** Right ascension and declination of the Sun in the body's equatorial frame, radians. */
  raRad: number;
  decRad: number;
}

/** Where the Sun is, seen from the body's centre, at a UTC epoch. */
export function sunFromBody(body: Body, epoch: Date): SunGeometry {
  const jde = julianDateTT(epoch);
  // a custom body about the Sun keeps its own Keplerian path (custom-bodies.ts)
  const helio = body.heliocentric ? keplerHeliocentricAu(body.heliocentric, jde) : heliocentricEclipticAu(body.planetId, jde);
  // the moon's offset from its planet, km to AU (zero for a planet)
  const towardSunIcrf = subtract(eclipticToEquatorial(scale(helio, -1)), scale(moonOffsetKm(body, jde), 1 / AU_KM));
  const distanceAu = norm(towardSunIcrf);
  const directionIcrf = scale(towardSunIcrf, 1 / distanceAu);
  const direction = toBodyFrame(bodyFrameAxes(body, jde), directionIcrf);
  return {
    direction,
    directionIcrf,
    distanceAu,
    raRad: Math.atan2(direction[1], direction[0]),
    decRad: Math.asin(Math.max(-1, Math.min(1, direction[2]))),
  };
}

/** Solar flux in W/m^2 at a distance in AU. */
// inverse-square law from TSI 1361 W/m^2 at 1 AU
export const solarFluxWm2 = (distanceAu: number): number => SOLAR_CONSTANT_WM2 / (distanceAu * distanceAu);

/** Sign (+1/-1) of the Sun's apparent motion around the body's pole: + when the body's orbit runs prograde about that pole. */
export function sunMotionSign(body: Body): 1 | -1 {
  // The planet's orbital pole is near the ecliptic pole (within 7 deg for every planet here).
  const eclipticPole = eclipticToEquatorial([0, 0, 1]);
  const { raRad, decRad } = poleRaDecRad(body, J2000_JD);
  return dot(fromSpherical(raRad, decRad), eclipticPole) >= 0 ? 1 : -1;
}

/** The Sun at the body's (or its planet's) perihelion, mean distance and aphelion: distance in AU, flux in W/m^2. */
export function sunlightRange(body: Body) {
  const { mean, min, max } = solarDistanceRangeAu(body);
  return {
    perihelion: { distanceAu: min, solarFluxWm2: solarFluxWm2(min) },
    mean: { distanceAu: mean, solarFluxWm2: solarFluxWm2(mean) },
    aphelion: { distanceAu: max, solarFluxWm2: solarFluxWm2(max) },
  };
}
