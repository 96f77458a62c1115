// One orbit sampled evenly in time, with everything about each sample that does not depend on where
// the Sun is (anomaly, radius, the body's apparent size), so a sweep over many dates or many
// surfaces solves Kepler's equation once. With the Sun given in the orbit's perifocal frame, the
// Sun's direction in the local frame at a sample is two multiplications, and the shadow tests
// compare cosines instead of taking arc functions.
// Leaves out: what eclipse.ts leaves out (the same conical shadow and two-disk overlap, here in a
// form for speed; mission-sweep.spec.ts holds the sweep built on it to computeEnvironment's answers).
// Sources: Vallado ch. 2 (perifocal frame, conic equation); Montenbruck & Gill sect. 3.4.2 (conical
// shadow, from memory).
import { SUN_RADIUS_KM } from './constants';
import { sunlitFraction, type EclipseSummary } from './eclipse';
import { solveKepler, trueAnomalyFromEccentric } from './kepler';
import type { Orbit } from './orbit-definition';

const TWO_PI = 2 * Math.PI;

export interface OrbitGrid {
  steps: number;
  periodS: number;
  tS: Float64Array;
  trueAnomalyRad: Float64Array;
  cosNu: Float64Array;
  sinNu: Float64Array;
  radiusKm: Float64Array;
  /** Sine and cosine of the body's apparent radius from each sample. */
  sinBody: Float64Array;
  cosBody: Float64Array;
}

/** The Sun in the orbit's perifocal frame (P toward periapsis, Q, W the orbit normal), unit components, and its distance. */
export interface PerifocalSun {
  sp: number;
  sq: number;
  sw: number;
  distanceKm: number;
}

export interface AnomalyAt {
  cosNu: number;
  sinNu: number;
  radiusKm: number;
}

/** True anomaly (radians) at tS seconds after periapsis; the circular case counts from the node. */
export function trueAnomalyAt(orbit: Orbit, tS: number): number {
  const m = orbit.meanMotionRadS * tS;
  return orbit.eccentricity === 0 ? m % TWO_PI : trueAnomalyFromEccentric(solveKepler(m, orbit.eccentricity), orbit.eccentricity);
}

/** `steps` samples at tS = k T / steps, k = 0 .. steps - 1. */
export function orbitGrid(orbit: Orbit, bodyRadiusKm: number, steps: number): OrbitGrid {
  const times = new Float64Array(steps);
  for (let k = 0; k < steps; k++) times[k] = (k * orbit.periodS) / steps;
  return orbitGridAt(orbit, bodyRadiusKm, times);
}

/** Samples at the given times after periapsis (orbit-sampling.ts chooses uneven ones). */
export function orbitGridAt(orbit: Orbit, bodyRadiusKm: number, times: Float64Array): OrbitGrid {
  const steps = times.length;
  const arrays = () => new Float64Array(steps);
  const grid: OrbitGrid = {
    steps, periodS: orbit.periodS, tS: arrays(), trueAnomalyRad: arrays(), cosNu: arrays(), sinNu: arrays(),
    radiusKm: arrays(), sinBody: arrays(), cosBody: arrays(),
  };
  const { semiMajorAxisKm: a, eccentricity: e } = orbit;
  for (let k = 0; k < steps; k++) {
    const tS = times[k];
    const nu = trueAnomalyAt(orbit, tS);
    const c = Math.cos(nu);
    // conic equation r = a (1 - e^2) / (1 + e cos nu)
    const r = (a * (1 - e * e)) / (1 + e * c);
    const sinB = Math.min(1, bodyRadiusKm / r);
    grid.tS[k] = tS;
    grid.trueAnomalyRad[k] = nu;
    grid.cosNu[k] = c;
    grid.sinNu[k] = Math.sin(nu);
    grid.radiusKm[k] = r;
    grid.sinBody[k] = sinB;
    grid.cosBody[k] = Math.sqrt(1 - sinB * sinB);
  }
  return grid;
}

