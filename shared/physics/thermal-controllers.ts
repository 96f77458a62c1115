// Heaters and pumped coolant loops: the parts of the model that act on what they measure.
// Each controller reads the temperatures at the start of a step and holds its output through the
// step. That keeps the implicit step smooth (a thermostat switching inside the iteration would
// chatter and stall it) at the price of switching up to one step late; more substeps narrow that.
// Heater power goes with the square of the bus voltage at fixed resistance (P = V^2/R, DOMAIN.md
// "Margins"). Proportional-integral controllers clamp their integral term to what the actuator can
// give, so they do not wind up while saturated.
import { KELVIN_OFFSET, ThermalModelError, type ThermalModelInput } from './thermal-model';
import { isClosedLoop } from './thermal-loops';
import { capacitanceOf, nodeIndexOf, type ThermalNetwork } from './thermal-network';

/** PI defaults (our choice, no source): full power 1 K below the set point, integral time 600 s. */
const DEFAULT_PI_BAND_K = 1;
const DEFAULT_INTEGRAL_TIME_S = 600;
/** An explicit controller is stable while gain * dt / C stays well below 2; we keep it at 0.5 or less. */
const EXPLICIT_GAIN_LIMIT = 0.5;
/** A loop flow change larger than this share since the last factorisation rebuilds the factor. */
const LOOP_REFACTOR_SHARE = 0.05;

interface HeaterPlan {
  free: number;
  powerW: number;
  thermostat: boolean;
  onK: number;
  offK: number;
  setPointK: number;
  kp: number;
  ki: number;
}

interface LoopPlan {
  /** Open loop: the nodes fed at the inlet temperature; closed: none (its terms are the network's). */
  frees: number[];
  /** The closed loop's index in net.loops, or -1 for an open loop. */
  closed: number;
  /** The controlled node, or -1 for a constant flow. */
  control: number;
  inletK: number;
  conductancePerFlow: number;
  setPointK: number;
  minFlow: number;
  maxFlow: number;
  nominalFlow: number;
  kp: number;
  ki: number;
  /** Feedforward flow per step over the orbit, kg/s (empty without feedforward). */
  feedforward: Float64Array;
}

export class ThermalControllers {
  readonly heaters: HeaterPlan[];
  readonly loops: LoopPlan[];
  /** Per heater: thermostat state, PI integral (W), current power (W). */
  readonly on: Uint8Array;
  readonly heaterIntegralW: Float64Array;
  readonly heaterPowerW: Float64Array;
  /** Per loop: PI integral (kg/s), current flow (kg/s). */
  readonly loopIntegral: Float64Array;
  readonly flowKgS: Float64Array;
  private readonly factoredFlow: Float64Array;
  /** Per free node, for the implicit step. */
  readonly extraWK: Float64Array;
  readonly extraSource: Float64Array;
  switches = 0;
  private readonly net: ThermalNetwork;

