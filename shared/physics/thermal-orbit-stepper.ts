// One orbit of implicit steps of the network with its controllers, and what the orbit leaves behind
// (each node's extremes and mean, each heater's energy and time on, each loop's flow). Kept apart
// from the periodic-state logic in thermal-periodic.ts so the step loop stays a small, monomorphic
// function over typed arrays that V8 optimises whole; nothing is allocated inside it.
import type { ThermalControllers } from './thermal-controllers';
import type { ImplicitStep, ThermalNetwork } from './thermal-network';

export interface OrbitSummary {
  endK: Float64Array;
  endOn: Uint8Array;
  minK: Float64Array;
  maxK: Float64Array;
  sumK: Float64Array;
  heaterJ: Float64Array;
  heaterOnS: Float64Array;
  heaterPeakW: Float64Array;
  loopFlowSum: Float64Array;
  loopHeatJ: Float64Array;
}

export function newSummary(n: number, heaters: number, loops: number): OrbitSummary {
  return {
    endK: new Float64Array(n), endOn: new Uint8Array(heaters), minK: new Float64Array(n).fill(Infinity), maxK: new Float64Array(n).fill(-Infinity),
    sumK: new Float64Array(n), heaterJ: new Float64Array(heaters), heaterOnS: new Float64Array(heaters),
    heaterPeakW: new Float64Array(heaters), loopFlowSum: new Float64Array(loops), loopHeatJ: new Float64Array(loops),
  };
}

/** Where a heater's running totals stood when it switched on. */
export interface SwitchOn {
  s: number;
  j: number;
  on: number;
}

export class OrbitStepper {
  /** Temperatures now and one step back (BDF2 needs both), K. */
  T: Float64Array;
  Tprev: Float64Array;
  /** Two steps back, for the predictor only. */
  private Tprev2: Float64Array;
  private Tnext: Float64Array;
  private readonly history: Float64Array;
  private readonly wasOn: Uint8Array;
  private stepsTaken = 0;
  /** The last orbit at the samples, sample-major: samples[sample * n + node]. */
  readonly samplesK: Float64Array;
  readonly heaterSamplesW: Float64Array;
  readonly loopSamplesKgS: Float64Array;
  elapsedS = 0;
  /** Per heater: energy and time on since the start, and where they stood at each switch-on. */
  readonly totalJ: Float64Array;
  readonly totalOnS: Float64Array;
  readonly switchOns: SwitchOn[][];
  /** Per closed-loop path element: the heat the coolant took from it over the last orbit, J. */
  readonly elementJ: Float64Array;

  constructor(
    private readonly net: ThermalNetwork,
    private readonly controllers: ThermalControllers,
    private readonly step: ImplicitStep,
    startK: Float64Array,
  ) {
    const { n, steps } = net;
    const H = controllers.heaters.length;
    this.T = new Float64Array(startK);
    this.Tprev = new Float64Array(startK);
    this.Tprev2 = new Float64Array(startK);
    this.Tnext = new Float64Array(n);
    this.history = new Float64Array(n);
    this.wasOn = new Uint8Array(H);
    this.samplesK = new Float64Array(steps * n);
    this.heaterSamplesW = new Float64Array(steps * H);
    this.loopSamplesKgS = new Float64Array(steps * controllers.loops.length);
    this.totalJ = new Float64Array(H);
    this.totalOnS = new Float64Array(H);
    this.switchOns = controllers.heaters.map(() => []);
    this.elementJ = new Float64Array(net.loops?.g.length ?? 0);
  }

  /** Moves the state to `next`, and the BDF2 history with it so the step after the jump keeps its slope. */
  jumpTo(next: Float64Array): void {
    const { T, Tprev, Tprev2 } = this;
    for (let i = 0; i < T.length; i++) {
      const shift = next[i] - T[i];
      Tprev[i] += shift;
      Tprev2[i] += shift;
      T[i] = next[i];
    }
  }

