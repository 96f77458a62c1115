// Where a moon is about its planet: the moon's planetocentric position (km, ICRF axes) at a date from
// a published theory, and a track that evaluates it cheaply over a span for sweeps.
// Theories: Earth's Moon from Meeus ch. 47 (ELP-2000/82 main terms, astronomia moonposition), turned
// from the ecliptic of date to J2000 by the general precession in longitude (Lieske et al. 1977,
// Meeus ch. 21, from memory; the ecliptic's own tilt, under 15 arcsec over this century, is left out);
// the Galilean moons from Meeus ch. 44's high-accuracy theory (Lieske E5, astronomia jupitermoons)
// and Titan and Enceladus from Meeus ch. 46 (astronomia saturnmoons). Those two give a moon as seen
// by an observer; here the observer is put at the planet's distance looking along the J2000
// equinox, so the answer's line of sight is the ICRF x axis, its y axis the planet's pole projected
// on the sky (IAU pole here; Meeus's differs by hundredths of a degree), and the observer's light
// time and perspective are taken back out. A moon with neither keeps a circular orbit at its mean
// elements in its planet's equator (mean-elements; its source is named in bodies.ts).
// Leaves out: light time between the planet and the Sun (the geometry is taken at one instant), and
// the theories' own errors (Meeus: about 10 arcsec for the Moon, under 0.001 planet radii for E5).
import jupiterMoons from 'astronomia/jupitermoons';
import moonPosition from 'astronomia/moonposition';
import saturnMoons from 'astronomia/saturnmoons';
import { getBody, type Body } from './bodies';
import { DAYS_PER_JULIAN_CENTURY, J2000_JD, SECONDS_PER_DAY, TT_MINUS_UTC_S } from './constants';
import { PhysicsError } from './physics-error';
import { bodyFrameAxes, eclipticToEquatorial, poleRaDecRad } from './sun';
import { cross, DEG, fromSpherical, scale, unit, type Vector3 } from './vector3';

const ARCSEC = DEG / 3600;
/** Light time per AU, days (Meeus 33.3). */
const LIGHT_DAYS_PER_AU = 0.0057755183;
const GALILEAN_INDEX: Record<string, number> = { io: 0, europa: 1, ganymede: 2, callisto: 3 };
const SATURNIAN_INDEX: Record<string, number> = { enceladus: 1, titan: 5 };
// Meeus's differential light-time constants (ch. 44 and 46), undone below.
const GALILEAN_K = [17295, 21819, 27558, 36548];
const SATURNIAN_K = [20947, 23715, 26382, 29876, 35313, 53800, 59222, 91820];
// Planet radii per AU in Meeus's perspective factor.
const RADII_PER_AU: Record<string, number> = { jupiter: 2095, saturn: 2475 };
const OBSERVER_AU = 5;

/** General precession in longitude from J2000 to the date, radians (Lieske et al. 1977). */
const precessionInLongitudeRad = (jde: number): number => {
  const t = (jde - J2000_JD) / DAYS_PER_JULIAN_CENTURY;
  return (5029.0966 * t + 1.11113 * t * t) * ARCSEC;
};

const noPlanet = { position: () => ({ lon: 0, lat: 0, range: 0 }) };

/** An observer OBSERVER_AU from the planet whose line of sight, of date, is the J2000 equinox. */
const sightAlongEquinox = (jde: number) => ({ position: () => ({ lon: precessionInLongitudeRad(jde), lat: 0, range: OBSERVER_AU }) });

/** Sky coordinates (planet radii) back to ICRF km: z along the line of sight (+x), y toward the planet's projected pole. */
function skyToIcrfKm(planet: Body, jde: number, x: number, y: number, z: number, k: number, radiiPerAu: number): Vector3 {
  // perspective W = D / (D + z / radiiPerAu) and the differential light time dx = |z| / k sqrt(1 - (x/r)^2)
  const w = OBSERVER_AU / (OBSERVER_AU + z / radiiPerAu);
  const sy = y / w;
  const r = Math.hypot(x / w, sy, z);
  const sx = x / w - (Math.abs(z) / k) * Math.sqrt(Math.max(0, 1 - (x / w / r) ** 2));
  const { raRad, decRad } = poleRaDecRad(planet, jde);
  const pole = fromSpherical(raRad, decRad);
  const ez: Vector3 = [1, 0, 0];
  const ey = unit([0, pole[1], pole[2]]);
  // Meeus's X grows westward on the sky: ez x ey for an observer looking along ez with ey up.
  const ex = cross(ez, ey);
  const km = planet.radiusKm;
  return [
    km * (sx * ex[0] + sy * ey[0] + z * ez[0]),
    km * (sx * ex[1] + sy * ey[1] + z * ez[1]),
    km * (sx * ex[2] + sy * ey[2] + z * ez[2]),
  ];
}

