// The VSOP87B heliocentric theory of the planets (J2000 ecliptic and equinox), evaluated from
// astronomia's coefficient tables packed once into typed arrays. astronomia's own evaluator builds
// an object per term (about 110 microseconds per Earth position); a ten-year day-by-day sweep needs
// thousands of positions, so this one runs the same sums over flat arrays.
// Leaves out: nothing of the theory (every term astronomia ships is summed). Source: Bretagnon &
// Francou 1988, VSOP87; Meeus, Astronomical Algorithms ch. 32 (L, B, R as power series in
// millennia of the sums A cos(B + C tau)). Checked against astronomia's Planet.position2000.
import earthData from 'astronomia/data/vsop87Bearth';
import jupiterData from 'astronomia/data/vsop87Bjupiter';
import marsData from 'astronomia/data/vsop87Bmars';
import mercuryData from 'astronomia/data/vsop87Bmercury';
import neptuneData from 'astronomia/data/vsop87Bneptune';
import saturnData from 'astronomia/data/vsop87Bsaturn';
import uranusData from 'astronomia/data/vsop87Buranus';
import venusData from 'astronomia/data/vsop87Bvenus';
import type { PlanetId } from './bodies';
import { J2000_JD } from './constants';

type RawSeries = Record<string, readonly (readonly number[])[]>;
export interface VsopTables {
  L: RawSeries;
  B: RawSeries;
  R: RawSeries;
}

/** One coordinate: per power of tau, the terms' amplitudes, phases and frequencies. */
interface PackedCoordinate {
  a: Float64Array[];
  b: Float64Array[];
  c: Float64Array[];
}
interface PackedPlanet {
  l: PackedCoordinate;
  b: PackedCoordinate;
  r: PackedCoordinate;
}

export interface VsopPosition {
  /** Heliocentric ecliptic longitude, radians 0..2pi. */
  lon: number;
  /** Heliocentric ecliptic latitude, radians. */
  lat: number;
  /** Distance from the Sun, AU. */
  range: number;
}

// The data modules are ES modules with a default export; under CommonJS interop (some bundlers,
// tsx in CJS mode) the default arrives wrapped as {default}. Accept both.
export function unwrapVsopModule(module: unknown): VsopTables {
  if (typeof module === 'object' && module !== null && !('L' in module) && 'default' in module) {
    return (module as { default: VsopTables }).default;
  }
  return module as VsopTables;
}

const tables: Record<PlanetId, unknown> = {
  mercury: mercuryData, venus: venusData, earth: earthData, mars: marsData,
  jupiter: jupiterData, saturn: saturnData, uranus: uranusData, neptune: neptuneData,
};

function packCoordinate(series: RawSeries): PackedCoordinate {
  const powers = Object.keys(series).map(Number).sort((x, y) => x - y);
  const packed: PackedCoordinate = { a: [], b: [], c: [] };
  for (const power of powers) {
    const terms = series[String(power)];
    const [a, b, c] = [new Float64Array(terms.length), new Float64Array(terms.length), new Float64Array(terms.length)];
    terms.forEach((t, i) => {
      a[i] = t[0];
      b[i] = t[1];
      c[i] = t[2];
    });
    packed.a[power] = a;
    packed.b[power] = b;
    packed.c[power] = c;
  }
  return packed;
}

const packed = new Map<PlanetId, PackedPlanet>();

function planetTables(id: PlanetId): PackedPlanet {
  let p = packed.get(id);
  if (!p) {
    const raw = unwrapVsopModule(tables[id]);
    p = { l: packCoordinate(raw.L), b: packCoordinate(raw.B), r: packCoordinate(raw.R) };
    packed.set(id, p);
  }
  return p;
}

