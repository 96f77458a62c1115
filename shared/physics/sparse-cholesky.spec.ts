// The sparse Cholesky factor the thermal solver steps with, against a dense solve of the same
// symmetric positive definite matrix (Gaussian elimination with partial pivoting, written here
// independently of the code under test; Golub & Van Loan, Matrix Computations, 4th ed., 3.2 and 4.2).
import { describe, expect, it } from 'vitest';
import { minimumDegreeOrder, SparseCholesky } from './sparse-cholesky';

/** Solves A x = b densely by Gaussian elimination with partial pivoting. */
function denseSolve(a: number[][], b: number[]): number[] {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    [m[c], m[p]] = [m[p], m[c]];
    for (let r = c + 1; r < n; r++) {
      const f = m[r][c] / m[c][c];
      for (let k = c; k <= n; k++) m[r][k] -= f * m[c][k];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let k = r + 1; k < n; k++) s -= m[r][k] * x[k];
    x[r] = s / m[r][r];
  }
  return x;
}

/** A small deterministic pseudo-random sequence (a linear congruential generator), so the test repeats. */
function random(seed: number): () => number {
  let s = seed;
  return () => {
    s = (s * 1664525 + 1013904223) % 4294967296;
    return s / 4294967296;
  };
}

/**
 * A thermal network's matrix on a graph: off-diagonals -g for each coupling, the diagonal the sum of
 * the couplings plus a positive capacitance-like term, so the matrix is symmetric and strictly
 * diagonally dominant with a positive diagonal, hence positive definite (Gershgorin).
 */
function networkMatrix(n: number, edges: [number, number][], next: () => number): number[][] {
  const a = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  for (const [i, j] of edges) {
    const g = 0.1 + 10 * next();
    a[i][j] -= g;
    a[j][i] -= g;
    a[i][i] += g;
    a[j][j] += g;
  }
  for (let i = 0; i < n; i++) a[i][i] += 0.01 + next();
  return a;
}

/** Each vertex's place in the minimum-degree order of the graph. */
function positions(n: number, edges: [number, number][]): Int32Array {
  const position = new Int32Array(n);
  minimumDegreeOrder(n, edges).order.forEach((v, p) => (position[v] = p));
  return position;
}

/** Factors scale x `a` on the pattern of `edges` with `factor` and solves it against b, in the original numbering. */
function factorAndSolve(factor: SparseCholesky, position: Int32Array, a: number[][], edges: [number, number][], b: number[], scale = 1): { x: number[]; ok: boolean } {
  const n = b.length;
  const diag = new Float64Array(n);
  const lower = new Float64Array(factor.nonZeros);
  for (let i = 0; i < n; i++) diag[position[i]] = scale * a[i][i];
  for (const [i, j] of edges) {
    const [row, col] = position[i] > position[j] ? [position[i], position[j]] : [position[j], position[i]];
    lower[factor.entry(row, col)] = scale * a[i][j];
  }
  const ok = factor.factor(diag, lower);
  const rhs = new Float64Array(n);
  for (let i = 0; i < n; i++) rhs[position[i]] = b[i];
  factor.solve(rhs);
  return { x: Array.from({ length: n }, (_, i) => rhs[position[i]]), ok };
}

/** Factors `a` on the pattern of `edges` and solves a x = b through the minimum-degree ordering. */
function sparseSolve(a: number[][], edges: [number, number][], b: number[]): { x: number[]; ok: boolean; factor: SparseCholesky; position: Int32Array } {
  const factor = new SparseCholesky(b.length, minimumDegreeOrder(b.length, edges).columns);
  const position = positions(b.length, edges);
  return { ...factorAndSolve(factor, position, a, edges, b), factor, position };
}

/** The sparse factor's answer is the dense solve's to 1e-10 of the largest value. */
function expectDenseAnswer(a: number[][], edges: [number, number][], b: number[]): void {
  const dense = denseSolve(a, b);
  const { x, ok } = sparseSolve(a, edges, b);
  expect(ok).toBe(true);
  const scale = Math.max(...dense.map(Math.abs));
  x.forEach((v, i) => expect(Math.abs(v - dense[i]) / scale).toBeLessThan(1e-10));
}

describe('sparse Cholesky against a dense solve (Golub & Van Loan 4.2; dense Gaussian elimination 3.2)', () => {
  it('a 6 x 6 grid network (fill-in inside the elimination) solves as the dense solve to 1e-10 relative', () => {
    const side = 6;
    const n = side * side;
    const edges: [number, number][] = [];
    for (let r = 0; r < side; r++) {
      for (let c = 0; c < side; c++) {
        const i = r * side + c;
        if (c + 1 < side) edges.push([i, i + 1]);
        if (r + 1 < side) edges.push([i, i + side]);
      }
    }
    const next = random(7);
    const a = networkMatrix(n, edges, next);
    const b = Array.from({ length: n }, () => 100 * (next() - 0.5));
    expectDenseAnswer(a, edges, b);
  });

  it('a random sparse network with a hub node (many couplings on one node) solves as the dense solve', () => {
    const n = 40;
    const next = random(11);
    const edges: [number, number][] = [];
    const seen = new Set<string>();
    for (let k = 0; k < 90; k++) {
      const i = Math.floor(next() * n);
      const j = k % 3 === 0 ? 0 : Math.floor(next() * n);
      if (i === j || seen.has(`${Math.min(i, j)},${Math.max(i, j)}`)) continue;
      seen.add(`${Math.min(i, j)},${Math.max(i, j)}`);
      edges.push([i, j]);
    }
    const a = networkMatrix(n, edges, next);
    const b = Array.from({ length: n }, () => next() - 0.5);
    expectDenseAnswer(a, edges, b);
  });

  it('answers false for a matrix that is not positive definite (a negative diagonal term, as a negative capacitance would give), naming the failed pivot', () => {
    const edges: [number, number][] = [[0, 1], [1, 2]];
    const a = networkMatrix(3, edges, random(3));
    a[1][1] = -1;
    const { ok, factor, position } = sparseSolve(a, edges, [1, 2, 3]);
    expect(ok).toBe(false);
    // The leading minors before node 1's pivot are those of a positive definite matrix: node 1's is the first to fail.
    expect(factor.failedColumn).toBe(position[1]);
  });

  it('a second factor of the same pattern factors another matrix on the same network: 2A gives half the answer', () => {
    const edges: [number, number][] = [[0, 1], [1, 2], [2, 3], [3, 0], [0, 2]];
    const a = networkMatrix(4, edges, random(5));
    const b = [1, -1, 2, 0.5];
    const { x, factor, position } = sparseSolve(a, edges, b);
    const twin = factorAndSolve(factor.samePattern(), position, a, edges, b, 2);
    expect(twin.ok).toBe(true);
    twin.x.forEach((v, i) => expect(v).toBeCloseTo(x[i] / 2, 12));
  });
});
