// One case's answer from a lumped-node model: the periodic steady state at the nominal bus voltage,
// and, for heaters that name a bus range, again at its minimum and maximum (a heater's power goes
// with V^2, so the cold case at minimum voltage is where a heater runs longest).
// Pass/fail takes the coldest prediction of all the runs against the minimum limits and the hottest
// against the maximum limits.
import { round } from './rounding';
import { checkLimits } from './thermal-limits';
import { loopResults } from './thermal-loop-results';
import { DEFAULT_MAX_ORBITS, DEFAULT_TOLERANCE_K, KELVIN_OFFSET, ThermalConvergenceError, type HeaterResult, type HeaterVoltageResult, type NodeResult, type ThermalSolveInput, type ThermalSolveResult, type UnsettledRun } from './thermal-model';
import { buildNetwork, type ThermalNetwork } from './thermal-network';
import { runPeriodic, unsettledMessage, type PeriodicRun } from './thermal-periodic';

const toC = (k: number) => k - KELVIN_OFFSET;
/** A series rounded to 1e-4 (of C when `offset` is the kelvin offset): a loop, as it runs per node and sample. */
function roundedSeries(series: Float64Array, offset = 0, scale = 1e4): number[] {
  const out = new Array<number>(series.length);
  for (let s = 0; s < series.length; s++) out[s] = Math.round((series[s] - offset) * scale) / scale;
  return out;
}

export function solveThermal(input: ThermalSolveInput): ThermalSolveResult {
  const net = buildNetwork(input, input.substeps ?? 1);
  const heaters = input.heaters ?? [];
  const base = runPeriodic(input, net, heaters.map(() => 1), input);
  const withBus = heaters.some((h) => h.busVoltage);
  const scaleAt = (pick: 'minV' | 'maxV') => heaters.map((h) => (h.busVoltage ? (h.busVoltage[pick] / h.busVoltage.nominalV) ** 2 : 1));
  const cold = withBus ? runPeriodic(input, net, scaleAt('minV'), input) : null;
  const hot = withBus ? runPeriodic(input, net, scaleAt('maxV'), input) : null;
  const unsettled = unsettledOf(input, net, [[base, ''], [cold, ' (heaters at minimum bus voltage)'], [hot, ' (heaters at maximum bus voltage)']]);
  if (unsettled && (input.whenUnsettled ?? 'refuse') === 'refuse') {
    throw new ThermalConvergenceError(unsettled.message, input.maxOrbits ?? DEFAULT_MAX_ORBITS, unsettled.remainingK, `nodes.${input.nodes.findIndex((node) => node.name === unsettled.node)}`);
  }

  const nodes = input.nodes.map((node, i): NodeResult => {
    const free = net.freeOfNode[i];
    if (free < 0) {
      const c = node.fixedC ?? 0;
      return { name: node.name, minC: c, maxC: c, meanC: c, temperaturesC: new Array<number>(input.steps).fill(c), limits: checkLimits(node, c, c, input.margins) };
    }
    const minC = toC(Math.min(base.minK[free], cold?.minK[free] ?? Infinity, hot?.minK[free] ?? Infinity));
    const maxC = toC(Math.max(base.maxK[free], cold?.maxK[free] ?? -Infinity, hot?.maxK[free] ?? -Infinity));
    return {
      name: node.name,
      minC: round(toC(base.minK[free])),
      maxC: round(toC(base.maxK[free])),
      meanC: round(toC(base.meanK[free])),
      temperaturesC: roundedSeries(base.samplesK[free], KELVIN_OFFSET),
      limits: checkLimits(node, minC, maxC, input.margins),
    };
  });

  const voltageResult = (run: PeriodicRun, k: number, voltageV: number, free: number): HeaterVoltageResult => ({
    voltageV,
    powerW: round(run.heaterInstalledW[k]),
    dutyCycle: round(run.heaterDuty[k]),
    orbitAverageW: round(run.heaterAverageW[k]),
    peakW: round(run.heaterPeakW[k]),
    nodeMinC: round(toC(run.minK[free])),
  });
  const heaterResults = heaters.map((h, k): HeaterResult => {
    const free = net.freeOfNode[input.nodes.findIndex((node) => node.name === h.node)];
    return {
      name: h.name ?? `${h.node} heater`,
      node: h.node,
      dutyCycle: round(base.heaterDuty[k]),
      orbitAverageW: round(base.heaterAverageW[k]),
      peakW: round(base.heaterPeakW[k]),
      powerW: roundedSeries(base.heaterSamplesW[k]),
      ...(h.busVoltage && cold && hot
        ? { atMinVoltage: voltageResult(cold, k, h.busVoltage.minV, free), atMaxVoltage: voltageResult(hot, k, h.busVoltage.maxV, free) }
        : {}),
    };
  });

  const loops = loopResults(input, net, base);

  return {
    converged: unsettled === null,
    unsettled,
    orbits: Math.max(base.orbits, cold?.orbits ?? 0, hot?.orbits ?? 0),
    periodOrbits: base.periodOrbits,
    averagedOrbits: base.averagedOrbits,
    residualK: round(base.residualK, 6),
    tS: Array.from({ length: input.steps }, (_, s) => round((s * input.periodS) / input.steps, 3)),
    nodes,
    heaters: heaterResults,
    loops,
    // A last orbit still drifting proves nothing: only a settled run can pass.
    pass: unsettled === null && nodes.every((node) => node.limits.every((l) => l.pass)),
    assumptions: assumptions(input, net, withBus),
  };
}

