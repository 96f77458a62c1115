// The lumped-node network as arrays the solver can step fast, and one implicit step of it.
// Node balance (DOMAIN.md "Thermal model"): C dT/dt = Q_abs + Q_diss + Q_heater - eps sigma A (T^4 - T_sink^4)
//   - sum G_ij (T_i - T_j) - sum sigma R_ij (T_i^4 - T_j^4) - loop heat.
// Boundary (fixed) nodes leave the unknowns; their couplings become constants and diagonal terms.
// The implicit step is BDF2 (backward Euler on the first step): A-stable and L-stable, so stiff
// networks (a small bracket on a big panel) neither ring nor blow up at a step set by the loads.
// The nonlinear radiation is solved by a chord iteration on a sparse Cholesky factor of the
// network's matrix, with radiative couplings in their exact secant form
// sigma R (T_i^4 - T_j^4) = h_ij (T_i - T_j), h_ij = sigma R (T_i^2 + T_j^2)(T_i + T_j), which keeps
// the matrix symmetric positive definite. The factor is reused step after step while it still
// contracts quickly and rebuilt when it does not.
import { STEFAN_BOLTZMANN } from './constants';
import { minimumDegreeOrder, SparseCholesky } from './sparse-cholesky';
import { ClosedLoops, withCoolantLumps } from './thermal-loops';
import { KELVIN_OFFSET, ThermalConvergenceError, ThermalModelError, type DissipationSchedule, type OrbitSeries, type ThermalModelInput } from './thermal-model';

/** An implicit step whose iteration did not settle: the free node that moved most, where it started and where it got to. */
export class StepDivergence extends ThermalConvergenceError {
  constructor(
    readonly free: number,
    readonly fromK: number,
    readonly toK: number,
    /** True when the step's matrix could not be factored at this node (a capacitance or conductance not positive). */
    readonly singular = false,
  ) {
    super('A time step did not converge.', 0, NaN);
  }
}

export interface ThermalNetwork {
  /** Free (non-boundary) nodes, in the solver's order. */
  readonly n: number;
  /** The model's node index of each free node, and the free index of each model node (-1 for boundaries). */
  readonly nodeOfFree: Int32Array;
  readonly freeOfNode: Int32Array;
  readonly capacitanceJK: Float64Array;
  /** eps sigma A to the sink plus sigma R to boundary nodes: coefficients of T^4. */
  readonly radiationWK4: Float64Array;
  /** Conductance to boundary nodes, W/K. */
  readonly boundaryWK: Float64Array;
  /** Symmetric adjacency of free nodes (both directions): conductance and sigma R per entry. */
  readonly adjStart: Int32Array;
  readonly adjIndex: Int32Array;
  readonly adjConductanceWK: Float64Array;
  readonly adjRadiationWK4: Float64Array;
  /** Position in the factor's pattern of each adjacency entry below the diagonal, else -1. */
  readonly adjFactorEntry: Int32Array;
  readonly factor: SparseCholesky;
  readonly steps: number;
  readonly substeps: number;
  readonly dtS: number;
  /** Heat into each free node per integration step, W: loads plus the boundary and sink terms. */
  readonly sourceW: Float64Array;
  readonly initialK: Float64Array;
  readonly fixedK: Float64Array;
  /** Closed coolant loops (their lumps are free unknowns after the model's nodes), or null. */
  readonly loops: ClosedLoops | null;
}

const radiatingArea = (area: number | undefined, eps: number | undefined) => (area ?? 0) * (eps ?? 0);

/** Value of a per-sample series at sample position s (fractional, periodic): linear between samples. */
function seriesAt(series: OrbitSeries | undefined, s: number, steps: number, path: string): number {
  if (series === undefined) return 0;
  if (typeof series === 'number') return series;
  if (series.length !== steps) throw new ThermalModelError(`${path} has ${series.length} values; it needs one per step (${steps})`, path);
  const i0 = Math.floor(s) % steps;
  const f = s - Math.floor(s);
  return series[i0] * (1 - f) + series[(i0 + 1) % steps] * f;
}

