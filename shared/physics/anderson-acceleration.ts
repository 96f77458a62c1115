// Anderson acceleration of a fixed-point iteration x = g(x) (Walker & Ni, "Anderson acceleration
// for fixed-point iterations", SIAM J. Numer. Anal. 49, 2011; the "type II" form with memory m).
// The thermal solver applies it to the orbit map (start of orbit -> end of orbit): plain repetition
// converges only as fast as the slowest node's time constant allows, the extrapolation of the last
// few orbits' changes skips most of those orbits.

export class AndersonAcceleration {
  private readonly xs: Float64Array[] = [];
  private readonly gs: Float64Array[] = [];

  constructor(
    private readonly n: number,
    private readonly memory = 5,
  ) {}

  reset(): void {
    this.xs.length = 0;
    this.gs.length = 0;
  }

  /** Given x and g(x), answers the next x to try. */
  next(x: Float64Array, gx: Float64Array): Float64Array {
    const { n } = this;
    this.xs.push(new Float64Array(x));
    this.gs.push(new Float64Array(gx));
    if (this.xs.length > this.memory + 1) {
      this.xs.shift();
      this.gs.shift();
    }
    const k = this.xs.length - 1;
    if (k === 0) return new Float64Array(gx);
    const f = (j: number, i: number) => this.gs[j][i] - this.xs[j][i];
    // Columns dF_j = f_{j+1} - f_j, dG_j = g_{j+1} - g_j; minimise |f_k - dF gamma|.
    const m = k;
    const normal = Array.from({ length: m }, () => new Float64Array(m));
    const rhs = new Float64Array(m);
    for (let a = 0; a < m; a++) {
      for (let b = a; b < m; b++) {
        let s = 0;
        for (let i = 0; i < n; i++) s += (f(a + 1, i) - f(a, i)) * (f(b + 1, i) - f(b, i));
        normal[a][b] = s;
        normal[b][a] = s;
      }
      let s = 0;
      for (let i = 0; i < n; i++) s += (f(a + 1, i) - f(a, i)) * f(k, i);
      rhs[a] = s;
    }
    let trace = 0;
    for (let a = 0; a < m; a++) trace += normal[a][a];
    // A little Tikhonov regularisation keeps nearly parallel columns from blowing gamma up.
    for (let a = 0; a < m; a++) normal[a][a] += 1e-10 * trace + 1e-300;
    const gamma = solveSmall(normal, rhs);
    // Wild coefficients mean the columns carry no information (a ramp, rounding): start afresh.
    if (!gamma.every((g) => Number.isFinite(g) && Math.abs(g) < 1e3)) {
      this.reset();
      return new Float64Array(gx);
    }
    const out = new Float64Array(gx);
    for (let a = 0; a < m; a++) {
      const g = gamma[a];
      for (let i = 0; i < n; i++) out[i] -= g * (this.gs[a + 1][i] - this.gs[a][i]);
    }
    return out;
  }
}

/** Gaussian elimination with partial pivoting on a small dense system. */
function solveSmall(a: Float64Array[], b: Float64Array): Float64Array {
  const m = b.length;
  const x = new Float64Array(b);
  const rows = a.map((r) => new Float64Array(r));
  for (let c = 0; c < m; c++) {
    let pivot = c;
    for (let r = c + 1; r < m; r++) if (Math.abs(rows[r][c]) > Math.abs(rows[pivot][c])) pivot = r;
    [rows[c], rows[pivot]] = [rows[pivot], rows[c]];
    [x[c], x[pivot]] = [x[pivot], x[c]];
    const d = rows[c][c];
    if (d === 0) continue;
    for (let r = c + 1; r < m; r++) {
      const factor = rows[r][c] / d;
      for (let k = c; k < m; k++) rows[r][k] -= factor * rows[c][k];
      x[r] -= factor * x[c];
    }
  }
  for (let c = m - 1; c >= 0; c--) {
    let s = x[c];
    for (let k = c + 1; k < m; k++) s -= rows[c][k] * x[k];
    x[c] = rows[c][c] === 0 ? 0 : s / rows[c][c];
  }
  return x;
}
