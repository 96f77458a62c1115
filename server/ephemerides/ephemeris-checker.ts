// Row-by-row checks every ephemeris format goes through, and the summary computed while the rows
// stream past (span, median step, altitude range). Collects at most the first MAX_PROBLEMS;
// points go to the spool only while the file is still clean (a refused file keeps nothing).
import type { ErrorDetail } from '../../shared/api/errors';
import type { Body } from '../../shared/physics/bodies';
import type { PointSpool } from './point-spool';

export const MAX_PROBLEMS = 20;
/** A distance above this many body radii is taken for metres (Earth: 6.4 million km, past its sphere of influence). */
const METRES_RADII = 1000;
/** No trajectory about a body in this catalogue moves faster than this (km/s); above it, m/s. */
const METRES_SPEED_KMS = 200;

export type Problem = Required<Pick<ErrorDetail, 'row' | 'message'>> & Pick<ErrorDetail, 'column' | 'value'>;

const shownValue = (cell: string): string => {
  const text = cell.trim();
  return text.length > 40 ? text.slice(0, 37) + '…' : text;
};
const plainNumber = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
/** Exact powers of ten: 1e0 to 1e22 are all exactly representable as doubles. */
const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => 10 ** k);
const MAX_FAST_DIGITS = 15;

/**
 * A plain decimal ("-6928.137000": sign, digits, at most one point, no spaces, no exponent) with at
 * most 15 digits, read from its character codes in one pass; NaN for anything else. The digits
 * form an integer below 2^53 and the divisor is an exact power of ten, so the one division rounds
 * correctly and gives exactly what Number() gives, without the pattern test and the string copy.
 */
function plainDecimal(text: string): number {
  const n = text.length;
  let k = 0;
  let negative = false;
  const first = text.charCodeAt(0);
  if (first === 45 || first === 43) {
    negative = first === 45;
    k = 1;
  }
  let mantissa = 0;
  let digits = 0;
  let fraction = -1;
  for (; k < n; k++) {
    const c = text.charCodeAt(k);
    if (c >= 48 && c <= 57) {
      mantissa = mantissa * 10 + (c - 48);
      digits++;
      if (fraction >= 0) fraction++;
    } else if (c === 46 && fraction < 0) {
      fraction = 0;
    } else {
      return NaN;
    }
  }
  if (digits === 0 || digits > MAX_FAST_DIGITS) return NaN;
  const value = fraction > 0 ? mantissa / POWERS_OF_TEN[fraction] : mantissa;
  return negative ? -value : value;
}
const fmt = (x: number) => (Math.abs(x) >= 1e5 ? x.toExponential(3) : x.toFixed(1));

export interface EphemerisStats {
  rows: number;
  startMs: number;
  endMs: number;
  stepS: number;
  minAltitudeKm: number;
  maxAltitudeKm: number;
  hasVelocity: boolean;
}

export class EphemerisChecker {
  readonly problems: Problem[] = [];
  private lastMs: number | null = null;
  private lastRow = 0;
  private firstMs = NaN;
  private minRadius = Infinity;
  private maxRadius = -Infinity;
  // Steps rounded to the microsecond, counted: exact median in little memory, as steps repeat.
  private readonly steps = new Map<number, number>();
  private rows = 0;
  private velocity = false;

  constructor(
    private readonly body: Body,
    private readonly spool: PointSpool,
  ) {}

  get full(): boolean {
    return this.problems.length >= MAX_PROBLEMS;
  }

  get clean(): boolean {
    return this.problems.length === 0;
  }

  problem(row: number, column: string | undefined, value: string | undefined, message: string): void {
    if (this.full) return;
    this.problems.push({ row, message, ...(column ? { column } : {}), ...(value !== undefined ? { value: shownValue(value) } : {}) });
  }

  /** The cell as a finite number, or null after recording why it is not one. */
  number(row: number, column: string, text: string): number | null {
    const fast = plainDecimal(text);
    if (!Number.isNaN(fast)) return fast;
    const t = text.trim();
    // The well-formed number first: it is nearly every cell, and one test is all it needs.
    if (plainNumber.test(t)) {
      const value = Number(t);
      if (Number.isFinite(value)) return value;
      this.problem(row, column, text, 'too large to be a finite number');
      return null;
    }
    if (t === '') this.problem(row, column, text, 'empty: a number is needed');
    else if (/^[+-]?nan$/i.test(t)) this.problem(row, column, text, 'NaN is not a number: the propagator gave no value here');
    else if (/^[+-]?(inf|infinity)$/i.test(t)) this.problem(row, column, text, 'infinite: a position or velocity must be a finite number');
    else this.problem(row, column, text, 'not a number');
    return null;
  }

