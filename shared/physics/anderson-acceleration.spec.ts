// Anderson acceleration on a linear fixed point x = M x + c whose answer is known, x* = (I - M)^-1 c.
// On a linear map, Anderson acceleration with memory m >= n is equivalent to GMRES on (I - M) x = c
// (Walker & Ni, SIAM J. Numer. Anal. 49, 2011, sec. 4), so it reaches x* in about n + 1 steps where
// plain iteration only contracts by the spectral radius of M per step.
import { describe, expect, it } from 'vitest';
import { AndersonAcceleration } from './anderson-acceleration';

// A symmetric M with eigenvalues 0.95, 0.9, 0.5 and 0.2 (Q diag Q^T with a fixed rotation Q), and c.
const eigen = [0.95, 0.9, 0.5, 0.2];
const q = (() => {
  // Householder reflection I - 2 v v^T / v^T v: orthogonal, so M's eigenvalues are eigen.
  const v = [1, 2, -1, 0.5];
  const vv = v.reduce((s, x) => s + x * x, 0);
  return v.map((vi, i) => v.map((vj, j) => (i === j ? 1 : 0) - (2 * vi * vj) / vv));
})();
const M = q.map((_, i) => q.map((__, j) => eigen.reduce((s, e, k) => s + q[i][k] * e * q[j][k], 0)));
const c = [1, -2, 3, 0.5];
// x* in the eigenbasis: (Q^T c)_k / (1 - e_k), back with Q.
const xStar = (() => {
  const ct = eigen.map((_, k) => q.reduce((s, row, i) => s + row[k] * c[i], 0));
  return q.map((row) => row.reduce((s, qik, k) => s + (qik * ct[k]) / (1 - eigen[k]), 0));
})();
const g = (x: Float64Array) => Float64Array.from(M.map((row, i) => row.reduce((s, m, j) => s + m * x[j], 0) + c[i]));
const error = (x: Float64Array) => Math.max(...xStar.map((v, i) => Math.abs(x[i] - v)));

/** `steps` accelerated and plain iterations from 0. */
function iterate(memory: number, steps: number): { x: Float64Array; plain: Float64Array } {
  const anderson = new AndersonAcceleration(4, memory);
  let x: Float64Array = new Float64Array(4);
  let plain: Float64Array = new Float64Array(4);
  for (let k = 0; k < steps; k++) {
    x = anderson.next(x, g(x));
    plain = g(plain);
  }
  return { x, plain };
}

describe('Anderson acceleration (Walker & Ni 2011) on a linear fixed point with a known answer', () => {
  it('reaches x* = (I - M)^-1 c to 1e-8 within n + 2 steps, where plain iteration is still far off', () => {
    const { x, plain } = iterate(5, 6);
    expect(error(x)).toBeLessThan(1e-8);
    // Plain iteration contracts by 0.95 per step along the slowest direction: after 6 steps most of the way remains.
    expect(error(plain)).toBeGreaterThan(1);
  });

  it('with memory 1 (a secant step) it still converges, faster than plain iteration', () => {
    const { x, plain } = iterate(1, 30);
    expect(error(x)).toBeLessThan(error(plain) / 10);
  });

  it('the first step is the plain step g(x), and reset forgets the history', () => {
    const anderson = new AndersonAcceleration(4);
    const x0 = Float64Array.from([1, 1, 1, 1]);
    expect(Array.from(anderson.next(x0, g(x0)))).toEqual(Array.from(g(x0)));
    anderson.next(g(x0), g(g(x0)));
    anderson.reset();
    expect(Array.from(anderson.next(x0, g(x0)))).toEqual(Array.from(g(x0)));
  });
});
