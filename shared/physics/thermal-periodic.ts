// The periodic steady state of a thermal network over one orbit: start near it (the steady state of
// the orbit-averaged loads with ideal heaters), then step orbit after orbit until the temperatures
// at the end of an orbit are those at its start within the tolerance (issue 7: 0.01 K).
// A thermostat's on/off cycle need not fit the orbit: its switching can repeat only every p orbits.
// Then no single orbit repeats, but the state p orbits apart does; we accept that (p up to
// MAX_PERIOD_ORBITS), answer the last orbit's temperatures and average duty and power over the p orbits.
// A cycle that never locks to the orbit (a thermostat on a steady load) is judged by its averages:
// when two successive windows of MAX_PERIOD_ORBITS orbits agree in every node's mean temperature
// (within 0.05 K) and every heater's duty cycle (within 0.02), the averages over the last window are
// the answer (periodOrbits 0, averagedOrbits the window). The cycle beats against the orbit, so
// those window averages wander by about one on-time over the window; the limits say how much.
import { DEFAULT_MAX_ORBITS, DEFAULT_TOLERANCE_K, KELVIN_OFFSET, ThermalConvergenceError, type ThermalModelInput, type ThermalSolveOptions } from './thermal-model';
import { AndersonAcceleration } from './anderson-acceleration';
import { ThermalControllers } from './thermal-controllers';
import { buildNetwork, ImplicitStep, type ThermalNetwork } from './thermal-network';

export const MAX_PERIOD_ORBITS = 24;
const UNLOCKED_MEAN_CHANGE_K = 0.05;
const UNLOCKED_DUTY_CHANGE = 0.02;
/** Extrapolation helps while a transient decays; past this many orbits it only disturbs a cycle. */
const MAX_ACCELERATED_ORBITS = 12;
/** Warm start: an ideal heater is a stiff conductance to its set point (W/K), clipped to its power. */
const HOLD_WK = 1e6;
const PSEUDO_STEPS_ORBITS = [1, 10, 100, 1e3, 1e4, 1e5, 1e6];

export interface PeriodicRun {
  orbits: number;
  periodOrbits: number;
  averagedOrbits: number;
  residualK: number;
  /** Per free node: the last orbit's temperatures at the samples. */
  samplesK: Float64Array[];
  minK: Float64Array;
  maxK: Float64Array;
  meanK: Float64Array;
  heaterSamplesW: Float64Array[];
  heaterDuty: number[];
  heaterAverageW: number[];
  heaterPeakW: number[];
  heaterInstalledW: number[];
  loopSamplesKgS: Float64Array[];
  loopAverageKgS: number[];
  loopHeatW: number[];
  iterations: number;
  factorizations: number;
}

