// Heaters and pumped coolant loops: the parts of the model that act on what they measure.
// Each controller reads the temperatures at the start of a step and holds its output through the
// step. That keeps the implicit step smooth (a thermostat switching inside the iteration would
// chatter and stall it) at the price of switching up to one step late; more substeps narrow that.
// Heater power goes with the square of the bus voltage at fixed resistance (P = V^2/R, DOMAIN.md
// "Margins"). Proportional-integral controllers clamp their integral term to what the actuator can
// give, so they do not wind up while saturated.
import { KELVIN_OFFSET, ThermalModelError, type ThermalModelInput } from './thermal-model';
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
  frees: number[];
  control: number;
  inletK: number;
  conductancePerFlow: number;
  setPointK: number;
  minFlow: number;
  maxFlow: number;
  nominalFlow: number;
  kp: number;
  ki: number;
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
    this.loops = (model.loops ?? []).map((loop, k) => {
      const path = `loops.${k}`;
      const frees = loop.nodes.map((name, j) => freeNode(name, `${path}.nodes.${j}`, 'a coolant loop'));
      const control = freeNode(loop.controlNode ?? loop.nodes[0], `${path}.controlNode`, 'a loop controller');
      const capacitance = capacitanceOf(model.nodes[net.nodeOfFree[control]], `${path}.controlNode`);
      const conductancePerFlow = (loop.effectiveness ?? 1) * loop.specificHeatJKgK;
      const span = loop.maxFlowKgS - loop.minFlowKgS;
      // Gain limit as for heaters: flow gain x c_p x (T - T_in) acts as a power gain; (T - T_in) taken as 20 K.
      const kp = loop.proportionalKgSK ?? Math.min(span / (2 * DEFAULT_PI_BAND_K), (EXPLICIT_GAIN_LIMIT * capacitance) / (net.dtS * conductancePerFlow * 20));
      return {
        frees, control, conductancePerFlow,
        inletK: loop.inletC + KELVIN_OFFSET,
        setPointK: loop.setPointC + KELVIN_OFFSET,
        minFlow: loop.minFlowKgS, maxFlow: loop.maxFlowKgS, nominalFlow: loop.nominalFlowKgS,
        kp, ki: loop.integralKgSKs ?? kp / DEFAULT_INTEGRAL_TIME_S,
      };
    });
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
      const flow = flowKgS[k] ?? loop.nominalFlow;
      this.loopIntegral[k] = Math.min(Math.max(flow, loop.minFlow), loop.maxFlow) - loop.nominalFlow;
    });
  }

  /**
   * Sets every output from the temperatures T at the start of a step of dtS seconds and fills
   * extraWK / extraSource. Answers true when a loop's flow moved enough that the factor should be rebuilt.
   */
  update(T: Float64Array, dtS: number): boolean {
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
      const error = T[loop.control] - loop.setPointK;
      const lo = loop.minFlow - loop.nominalFlow;
      const hi = loop.maxFlow - loop.nominalFlow;
      this.loopIntegral[k] = Math.min(Math.max(this.loopIntegral[k] + loop.ki * error * dtS, lo), hi);
      const flow = Math.min(Math.max(loop.nominalFlow + loop.kp * error + this.loopIntegral[k], loop.minFlow), loop.maxFlow);
      this.flowKgS[k] = flow;
      if (Math.abs(flow - this.factoredFlow[k]) > LOOP_REFACTOR_SHARE * Math.max(this.factoredFlow[k], loop.maxFlow * 1e-3)) {
        refactor = true;
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

  /** Heat the loop takes from its nodes at temperatures T with its current flow, W. */
  loopHeatW(k: number, T: Float64Array): number {
    const loop = this.loops[k];
    const g = loop.conductancePerFlow * this.flowKgS[k];
    return loop.frees.reduce((sum, free) => sum + g * (T[free] - loop.inletK), 0);
  }

}