// Meeus eq. 32.1: X = X0 + X1 tau + X2 tau^2 + ..., each Xn = sum of A cos(B + C tau)
function evaluate(coordinate: PackedCoordinate, tau: number): number {
  let total = 0;
  for (let power = coordinate.a.length - 1; power >= 0; power--) {
    const a = coordinate.a[power];
    const b = coordinate.b[power];
    const c = coordinate.c[power];
    let sum = 0;
    if (a) for (let i = 0; i < a.length; i++) sum += a[i] * Math.cos(b[i] + c[i] * tau);
    total = total * tau + sum;
  }
  return total;
}

const TWO_PI = 2 * Math.PI;
// The rotation recurrence below restarts from exact cosines this often, so its rounding error
// (about one unit in the last place per step) stays below 1e-13 of each term.
const RESEED_EVERY = 64;

/**
 * One coordinate at `count` evenly spaced tau = tau0 + n dtau, into `out`. cos(B + C tau) along an
 * even grid is a rotation by C dtau per step, so each term costs one cosine and sine per restart
 * instead of one per date: the sums are the same as evaluate's, term by term.
 */
function evaluateSeries(coordinate: PackedCoordinate, tau0: number, dtau: number, count: number, out: Float64Array, sum: Float64Array): void {
  out.fill(0);
  for (let power = coordinate.a.length - 1; power >= 0; power--) {
    const a = coordinate.a[power];
    const b = coordinate.b[power];
    const c = coordinate.c[power];
    sum.fill(0);
    if (a) {
      for (let i = 0; i < a.length; i++) {
        const amplitude = a[i];
        const delta = c[i] * dtau;
        const cosStep = Math.cos(delta);
        const sinStep = Math.sin(delta);
        for (let start = 0; start < count; start += RESEED_EVERY) {
          const phase = b[i] + c[i] * (tau0 + start * dtau);
          let cosPhase = Math.cos(phase);
          let sinPhase = Math.sin(phase);
          const end = Math.min(count, start + RESEED_EVERY);
          for (let n = start; n < end; n++) {
            sum[n] += amplitude * cosPhase;
            const next = cosPhase * cosStep - sinPhase * sinStep;
            sinPhase = sinPhase * cosStep + cosPhase * sinStep;
            cosPhase = next;
          }
        }
      }
    }
    for (let n = 0; n < count; n++) out[n] = out[n] * (tau0 + n * dtau) + sum[n];
  }
}

export interface VsopSeries {
  lon: Float64Array;
  lat: Float64Array;
  range: Float64Array;
}

/**
 * vsop87Position at `count` dates jde0, jde0 + stepDays, ...: the same theory, every term, for the
 * date grids of sweeps (a ten-year Sun track is about 900 positions).
 */
export function vsop87Series(id: PlanetId, jde0: number, stepDays: number, count: number): VsopSeries {
  const p = planetTables(id);
  const tau0 = (jde0 - J2000_JD) / 365250;
  const dtau = stepDays / 365250;
  const series: VsopSeries = { lon: new Float64Array(count), lat: new Float64Array(count), range: new Float64Array(count) };
  const sum = new Float64Array(count);
  evaluateSeries(p.l, tau0, dtau, count, series.lon, sum);
  evaluateSeries(p.b, tau0, dtau, count, series.lat, sum);
  evaluateSeries(p.r, tau0, dtau, count, series.range, sum);
  for (let n = 0; n < count; n++) {
    const lon = series.lon[n] % TWO_PI;
    series.lon[n] = lon < 0 ? lon + TWO_PI : lon;
  }
  return series;
}

/** Heliocentric position of a planet at a Julian ephemeris date (TT), J2000 ecliptic and equinox. */
export function vsop87Position(id: PlanetId, jde: number): VsopPosition {
  const p = planetTables(id);
  // tau counts Julian millennia from J2000
  const tau = (jde - J2000_JD) / 365250;
  const lon = evaluate(p.l, tau) % TWO_PI;
  return { lon: lon < 0 ? lon + TWO_PI : lon, lat: evaluate(p.b, tau), range: evaluate(p.r, tau) };
}