interface OrbitSummary {
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

type HeaterMode = 'held' | 'full' | 'off';

/** Steady state of the orbit-averaged loads, heaters holding their set points where their power allows. */
function warmStart(net: ThermalNetwork, controllers: ThermalControllers, step: ImplicitStep, periodS: number): { T: Float64Array; heaterW: number[] } | null {
  const { n } = net;
  const total = net.steps * net.substeps;
  const mean = new Float64Array(n);
  for (let s = 0; s < total; s++) for (let i = 0; i < n; i++) mean[i] += net.sourceW[s * n + i] / total;
  const T = new Float64Array(net.initialK);
  const extraWK = new Float64Array(n);
  const extraSource = new Float64Array(n);
  const modes: HeaterMode[] = controllers.heaters.map(() => 'held');
  const target = controllers.heaters.map((h) => (h.thermostat ? (h.onK + h.offK) / 2 : h.setPointK));
  const heaterW = controllers.heaters.map(() => 0);
  for (let pass = 0; pass < 6; pass++) {
    extraWK.fill(0);
    extraSource.fill(0);
    controllers.loops.forEach((loop) => {
      const g = loop.conductancePerFlow * loop.nominalFlow;
      for (const free of loop.frees) {
        extraWK[free] += g;
        extraSource[free] += g * loop.inletK;
      }
    });
    controllers.heaters.forEach((h, k) => {
      if (modes[k] === 'held') {
        extraWK[h.free] += HOLD_WK;
        extraSource[h.free] += HOLD_WK * target[k];
      } else if (modes[k] === 'full') extraSource[h.free] += h.powerW;
    });
    step.invalidate();
    for (const orbits of PSEUDO_STEPS_ORBITS) {
      const history = new Float64Array(T);
      step.solve(T, history, 1, periodS * orbits, mean, 0, extraWK, extraSource, 1e-6);
    }
    let changed = false;
    controllers.heaters.forEach((h, k) => {
      const implied = HOLD_WK * (target[k] - T[h.free]);
      const before = modes[k];
      if (before === 'held') modes[k] = implied > h.powerW ? 'full' : implied < 0 ? 'off' : 'held';
      else if (before === 'full' && T[h.free] > target[k]) modes[k] = 'held';
      else if (before === 'off' && T[h.free] < target[k]) modes[k] = 'held';
      heaterW[k] = modes[k] === 'held' ? implied : modes[k] === 'full' ? h.powerW : 0;
      changed ||= modes[k] !== before;
    });
    if (!changed) break;
  }
  step.invalidate();
  for (let i = 0; i < n; i++) if (!(T[i] > 1 && T[i] < 3000)) return null;
  return { T, heaterW };
}

/** Each model node's warm-start temperature, C (boundaries at theirs); initialC where there is none. */
export function orbitAverageStartC(model: ThermalModelInput): number[] {
  const net = buildNetwork(model);
  const warm = warmStart(net, new ThermalControllers(model, net, (model.heaters ?? []).map(() => 1)), new ImplicitStep(net), model.periodS);
  return model.nodes.map((node, i) => {
    const free = net.freeOfNode[i];
    return free < 0 ? (node.fixedC ?? node.initialC) : warm ? warm.T[free] - KELVIN_OFFSET : node.initialC;
  });
}

/** Time, energy and on-time between the first and the last switch-on since `fromS`, if two or more. */
function wholeCycles(list: readonly { s: number; j: number; on: number }[], fromS: number): { s: number; j: number; onS: number } | null {
  const inside = list.filter((e) => e.s >= fromS);
  if (inside.length < 2) return null;
  const a = inside[0];
  const b = inside[inside.length - 1];
  return { s: b.s - a.s, j: b.j - a.j, onS: b.on - a.on };
}

function newSummary(n: number, heaters: number, loops: number): OrbitSummary {
  return {
    endK: new Float64Array(n), endOn: new Uint8Array(heaters), minK: new Float64Array(n).fill(Infinity), maxK: new Float64Array(n).fill(-Infinity),
    sumK: new Float64Array(n), heaterJ: new Float64Array(heaters), heaterOnS: new Float64Array(heaters),
    heaterPeakW: new Float64Array(heaters), loopFlowSum: new Float64Array(loops), loopHeatJ: new Float64Array(loops),
  };
}

export function runPeriodic(model: ThermalModelInput, net: ThermalNetwork, heaterScale: readonly number[], options: ThermalSolveOptions = {}): PeriodicRun {
  const toleranceK = options.toleranceK ?? DEFAULT_TOLERANCE_K;
  const maxOrbits = options.maxOrbits ?? DEFAULT_MAX_ORBITS;
  const { n, steps, substeps, dtS } = net;
  const total = steps * substeps;
  const controllers = new ThermalControllers(model, net, heaterScale);
  const step = new ImplicitStep(net);
  const H = controllers.heaters.length;
  const L = controllers.loops.length;

  let T: Float64Array = new Float64Array(net.initialK);
  if ((options.start ?? 'orbit-average') === 'orbit-average') {
    const warm = warmStart(net, controllers, step, model.periodS);
    if (warm) {
      T = warm.T;
      controllers.prime(warm.heaterW, controllers.loops.map((l) => l.nominalFlow));
    }
  }
  let Tprev: Float64Array = new Float64Array(T);
  let Tnext: Float64Array = new Float64Array(n);
  const history = new Float64Array(n);
  const samplesK = Array.from({ length: n }, () => new Float64Array(steps));
  const heaterSamplesW = Array.from({ length: H }, () => new Float64Array(steps));
  const loopSamplesKgS = Array.from({ length: L }, () => new Float64Array(steps));
  const summaries: OrbitSummary[] = [];
  // Per heater: running totals and where they stood at each switch-on, so an unlocked cycle's duty
  // can be taken over whole cycles (switch-on to switch-on) where nothing is left stored in the node.
  const elapsed = { s: 0 };
  const totalJ = new Float64Array(H);
  const totalOnS = new Float64Array(H);
  const switchOns: { s: number; j: number; on: number }[][] = controllers.heaters.map(() => []);
  const wasOn = new Uint8Array(H);
  let first = true;
  let residualK = Infinity;
  // Orbit-map acceleration; switched off for good once it stops helping (a thermostat limit cycle).
  const anderson = options.accelerate === false ? null : new AndersonAcceleration(n);
  let accelerating = anderson !== null;
  let bestResidualK = Infinity;
  let stalledOrbits = 0;
  let lastJumpOrbit = 0;

  for (let orbit = 1; orbit <= maxOrbits; orbit++) {
    const summary = summaries.length >= 2 * MAX_PERIOD_ORBITS ? summaries.shift()! : newSummary(n, H, L);
    summary.minK.fill(Infinity);
    summary.maxK.fill(-Infinity);
    for (const a of [summary.sumK, summary.heaterJ, summary.heaterOnS, summary.heaterPeakW, summary.loopFlowSum, summary.loopHeatJ]) a.fill(0);
    const startK = new Float64Array(T);
    const startOn = new Uint8Array(controllers.on);
    const switchesBefore = controllers.switches;
    for (let s = 0; s < total; s++) {
      const sample = Math.floor(s / substeps);
      if (s % substeps === 0) {
        for (let i = 0; i < n; i++) samplesK[i][sample] = T[i];
        for (let k = 0; k < H; k++) heaterSamplesW[k][sample] = 0;
        for (let k = 0; k < L; k++) loopSamplesKgS[k][sample] = 0;
      }
      wasOn.set(controllers.on);
      if (controllers.update(T, dtS)) step.invalidate();
      for (let k = 0; k < H; k++) {
        if (controllers.on[k] && !wasOn[k]) {
          const list = switchOns[k];
          list.push({ s: elapsed.s, j: totalJ[k], on: totalOnS[k] });
          if (list.length > 4000) list.splice(0, 2000);
        }
      }
      // BDF2: (3 T_{n+1} - 4 T_n + T_{n-1}) / (2 dt) = f(T_{n+1}); backward Euler to begin with.
      const alpha = first ? 1 : 1.5;
      for (let i = 0; i < n; i++) {
        history[i] = first ? T[i] : 2 * T[i] - 0.5 * Tprev[i];
        // Linear extrapolation predicts the new temperatures; the iteration corrects them.
        Tnext[i] = first ? T[i] : Math.max(2 * T[i] - Tprev[i], 0.5 * T[i]);
      }
      step.solve(Tnext, history, alpha, dtS, net.sourceW, s * n, controllers.extraWK, controllers.extraSource);
      first = false;
      for (let k = 0; k < H; k++) {
        const p = controllers.heaterPowerW[k];
        summary.heaterJ[k] += p * dtS;
        totalJ[k] += p * dtS;
        if (p > 0) totalOnS[k] += dtS;
        if (p > 0) summary.heaterOnS[k] += dtS;
        if (p > summary.heaterPeakW[k]) summary.heaterPeakW[k] = p;
        heaterSamplesW[k][sample] += p / substeps;
      }
      for (let k = 0; k < L; k++) {
        const flow = controllers.flowKgS[k];
        summary.loopFlowSum[k] += flow;
        summary.loopHeatJ[k] += controllers.loopHeatW(k, Tnext) * dtS;
        loopSamplesKgS[k][sample] += flow / substeps;
      }
      for (let i = 0; i < n; i++) {
        const t = Tnext[i];
        if (t < summary.minK[i]) summary.minK[i] = t;
        if (t > summary.maxK[i]) summary.maxK[i] = t;
        summary.sumK[i] += t;
      }
      elapsed.s += dtS;
      const spare = Tprev;
      Tprev = T;
      T = Tnext;
      Tnext = spare;
    }
    summary.endK.set(T);
    summary.endOn.set(controllers.on);
    summaries.push(summary);
    residualK = 0;
    for (let i = 0; i < n; i++) {
      const t = T[i];
      // A run with no way to lose its heat climbs without end; say so rather than answer nonsense.
      if (!(t > 0 && t < 1e5)) {
        throw new ThermalConvergenceError(`Temperatures ran away in orbit ${orbit} (a node reached ${Number.isFinite(t) ? Math.round(t - KELVIN_OFFSET) + ' C' : String(t)}): check that every node has a path to lose its heat.`, orbit, Infinity);
      }
      residualK = Math.max(residualK, Math.abs(t - startK[i]));
    }
    // The thermostats are part of the state: the same temperatures heading the other way do not repeat.
    const sameSwitches = (a: Uint8Array, b: Uint8Array) => a.every((v, k) => v === b[k]);
    let periodOrbits = residualK < toleranceK && sameSwitches(startOn, controllers.on) ? 1 : 0;
    // A repeat p orbits apart proves a period only if no extrapolated jump came in between.
    if (!periodOrbits && controllers.hasThermostats && controllers.switches > switchesBefore && orbit - lastJumpOrbit > MAX_PERIOD_ORBITS) {
      for (let p = 2; p <= Math.min(MAX_PERIOD_ORBITS, summaries.length - 1); p++) {
        const earlier = summaries[summaries.length - 1 - p];
        let d = 0;
        for (let i = 0; i < n; i++) d = Math.max(d, Math.abs(T[i] - earlier.endK[i]));
        if (d < toleranceK && sameSwitches(earlier.endOn, controllers.on)) {
          periodOrbits = p;
          residualK = d;
          break;
        }
      }
    }
    let averagedOrbits = periodOrbits;
    const W = MAX_PERIOD_ORBITS;
    if (!periodOrbits && controllers.hasThermostats && controllers.switches > switchesBefore && orbit - lastJumpOrbit >= 2 * W && summaries.length >= 2 * W) {
      const recent = summaries.slice(-W);
      const before = summaries.slice(-2 * W, -W);
      const meanOf = (list: OrbitSummary[], i: number) => list.reduce((a, o) => a + o.sumK[i], 0) / (total * W);
      const dutyOf = (list: OrbitSummary[], k: number) => list.reduce((a, o) => a + o.heaterOnS[k], 0) / (W * model.periodS);
      let d = 0;
      for (let i = 0; i < n; i++) d = Math.max(d, Math.abs(meanOf(recent, i) - meanOf(before, i)));
      const dutySteady = controllers.heaters.every((_, k) => Math.abs(dutyOf(recent, k) - dutyOf(before, k)) < UNLOCKED_DUTY_CHANGE);
      if (d < Math.max(toleranceK, UNLOCKED_MEAN_CHANGE_K) && dutySteady) {
        averagedOrbits = W;
        residualK = d;
      }
    }
    if (!averagedOrbits && anderson && accelerating) {
      if (residualK < 0.7 * bestResidualK) {
        bestResidualK = residualK;
        stalledOrbits = 0;
      } else if (++stalledOrbits >= 4) accelerating = false;
      if (orbit >= MAX_ACCELERATED_ORBITS) accelerating = false;
      if (accelerating) {
        const next = anderson.next(startK, T);
        for (let i = 0; i < n; i++) {
          // Move the BDF2 history with the state so the step after the jump keeps its slope.
          const shift = next[i] - T[i];
          Tprev[i] += shift;
          T[i] = next[i];
        }
        lastJumpOrbit = orbit;
      }
    }
    if (averagedOrbits) {
      const last = summaries.slice(-averagedOrbits);
      const span = averagedOrbits * model.periodS;
      const minK = new Float64Array(n).fill(Infinity);
      const maxK = new Float64Array(n).fill(-Infinity);
      const meanK = new Float64Array(n);
      for (const o of last) {
        for (let i = 0; i < n; i++) {
          minK[i] = Math.min(minK[i], o.minK[i]);
          maxK[i] = Math.max(maxK[i], o.maxK[i]);
          meanK[i] += o.sumK[i] / (total * averagedOrbits);
        }
      }
      const sum = (pick: (o: OrbitSummary) => Float64Array, k: number) => last.reduce((acc, o) => acc + pick(o)[k], 0);
      return {
        orbits: orbit, periodOrbits, averagedOrbits, residualK, samplesK, minK, maxK, meanK, heaterSamplesW,
        heaterDuty: controllers.heaters.map((h, k) => {
          const whole = periodOrbits ? null : wholeCycles(switchOns[k], elapsed.s - span);
          if (h.thermostat) return whole ? whole.onS / whole.s : sum((o) => o.heaterOnS, k) / span;
          return h.powerW > 0 ? sum((o) => o.heaterJ, k) / span / h.powerW : 0;
        }),
        heaterAverageW: controllers.heaters.map((_, k) => {
          const whole = periodOrbits ? null : wholeCycles(switchOns[k], elapsed.s - span);
          return whole ? whole.j / whole.s : sum((o) => o.heaterJ, k) / span;
        }),
        heaterPeakW: controllers.heaters.map((_, k) => Math.max(...last.map((o) => o.heaterPeakW[k]))),
        heaterInstalledW: controllers.heaters.map((h) => h.powerW),
        loopSamplesKgS,
        loopAverageKgS: controllers.loops.map((_, k) => sum((o) => o.loopFlowSum, k) / (total * averagedOrbits)),
        loopHeatW: controllers.loops.map((_, k) => sum((o) => o.loopHeatJ, k) / span),
        iterations: step.iterations,
        factorizations: step.factorizations,
      };
    }
  }
  throw new ThermalConvergenceError(
    `The model did not reach a periodic state in ${maxOrbits} orbits: temperatures still changed by ${residualK.toFixed(3)} K over the last orbit (the tolerance is ${toleranceK} K). Allow more orbits, or look for a node with no path to lose heat.`,
    maxOrbits,
    residualK,
  );
}