/** Circular orbit at the mean elements in the planet's equator, mean longitude from the node on the ICRF equator. */
function meanElementsKm(body: Body, jde: number): Vector3 {
  const orbit = body.parentOrbit!;
  const planet = getBody(body.planetId);
  const axes = bodyFrameAxes(planet, jde);
  const lonRad = ((orbit.meanLongitudeJ2000Deg ?? 0) + (360 / orbit.periodDays) * (jde - J2000_JD)) * DEG;
  const [c, s] = [Math.cos(lonRad) * orbit.semiMajorAxisKm, Math.sin(lonRad) * orbit.semiMajorAxisKm];
  return [c * axes.x[0] + s * axes.y[0], c * axes.x[1] + s * axes.y[1], c * axes.x[2] + s * axes.y[2]];
}

/** The moon's position relative to its planet, km, ICRF axes, at a Julian ephemeris date. A planet answers [0, 0, 0]. */
export function moonOffsetKm(body: Body, jde: number): Vector3 {
  const orbit = body.parentOrbit;
  if (!orbit) return [0, 0, 0];
  switch (orbit.theory) {
    case 'meeus-moon': {
      const p = moonPosition.position(jde) as { lon: number; lat: number; range: number };
      return eclipticToEquatorial(scale(fromSpherical(p.lon - precessionInLongitudeRad(jde), p.lat), p.range));
    }
    case 'meeus-galilean': {
      const i = GALILEAN_INDEX[body.id];
      const tau = LIGHT_DAYS_PER_AU * OBSERVER_AU;
      const p = (jupiterMoons.e5(jde + tau, noPlanet, sightAlongEquinox(jde)) as { x: number; y: number; z: number }[])[i];
      return skyToIcrfKm(getBody('jupiter'), jde, p.x, p.y, p.z, GALILEAN_K[i], RADII_PER_AU['jupiter']);
    }
    case 'meeus-saturnian': {
      const i = SATURNIAN_INDEX[body.id];
      const tau = LIGHT_DAYS_PER_AU * OBSERVER_AU;
      const p = (saturnMoons.positions(jde + tau, noPlanet, sightAlongEquinox(jde)) as { x: number; y: number; z: number }[])[i];
      return skyToIcrfKm(getBody('saturn'), jde, p.x, p.y, p.z, SATURNIAN_K[i], RADII_PER_AU['saturn']);
    }
    case 'mean-elements':
      return meanElementsKm(body, jde);
  }
}

// local copies of the constants for the hot paths below (an imported binding may be read through a getter)
const TT_MINUS_UTC = TT_MINUS_UTC_S;
const DAY_S = SECONDS_PER_DAY;
const J2000 = J2000_JD;

/** Julian ephemeris date of a UTC instant in ms (the same as sun.ts julianDateTT, without a Date). */
export const jdeOfMs = (ms: number): number => 2440587.5 + (ms / 1000 + TT_MINUS_UTC) / DAY_S;

export interface MoonTrack {
  /** The moon's planetocentric position (km, ICRF) at a UTC instant in ms, written into out. */
  at(ms: number, out: Float64Array): void;
  /** Node spacing, days. */
  readonly nodeDays: number;
  /** Theory evaluations so far (for the bench and tests). */
  readonly evaluations: number;
}

/** The frame turning with the moon's mean motion about its mean plane's pole, in which a near-circular orbit is nearly still. */
function coRotation(body: Body) {
  const orbit = body.parentOrbit;
  if (!orbit) throw new PhysicsError('unknown_body', `${body.name} is not a moon`);
  const pole = orbit.meanPlane === 'ecliptic'
    ? eclipticToEquatorial([0, 0, 1])
    : (() => {
      const { raRad, decRad } = poleRaDecRad(getBody(body.planetId), J2000_JD);
      return fromSpherical(raRad, decRad);
    })();
  const rate = (2 * Math.PI) / orbit.periodDays;
  const [kx, ky, kz] = pole;
  /** Rodrigues' rotation of (x, y, z) about the pole by rate * days, into out, without allocating. */
  const turn = (x: number, y: number, z: number, days: number, out: Float64Array): void => {
    const angle = rate * days;
    const [cs, sn] = [Math.cos(angle), Math.sin(angle)];
    const kv = (kx * x + ky * y + kz * z) * (1 - cs);
    out[0] = x * cs + (ky * z - kz * y) * sn + kx * kv;
    out[1] = y * cs + (kz * x - kx * z) * sn + ky * kv;
    out[2] = z * cs + (kx * y - ky * x) * sn + kz * kv;
  };
  /** The theory's position at J2000 + days, turned back into the rotating frame. */
  const still = (days: number): Vector3 => {
    const p = moonOffsetKm(body, J2000_JD + days);
    const q = new Float64Array(3);
    turn(p[0], p[1], p[2], -days, q);
    return [q[0], q[1], q[2]];
  };
  return { turn, still };
}