  /** `heaterScale[h]`: this run's power over the installed power, (V / V_nominal)^2. */
  constructor(model: ThermalModelInput, net: ThermalNetwork, heaterScale: readonly number[]) {
    const index = nodeIndexOf(model);
    const freeNode = (name: string, path: string, what: string) => {
      const i = index.get(name);
      if (i === undefined) throw new ThermalModelError(`${path} names node ${JSON.stringify(name)}, which the model does not have`, path);
      const free = net.freeOfNode[i];
      if (free < 0) throw new ThermalModelError(`${path}: ${what} cannot act on ${name}, a boundary node at a fixed temperature`, path);
      return free;
    };
    this.heaters = (model.heaters ?? []).map((h, k) => {
      const path = `heaters.${k}`;
      const free = freeNode(h.node, `${path}.node`, 'a heater');
      const powerW = h.powerW * (heaterScale[k] ?? 1);
      const thermostat = (h.control ?? 'thermostat') === 'thermostat';
      if (thermostat && (h.onC === undefined || h.offC === undefined)) throw new ThermalModelError(`${path}: a thermostat needs onC and offC`, path);
      if (!thermostat && h.setPointC === undefined) throw new ThermalModelError(`${path}: a PI heater needs setPointC`, `${path}.setPointC`);
      const capacitance = capacitanceOf(model.nodes[net.nodeOfFree[free]], `${path}.node`);
      const kp = h.proportionalWK ?? Math.min(powerW / DEFAULT_PI_BAND_K, (EXPLICIT_GAIN_LIMIT * capacitance) / net.dtS);
      return {
        free, powerW, thermostat,
        onK: (h.onC ?? 0) + KELVIN_OFFSET,
        offK: (h.offC ?? 0) + KELVIN_OFFSET,
        setPointK: (h.setPointC ?? 0) + KELVIN_OFFSET,
        kp,
        ki: h.integralWKs ?? kp / DEFAULT_INTEGRAL_TIME_S,
      };
    });
    let closedCount = 0;
    this.loops = (model.loops ?? []).map((loop, k) => {
      const path = `loops.${k}`;
      const closed = isClosedLoop(loop);
      const frees = closed ? [] : (loop.nodes ?? []).map((name, j) => freeNode(name, `${path}.nodes.${j}`, 'a coolant loop'));
      const pathFrees = closed ? (loop.path ?? []).map((e, j) => freeNode(e.node, `${path}.path.${j}.node`, 'a coolant loop')) : frees;
      const controlled = loop.minFlowKgS < loop.maxFlowKgS;
      if (controlled && loop.controlNode === undefined) {
        throw new ThermalModelError(`${path}: the flow can vary between ${loop.minFlowKgS} and ${loop.maxFlowKgS} kg/s, so choose the node it controls (controlNode)`, `${path}.controlNode`);
      }
      if (controlled && loop.setPointC === undefined) throw new ThermalModelError(`${path}: a controlled loop needs setPointC`, `${path}.setPointC`);
      const control = controlled ? freeNode(loop.controlNode ?? '', `${path}.controlNode`, 'a loop controller') : -1;
      const conductancePerFlow = (loop.effectiveness ?? 1) * loop.specificHeatJKgK;
      const span = loop.maxFlowKgS - loop.minFlowKgS;
      let kp = 0;
      if (controlled) {
        const capacitance = capacitanceOf(model.nodes[net.nodeOfFree[control]], `${path}.controlNode`);
        // Gain limit as for heaters: flow gain x c_p x (T - T_coolant) acts as a power gain; (T - T_coolant) taken as 20 K.
        kp = loop.proportionalKgSK ?? Math.min(span / (2 * DEFAULT_PI_BAND_K), (EXPLICIT_GAIN_LIMIT * capacitance) / (net.dtS * conductancePerFlow * 20));
      }
      return {
        frees, control, conductancePerFlow,
        closed: closed ? closedCount++ : -1,
        inletK: (loop.inletC ?? 0) + KELVIN_OFFSET,
        setPointK: (loop.setPointC ?? 0) + KELVIN_OFFSET,
        minFlow: loop.minFlowKgS, maxFlow: loop.maxFlowKgS, nominalFlow: loop.nominalFlowKgS,
        kp, ki: controlled ? (loop.integralKgSKs ?? kp / DEFAULT_INTEGRAL_TIME_S) : 0,
        feedforward: controlled && loop.feedforwardKgSW ? feedforwardFlow(net, pathFrees, loop.feedforwardKgSW, loop.feedforwardLeadS ?? 0) : new Float64Array(0),
      };
    });
    this.net = net;
    this.on = new Uint8Array(this.heaters.length);
    this.heaterIntegralW = new Float64Array(this.heaters.length);
    this.heaterPowerW = new Float64Array(this.heaters.length);
    this.loopIntegral = new Float64Array(this.loops.length);
    this.flowKgS = new Float64Array(this.loops.length).map((_, k) => this.loops[k].nominalFlow);
    this.factoredFlow = new Float64Array(this.flowKgS);
    this.extraWK = new Float64Array(net.n);
    this.extraSource = new Float64Array(net.n);
  }

  get hasThermostats(): boolean {
    return this.heaters.some((h) => h.thermostat);
  }

  /** Starts the PI integrals at the steady powers and flows a warm start found. */
  prime(heaterPowerW: readonly number[], flowKgS: readonly number[]): void {
    this.heaters.forEach((h, k) => {
      if (!h.thermostat) this.heaterIntegralW[k] = Math.min(Math.max(heaterPowerW[k] ?? 0, 0), h.powerW);
    });
    this.loops.forEach((loop, k) => {
      if (loop.control < 0) return;
      const flow = flowKgS[k] ?? loop.nominalFlow;
      this.loopIntegral[k] = Math.min(Math.max(flow, loop.minFlow), loop.maxFlow) - loop.nominalFlow;
    });
  }