/** Mean dissipation of an on/off schedule over [t0, t1] within the orbit (the cycle restarts each orbit). */
function scheduleMean(schedule: DissipationSchedule, t0: number, t1: number): number {
  const { onW, offW = 0, periodS, onS, phaseS = 0 } = schedule;
  // Time on in [0, t] of a cycle starting on at phaseS.
  const onUpTo = (t: number) => {
    const u = t - phaseS;
    const cycles = Math.floor(u / periodS);
    return cycles * onS + Math.min(u - cycles * periodS, onS);
  };
  const on = onUpTo(t1) - onUpTo(t0);
  return (on * onW + (t1 - t0 - on) * offW) / (t1 - t0);
}

/**
 * The orbit-average of a node's dissipation as a thermal run on a case of period `periodS` applies it:
 * a constant as it is, an on/off schedule its mean over the orbit (its cycle restarts each orbit).
 */
export function orbitAverageDissipationW(dissipation: number | DissipationSchedule, periodS: number): number {
  return typeof dissipation === 'number' ? dissipation : scheduleMean(dissipation, 0, periodS);
}

export function capacitanceOf(node: ThermalModelInput['nodes'][number], path: string): number {
  if (node.capacitanceJK !== undefined) return node.capacitanceJK;
  if (node.massKg !== undefined && node.specificHeatJKgK !== undefined) return node.massKg * node.specificHeatJKgK;
  throw new ThermalModelError(`node ${node.name} needs capacitanceJK, or massKg and specificHeatJKgK`, path);
}

export function nodeIndexOf(model: ThermalModelInput): Map<string, number> {
  const index = new Map<string, number>();
  model.nodes.forEach((node, i) => {
    if (index.has(node.name)) throw new ThermalModelError(`node name ${node.name} is used twice`, `nodes.${i}.name`);
    index.set(node.name, i);
  });
  return index;
}