/**
 * Share of the Sun's disk (0..1) seen from a point at radius r whose zenith makes cos = sunZenith
 * with the Sun direction. Same model as shadowGeometry + sunlitFraction in eclipse.ts.
 */
export function sunlitAt(sunZenith: number, radiusKm: number, sinBody: number, cosBody: number, sunDistanceKm: number): number {
  const d = sunDistanceKm;
  const dSun = Math.sqrt(d * d - 2 * d * radiusKm * sunZenith + radiusKm * radiusKm);
  // angle between the Sun's and the body's centres seen from the point
  const cosSep = (radiusKm - d * sunZenith) / dSun;
  const sinSun = Math.min(1, SUN_RADIUS_KM / dSun);
  const cosSun = Math.sqrt(1 - sinSun * sinSun);
  // separation >= sun + body radius: clear of the body (cos of a sum)
  if (cosSep <= cosBody * cosSun - sinBody * sinSun) return 1;
  // separation <= body - sun radius: umbra (cos of a difference; needs the body disk the larger)
  if (sinBody > sinSun && cosSep >= cosBody * cosSun + sinBody * sinSun) return 0;
  return sunlitFraction({
    sunRadiusRad: Math.asin(sinSun),
    bodyRadiusRad: Math.asin(sinBody),
    separationRad: Math.acos(Math.max(-1, Math.min(1, cosSep))),
  });
}

/** Per-sample Sun geometry and shade of one orbit, written by shadeGrid into reusable arrays. */
export interface GridShade {
  /** The Sun's components in the local frame: x toward ram, z toward zenith (y is the orbit normal's, constant). */
  cx: Float64Array;
  cz: Float64Array;
  /** Negative inside the shadow (penumbra or umbra): cos(sun + body radius) - cos(separation). */
  shadowTest: Float64Array;
  /** Negative inside the umbra: cos(body - sun radius) - cos(separation); 1 where the Sun's disk is the larger. */
  umbraTest: Float64Array;
  sunlit: Float64Array;
}

export function gridShade(steps: number): GridShade {
  const arrays = () => new Float64Array(steps);
  return { cx: arrays(), cz: arrays(), shadowTest: arrays(), umbraTest: arrays(), sunlit: arrays() };
}

/**
 * sqrt(1 - s^2) for the Sun's apparent radius: below 0.02 rad (every planet's Sun but from inside
 * Mercury's orbit) the series to s^8 is exact to double precision (the next term is under 1e-18)
 * and saves a square root per sample; otherwise the square root itself.
 */
function cosFromSin(s: number): number {
  if (s >= 0.02) return Math.sqrt(1 - s * s);
  const s2 = s * s;
  return 1 - s2 * (0.5 + s2 * (0.125 + s2 * (0.0625 + s2 * 0.0390625)));
}

/** Fills `shade` for the Sun `sun` on `grid`: the same model as sunlitAt, one pass. */
export function shadeGrid(grid: OrbitGrid, sun: PerifocalSun, shade: GridShade): void {
  const { sp, sq, distanceKm: d } = sun;
  const { cosNu, sinNu, radiusKm, sinBody, cosBody } = grid;
  const { cx, cz, shadowTest, umbraTest, sunlit } = shade;
  const steps = grid.steps;
  const dd = d * d;
  // a local copy: an imported binding may be read through a getter on every use
  const sunRadiusKm = SUN_RADIUS_KM;
  for (let k = 0; k < steps; k++) {
    const c = cosNu[k];
    const s = sinNu[k];
    const r = radiusKm[k];
    // local frame: x ram = Q cos nu - P sin nu, z zenith = P cos nu + Q sin nu
    const z = sp * c + sq * s;
    cx[k] = sq * c - sp * s;
    cz[k] = z;
    // one division for both ratios over the distance to the Sun
    const inverseSun = 1 / Math.sqrt(dd - 2 * d * r * z + r * r);
    const cosSep = (r - d * z) * inverseSun;
    const sinSun = Math.min(1, sunRadiusKm * inverseSun);
    const cosSun = cosFromSin(sinSun);
    const sinB = sinBody[k];
    const cosB = cosBody[k];
    const clear = cosB * cosSun - sinB * sinSun - cosSep;
    const umbra = sinB > sinSun ? cosB * cosSun + sinB * sinSun - cosSep : 1;
    shadowTest[k] = clear;
    umbraTest[k] = umbra;
    sunlit[k] = clear >= 0 ? 1 : umbra <= 0 ? 0 : partialSunlit(sinSun, sinB, cosSep);
  }
}