/**
 * The moon's position over any span, its theory evaluated at nodes `nodeDays` apart (computed when
 * first needed, kept) and interpolated between by four-point Lagrange (Abramowitz & Stegun 25.2.13)
 * in the frame turning with the moon (coRotation): the error is about (3/128) (2 pi / nodes a
 * revolution)^4 of the orbit's departures from a circle (checked against the theory in
 * parent-shadow.spec.ts).
 */
export function moonTrack(body: Body, nodeDays = defaultMoonNodeDays(body)): MoonTrack {
  const { turn, still } = coRotation(body);
  const nodes = new Map<number, Vector3>();
  let evaluations = 0;
  const node = (k: number): Vector3 => {
    let q = nodes.get(k);
    if (!q) {
      if (nodes.size > 4096) nodes.clear();
      evaluations++;
      q = still(k * nodeDays);
      nodes.set(k, q);
    }
    return q;
  };
  return {
    nodeDays,
    get evaluations() {
      return evaluations;
    },
    at(ms: number, out: Float64Array): void {
      const days = jdeOfMs(ms) - J2000;
      const s = days / nodeDays;
      const j = Math.floor(s);
      const u = s - j;
      const wm = (-u * (u - 1) * (u - 2)) / 6;
      const w0 = ((u + 1) * (u - 1) * (u - 2)) / 2;
      const w1 = (-(u + 1) * u * (u - 2)) / 2;
      const w2 = ((u + 1) * u * (u - 1)) / 6;
      const a = node(j - 1);
      const b = node(j);
      const c = node(j + 1);
      const d = node(j + 2);
      turn(
        wm * a[0] + w0 * b[0] + w1 * c[0] + w2 * d[0],
        wm * a[1] + w0 * b[1] + w1 * c[1] + w2 * d[1],
        wm * a[2] + w0 * b[2] + w1 * c[2] + w2 * d[2],
        days, out,
      );
    },
  };
}

/**
 * The moon over a short span (a passage behind its planet, hours): the theory at the span's two
 * ends and middle, a parabola between in the frame turning with the moon. Over a tenth of a
 * revolution its error is under about (1/16) (2 pi x span / period)^3 of the orbit's departures from
 * a circle: a few km for the Galilean moons (checked in parent-shadow.spec.ts). Three evaluations.
 */
export function localMoonTrack(body: Body, fromMs: number, toMs: number): (ms: number, out: Float64Array) => void {
  const { turn, still } = coRotation(body);
  const d0 = jdeOfMs(fromMs) - J2000_JD;
  const h = (jdeOfMs(toMs) - J2000_JD - d0) / 2;
  const [a, b, c] = [still(d0), still(d0 + h), still(d0 + 2 * h)];
  return (ms, out) => {
    const days = jdeOfMs(ms) - J2000;
    const u = h > 0 ? (days - d0) / h : 0;
    // three-point Lagrange weights for nodes 0, 1, 2 (Abramowitz & Stegun 25.2.11)
    const [wa, wb, wc] = [((u - 1) * (u - 2)) / 2, -u * (u - 2), (u * (u - 1)) / 2];
    turn(wa * a[0] + wb * b[0] + wc * c[0], wa * a[1] + wb * b[1] + wc * c[1], wa * a[2] + wb * b[2] + wc * c[2], days, out);
  };
}

/**
 * Nodes for the accuracy shadows need: 16 a revolution for the Moon (its departures from a circle
 * reach 30,000 km: about 20 km off), 8 for the near-circular moons of the giant planets (under
 * 10,000 km: under 100 km off, a few seconds of a shadow's edge).
 */
export const defaultMoonNodeDays = (body: Body): number => {
  if (!body.parentOrbit) return 1;
  return body.parentOrbit.periodDays / (body.parentOrbit.eccentricity > 0.02 || body.parentOrbit.theory === 'meeus-moon' ? 16 : 8);
};
