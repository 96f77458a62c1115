// Sizing from the periodic solution (DOMAIN.md "Thermal model", "Margins"):
// - the radiator area that keeps a node at or below its maximum minus margin in the hot case;
//   the radiator equation A = Q / (eps sigma T^4 - q_absorbed) [Gilmore] gives the first guess and
//   the answer for constant loads; the transient's peak, found by bisection, decides;
// - the installed heater power (at nominal bus voltage) that keeps a node at or above its minimum
//   plus margin in the cold case at minimum bus voltage with the duty cycle at most the chosen limit.
// The node's absorbed load is taken to fall on its radiator, so it scales with the area.
import { STEFAN_BOLTZMANN } from './constants';
import { DEFAULT_MAX_HEATER_DUTY, KELVIN_OFFSET, ThermalConvergenceError, ThermalModelError, type OrbitSeries, type ThermalSolveInput } from './thermal-model';
import { buildNetwork } from './thermal-network';
import { runPeriodic } from './thermal-periodic';

const RELATIVE_TOLERANCE = 1e-4;
const MAX_BISECTIONS = 60;
const MAX_AREA_M2 = 1e4;
const MAX_HEATER_W = 1e6;

const meanOf = (series: OrbitSeries | undefined) =>
  series === undefined ? 0 : typeof series === 'number' ? series : series.reduce((a, b) => a + b, 0) / series.length;

export interface RadiatorSizing {
  node: string;
  areaM2: number;
  /** The radiator equation with orbit-average loads, for comparison. */
  equationAreaM2: number | null;
  targetMaxC: number;
  achievedMaxC: number;
  solves: number;
  /** Why the answer is what it is when it is no radiator at all; null otherwise. */
  note: string | null;
}

export interface HeaterSizing {
  node: string;
  /** Installed power at nominal bus voltage. */
  powerW: number;
  minVoltageV: number | null;
  powerAtMinVoltageW: number;
  dutyCycleAtMinVoltage: number;
  orbitAverageAtMinVoltageW: number;
  maxDutyCycle: number;
  targetMinC: number;
  achievedMinC: number;
  solves: number;
  /** Why the answer is what it is when it is no heater at all; null otherwise. */
  note: string | null;
}

function nodeAt(input: ThermalSolveInput, name: string, path: string): number {
  const i = input.nodes.findIndex((n) => n.name === name);
  if (i < 0) throw new ThermalModelError(`${path} names node ${JSON.stringify(name)}, which the model does not have`, path);
  if (input.nodes[i].fixedC !== undefined) throw new ThermalModelError(`${name} is a boundary node at a fixed temperature; it cannot be sized`, path);
  return i;
}

const scaled = (series: OrbitSeries | undefined, f: number): OrbitSeries | undefined =>
  series === undefined ? undefined : typeof series === 'number' ? series * f : series.map((v) => v * f);

