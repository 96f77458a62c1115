// The periodic steady state of a thermal network over one orbit: start near it (the steady state of
// the orbit-averaged loads with ideal heaters), then step orbit after orbit until the temperatures
// at the end of an orbit are those at its start within the tolerance (issue 7: 0.01 K) and the
// estimated distance still to go is within it too (thermal-orbit-correction.ts: a node with a time
// constant of 1000 orbits that changes 0.01 K per orbit is still about 10 K away). Each orbit's end
// is moved by that estimate, with Anderson acceleration over the moves, so a transient of any time
// constant is gone in a few orbits.
// A thermostat's on/off cycle need not fit the orbit: its switching can repeat only every p orbits.
// Then no single orbit repeats, but the state p orbits apart does; we accept that (p up to
// MAX_PERIOD_ORBITS), answer the last orbit's temperatures and average duty and power over the p orbits.
// A cycle that never locks to the orbit (a thermostat on a steady load) is judged by its averages:
// when two successive windows of MAX_PERIOD_ORBITS orbits agree in every node's mean temperature
// (within 0.05 K) and every heater's duty cycle (within 0.02), the averages over the last window are
// the answer (periodOrbits 0, averagedOrbits the window). The cycle beats against the orbit, so
// those window averages wander by about one on-time over the window; the limits say how much.
import { DEFAULT_MAX_ORBITS, DEFAULT_TOLERANCE_K, KELVIN_OFFSET, temperatureWords, ThermalConvergenceError, type ThermalModelInput, type ThermalSolveOptions } from './thermal-model';
import { AndersonAcceleration } from './anderson-acceleration';
import { ThermalControllers } from './thermal-controllers';
import { LoopIntegrals } from './thermal-loop-integrals';
import { OrbitCorrection } from './thermal-orbit-correction';
import { newSummary, OrbitStepper, type OrbitSummary, type SwitchOn } from './thermal-orbit-stepper';
import { buildNetwork, ImplicitStep, StepDivergence, type ThermalNetwork } from './thermal-network';

export const MAX_PERIOD_ORBITS = 24;
const UNLOCKED_MEAN_CHANGE_K = 0.05;
const UNLOCKED_DUTY_CHANGE = 0.02;
/** Extrapolation helps while a transient decays; past this many orbits it only disturbs a cycle. */
const MAX_ACCELERATED_ORBITS = 12;
/** Warm start: an ideal heater is a stiff conductance to its set point (W/K), clipped to its power. */
const HOLD_WK = 1e6;
const PSEUDO_STEPS_ORBITS = [1, 10, 100, 1e3, 1e4, 1e5, 1e6];

/** The node furthest from its periodic state when the allowed orbits ran out. */
export interface UnsettledNode {
  free: number;
  lastChangeK: number;
  remainingK: number;
  endK: number;
}

