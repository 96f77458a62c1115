// Closed coolant loops (API.md "Coolant loops"): the coolant's own temperature along the loop's path.
// Each path element is one lump of coolant (its share of the loop's fluid mass times c_p) that leaves
// the element at Tc_e. The lumps are unknowns of the network like nodes (withCoolantLumps adds them),
// so the implicit step, the orbit's samples and the periodic-state search carry them unchanged.
//
// Lump e, fed by the lump before it on the path (the last feeds the first):
//   m_e c_p dTc_e/dt = m_dot c_p (Tc_prev - Tc_e) + g_e (T_node - Tc_e)
// and its node loses g_e (T_node - Tc_e). g_e is the element's UA corrected so that, with the lump
// well mixed, the element's steady effectiveness is the plug-flow one, eps = 1 - exp(-NTU),
// NTU = UA / (m_dot c_p) (effectiveness-NTU for a fluid against an isothermal wall, Incropera & DeWitt,
// Fundamentals of Heat and Mass Transfer, ch. 8 and 11): g = m_dot c_p (e^NTU - 1) gives
// Q = g/(1 + g/(m_dot c_p)) (T_node - Tc_prev) = eps m_dot c_p (T_node - Tc_prev). At zero flow the
// standing coolant exchanges UA with its plate.
//
// The lump-node exchange and the symmetric half of the advection (a conductance m_dot c_p / 2 along
// each step of the ring) join the network's symmetric matrix; the skew half,
// (m_dot c_p / 2)(Tc_next - Tc_prev) per lump, is a low-rank term the step takes exactly with the
// Sherman-Morrison-Woodbury identity (Golub & Van Loan, Matrix Computations, 2.1.4): one factor
// solve per lump when the matrix is refactored, a small dense solve per iteration. A ring of one or
// two lumps has no skew half.
import type { SparseCholesky } from './sparse-cholesky';
import { ThermalModelError, type CoolantLoopInput, type ThermalModelInput } from './thermal-model';

/** Past this NTU the element has reached its plate (e^-12 = 6e-6): g stops growing, which keeps the matrix well conditioned. */
const MAX_NTU = 12;
/** Lump names cannot clash with a user's node names (those are trimmed printable text). */
const LUMP_PREFIX = '\u0000coolant';

export const isClosedLoop = (loop: CoolantLoopInput): boolean => loop.path !== undefined && loop.inletC === undefined;

/** The model with one coolant lump per closed-loop path element after its own nodes, each joined to its node (and its ring neighbours) with no conductance: the pattern the loop terms fill in. */
export function withCoolantLumps(model: ThermalModelInput): ThermalModelInput {
  const closed = (model.loops ?? []).filter(isClosedLoop);
  if (!closed.length) return model;
  const lumps: ThermalModelInput['nodes'][number][] = [];
  const couplings: { from: string; to: string; conductanceWK: number }[] = [];
  const byName = new Map(model.nodes.map((n) => [n.name, n]));
  (model.loops ?? []).forEach((loop, k) => {
    if (!isClosedLoop(loop)) return;
    const path = loop.path ?? [];
    const share = ((loop.fluidMassKg ?? 0) * loop.specificHeatJKgK) / path.length;
    path.forEach((element, j) => {
      const name = `${LUMP_PREFIX} ${k}/${j}`;
      lumps.push({ name, capacitanceJK: share, initialC: byName.get(element.node)?.initialC ?? 0 });
      couplings.push({ from: name, to: element.node, conductanceWK: 0 });
      if (path.length > 1) couplings.push({ from: name, to: `${LUMP_PREFIX} ${k}/${(j + 1) % path.length}`, conductanceWK: 0 });
    });
  });
  return { ...model, nodes: [...model.nodes, ...lumps], couplings: [...(model.couplings ?? []), ...couplings] };
}

/** The closed loops as the network's arrays: per element its node and lump (free indices), per loop its flow. */
export class ClosedLoops {
  /** Model loop index of each closed loop, and the first element / element count of each. */
  readonly modelLoop: number[] = [];
  readonly start: number[] = [];
  readonly count: number[] = [];
  readonly nodeFree: Int32Array;
  readonly lumpFree: Int32Array;
  readonly prevLump: Int32Array;
  readonly nextLump: Int32Array;
  readonly loopOf: Int32Array;
  readonly ua: Float64Array;
  /** Current lump-node conductance per element, W/K, and m_dot c_p per loop, W/K. */
  readonly g: Float64Array;
  readonly flowCp: Float64Array;
  readonly specificHeat: Float64Array;
  private readonly nodeLumpEntry: Int32Array;
  /** Per unknown, the elements whose node or lump it is (CSR). */
  private readonly touchStart: Int32Array;
  private readonly touchElement: Int32Array;
  private readonly ringEntry: Int32Array;
  /** Elements in rings of three or more (the skew half is theirs), and the Woodbury pieces. */
  private readonly skew: number[];
  private readonly z: Float64Array[];
  private readonly k: Float64Array;
  private readonly pivots: Int32Array;
  private readonly v: Float64Array;
  private readonly zFlowCp: Float64Array;

