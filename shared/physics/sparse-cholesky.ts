// Sparse Cholesky factorisation L L^T of a symmetric positive definite matrix whose pattern is a
// node network's couplings: a minimum-degree ordering (Tinney & Walker's scheme 2), the symbolic
// pattern from the elimination graph, then a left-looking numeric factorisation that can be redone
// cheaply when only the values change (the thermal solver refactors as radiation linearises anew).
// Works in the permuted order throughout: callers number their unknowns by `order`.

/** Orders the vertices of an undirected graph to keep fill low: always eliminate a least-connected one. */
export function minimumDegreeOrder(n: number, edges: readonly (readonly [number, number])[]): { order: Int32Array; columns: number[][] } {
  const adjacency: Set<number>[] = Array.from({ length: n }, () => new Set<number>());
  for (const [a, b] of edges) {
    if (a === b) continue;
    adjacency[a].add(b);
    adjacency[b].add(a);
  }
  const eliminated = new Uint8Array(n);
  const order = new Int32Array(n);
  const neighboursAtElimination: number[][] = [];
  for (let k = 0; k < n; k++) {
    let best = -1;
    let bestDegree = Infinity;
    for (let v = 0; v < n; v++) {
      if (!eliminated[v] && adjacency[v].size < bestDegree) {
        best = v;
        bestDegree = adjacency[v].size;
      }
    }
    const neighbours = [...adjacency[best]];
    // Eliminating a vertex joins its neighbours into a clique: that is the fill.
    for (const a of neighbours) {
      adjacency[a].delete(best);
      for (const b of neighbours) if (a !== b) adjacency[a].add(b);
    }
    eliminated[best] = 1;
    order[k] = best;
    neighboursAtElimination.push(neighbours);
  }
  const position = new Int32Array(n);
  for (let k = 0; k < n; k++) position[order[k]] = k;
  const columns = neighboursAtElimination.map((ns) => ns.map((v) => position[v]).sort((a, b) => a - b));
  return { order, columns };
}

export class SparseCholesky {
  private readonly colStart: Int32Array;
  private readonly rowIndex: Int32Array;
  private readonly values: Float64Array;
  private readonly diagonal: Float64Array;
  // For each row k: the columns j < k with L[k][j] != 0 and where that entry sits in `values`.
  private readonly rowStart: Int32Array;
  private readonly rowEntry: Int32Array;
  private readonly rowColumn: Int32Array;
  private readonly work: Float64Array;

  /** `columns[k]`: the rows below the diagonal of column k of L (permuted numbering, ascending). */
  constructor(readonly n: number, columns: readonly (readonly number[])[]) {
    this.colStart = new Int32Array(n + 1);
    for (let k = 0; k < n; k++) this.colStart[k + 1] = this.colStart[k] + columns[k].length;
    const nnz = this.colStart[n];
    this.rowIndex = new Int32Array(nnz);
    this.values = new Float64Array(nnz);
    this.diagonal = new Float64Array(n);
    this.work = new Float64Array(n);
    const rowCount = new Int32Array(n + 1);
    for (let k = 0; k < n; k++) {
      let p = this.colStart[k];
      for (const i of columns[k]) {
        this.rowIndex[p++] = i;
        rowCount[i + 1]++;
      }
    }
    this.rowStart = new Int32Array(n + 1);
    for (let i = 0; i < n; i++) this.rowStart[i + 1] = this.rowStart[i] + rowCount[i + 1];
    this.rowEntry = new Int32Array(nnz);
    this.rowColumn = new Int32Array(nnz);
    const fill = this.rowStart.slice(0, n);
    for (let k = 0; k < n; k++) {
      for (let p = this.colStart[k]; p < this.colStart[k + 1]; p++) {
        const i = this.rowIndex[p];
        const at = fill[i]++;
        this.rowEntry[at] = p;
        this.rowColumn[at] = k;
      }
    }
  }

  /** The column (permuted numbering) whose pivot was not positive in the last failed factorisation; -1 if none failed. */
  failedColumn = -1;

  /** A second factor of the same pattern, for another matrix on the same network. */
  samePattern(): SparseCholesky {
    const columns = Array.from({ length: this.n }, (_, k) => Array.from(this.rowIndex.subarray(this.colStart[k], this.colStart[k + 1])));
    return new SparseCholesky(this.n, columns);
  }

  /** The positions in L's pattern, to place a matrix's off-diagonal entries: entry(row, col) with row > col. */
  entry(row: number, col: number): number {
    for (let p = this.colStart[col]; p < this.colStart[col + 1]; p++) if (this.rowIndex[p] === row) return p;
    throw new Error(`SparseCholesky: (${row}, ${col}) is outside the pattern`);
  }

  /**
   * Factorises the matrix with diagonal `diag` and strictly-lower entries `lower` (laid out like L's
   * pattern, zero where the matrix has none). Answers false when the matrix is not positive definite.
   */
  factor(diag: Float64Array, lower: Float64Array): boolean {
    const { n, colStart, rowIndex, values, diagonal, rowStart, rowEntry, rowColumn, work } = this;
    for (let k = 0; k < n; k++) {
      const start = colStart[k];
      const end = colStart[k + 1];
      work[k] = diag[k];
      for (let p = start; p < end; p++) work[rowIndex[p]] = lower[p];
      for (let r = rowStart[k]; r < rowStart[k + 1]; r++) {
        const p = rowEntry[r];
        const j = rowColumn[r];
        const lkj = values[p];
        const jEnd = colStart[j + 1];
        // Rows k and below of column j all lie in column k's pattern (elimination-graph property).
        for (let q = p; q < jEnd; q++) work[rowIndex[q]] -= values[q] * lkj;
      }
      const d = work[k];
      if (!(d > 0)) {
        this.failedColumn = k;
        return false;
      }
      const lkk = Math.sqrt(d);
      diagonal[k] = lkk;
      work[k] = 0;
      for (let p = start; p < end; p++) {
        const i = rowIndex[p];
        values[p] = work[i] / lkk;
        work[i] = 0;
      }
    }
    return true;
  }

  /** Solves L L^T x = b in place. */
  solve(x: Float64Array): void {
    const { n, colStart, rowIndex, values, diagonal } = this;
    for (let k = 0; k < n; k++) {
      const xk = x[k] / diagonal[k];
      x[k] = xk;
      for (let p = colStart[k]; p < colStart[k + 1]; p++) x[rowIndex[p]] -= values[p] * xk;
    }
    for (let k = n - 1; k >= 0; k--) {
      let s = x[k];
      for (let p = colStart[k]; p < colStart[k + 1]; p++) s -= values[p] * x[rowIndex[p]];
      x[k] = s / diagonal[k];
    }
  }

  get nonZeros(): number {
    return this.colStart[this.n] + this.n;
  }
}
