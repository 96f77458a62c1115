// The lumped-node thermal model: what a model holds (nodes, couplings, heaters, coolant loops) and
// what a solve answers. Plain JSON-able data, so a mission can save a model as it is posted to
// POST /api/v1/thermal/solve (API.md "Thermal solve"); the solver is in thermal-solver.ts.
// Temperatures cross this boundary in degrees Celsius; the solver works in kelvin inside.

/** A value constant over the orbit, or one value per sample (`steps` of them, evenly spaced in time). */
export type OrbitSeries = number | readonly number[];

/** Internal dissipation switched on and off with its own period; the cycle restarts each orbit. */
export interface DissipationSchedule {
  onW: number;
  /** Dissipation while off; 0 when not given. */
  offW?: number;
  periodS: number;
  /** Time on in each period. */
  onS: number;
  /** When in the period the unit switches on, from the orbit start. */
  phaseS?: number;
}

export interface ThermalNodeInput {
  name: string;
  /** Thermal capacitance; or give massKg and specificHeatJKgK. Boundary nodes need neither. */
  capacitanceJK?: number;
  massKg?: number;
  specificHeatJKgK?: number;
  initialC: number;
  dissipationW?: OrbitSeries | DissipationSchedule;
  /** The case's environmental load absorbed by the node's surfaces. */
  absorbedW?: OrbitSeries;
  /** Area radiating to the sink (deep space at 0 K unless sinkC). */
  radiatorAreaM2?: number;
  emissivity?: number;
  sinkC?: number;
  /** A boundary held at this temperature. */
  fixedC?: number;
  /** Operating limits. */
  minC?: number;
  maxC?: number;
  survivalMinC?: number;
  survivalMaxC?: number;
}

export interface ConductiveCoupling {
  from: string;
  to: string;
  conductanceWK: number;
}

/** Radiative exchange sigma * areaM2 * effectiveEmissivity * viewFactor * (T_from^4 - T_to^4). */
export interface RadiativeCoupling {
  from: string;
  to: string;
  areaM2: number;
  effectiveEmissivity: number;
  viewFactor: number;
}

/** The heater's resistance is fixed, so its power goes with the square of the bus voltage (P = V^2/R). */
export interface BusVoltage {
  nominalV: number;
  minV: number;
  maxV: number;
}

export type HeaterControl = 'thermostat' | 'pi';

export interface HeaterInput {
  name?: string;
  node: string;
  /** Installed power at the nominal bus voltage. */
  powerW: number;
  control?: HeaterControl;
  /** Thermostat: on at or below onC, off at or above offC. */
  onC?: number;
  offC?: number;
  /** Proportional-integral control: the set point and gains (defaults in thermal-controllers.ts). */
  setPointC?: number;
  proportionalWK?: number;
  integralWKs?: number;
  busVoltage?: BusVoltage;
}

/** One element of a closed loop's path: the coolant passes its node's cold plate (or panel) with this UA. */
export interface CoolantPathElement {
  node: string;
  conductanceWK: number;
}

/**
 * A pumped loop (API.md "Coolant loops"). Closed: a `path` and no `inletC`; the coolant passes the
 * path's nodes in order and returns to the first, its temperature computed (thermal-loops.ts).
 * Open: `nodes` + `inletC`; each node gives the coolant effectiveness * flow * c_p * (T_node - T_inlet).
 * With minFlowKgS < maxFlowKgS the flow is set by a proportional-integral controller (with
 * anti-windup) holding `controlNode` at the set point; with them equal the flow is constant.
 */
export interface CoolantLoopInput {
  name: string;
  /** Open form. */
  nodes?: readonly string[];
  inletC?: number;
  effectiveness?: number;
  /** Closed form. */
  path?: readonly CoolantPathElement[];
  fluidMassKg?: number;
  densityKgM3?: number;
  specificHeatJKgK: number;
  setPointC?: number;
  /** The node whose temperature the flow controller holds; required when the flow can vary. */
  controlNode?: string;
  minFlowKgS: number;
  maxFlowKgS: number;
  nominalFlowKgS: number;
  proportionalKgSK?: number;
  integralKgSKs?: number;
  /** The control requirement: the controlled node within +/- bandK of the set point. */
  bandK?: number;
  /**
   * Feedforward from the case's known loads: flow += feedforwardKgSW * (Q(t + lead) - mean Q), Q the
   * absorbed and dissipated load on the loop's nodes (W).
   */
  feedforwardKgSW?: number;
  feedforwardLeadS?: number;
}

export interface ThermalMargins {
  /** Added to the minimum and taken from the maximum of the operating limits. */
  operatingK?: number;
  survivalK?: number;
}

export interface ThermalModelInput {
  periodS: number;
  steps: number;
  nodes: readonly ThermalNodeInput[];
  couplings?: readonly ConductiveCoupling[];
  radiativeCouplings?: readonly RadiativeCoupling[];
  heaters?: readonly HeaterInput[];
  loops?: readonly CoolantLoopInput[];
  margins?: ThermalMargins;
}

export interface ThermalSolveOptions {
  /**
   * Periodic steady state: the largest change of any node over one orbit, K, and also the largest
   * estimated distance still to go (a slow node changes little per orbit however far it is).
   */
  toleranceK?: number;
  maxOrbits?: number;
  /** Integration steps per sample; more for stiff or fast-switching models. */
  substeps?: number;
  /**
   * 'orbit-average' starts from the steady state of the orbit-averaged loads (few orbits to go);
   * 'initial' starts every node at its initialC, as a test from cold would.
   */
  start?: 'orbit-average' | 'initial';
  /**
   * Jump each orbit's end by the estimated distance to the periodic state, with Anderson acceleration
   * over those jumps, to get there in fewer orbits; on by default. Off: plain orbit-after-orbit repetition.
   */
  accelerate?: boolean;
  /**
   * A run that does not reach its periodic state in maxOrbits: 'refuse' (the default) throws
   * ThermalConvergenceError; 'last-orbit' answers the last orbit, marked converged: false.
   */
  whenUnsettled?: 'refuse' | 'last-orbit';
}

