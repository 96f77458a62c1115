import { describe, expect, it } from 'vitest';
import { resampleByTime } from './thermal-run-inputs';

describe('an eccentric case\'s loads on the thermal solver\'s even steps', () => {
  it('keep the orbit-integrated energy of a short periapsis pulse (trapezoid rule on the linear series; conservation, no source)', () => {
    const periodS = 1000;
    // dense samples round periapsis (t = 0), sparse elsewhere; a 100 W pulse of about 10 s
    const tS = [0, 2, 4, 6, 8, 300, 500, 700, 992, 994, 996, 998];
    const values = tS.map((t) => (t < 5 || t > 995 ? 100 : 1));
    const t = [...tS, periodS];
    const v = [...values, values[0]!];
    let energy = 0;
    for (let i = 1; i < t.length; i++) energy += ((v[i]! + v[i - 1]!) / 2) * (t[i]! - t[i - 1]!);
    for (const n of [10, 37, 120]) {
      const even = resampleByTime(values, tS, periodS, n);
      expect(even).toHaveLength(n);
      expect(even.reduce((a, b) => a + b, 0) * (periodS / n)).toBeCloseTo(energy, 6);
    }
    // the pulse lands in the step centred on periapsis
    const ten = resampleByTime(values, tS, periodS, 10);
    expect(ten[0]).toBeGreaterThan(5 * ten[5]!);
  });

  it('a constant load stays constant', () => {
    expect(resampleByTime([3, 3, 3], [0, 100, 700], 1000, 7).every((w) => Math.abs(w - 3) < 1e-12)).toBe(true);
  });
});