/** Radiator area holding `node` at or below maxC - margin over the orbit. */
export function radiatorAreaFor(input: ThermalSolveInput, node: string, marginK = 0): RadiatorSizing {
  const i = nodeAt(input, node, 'sizing.node');
  const base = input.nodes[i];
  if (base.maxC === undefined) throw new ThermalModelError(`${node} has no maxC to size its radiator against`, 'sizing.node');
  if (!base.emissivity) throw new ThermalModelError(`${node} needs an emissivity above 0 to radiate`, `nodes.${i}.emissivity`);
  const emissivity = base.emissivity;
  const targetMaxC = base.maxC - marginK;
  const area0 = base.radiatorAreaM2 ?? 0;
  let solves = 0;
  const withArea = (areaM2: number): ThermalSolveInput => {
    const f = area0 > 0 ? areaM2 / area0 : 1;
    const nodes = input.nodes.map((n, k) => (k === i ? { ...n, radiatorAreaM2: areaM2, absorbedW: area0 > 0 ? scaled(n.absorbedW, f) : n.absorbedW } : n));
    return { ...input, nodes };
  };
  const maxAt = (areaM2: number): number => {
    solves++;
    const model = withArea(areaM2);
    try {
      const net = buildNetwork(model, input.substeps ?? 1);
      const run = runPeriodic(model, net, (input.heaters ?? []).map(() => 1), input);
      // A run still warming when its orbits ran out says nothing about its peak: as good as too hot.
      return run.settled ? run.maxK[net.freeOfNode[i]] - KELVIN_OFFSET : Infinity;
    } catch (e) {
      // Too small a radiator can leave the heat nowhere to go: as good as too hot.
      if (e instanceof ThermalConvergenceError) return Infinity;
      throw e;
    }
  };

  // Radiator equation (DOMAIN.md; Gilmore): A = Q / (eps sigma T^4 - q_absorbed)
  const tK = targetMaxC + KELVIN_OFFSET;
  const q = meanOf(base.dissipationW as OrbitSeries | undefined);
  const qAbs = area0 > 0 ? meanOf(base.absorbedW) / area0 : 0;
  const denominator = emissivity * STEFAN_BOLTZMANN * tK ** 4 - qAbs;
  const equationAreaM2 = typeof base.dissipationW === 'object' && !Array.isArray(base.dissipationW) ? null
    : denominator > 0 ? q / denominator : null;

  const target = `${node} at or below ${targetMaxC} °C${marginK ? ` (its maximum ${base.maxC} °C less the ${marginK} K margin)` : ''}`;
  const none = maxAt(0);
  if (none <= targetMaxC) {
    return {
      node, areaM2: 0, equationAreaM2, targetMaxC, achievedMaxC: none, solves,
      note: `No radiator is needed: even with none, ${node} peaks at ${none.toFixed(1)} °C, within ${targetMaxC} °C${marginK ? ` (its maximum less the ${marginK} K margin)` : ''}; its heat leaves through its couplings.`,
    };
  }
  let hi = Math.max(equationAreaM2 ?? 0.1, 1e-4) * 1.5;
  let settledPeak: { peak: number; areaM2: number } | null = null;
  for (let peak = maxAt(hi); peak > targetMaxC; peak = maxAt(hi)) {
    if (Number.isFinite(peak)) settledPeak = { peak, areaM2: hi };
    if (hi * 2 > MAX_AREA_M2) {
      const reached = settledPeak ? `it still peaks at ${settledPeak.peak.toFixed(1)} °C with ${settledPeak.areaM2.toPrecision(3)} m²` : 'no area tried gave a run that settles';
      throw new ThermalModelError(`No radiator area up to ${MAX_AREA_M2} m² holds ${target}: ${reached}. The absorbed load per m² is too high for the emissivity, or heat comes in from elsewhere.`, 'sizing.node');
    }
    hi *= 2;
  }
  let lo = 0;
  for (let k = 0; k < MAX_BISECTIONS && hi - lo > RELATIVE_TOLERANCE * hi; k++) {
    const mid = (lo + hi) / 2;
    if (maxAt(mid) > targetMaxC) lo = mid;
    else hi = mid;
  }
  return { node, areaM2: hi, equationAreaM2, targetMaxC, achievedMaxC: maxAt(hi), solves, note: null };
}