export function buildNetwork(userModel: ThermalModelInput, substeps = 1): ThermalNetwork {
  const model = withCoolantLumps(userModel);
  const index = nodeIndexOf(model);
  const find = (name: string, path: string) => {
    const i = index.get(name);
    if (i === undefined) throw new ThermalModelError(`${path} names node ${JSON.stringify(name)}, which the model does not have`, path);
    return i;
  };
  const count = model.nodes.length;
  const fixed = model.nodes.map((node) => node.fixedC !== undefined);
  const freeOfNode = new Int32Array(count).fill(-1);
  const freeNodes = model.nodes.map((_, i) => i).filter((i) => !fixed[i]);
  const n = freeNodes.length;
  const localOf = new Int32Array(count).fill(-1);
  freeNodes.forEach((node, k) => (localOf[node] = k));

  // Free-free pairs, their conductance and sigma R; couplings between the same pair add up.
  const pairs = new Map<string, { a: number; b: number; g: number; r: number }>();
  const boundaryWK = new Float64Array(count);
  const boundaryRad = new Float64Array(count);
  const boundarySourceW = new Float64Array(count);
  const addPair = (i: number, j: number, g: number, r: number) => {
    if (i === j) return;
    if (fixed[i] && fixed[j]) return;
    if (fixed[i] || fixed[j]) {
      const [free, wall] = fixed[i] ? [j, i] : [i, j];
      const tWall = (model.nodes[wall].fixedC ?? 0) + KELVIN_OFFSET;
      boundaryWK[free] += g;
      boundaryRad[free] += r;
      boundarySourceW[free] += g * tWall + r * tWall ** 4;
      return;
    }
    const [a, b] = localOf[i] < localOf[j] ? [localOf[i], localOf[j]] : [localOf[j], localOf[i]];
    const key = `${a},${b}`;
    const pair = pairs.get(key) ?? { a, b, g: 0, r: 0 };
    pair.g += g;
    pair.r += r;
    pairs.set(key, pair);
  };
  (model.couplings ?? []).forEach((c, k) => {
    addPair(find(c.from, `couplings.${k}.from`), find(c.to, `couplings.${k}.to`), c.conductanceWK, 0);
  });
  (model.radiativeCouplings ?? []).forEach((c, k) => {
    // Radiative exchange factor sigma A eps_eff F (DOMAIN.md "Thermal model", sigma R_ij)
    const r = STEFAN_BOLTZMANN * c.areaM2 * c.effectiveEmissivity * c.viewFactor;
    addPair(find(c.from, `radiativeCouplings.${k}.from`), find(c.to, `radiativeCouplings.${k}.to`), 0, r);
  });

  const pairList = [...pairs.values()];
  const { order, columns } = minimumDegreeOrder(n, pairList.map((p) => [p.a, p.b] as const));
  const positionOfLocal = new Int32Array(n);
  order.forEach((local, position) => (positionOfLocal[local] = position));
  const nodeOfFree = new Int32Array(n);
  for (let p = 0; p < n; p++) {
    nodeOfFree[p] = freeNodes[order[p]];
    freeOfNode[nodeOfFree[p]] = p;
  }
  const factor = new SparseCholesky(n, columns);

  // Adjacency in the solver's order, both directions.
  const degree = new Int32Array(n + 1);
  const ends = pairList.map((pair) => [positionOfLocal[pair.a], positionOfLocal[pair.b]] as const);
  for (const [a, b] of ends) {
    degree[a + 1]++;
    degree[b + 1]++;
  }
  const adjStart = new Int32Array(n + 1);
  for (let i = 0; i < n; i++) adjStart[i + 1] = adjStart[i] + degree[i + 1];
  const fill = adjStart.slice(0, n);
  const total = adjStart[n];
  const adjIndex = new Int32Array(total);
  const adjConductanceWK = new Float64Array(total);
  const adjRadiationWK4 = new Float64Array(total);
  const adjFactorEntry = new Int32Array(total).fill(-1);
  pairList.forEach((pair, k) => {
    const [a, b] = ends[k];
    for (const [row, col] of [[a, b], [b, a]] as const) {
      const at = fill[row]++;
      adjIndex[at] = col;
      adjConductanceWK[at] = pair.g;
      adjRadiationWK4[at] = pair.r;
      if (row > col) adjFactorEntry[at] = factor.entry(row, col);
    }
  });

  const capacitanceJK = new Float64Array(n);
  const radiationWK4 = new Float64Array(n);
  const boundaryFree = new Float64Array(n);
  const initialK = new Float64Array(n);
  const steps = model.steps;
  const dtS = model.periodS / (steps * substeps);
  const sourceW = new Float64Array(steps * substeps * n);
  for (let p = 0; p < n; p++) {
    const i = nodeOfFree[p];
    const node = model.nodes[i];
    const path = `nodes.${i}`;
    capacitanceJK[p] = capacitanceOf(node, path);
    const sink = STEFAN_BOLTZMANN * radiatingArea(node.radiatorAreaM2, node.emissivity);
    radiationWK4[p] = sink + boundaryRad[i];
    boundaryFree[p] = boundaryWK[i];
    initialK[p] = node.initialC + KELVIN_OFFSET;
    // Radiation to a sink at sinkC comes back as sigma eps A T_sink^4 (deep space: 0 K).
    const constant = boundarySourceW[i] + sink * (node.sinkC === undefined ? 0 : (node.sinkC + KELVIN_OFFSET) ** 4);
    const diss = node.dissipationW;
    for (let s = 0; s < steps * substeps; s++) {
      // Implicit steps take the loads at their end time; a schedule its mean over the step.
      const sample = (s + 1) / substeps;
      const absorbed = seriesAt(node.absorbedW, sample, steps, `${path}.absorbedW`);
      const dissipation = diss !== undefined && typeof diss === 'object' && !Array.isArray(diss)
        ? scheduleMean(diss as DissipationSchedule, s * dtS, (s + 1) * dtS)
        : seriesAt(diss as OrbitSeries | undefined, sample, steps, `${path}.dissipationW`);
      sourceW[s * n + p] = absorbed + dissipation + constant;
    }
  }
  const fixedK = new Float64Array(count).fill(NaN);
  model.nodes.forEach((node, i) => {
    if (node.fixedC !== undefined) fixedK[i] = node.fixedC + KELVIN_OFFSET;
  });
  return {
    n, nodeOfFree, freeOfNode, capacitanceJK, radiationWK4, boundaryWK: boundaryFree,
    adjStart, adjIndex, adjConductanceWK, adjRadiationWK4, adjFactorEntry, factor,
    steps, substeps, dtS, sourceW, initialK, fixedK,
    loops: model === userModel ? null : new ClosedLoops(model, userModel.nodes.length, freeOfNode, factor),
  };
}