/** The first of the runs that ran out of orbits, in the answer's words; null when all settled. */
function unsettledOf(input: ThermalSolveInput, net: ThermalNetwork, runs: [PeriodicRun | null, string][]): UnsettledRun | null {
  for (const [run, which] of runs) {
    const u = run?.unsettled;
    if (!run || !u) continue;
    const toleranceK = input.toleranceK ?? DEFAULT_TOLERANCE_K;
    return {
      node: input.nodes[net.nodeOfFree[u.free]]?.name ?? '',
      lastChangeK: round(u.lastChangeK, 6),
      remainingK: round(u.remainingK, 6),
      endC: round(toC(u.endK)),
      toleranceK,
      message: unsettledMessage(input, net, run, toleranceK, input.whenUnsettled === 'last-orbit').replace(/^Not settled/, `Not settled${which}`),
    };
  }
  return null;
}

function assumptions(input: ThermalSolveInput, net: ThermalNetwork, withBus: boolean): string[] {
  const list = [
    `Periodic steady state: orbits repeated until no node changes by more than ${input.toleranceK ?? 0.01} K over an orbit, and no node is estimated to be more than that from its periodic state (the orbit's net heat over the network's conductances and time constants).`,
    `Implicit second-order time steps (BDF2) of ${round(net.dtS, 2)} s; loads between the case's samples interpolated linearly; heaters and loop flows set at the start of each step.`,
    'Radiators see deep space at 0 K unless a sink temperature is given.',
  ];
  if (net.n && input.heaters?.some((h) => (h.control ?? 'thermostat') === 'thermostat')) {
    list.push('Thermostat cycles that do not repeat with the orbit are judged by their averages over 24 orbits.');
  }
  if (withBus) list.push('Heater power scales with the square of the bus voltage; pass/fail uses the coldest and hottest of the nominal, minimum and maximum voltage runs.');
  if ((input.loops ?? []).some((l) => l.inletC !== undefined)) {
    list.push("Each node on an open loop gives the coolant effectiveness × mass flow × specific heat × (node temperature − the loop's fixed inlet temperature).");
  }
  if (net.loops) {
    list.push(
      'A closed loop carries its coolant as one lump per element along its path (that element\'s share of the fluid); each element gives the coolant ' +
        'effectiveness × mass flow × specific heat × (node temperature − coolant temperature entering it), with effectiveness 1 − exp(−UA / (mass flow × specific heat)); ' +
        "the flow is held over each step, set from the controlled node's temperature at its start.",
    );
  }
  const m = input.margins;
  list.push(m && (m.operatingK || m.survivalK)
    ? `Limits checked with margins of ${m.operatingK ?? 0} K (operating) and ${m.survivalK ?? 0} K (survival).`
    : 'Limits checked with no margin; MIL-STD-1540 uses 11 K for a correlated passive model and 17 K before correlation (Gilmore, Spacecraft Thermal Control Handbook, ch. 19).');
  return list;
}