  /** Steps one orbit, filling `summary` (cleared first). */
  orbit(summary: OrbitSummary): void {
    const { net, controllers, step, history, wasOn, samplesK, heaterSamplesW, loopSamplesKgS, totalJ, totalOnS } = this;
    const { n, steps, substeps, dtS, sourceW } = net;
    const total = steps * substeps;
    const H = controllers.heaters.length;
    const L = controllers.loops.length;
    const { minK, maxK, sumK, heaterJ, heaterOnS, heaterPeakW, loopFlowSum, loopHeatJ } = summary;
    minK.fill(Infinity);
    maxK.fill(-Infinity);
    sumK.fill(0);
    heaterJ.fill(0);
    heaterOnS.fill(0);
    heaterPeakW.fill(0);
    loopFlowSum.fill(0);
    loopHeatJ.fill(0);
    const elementJ = this.elementJ;
    elementJ.fill(0);
    const closed = net.loops;
    const on = controllers.on;
    const heaterPowerW = controllers.heaterPowerW;
    let T = this.T;
    let Tprev = this.Tprev;
    let Tprev2 = this.Tprev2;
    let Tnext = this.Tnext;
    for (let s = 0; s < total; s++) {
      const sample = (s / substeps) | 0;
      if (s % substeps === 0) {
        samplesK.set(T, sample * n);
        heaterSamplesW.fill(0, sample * H, sample * H + H);
        loopSamplesKgS.fill(0, sample * L, sample * L + L);
      }
      wasOn.set(on);
      if (controllers.update(T, dtS, s)) step.invalidate();
      for (let k = 0; k < H; k++) {
        if (on[k] && !wasOn[k]) {
          const list = this.switchOns[k];
          list.push({ s: this.elapsedS, j: totalJ[k], on: totalOnS[k] });
          if (list.length > 4000) list.splice(0, 2000);
        }
      }
      // BDF2: (3 T_{n+1} - 4 T_n + T_{n-1}) / (2 dt) = f(T_{n+1}); backward Euler to begin with.
      let alpha = 1.5;
      if (this.stepsTaken === 0) {
        alpha = 1;
        history.set(T);
        Tnext.set(T);
      } else {
        // The predictor: quadratic extrapolation through the last three states (linear at the
        // second step). The nearer it lands, the fewer sweeps the step needs; the step's own
        // iteration, not the predictor, sets the answer.
        const quadratic = this.stepsTaken > 1;
        for (let i = 0; i < n; i++) {
          const t = T[i];
          const tp = Tprev[i];
          history[i] = 2 * t - 0.5 * tp;
          const predicted = quadratic ? 3 * t - 3 * tp + Tprev2[i] : 2 * t - tp;
          Tnext[i] = predicted > 0.5 * t ? predicted : 0.5 * t;
        }
      }
      this.stepsTaken++;
      step.solve(Tnext, history, alpha, dtS, sourceW, s * n, controllers.extraWK, controllers.extraSource);
      for (let k = 0; k < H; k++) {
        const p = heaterPowerW[k];
        heaterJ[k] += p * dtS;
        totalJ[k] += p * dtS;
        if (p > 0) {
          totalOnS[k] += dtS;
          heaterOnS[k] += dtS;
        }
        if (p > heaterPeakW[k]) heaterPeakW[k] = p;
        heaterSamplesW[sample * H + k] += p / substeps;
      }
      for (let k = 0; k < L; k++) {
        const flow = controllers.flowKgS[k];
        loopFlowSum[k] += flow;
        loopHeatJ[k] += controllers.loopHeatW(k, Tnext) * dtS;
        loopSamplesKgS[sample * L + k] += flow / substeps;
      }
      for (let e = 0; e < elementJ.length; e++) elementJ[e] += closed!.coolantSideHeatW(e, Tnext, history, alpha, dtS, net.capacitanceJK) * dtS;
      for (let i = 0; i < n; i++) {
        const t = Tnext[i];
        if (t < minK[i]) minK[i] = t;
        if (t > maxK[i]) maxK[i] = t;
        sumK[i] += t;
      }
      this.elapsedS += dtS;
      const spare = Tprev2;
      Tprev2 = Tprev;
      Tprev = T;
      T = Tnext;
      Tnext = spare;
    }
    this.T = T;
    this.Tprev = Tprev;
    this.Tprev2 = Tprev2;
    this.Tnext = Tnext;
    summary.endK.set(T);
    summary.endOn.set(on);
  }

  /** One series per item from a sample-major buffer of `width` items per sample. */
  static bySeries(buffer: Float64Array, width: number, steps: number): Float64Array[] {
    return Array.from({ length: width }, (_, i) => {
      const series = new Float64Array(steps);
      for (let s = 0; s < steps; s++) series[s] = buffer[s * width + i];
      return series;
    });
  }
}