/** Installed heater power (nominal voltage) holding the node at or above minC + margin at minimum voltage. */
export function heaterPowerFor(input: ThermalSolveInput, node: string, marginK = 0, maxDutyCycle = DEFAULT_MAX_HEATER_DUTY): HeaterSizing {
  const i = nodeAt(input, node, 'sizing.node');
  const target = input.nodes[i];
  if (target.minC === undefined) throw new ThermalModelError(`${node} has no minC to size its heater against`, 'sizing.node');
  const heaters = input.heaters ?? [];
  const h = heaters.findIndex((x) => x.node === node);
  if (h < 0) throw new ThermalModelError(`${node} has no heater to size; add one with its thermostat set points`, 'sizing.node');
  const heater = heaters[h];
  const targetMinC = target.minC + marginK;
  const setPoint = (heater.control ?? 'thermostat') === 'thermostat' ? heater.onC : heater.setPointC;
  if (setPoint !== undefined && setPoint < targetMinC) {
    throw new ThermalModelError(`The heater on ${node} switches on at ${setPoint} °C, below the ${targetMinC} °C it must hold; raise its set point`, `heaters.${h}`);
  }
  const scale = heater.busVoltage ? (heater.busVoltage.minV / heater.busVoltage.nominalV) ** 2 : 1;
  const net = buildNetwork(input, input.substeps ?? 1);
  const free = net.freeOfNode[i];
  let solves = 0;
  const at = (powerW: number) => {
    solves++;
    const model = { ...input, heaters: heaters.map((x, k) => (k === h ? { ...x, powerW } : x)) };
    // Every heater at the bottom of its bus range: the cold case's worst.
    try {
      const run = runPeriodic(model, net, heaters.map((x) => (x.busVoltage ? (x.busVoltage.minV / x.busVoltage.nominalV) ** 2 : 1)), input);
      const minC = run.minK[free] - KELVIN_OFFSET;
      return { ok: run.settled && minC >= targetMinC - 1e-9 && run.heaterDuty[h] <= maxDutyCycle, settled: run.settled, minC, duty: run.heaterDuty[h], averageW: run.heaterAverageW[h], failure: null };
    } catch (e) {
      // A trial power that makes the run break down is one that does not fit; say why if none does.
      if (!(e instanceof ThermalConvergenceError)) throw e;
      return { ok: false, settled: false, minC: NaN, duty: NaN, averageW: NaN, failure: e.message };
    }
  };
  const answer = (powerW: number, r: ReturnType<typeof at>, note: string | null = null): HeaterSizing => ({
    node, powerW, minVoltageV: heater.busVoltage?.minV ?? null, powerAtMinVoltageW: powerW * scale,
    dutyCycleAtMinVoltage: r.duty, orbitAverageAtMinVoltageW: r.averageW, maxDutyCycle, targetMinC, achievedMinC: r.minC, solves, note,
  });
  const holding = `${node} at or above ${targetMinC} °C${marginK ? ` (its minimum ${target.minC} °C plus the ${marginK} K margin)` : ''}`;
  const none = at(0);
  if (none.ok) {
    return answer(0, none, `No heater is needed: even with it off, ${node} stays at or above ${none.minC.toFixed(1)} °C in this case, within ${targetMinC} °C${marginK ? ' (its minimum plus the margin)' : ''}.`);
  }
  let hi = Math.max(heater.powerW, 1);
  let hiResult = at(hi);
  let previous = none;
  let previousW = 0;
  while (!hiResult.ok) {
    if (hiResult.failure !== null && previous.failure === null && hi > 4 * Math.max(heater.powerW, 1)) {
      throw new ThermalModelError(`No heater power holds ${holding}: a ${hi.toPrecision(3)} W heater is too strong for the model to settle (${hiResult.failure}), and weaker ones leave ${node} at ${previous.minC.toFixed(2)} °C at coldest with the heater on ${(previous.duty * 100).toFixed(1)} % of the orbit.`, 'sizing.node');
    }
    // More power no longer warms the node's coldest moment: the heater's set point, not its power, limits it.
    const stalled = hiResult.settled && previous.settled && hiResult.duty <= maxDutyCycle && previous.duty <= maxDutyCycle && hiResult.minC - previous.minC < 0.01;
    if (stalled) {
      const controlWords = (heater.control ?? 'thermostat') === 'thermostat' ? `its thermostat switches on at ${heater.onC} °C` : `its controller holds ${heater.setPointC} °C`;
      throw new ThermalModelError(`No heater power holds ${holding}: at ${previousW.toPrecision(3)} W and at ${hi.toPrecision(3)} W alike its coldest moment stays at ${hiResult.minC.toFixed(3)} °C, because ${controlWords} and the node cools a little before the heater answers. Set the heater to switch on above ${targetMinC} °C (for example ${(targetMinC + 1).toFixed(1)} °C), or size with a smaller margin.`, `heaters.${h}`);
    }
    if (hi * 2 > MAX_HEATER_W) {
      const reached = hiResult.failure ?? `${node} is at ${hiResult.minC.toFixed(1)} °C at coldest with the heater on ${(hiResult.duty * 100).toFixed(1)} % of the orbit`;
      throw new ThermalModelError(`No heater up to ${MAX_HEATER_W} W holds ${holding} within a duty cycle of ${maxDutyCycle}: at ${hi.toPrecision(3)} W ${reached}.`, 'sizing.node');
    }
    previous = hiResult;
    previousW = hi;
    hi *= 2;
    hiResult = at(hi);
  }
  let lo = 0;
  for (let k = 0; k < MAX_BISECTIONS && hi - lo > RELATIVE_TOLERANCE * hi; k++) {
    const mid = (lo + hi) / 2;
    const r = at(mid);
    if (r.ok) {
      hi = mid;
      hiResult = r;
    } else lo = mid;
  }
  return answer(hi, hiResult);
}