/** The penumbra's share of the Sun's disk, out of the hot loop above so that loop stays small. */
function partialSunlit(sinSun: number, sinBody: number, cosSep: number): number {
  return sunlitFraction({
    sunRadiusRad: Math.asin(sinSun), bodyRadiusRad: Math.asin(sinBody), separationRad: Math.acos(Math.max(-1, Math.min(1, cosSep))),
  });
}

/** One of the two shadow tests (0 shadow, 1 umbra) at any time tS after periapsis, on the exact orbit. */
function shadowTestAt(orbit: Orbit, sun: PerifocalSun, bodyRadiusKm: number, tS: number, which: number): number {
  const nu = trueAnomalyAt(orbit, tS);
  const c = Math.cos(nu);
  const e = orbit.eccentricity;
  const r = (orbit.semiMajorAxisKm * (1 - e * e)) / (1 + e * c);
  const d = sun.distanceKm;
  const z = sun.sp * c + sun.sq * Math.sin(nu);
  const dSun = Math.sqrt(d * d - 2 * d * r * z + r * r);
  const cosSep = (r - d * z) / dSun;
  const sinSun = Math.min(1, SUN_RADIUS_KM / dSun);
  const cosSun = Math.sqrt(1 - sinSun * sinSun);
  const sinB = Math.min(1, bodyRadiusKm / r);
  const cosB = Math.sqrt(1 - sinB * sinB);
  if (which === 0) return cosB * cosSun - sinB * sinSun - cosSep;
  return sinB > sinSun ? cosB * cosSun + sinB * sinSun - cosSep : 1;
}

/**
 * Where the test changes sign between t0 (value f0) and t1 (value f1): the Illinois variant of
 * regula falsi (Dowell & Jarratt 1971), to 1 microsecond, bisecting when it stalls.
 */
function crossingS(orbit: Orbit, sun: PerifocalSun, bodyRadiusKm: number, which: number, t0: number, f0: number, t1: number, f1: number): number {
  let [a, fa, b, fb] = [t0, f0, t1, f1];
  let side = 0;
  for (let n = 0; n < 100 && b - a > 1e-6; n++) {
    let t = fa === fb ? (a + b) / 2 : (a * fb - b * fa) / (fb - fa);
    if (!(t > a && t < b)) t = (a + b) / 2;
    const ft = shadowTestAt(orbit, sun, bodyRadiusKm, t, which);
    if ((ft < 0) === (fa < 0)) {
      [a, fa] = [t, ft];
      if (side === -1) fb /= 2;
      side = -1;
    } else {
      [b, fb] = [t, ft];
      if (side === 1) fa /= 2;
      side = 1;
    }
    // Once the root is bracketed within a microsecond's worth of the slope, stop.
    if (Math.abs(ft) < 1e-15) return t;
  }
  return (a + b) / 2;
}

/**
 * Eclipse over one orbit with the Sun held fixed, from a filled shade: a scan of the samples for
 * sign changes of the two shadow tests, each crossing refined on the exact orbit, and a search
 * around the deepest sample so that a grazing shadow shorter than one grid step is not missed.
 */