  constructor(model: ThermalModelInput, realNodes: number, freeOfNode: Int32Array, factor: SparseCholesky) {
    const index = new Map(model.nodes.map((n, i) => [n.name, i]));
    const elements: { node: number; lump: number; prev: number; next: number; loop: number; ua: number }[] = [];
    let lump = realNodes;
    (model.loops ?? []).forEach((loop, k) => {
      if (!isClosedLoop(loop)) return;
      const path = loop.path ?? [];
      const c = this.modelLoop.length;
      this.modelLoop.push(k);
      this.start.push(elements.length);
      this.count.push(path.length);
      path.forEach((element, j) => {
        const at = (i: number) => freeOfNode[lump + ((i + path.length) % path.length)];
        const node = freeOfNode[index.get(element.node) ?? -1] ?? -1;
        if (node < 0) {
          throw new ThermalModelError(`loops.${k}.path.${j}.node: ${JSON.stringify(element.node)} is not a node the coolant can exchange heat with (unknown, or a boundary at a fixed temperature)`, `loops.${k}.path.${j}.node`);
        }
        elements.push({ node, lump: at(j), prev: at(j - 1), next: at(j + 1), loop: c, ua: element.conductanceWK });
      });
      lump += path.length;
    });
    const m = elements.length;
    this.nodeFree = Int32Array.from(elements, (e) => e.node);
    this.lumpFree = Int32Array.from(elements, (e) => e.lump);
    this.prevLump = Int32Array.from(elements, (e) => e.prev);
    this.nextLump = Int32Array.from(elements, (e) => e.next);
    this.loopOf = Int32Array.from(elements, (e) => e.loop);
    this.ua = Float64Array.from(elements, (e) => e.ua);
    this.g = new Float64Array(m);
    this.flowCp = new Float64Array(this.modelLoop.length);
    this.specificHeat = Float64Array.from(this.modelLoop, (k) => (model.loops ?? [])[k].specificHeatJKgK);
    const entry = (a: number, b: number) => (a > b ? factor.entry(a, b) : factor.entry(b, a));
    this.nodeLumpEntry = Int32Array.from(elements, (e) => entry(e.node, e.lump));
    this.ringEntry = Int32Array.from(elements, (e) => (e.prev === e.lump ? -1 : entry(e.lump, e.prev)));
    this.skew = elements.map((_, e) => e).filter((e) => this.count[this.loopOf[e]] >= 3);
    const touching: number[][] = Array.from({ length: factor.n }, () => []);
    elements.forEach((el, e) => {
      touching[el.node]?.push(e);
      touching[el.lump]?.push(e);
    });
    this.touchStart = new Int32Array(factor.n + 1);
    touching.forEach((list, i) => (this.touchStart[i + 1] = this.touchStart[i] + list.length));
    this.touchElement = Int32Array.from(touching.flat());
    const s = this.skew.length;
    this.z = this.skew.map(() => new Float64Array(factor.n));
    this.k = new Float64Array(s * s);
    this.pivots = new Int32Array(s);
    this.v = new Float64Array(s);
    this.zFlowCp = new Float64Array(this.modelLoop.length);
    (model.loops ?? []).forEach((loop, k) => {
      const c = this.modelLoop.indexOf(k);
      if (c >= 0) this.setFlow(c, loop.nominalFlowKgS);
    });
  }

  /** Sets closed loop c's flow, kg/s, and its elements' conductances. */
  setFlow(c: number, flowKgS: number): void {
    const w = flowKgS * this.specificHeat[c];
    this.flowCp[c] = w;
    for (let e = this.start[c]; e < this.start[c] + this.count[c]; e++) {
      const ua = this.ua[e];
      this.g[e] = w > 0 ? Math.max(ua, w * Math.expm1(Math.min(ua / w, MAX_NTU))) : ua;
    }
  }

  /** Heat the coolant takes from element e's node at temperatures T, W (negative where it gives heat up). */
  elementHeatW(e: number, T: Float64Array): number {
    return this.g[e] * (T[this.nodeFree[e]] - T[this.lumpFree[e]]);
  }

  /**
   * The same heat from the coolant's side of a solved implicit step: what lump e stored,
   * (C/dt)(alpha T - history), plus what it carried on, m_dot c_p (Tc_e - Tc_prev). Equal to
   * elementHeatW at the step's solution, but without g's large factor on the step's tolerance (at
   * high NTU g is huge and T_node - Tc tiny).
   */
  coolantSideHeatW(e: number, T: Float64Array, history: Float64Array, alpha: number, dtS: number, capacitanceJK: Float64Array): number {
    const lump = this.lumpFree[e];
    return (capacitanceJK[lump] / dtS) * (alpha * T[lump] - history[lump]) + this.flowCp[this.loopOf[e]] * (T[lump] - T[this.prevLump[e]]);
  }

  /** Takes each unknown's loop heat out of `r` (r holds minus the heat out of each unknown). */
  subtractHeatOut(T: Float64Array, r: Float64Array): void {
    const { nodeFree, lumpFree, prevLump, loopOf, g, flowCp } = this;
    for (let e = 0; e < g.length; e++) {
      const node = nodeFree[e];
      const lump = lumpFree[e];
      const q = g[e] * (T[node] - T[lump]);
      r[node] -= q;
      r[lump] += q - flowCp[loopOf[e]] * (T[lump] - T[prevLump[e]]);
    }
  }