  /**
   * One data row, its cells already read (null where a cell was refused; `hasV` false and the
   * velocities null when the file has none). Checks the epoch order, the position against the
   * surface and the units, then keeps the point while the file is clean. Scalars rather than
   * arrays: a million rows would otherwise make two million short-lived arrays.
   */
  point(
    row: number, epochColumn: string, epochValue: string, tMs: number | null,
    x: number | null, y: number | null, z: number | null,
    hasV: boolean, vx: number | null, vy: number | null, vz: number | null,
  ): void {
    this.rows = row;
    if (tMs !== null) {
      if (this.lastMs !== null && tMs === this.lastMs) {
        this.problem(row, epochColumn, epochValue, `repeated epoch: row ${this.lastRow} has the same one`);
      } else if (this.lastMs !== null && tMs < this.lastMs) {
        this.problem(row, epochColumn, epochValue, `epochs must increase: this one is before row ${this.lastRow}'s`);
      } else {
        if (this.lastMs !== null) {
          const step = Math.round((tMs - this.lastMs) * 1000) / 1e6;
          this.steps.set(step, (this.steps.get(step) ?? 0) + 1);
        } else {
          this.firstMs = tMs;
        }
        this.lastMs = tMs;
        this.lastRow = row;
      }
    }
    if (x === null || y === null || z === null || tMs === null) return;
    const radius = Math.hypot(x, y, z);
    const R = this.body.radiusKm;
    if (radius > METRES_RADII * R) {
      this.problem(row, 'x, y, z', `|r| = ${fmt(radius)}`, `looks like metres; Eclipta expects km (|r| is ${fmt(radius / R)} times the radius of ${this.body.name})`);
      return;
    }
    if (radius < R) {
      this.problem(row, 'x, y, z', `|r| = ${fmt(radius)} km`, `below the surface of ${this.body.name}: |r| = ${fmt(radius)} km is less than its radius ${R} km (altitude ${fmt(radius - R)} km)`);
      return;
    }
    if (hasV) {
      if (vx === null || vy === null || vz === null) return;
      const speed = Math.hypot(vx, vy, vz);
      if (speed > METRES_SPEED_KMS) {
        this.problem(row, 'vx, vy, vz', `|v| = ${fmt(speed)}`, `looks like m/s; Eclipta expects km/s (|v| = ${fmt(speed)} km/s is faster than anything in orbit)`);
        return;
      }
      this.velocity = true;
    }
    this.minRadius = Math.min(this.minRadius, radius);
    this.maxRadius = Math.max(this.maxRadius, radius);
    if (this.clean) this.spool.push(tMs, x, y, z, vx ?? NaN, vy ?? NaN, vz ?? NaN);
  }

  /** Called after the last row: refuses files with too few rows; the stats when all is well. */
  finish(): EphemerisStats | null {
    if (this.clean && this.rows === 0) this.problem(0, undefined, undefined, 'the file has a header but no data rows');
    else if (this.clean && this.rows === 1) this.problem(1, undefined, undefined, 'the file has one data row; a trajectory needs at least two');
    if (!this.clean || this.lastMs === null) return null;
    return {
      rows: this.spool.points,
      startMs: this.firstMs,
      endMs: this.lastMs,
      stepS: medianStep(this.steps),
      minAltitudeKm: this.minRadius - this.body.radiusKm,
      maxAltitudeKm: this.maxRadius - this.body.radiusKm,
      hasVelocity: this.velocity,
    };
  }
}

function medianStep(steps: Map<number, number>): number {
  const sorted = [...steps.entries()].sort((a, b) => a[0] - b[0]);
  const total = sorted.reduce((n, [, count]) => n + count, 0);
  const middle = [Math.floor((total - 1) / 2), Math.floor(total / 2)];
  const at = (k: number): number => {
    let seen = 0;
    for (const [step, count] of sorted) {
      seen += count;
      if (k < seen) return step;
    }
    return sorted[sorted.length - 1]?.[0] ?? 0;
  };
  return (at(middle[0]) + at(middle[1])) / 2;
}