export function eclipseFromShade(orbit: Orbit, grid: OrbitGrid, shade: GridShade, sun: PerifocalSun, bodyRadiusKm: number): EclipseSummary {
  const dt = grid.periodS / grid.steps;
  const steps = grid.steps;
  let crossings = 0;
  let scannedShadowS = 0;
  let umbraTotalS = 0;
  for (let which = 0; which < 2; which++) {
    const f = which === 0 ? shade.shadowTest : shade.umbraTest;
    // intervals wholly inside are counted first; only those with a sign change are refined
    let inside = 0;
    let total = 0;
    let f0 = f[0];
    for (let k = 1; k <= steps; k++) {
      const f1 = k === steps ? f[0] : f[k];
      if (f0 < 0) {
        if (f1 < 0) inside++;
        else {
          if (which === 0) crossings++;
          const t0 = (k - 1) * dt;
          total += crossingS(orbit, sun, bodyRadiusKm, which, t0, f0, k * dt, f1) - t0;
        }
      } else if (f1 < 0) {
        if (which === 0) crossings++;
        const t1 = k * dt;
        total += t1 - crossingS(orbit, sun, bodyRadiusKm, which, t1 - dt, f0, t1, f1);
      }
      f0 = f1;
    }
    total += inside * dt;
    if (which === 0) scannedShadowS = total;
    else umbraTotalS = total;
  }
  let shadowS = scannedShadowS;
  if (crossings === 0) {
    // A grazing shadow can fall between two samples: look for a negative minimum next to the deepest one.
    let deepest = 0;
    for (let k = 1; k < steps; k++) if (shade.shadowTest[k] < shade.shadowTest[deepest]) deepest = k;
    if (shade.shadowTest[deepest] >= 0) shadowS += grazingShadowS(orbit, sun, bodyRadiusKm, deepest * dt, dt);
  }
  const umbraS = Math.min(umbraTotalS, shadowS);
  const penumbraS = Math.max(0, shadowS - umbraS);
  const eclipseDurationS = umbraS + penumbraS / 2;
  return { eclipseFraction: eclipseDurationS / orbit.periodS, eclipseDurationS, umbraS, penumbraS };
}

/** Eclipse over one orbit on a grid (allocates its own shade). */
export function eclipseOnGrid(orbit: Orbit, grid: OrbitGrid, sun: PerifocalSun, bodyRadiusKm: number): EclipseSummary {
  const shade = gridShade(grid.steps);
  shadeGrid(grid, sun, shade);
  return eclipseFromShade(orbit, grid, shade, sun, bodyRadiusKm);
}

/** Shadow time within [centre - dt, centre + dt]: golden-section search for the minimum of the test, then the two edges. */
function grazingShadowS(orbit: Orbit, sun: PerifocalSun, bodyRadiusKm: number, centre: number, dt: number): number {
  const g = (Math.sqrt(5) - 1) / 2;
  let [lo, hi] = [centre - dt, centre + dt];
  for (let n = 0; n < 60 && hi - lo > 1e-6; n++) {
    const x1 = hi - g * (hi - lo);
    const x2 = lo + g * (hi - lo);
    if (shadowTestAt(orbit, sun, bodyRadiusKm, x1, 0) < shadowTestAt(orbit, sun, bodyRadiusKm, x2, 0)) hi = x2;
    else lo = x1;
  }
  const tMin = (lo + hi) / 2;
  const fMin = shadowTestAt(orbit, sun, bodyRadiusKm, tMin, 0);
  if (!(fMin < 0)) return 0;
  const fLo = shadowTestAt(orbit, sun, bodyRadiusKm, centre - dt, 0);
  const fHi = shadowTestAt(orbit, sun, bodyRadiusKm, centre + dt, 0);
  const exit = crossingS(orbit, sun, bodyRadiusKm, 0, tMin, fMin, centre + dt, fHi);
  const entry = crossingS(orbit, sun, bodyRadiusKm, 0, centre - dt, fLo, tMin, fMin);
  return exit - entry;
}