  /**
   * Sets every output from the temperatures T at the start of a step of dtS seconds and fills
   * extraWK / extraSource. `step` is the step's index in the orbit (for feedforward). Answers true
   * when a loop's flow moved enough that the factor should be rebuilt.
   */
  update(T: Float64Array, dtS: number, step = 0): boolean {
    // Called every step: plain loops, no closures.
    const { extraWK, extraSource, heaters, loops } = this;
    if (loops.length) extraWK.fill(0);
    extraSource.fill(0);
    for (let k = 0; k < heaters.length; k++) {
      const h = heaters[k];
      const t = T[h.free];
      let power: number;
      if (h.thermostat) {
        const was = this.on[k];
        if (t <= h.onK) this.on[k] = 1;
        else if (t >= h.offK) this.on[k] = 0;
        if (this.on[k] !== was) this.switches++;
        power = this.on[k] ? h.powerW : 0;
      } else {
        const error = h.setPointK - t;
        // Integral term held within what the heater can give (no wind-up).
        this.heaterIntegralW[k] = Math.min(Math.max(this.heaterIntegralW[k] + h.ki * error * dtS, 0), h.powerW);
        power = Math.min(Math.max(h.kp * error + this.heaterIntegralW[k], 0), h.powerW);
      }
      this.heaterPowerW[k] = power;
      extraSource[h.free] += power;
    }
    let refactor = false;
    for (let k = 0; k < loops.length; k++) {
      const loop = loops[k];
      let flow = loop.nominalFlow;
      if (loop.control >= 0) {
        const error = T[loop.control] - loop.setPointK;
        const lo = loop.minFlow - loop.nominalFlow;
        const hi = loop.maxFlow - loop.nominalFlow;
        const ff = loop.feedforward.length ? loop.feedforward[step % loop.feedforward.length] : 0;
        const wanted = loop.nominalFlow + ff + loop.kp * error + this.loopIntegral[k];
        // Anti-windup: no integration while the flow is held at a limit the error pushes it past,
        // and the integral itself kept within the flow range (Astrom & Murray, Feedback Systems, 10.4).
        const pushing = (wanted >= loop.maxFlow && error > 0) || (wanted <= loop.minFlow && error < 0);
        if (!pushing) this.loopIntegral[k] = Math.min(Math.max(this.loopIntegral[k] + loop.ki * error * dtS, lo), hi);
        flow = Math.min(Math.max(loop.nominalFlow + ff + loop.kp * error + this.loopIntegral[k], loop.minFlow), loop.maxFlow);
      }
      this.flowKgS[k] = flow;
      if (Math.abs(flow - this.factoredFlow[k]) > LOOP_REFACTOR_SHARE * Math.max(this.factoredFlow[k], loop.maxFlow * 1e-3)) {
        refactor = true;
      }
      if (loop.closed >= 0) {
        this.net.loops?.setFlow(loop.closed, flow);
        continue;
      }
      // Pumped loop heat: effectiveness x m_dot c_p (T_node - T_inlet) (DOMAIN.md "Thermal model")
      const g = loop.conductancePerFlow * flow;
      for (const free of loop.frees) {
        extraWK[free] += g;
        extraSource[free] += g * loop.inletK;
      }
    }
    if (refactor) this.factoredFlow.set(this.flowKgS);
    return refactor;
  }

  /** Heat an open loop takes from its nodes at temperatures T with its current flow, W (a closed loop's is per element, in the orbit stepper). */
  loopHeatW(k: number, T: Float64Array): number {
    const loop = this.loops[k];
    const g = loop.conductancePerFlow * this.flowKgS[k];
    return loop.frees.reduce((sum, free) => sum + g * (T[free] - loop.inletK), 0);
  }
}

/**
 * Feedforward flow at each step of the orbit: gain x (Q(t + lead) - mean Q), Q the load the case
 * puts on the loop's nodes (absorbed plus dissipated, from the network's per-step sources).
 */
function feedforwardFlow(net: ThermalNetwork, frees: readonly number[], gainKgSW: number, leadS: number): Float64Array {
  const total = net.steps * net.substeps;
  const load = new Float64Array(total);
  for (let s = 0; s < total; s++) for (const free of frees) load[s] += net.sourceW[s * net.n + free];
  const mean = load.reduce((a, b) => a + b, 0) / total;
  const lead = Math.round(leadS / net.dtS);
  return load.map((_, s) => gainKgSW * (load[(((s + lead) % total) + total) % total] - mean));
}