export interface PeriodicRun {
  /** False when maxOrbits ran out: then every figure is the last orbit's, and `unsettled` names the node. */
  settled: boolean;
  unsettled: UnsettledNode | null;
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
  /** Per closed-loop path element (net.loops order): the heat the coolant took from it, orbit average, W. */
  elementHeatW: number[];
  iterations: number;
  factorizations: number;
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
  const steadyStepS = Math.max(periodS, 1e12 * net.capacitanceJK.reduce((a, c) => Math.max(a, c), 0));
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
    // The pseudo-steps are backward Euler steps, so they stop short of the steady state by about
    // C/dt over the node's conductance: 10 % at C = 1e9 J/K. A last step long enough that C/dt is
    // 1e-12 W/K lands on the steady state itself; the steps before brought T near enough for it.
    const settled = new Float64Array(T);
    try {
      step.solve(settled, new Float64Array(T), 1, steadyStepS, mean, 0, extraWK, extraSource, 1e-6);
      T.set(settled);
    } catch (error) {
      if (!(error instanceof ThermalConvergenceError)) throw error;
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
function wholeCycles(list: readonly SwitchOn[], fromS: number): { s: number; j: number; onS: number } | null {
  const inside = list.filter((e) => e.s >= fromS);
  if (inside.length < 2) return null;
  const a = inside[0];
  const b = inside[inside.length - 1];
  return { s: b.s - a.s, j: b.j - a.j, onS: b.on - a.on };
}

export function runPeriodic(model: ThermalModelInput, net: ThermalNetwork, heaterScale: readonly number[], options: ThermalSolveOptions = {}): PeriodicRun {
  const toleranceK = options.toleranceK ?? DEFAULT_TOLERANCE_K;
  const maxOrbits = options.maxOrbits ?? DEFAULT_MAX_ORBITS;
  const { n, steps, substeps } = net;
  const total = steps * substeps;
  const controllers = new ThermalControllers(model, net, heaterScale);
  const step = new ImplicitStep(net);
  const nameOf = (free: number) => model.nodes[net.nodeOfFree[free]]?.name ?? `node ${free + 1}`;
  const stepFailure = (e: StepDivergence, when: string, orbit: number) => new ThermalConvergenceError(
    e.singular
      ? `The network could not be solved at node "${nameOf(e.free)}" ${when} (at ${temperatureWords(e.fromK)}): its capacitance, a conductance or a loop's flow there is not positive. Check the values given for "${nameOf(e.free)}".`
      : `The temperature of node "${nameOf(e.free)}" did not settle ${when}: it started near ${temperatureWords(e.fromK)} and the step's iteration got to ${temperatureWords(e.toK)}. Check that "${nameOf(e.free)}" has a path to lose its heat and that its loads and heater power are right; more substeps shorten the step.`,
    orbit, NaN, `nodes.${net.nodeOfFree[e.free]}`);
  const H = controllers.heaters.length;
  const L = controllers.loops.length;

  let startK: Float64Array = new Float64Array(net.initialK);
  if ((options.start ?? 'orbit-average') === 'orbit-average') {
    let warm: ReturnType<typeof warmStart>;
    try {
      warm = warmStart(net, controllers, step, model.periodS);
    } catch (error) {
      if (!(error instanceof StepDivergence)) throw error;
      throw stepFailure(error, 'while finding the steady state of the orbit-averaged loads to start from', 0);
    }
    if (warm) {
      startK = warm.T;
      controllers.prime(warm.heaterW, controllers.loops.map((l) => l.nominalFlow));
    }
  }
  const stepper = new OrbitStepper(net, controllers, step, startK);
  const summaries: OrbitSummary[] = [];
  // Orbit-map acceleration; switched off for good once it stops helping (a thermostat limit cycle).
  // The loops' PI integrals ride along with the temperatures in the extrapolated orbit map.
  const integrals = new LoopIntegrals(controllers);
  const mapStart = new Float64Array(n + integrals.size);
  const mapEnd = new Float64Array(n + integrals.size);
  const anderson = options.accelerate === false ? null : new AndersonAcceleration(n + integrals.size);
  let accelerating = anderson !== null;
  const correction = new OrbitCorrection(net);
  const driftK = new Float64Array(n);
  const orbitMeanK = new Float64Array(n);
  const distance = new Float64Array(n);
  const distanceP = new Float64Array(n);
  const corrected = new Float64Array(n);
  const orbitStartK = new Float64Array(n);
  const startOn = new Uint8Array(H);
  let bestResidualK = Infinity;
  let stalledOrbits = 0;
  let lastJumpOrbit = 0;
  // The thermostats are part of the state: the same temperatures heading the other way do not repeat.
  const sameSwitches = (a: Uint8Array, b: Uint8Array) => a.every((v, k) => v === b[k]);

  for (let orbit = 1; orbit <= maxOrbits; orbit++) {
    const summary = summaries.length >= 2 * MAX_PERIOD_ORBITS ? summaries.shift()! : newSummary(n, H, L);
    orbitStartK.set(stepper.T);
    integrals.read(mapStart, n);
    startOn.set(controllers.on);
    const switchesBefore = controllers.switches;
    try {
      stepper.orbit(summary);
    } catch (error) {
      if (!(error instanceof StepDivergence)) throw error;
      throw stepFailure(error, `in orbit ${orbit}, the step from ${timeWords(stepper.elapsedS)} to ${timeWords(stepper.elapsedS + net.dtS)} after the start`, orbit);
    }
    summaries.push(summary);
    const T = stepper.T;
    let residualK = 0;
    for (let i = 0; i < n; i++) {
      const t = T[i];
      // A run with no way to lose its heat climbs without end; say so rather than answer nonsense.
      if (!(t > 0 && t < 1e5)) {
        throw new ThermalConvergenceError(
          `Node "${nameOf(i)}" ran away: it went from ${temperatureWords(orbitStartK[i])} to ${temperatureWords(t)} over orbit ${orbit} (${timeWords(stepper.elapsedS - model.periodS)} to ${timeWords(stepper.elapsedS)} after the start). Check that "${nameOf(i)}" has a path to lose its heat (a coupling or a radiator) and that its loads are right.`,
          orbit, Infinity, `nodes.${net.nodeOfFree[i]}`);
      }
      driftK[i] = t - orbitStartK[i];
      orbitMeanK[i] = summary.sumK[i] / total;
      residualK = Math.max(residualK, Math.abs(driftK[i]));
    }
    // A small change over the orbit is not enough: a slow node changes little per orbit however far
    // it has to go. The periodic state also needs the estimated distance still to go below the
    // tolerance (thermal-orbit-correction.ts); where the network cannot be factored, the change alone.
    let distanceK = NaN;
    let periodOrbits = 0;
    if (residualK < toleranceK && sameSwitches(startOn, controllers.on)) {
      distanceK = correction.distance(orbitMeanK, driftK, model.periodS, controllers, summary.heaterOnS, distance);
      if (!(distanceK >= toleranceK)) periodOrbits = 1;
    }
    // The larger of the last change and the estimated distance still to go.
    const remainingK = distanceK > residualK ? distanceK : residualK;
    // A repeat p orbits apart proves a period only if no extrapolated jump came in between.
    if (!periodOrbits && controllers.hasThermostats && controllers.switches > switchesBefore && orbit - lastJumpOrbit > MAX_PERIOD_ORBITS) {
      for (let p = 2; p <= Math.min(MAX_PERIOD_ORBITS, summaries.length - 1); p++) {
        const earlier = summaries[summaries.length - 1 - p];
        let d = 0;
        for (let i = 0; i < n; i++) d = Math.max(d, Math.abs(T[i] - earlier.endK[i]));
        if (d < toleranceK && sameSwitches(earlier.endOn, controllers.on)) {
          const onS = new Float64Array(H);
          for (const o of summaries.slice(-p)) for (let k = 0; k < H; k++) onS[k] += o.heaterOnS[k];
          const driftP = T.map((t, i) => t - earlier.endK[i]);
          const far = correction.distance(orbitMeanK, driftP, p * model.periodS, controllers, onS, distanceP);
          if (far >= toleranceK) continue;
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
    // Out of orbits: the last orbit is the answer, marked as such, with the node furthest from settling.
    let unsettled: UnsettledNode | null = null;
    if (!averagedOrbits && orbit === maxOrbits) {
      averagedOrbits = 1;
      let worst = 0;
      let worstK = -1;
      for (let i = 0; i < n; i++) {
        const far = Math.max(Math.abs(driftK[i]), Number.isNaN(distanceK) ? 0 : Math.abs(distance[i]));
        if (far > worstK) {
          worst = i;
          worstK = far;
        }
      }
      unsettled = { free: worst, lastChangeK: driftK[worst], remainingK: Math.max(worstK, remainingK), endK: T[worst] };
    }
    if (!averagedOrbits && anderson && accelerating) {
      if (remainingK < 0.7 * bestResidualK) {
        bestResidualK = remainingK;
        stalledOrbits = 0;
      } else if (++stalledOrbits >= 4) accelerating = false;
      if (orbit >= MAX_ACCELERATED_ORBITS) accelerating = false;
      if (accelerating) {
        // The corrected orbit map T_start -> T_end + distance has the periodic state as its fixed
        // point and contracts about tenfold per orbit; Anderson on top takes out what the linear,
        // orbit-averaged estimate misses (radiation, thermostat switching).
        if (Number.isNaN(distanceK)) correction.distance(orbitMeanK, driftK, model.periodS, controllers, summary.heaterOnS, distance);
        for (let i = 0; i < n; i++) corrected[i] = T[i] + distance[i];
        mapStart.set(orbitStartK);
        mapEnd.set(corrected);
        integrals.read(mapEnd, n);
        const next = anderson.next(mapStart, mapEnd);
        const nextK = next.subarray(0, n);
        // A node with nowhere to lose its heat has no periodic state to jump to: step on and let the climb show.
        if (nextK.every((t) => t > 1 && t < 1e5)) {
          stepper.jumpTo(nextK);
          integrals.write(next, n);
          lastJumpOrbit = orbit;
        } else accelerating = false;
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
      const sinceS = stepper.elapsedS - span;
      return {
        settled: unsettled === null, unsettled,
        orbits: orbit, periodOrbits, averagedOrbits, residualK, minK, maxK, meanK,
        samplesK: OrbitStepper.bySeries(stepper.samplesK, n, steps),
        heaterSamplesW: OrbitStepper.bySeries(stepper.heaterSamplesW, H, steps),
        heaterDuty: controllers.heaters.map((h, k) => {
          const whole = periodOrbits ? null : wholeCycles(stepper.switchOns[k], sinceS);
          if (h.thermostat) return whole ? whole.onS / whole.s : sum((o) => o.heaterOnS, k) / span;
          return h.powerW > 0 ? sum((o) => o.heaterJ, k) / span / h.powerW : 0;
        }),
        heaterAverageW: controllers.heaters.map((_, k) => {
          const whole = periodOrbits ? null : wholeCycles(stepper.switchOns[k], sinceS);
          return whole ? whole.j / whole.s : sum((o) => o.heaterJ, k) / span;
        }),
        heaterPeakW: controllers.heaters.map((_, k) => Math.max(...last.map((o) => o.heaterPeakW[k]))),
        heaterInstalledW: controllers.heaters.map((h) => h.powerW),
        loopSamplesKgS: OrbitStepper.bySeries(stepper.loopSamplesKgS, L, steps),
        loopAverageKgS: controllers.loops.map((_, k) => sum((o) => o.loopFlowSum, k) / (total * averagedOrbits)),
        loopHeatW: controllers.loops.map((_, k) => sum((o) => o.loopHeatJ, k) / span),
        elementHeatW: Array.from(stepper.elementJ, (j) => j / model.periodS),
        iterations: step.iterations,
        factorizations: step.factorizations,
      };
    }
  }
  throw new ThermalConvergenceError(`The model was given no orbits to run (maxOrbits ${maxOrbits}); allow at least one.`, 0, NaN, 'maxOrbits');
}

/** A time since the run's start in words: seconds, and orbits-and-minutes where long. */
function timeWords(s: number): string {
  return s < 600 ? `${s.toFixed(1)} s` : `${Math.round(s)} s (${(s / 60).toFixed(1)} min)`;
}

/** Why a run that ran out of orbits is not settled, in words, naming the node and its figures. */
export function unsettledMessage(model: ThermalModelInput, net: ThermalNetwork, run: PeriodicRun, toleranceK = DEFAULT_TOLERANCE_K, answered = true): string {
  const u = run.unsettled;
  if (!u) return '';
  const name = model.nodes[net.nodeOfFree[u.free]]?.name ?? `node ${u.free + 1}`;
  const change = u.lastChangeK;
  const trend = Math.abs(change) < toleranceK ? `changed by only ${Math.abs(change).toFixed(4)} K over the last orbit but is still an estimated ${u.remainingK.toFixed(3)} K from its periodic state (it is slow to settle)`
    : `still ${change > 0 ? 'warmed' : 'cooled'} by ${Math.abs(change).toFixed(3)} K over the last orbit`;
  return `Not settled after ${run.orbits} orbit${run.orbits === 1 ? '' : 's'}: node "${name}" ${trend}, ending it at ${temperatureWords(u.endK)}; a periodic state needs every node within ${toleranceK} K.${answered ? " The figures shown are the last orbit's." : ''} Allow more orbits, or check that "${name}" has a path to lose its heat.`;
}