export type ThermalSolveInput = ThermalModelInput & ThermalSolveOptions;

export interface LimitCheck {
  kind: 'operating' | 'survival';
  minC: number | null;
  maxC: number | null;
  marginK: number;
  /** Predicted minus (limit plus margin): negative means the prediction breaks the limit. */
  coldMarginK: number | null;
  hotMarginK: number | null;
  pass: boolean;
}

export interface NodeResult {
  name: string;
  minC: number;
  maxC: number;
  meanC: number;
  temperaturesC: number[];
  limits: LimitCheck[];
}

export interface HeaterVoltageResult {
  voltageV: number;
  powerW: number;
  dutyCycle: number;
  orbitAverageW: number;
  peakW: number;
  /** The coldest its node gets at this voltage. */
  nodeMinC: number;
}

export interface HeaterResult {
  name: string;
  node: string;
  dutyCycle: number;
  orbitAverageW: number;
  peakW: number;
  /** Heater power over the orbit, one value per sample (the mean over the sample's interval). */
  powerW: number[];
  atMinVoltage?: HeaterVoltageResult;
  atMaxVoltage?: HeaterVoltageResult;
}

/** How well a loop's controller holds its node (API.md "Coolant loops": control). */
export interface ControlFigures {
  node: string;
  setPointC: number;
  bandK: number;
  /** Largest |T - set point| over the periodic orbit, K. */
  maxDeviationK: number;
  /** Time per orbit outside +/- bandK, s. */
  outsideBandS: number;
  /** maxDeviationK within bandK. */
  pass: boolean;
}

export interface LoopResult {
  name: string;
  closed: boolean;
  flowKgS: number[];
  averageFlowKgS: number;
  nominalFlowKgS: number;
  averageToNominal: number;
  /** Closed: the heat the coolant moves (the sum of what it takes up); open: what it removes. */
  heatRemovedW: number;
  /** The coolant leaving each path element over the orbit (closed loops). */
  coolantC: { node: string; temperaturesC: number[] }[];
  /** Orbit-average heat the coolant takes from each element (negative where it gives heat up). */
  heatW: { node: string; averageW: number }[];
  /** Share of the orbit the flow sits at its minimum or maximum (0 without a controller). */
  saturatedFraction: number;
  densityKgM3: number | null;
  control: ControlFigures | null;
}

/** Why a run's answer is its last orbit rather than the periodic state, in user words and figures. */
export interface UnsettledRun {
  /** The node furthest from settling (its name in the model). */
  node: string;
  /** Its change over the last orbit, K (end minus start). */
  lastChangeK: number;
  /** Its estimated distance still to go to the periodic state, K (the larger of that and the change). */
  remainingK: number;
  /** Its temperature at the end of the last orbit, C. */
  endC: number;
  toleranceK: number;
  message: string;
}

export interface ThermalSolveResult {
  /** False when the run did not settle in the allowed orbits and the answer is its last orbit (`unsettled` says why). */
  converged: boolean;
  unsettled: UnsettledRun | null;
  orbits: number;
  /**
   * 1 when the answer repeats every orbit; p when a thermostat's cycle repeats only every p orbits;
   * 0 when it never locks to the orbit and the figures are averages over averagedOrbits orbits.
   */
  periodOrbits: number;
  /** Orbits that minC, maxC, meanC, duty cycles and powers are taken over. */
  averagedOrbits: number;
  /** The last orbit's largest change of any node (p orbits' for a p-orbit cycle), K. */
  residualK: number;
  tS: number[];
  nodes: NodeResult[];
  heaters: HeaterResult[];
  loops: LoopResult[];
  pass: boolean;
  assumptions: string[];
}

/** Heater sizing: duty cycle at most 70-80 % at minimum bus voltage [M: DOMAIN.md]; the middle of that. */
export const DEFAULT_MAX_HEATER_DUTY = 0.75;
export const DEFAULT_TOLERANCE_K = 0.01;
export const DEFAULT_MAX_ORBITS = 200;

export const KELVIN_OFFSET = 273.15;

/** The solver gave up: the orbit did not repeat, or a step's iteration did not settle. */
export class ThermalConvergenceError extends Error {
  override readonly name = 'ThermalConvergenceError';
  constructor(
    message: string,
    readonly orbits: number,
    readonly residualK: number,
    /** The model field the failure is about (e.g. `nodes.2`), when one node is to blame. */
    readonly path?: string,
  ) {
    super(message);
  }
}

/** A temperature in words for messages: "12.3 C", or what a non-number means. */
export function temperatureWords(k: number): string {
  if (Number.isNaN(k)) return 'no temperature at all (the solution broke down)';
  if (!Number.isFinite(k) || k > 1e6) return 'beyond a million degrees (without bound)';
  const c = k - KELVIN_OFFSET;
  return `${Math.abs(c) >= 1000 ? Math.round(c) : c.toFixed(1)} °C`;
}

/** The model cannot be what was asked: an unknown node, a radiator no area can make cool enough. */
export class ThermalModelError extends Error {
  override readonly name = 'ThermalModelError';
  constructor(
    message: string,
    readonly path: string,
  ) {
    super(message);
  }
}