/**
 * Fills the network's symmetric matrix, linearised at temperatures T, for the factor:
 *   diag_i = capacitancePerS C_i + G_boundary + extraWK + 4 sigma eps A T_i^3 + sum_j h_ij,  lower_ij = -h_ij,
 * with h_ij = G_ij + sigma R_ij (T_i^2 + T_j^2)(T_i + T_j) (the exact secant of the T^4 exchange).
 * Answers the largest share of a diagonal taken by the couplings (how far from diagonal dominance).
 */
export function assembleNetworkMatrix(net: ThermalNetwork, T: Float64Array, capacitancePerS: number, extraWK: Float64Array, diag: Float64Array, lower: Float64Array): number {
  lower.fill(0);
  let dominance = 0;
  for (let i = 0; i < net.n; i++) {
    const ti = T[i];
    let off = 0;
    let d = capacitancePerS * net.capacitanceJK[i] + net.boundaryWK[i] + extraWK[i] + 4 * net.radiationWK4[i] * ti * ti * ti;
    for (let p = net.adjStart[i]; p < net.adjStart[i + 1]; p++) {
      const tj = T[net.adjIndex[p]];
      const g = net.adjConductanceWK[p] + net.adjRadiationWK4[p] * (ti * ti + tj * tj) * (ti + tj);
      d += g;
      off += g;
      const at = net.adjFactorEntry[p];
      if (at >= 0) lower[at] = -g;
    }
    diag[i] = d;
    dominance = Math.max(dominance, off / d);
  }
  // Closed loops: their terms, and how much of a diagonal their couplings take.
  return net.loops ? Math.max(dominance, net.loops.addSymmetric(diag, lower)) : dominance;
}

/**
 * Solves one implicit step in place:  (C/dt) (alpha T - history) = source + extraSource
 *   - extraWK T - radiationWK4 T^4 - boundaryWK T - sum_j [G_ij (T_i - T_j) + sigma R_ij (T_i^4 - T_j^4)].
 * `extraWK`/`extraSource` carry the controllers (loop conductance to the inlet, heater power).
 */
export class ImplicitStep {
  private readonly diag: Float64Array;
  private readonly lower: Float64Array;
  private readonly residual: Float64Array;
  private readonly t4: Float64Array;
  private factored = false;
  private factorAlpha = NaN;
  private factorDtS = NaN;
  /** Strongly diagonally dominant (the usual case: C/dt well above the conductances): sweep instead of factor solves. */
  private sweeping = false;
  factorizations = 0;
  iterations = 0;

  constructor(private readonly net: ThermalNetwork) {
    this.diag = new Float64Array(net.n);
    this.lower = new Float64Array(net.factor.nonZeros);
    this.residual = new Float64Array(net.n);
    this.t4 = new Float64Array(net.n);
  }

  /** Forget the factor, e.g. when the controllers' conductances changed a lot. */
  invalidate(): void {
    this.factored = false;
  }

  private refactor(T: Float64Array, alpha: number, dtS: number, extraWK: Float64Array): void {
    const { net, diag, lower } = this;
    const dominance = assembleNetworkMatrix(net, T, alpha / dtS, extraWK, diag, lower);
    // Gauss-Seidel contracts by about the square of this ratio per sweep.
    this.sweeping = dominance < (net.loops ? 0.7 : 0.3);
    if (!net.factor.factor(diag, lower)) {
      const free = Math.max(0, net.factor.failedColumn);
      throw new StepDivergence(free, T[free], NaN, true);
    }
    net.loops?.prepare(net.factor);
    this.factored = true;
    this.factorAlpha = alpha;
    this.factorDtS = dtS;
    this.factorizations++;
  }