  /**
   * Adds the symmetric part of the loop terms to a network matrix laid out as the factor's pattern.
   * Answers the largest share of a lump's or a path node's diagonal its loop couplings take (the
   * Gauss-Seidel sweep needs it well below 1: a fast loop ties its ring tightly).
   */
  addSymmetric(diag: Float64Array, lower: Float64Array): number {
    const { nodeFree, lumpFree, prevLump, loopOf, g, flowCp, nodeLumpEntry, ringEntry } = this;
    let dominance = 0;
    for (let e = 0; e < g.length; e++) {
      diag[nodeFree[e]] += g[e];
      diag[lumpFree[e]] += g[e];
      lower[nodeLumpEntry[e]] -= g[e];
      if (ringEntry[e] >= 0) {
        const half = flowCp[loopOf[e]] / 2;
        diag[lumpFree[e]] += half;
        diag[prevLump[e]] += half;
        lower[ringEntry[e]] -= half;
      }
    }
    for (let e = 0; e < g.length; e++) {
      const w = ringEntry[e] >= 0 ? flowCp[loopOf[e]] : 0;
      dominance = Math.max(dominance, (g[e] + w) / diag[lumpFree[e]], g[e] / diag[nodeFree[e]]);
    }
    return dominance;
  }

  /** The loop heat out of unknown i at temperatures T, W (for the sweep, one unknown at a time). */
  heatOut(i: number, T: Float64Array): number {
    let out = 0;
    for (let p = this.touchStart[i]; p < this.touchStart[i + 1]; p++) {
      const e = this.touchElement[p];
      const lump = this.lumpFree[e];
      const q = this.g[e] * (T[this.nodeFree[e]] - T[lump]);
      if (lump === i) out -= q - this.flowCp[this.loopOf[e]] * (T[lump] - T[this.prevLump[e]]);
      else out += q;
    }
    return out;
  }

  /** The skew half of lump e's advection applied to x, with m_dot c_p per loop from `flowCp`. */
  private skewOf(e: number, x: Float64Array, flowCp: Float64Array): number {
    return (flowCp[this.loopOf[e]] / 2) * (x[this.nextLump[e]] - x[this.prevLump[e]]);
  }

  /** After the factor is rebuilt: the Woodbury columns A^-1 e_lump and the small matrix I + V^T Z, LU-factored. */
  prepare(factor: SparseCholesky): void {
    const { skew, z, k, pivots } = this;
    const s = skew.length;
    if (!s) return;
    for (let a = 0; a < s; a++) {
      z[a].fill(0);
      z[a][this.lumpFree[skew[a]]] = 1;
      factor.solve(z[a]);
    }
    this.zFlowCp.set(this.flowCp);
    for (let a = 0; a < s; a++) for (let b = 0; b < s; b++) k[a * s + b] = (a === b ? 1 : 0) + this.skewOf(skew[a], z[b], this.zFlowCp);
    luFactor(k, s, pivots);
  }

  /** y = A^-1 r on entry; on exit (A + skew)^-1 r, with the skew half as it was at the last prepare. */
  correct(y: Float64Array): void {
    const { skew, z, k, pivots, v } = this;
    const s = skew.length;
    if (!s) return;
    for (let a = 0; a < s; a++) v[a] = this.skewOf(skew[a], y, this.zFlowCp);
    luSolve(k, s, pivots, v);
    for (let b = 0; b < s; b++) {
      const c = v[b];
      if (c === 0) continue;
      const zb = z[b];
      for (let i = 0; i < y.length; i++) y[i] -= zb[i] * c;
    }
  }
}

/** In-place LU with partial pivoting of an s x s row-major matrix. */
function luFactor(a: Float64Array, s: number, pivots: Int32Array): void {
  for (let c = 0; c < s; c++) {
    let p = c;
    for (let r = c + 1; r < s; r++) if (Math.abs(a[r * s + c]) > Math.abs(a[p * s + c])) p = r;
    pivots[c] = p;
    if (p !== c) for (let j = 0; j < s; j++) [a[c * s + j], a[p * s + j]] = [a[p * s + j], a[c * s + j]];
    const d = a[c * s + c];
    for (let r = c + 1; r < s; r++) {
      const f = (a[r * s + c] /= d);
      for (let j = c + 1; j < s; j++) a[r * s + j] -= f * a[c * s + j];
    }
  }
}

function luSolve(a: Float64Array, s: number, pivots: Int32Array, x: Float64Array): void {
  for (let c = 0; c < s; c++) {
    const p = pivots[c];
    if (p !== c) [x[c], x[p]] = [x[p], x[c]];
    for (let r = c + 1; r < s; r++) x[r] -= a[r * s + c] * x[c];
  }
  for (let c = s - 1; c >= 0; c--) {
    for (let j = c + 1; j < s; j++) x[c] -= a[c * s + j] * x[j];
    x[c] /= a[c * s + c];
  }
}