  /**
   * Nonlinear Gauss-Seidel with the factor's frozen diagonal: each node corrected in turn from its
   * neighbours' newest values. Answers the sweeps taken, or 0 when it did not settle (the caller
   * then falls back to the factor).
   */
  private sweep(T: Float64Array, history: Float64Array, alpha: number, dtS: number, source: Float64Array, sourceOffset: number,
    extraWK: Float64Array, extraSource: Float64Array, toleranceK: number): number {
    const { net, t4, diag } = this;
    const n = net.n;
    const { capacitanceJK, radiationWK4, boundaryWK, adjStart, adjIndex, adjConductanceWK, adjRadiationWK4, loops } = net;
    for (let i = 0; i < n; i++) {
      const sq = T[i] * T[i];
      t4[i] = sq * sq;
    }
    let previous = Infinity;
    for (let it = 1; it <= 12; it++) {
      let change = 0;
      for (let i = 0; i < n; i++) {
        const ti = T[i];
        const t4i = t4[i];
        let out = (capacitanceJK[i] / dtS) * (alpha * ti - history[i]) + radiationWK4[i] * t4i
          + (boundaryWK[i] + extraWK[i]) * ti - source[sourceOffset + i] - extraSource[i];
        for (let p = adjStart[i]; p < adjStart[i + 1]; p++) {
          const j = adjIndex[p];
          out += adjConductanceWK[p] * (ti - T[j]) + adjRadiationWK4[p] * (t4i - t4[j]);
        }
        if (loops) out += loops.heatOut(i, T);
        const d = -out / diag[i];
        const t = ti + d;
        T[i] = t;
        const sq = t * t;
        t4[i] = sq * sq;
        const a = d < 0 ? -d : d;
        if (a > change) change = a;
      }
      this.iterations++;
      if (!Number.isFinite(change)) return 0;
      const ratio = change / previous;
      if (change < toleranceK || (it > 1 && ratio < 0.5 && (change * ratio) / (1 - ratio) < toleranceK)) return it;
      previous = change;
    }
    return 0;
  }

  /**
   * T holds the predictor on entry and the solution on exit. Answers the iterations taken; throws
   * ThermalConvergenceError when the iteration does not settle to toleranceK.
   */
  solve(T: Float64Array, history: Float64Array, alpha: number, dtS: number, source: Float64Array, sourceOffset: number,
    extraWK: Float64Array, extraSource: Float64Array, toleranceK = 1e-5): number {
    const { net, residual: r, t4 } = this;
    const n = net.n;
    if (!this.factored || alpha !== this.factorAlpha || dtS !== this.factorDtS) this.refactor(T, alpha, dtS, extraWK);
    if (this.sweeping) {
      const sweeps = this.sweep(T, history, alpha, dtS, source, sourceOffset, extraWK, extraSource, toleranceK);
      if (sweeps > 0) return sweeps;
    }
    let previous = Infinity;
    for (let it = 1; it <= 40; it++) {
      for (let i = 0; i < n; i++) {
        const ti = T[i];
        const sq = ti * ti;
        t4[i] = sq * sq;
      }
      for (let i = 0; i < n; i++) {
        const ti = T[i];
        let out = (net.capacitanceJK[i] / dtS) * (alpha * ti - history[i]) + net.radiationWK4[i] * t4[i]
          + (net.boundaryWK[i] + extraWK[i]) * ti - source[sourceOffset + i] - extraSource[i];
        const t4i = t4[i];
        for (let p = net.adjStart[i]; p < net.adjStart[i + 1]; p++) {
          const j = net.adjIndex[p];
          out += net.adjConductanceWK[p] * (ti - T[j]) + net.adjRadiationWK4[p] * (t4i - t4[j]);
        }
        r[i] = -out;
      }
      if (net.loops) net.loops.subtractHeatOut(T, r);
      net.factor.solve(r);
      net.loops?.correct(r);
      let change = 0;
      for (let i = 0; i < n; i++) {
        T[i] += r[i];
        const a = Math.abs(r[i]);
        if (a > change) change = a;
        else if (Number.isNaN(a)) change = NaN;
      }
      this.iterations++;
      if (!Number.isFinite(change)) break;
      const ratio = change / previous;
      // Stop when the change, and what a geometric tail of it would add, is below the tolerance.
      if (change < toleranceK || (it > 1 && ratio < 0.5 && (change * ratio) / (1 - ratio) < toleranceK)) return it;
      if (it > 1 && ratio > 0.3) this.refactor(T, alpha, dtS, extraWK);
      previous = change;
    }
    // The node to blame: the first that is no longer a number, else the one furthest from where the step began.
    let worst = 0;
    let worstMove = -1;
    for (let i = 0; i < n; i++) {
      const move = Number.isFinite(T[i]) ? Math.abs(T[i] - history[i] / alpha) : Infinity;
      if (move > worstMove) {
        worst = i;
        worstMove = move;
      }
    }
    throw new StepDivergence(worst, history[worst] / alpha, T[worst]);
  }
}
