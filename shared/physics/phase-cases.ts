// Hot and cold design cases of a mission flown in phases (issue 19 item 3): each phase is derived on
// its own date range with its attitude mode's pointing (design-cases.ts). A case is the worst
// combination of environment and dissipation (DOMAIN.md "Cases": the hot case with maximum
// dissipation, the cold case with the minimum), so the phases are compared by the heat each puts into
// the spacecraft: its own case's orbit-average absorbed load on the mission's surfaces (no margin)
// plus the orbit-average dissipation of the nodes the phase names. The hot case is the phase with
// the most, the cold case the phase with the least; a phase of modest environment and high
// dissipation can drive the hot case. The survival cold case dissipates the same in every phase
// (each node's least over the phases), so its phase is the one with the least absorbed load alone.
// The chosen case keeps which phase drove it and every phase's figures, so "why this case" can
// compare them (case-why.ts phaseFactor).
// Leaves out: a node a phase does not name is counted 0 W in that phase's total (a thermal run gives
// it its model's own value; the case is not tied to a model). Slews between modes.
import { caseRationale, rankedW, type SurvivalDecision } from './case-why';
import { deriveDesignCases, type CaseSurface, type DerivationInput, type DerivedCase, type ScanSummary } from './design-cases';
import { getBody } from './bodies';
import { maxBy } from './design-scan';
import { round } from './rounding';
import type { DissipationSchedule } from './thermal-model';
import { orbitAverageDissipationW } from './thermal-network';

/** A node's dissipation as a phase gives it: a constant in W or an on/off schedule. */
export interface PhaseNodeDissipation {
  node: string;
  dissipationW: number | DissipationSchedule;
}

export interface PhaseToDerive {
  id: string;
  name: string;
  startDate: string;
  endDate: string;
  modeName: string;
  /** The mission's surfaces pointed by the phase's mode. */
  surfaces: CaseSurface[];
  /** The nodes the phase names and their dissipation. */
  dissipation: readonly PhaseNodeDissipation[];
}

/** One phase's figures beside the others': its own case of this kind. */
export interface PhaseFigures {
  name: string;
  /** Total orbit-average absorbed load, W (no margin). */
  orbitAverageAbsorbedW: number;
  /** Orbit-average dissipation of the nodes the phase names, W; absent on cases derived before dissipation counted. */
  dissipationW?: number | undefined;
  /** Nodes another phase names and this one does not (counted 0 W here). */
  notNamed?: string[] | undefined;
}

/**
 * How the phases were ranked: `heat` by absorbed load plus dissipation (hot and cold cases), `environment`
 * by absorbed load alone (the survival cold case, whose dissipation is the same in every phase; and
 * cases derived before dissipation counted, which carry no `by`).
 */
export type PhaseRanking = 'heat' | 'environment';

export interface PhaseDecision {
  id: string;
  name: string;
  startDate: string;
  endDate: string;
  modeName: string;
  by?: PhaseRanking | undefined;
  /** Every phase's own case of this kind. */
  compared: PhaseFigures[];
}

export interface PhasedCase extends DerivedCase {
  phaseIndex: number;
  scan: ScanSummary;
}

/** The orbit-average dissipation of the nodes a phase names, over an orbit of `periodS` (as a thermal run applies it). */
export const phaseDissipationW = (dissipation: readonly PhaseNodeDissipation[], periodS: number): number =>
  dissipation.reduce((sum, d) => sum + orbitAverageDissipationW(d.dissipationW, periodS), 0);

/**
 * The hot and the cold case over a mission's phases, each the phase with the most (least) heat into
 * the spacecraft, and the survival cold case's phase (the least absorbed load); each names its phase.
 */
export function derivePhasedCases(
  input: Omit<DerivationInput, 'startDate' | 'endDate' | 'surfaces'>,
  phases: readonly PhaseToDerive[],
): { hot: PhasedCase; cold: PhasedCase; survival: PhasedCase } {
  if (phases.length === 0) throw new RangeError('derivePhasedCases needs at least one phase');
  const each = phases.map((p) => deriveDesignCases({ ...input, startDate: p.startDate, endDate: p.endDate, surfaces: p.surfaces }));
  const bodyName = getBody(input.bodyId).name;
  const named = new Set(phases.flatMap((p) => p.dissipation.map((d) => d.node)));
  const pick = (kind: 'hot' | 'cold', by: PhaseRanking): PhasedCase => {
    const compared: PhaseFigures[] = phases.map((q, i) => {
      const own = each[i]![kind].results;
      const figures: PhaseFigures = { name: q.name, orbitAverageAbsorbedW: own.total.orbitAverageAbsorbedW };
      if (by === 'environment') return figures;
      const missing = [...named].filter((node) => !q.dissipation.some((d) => d.node === node));
      return { ...figures, dissipationW: round(phaseDissipationW(q.dissipation, own.periodS), 3), ...(missing.length > 0 ? { notNamed: missing } : {}) };
    });
    const sign = kind === 'hot' ? 1 : -1;
    const index = maxBy(phases.map((_, i) => i), (i) => sign * rankedW(compared[i]!, by));
    const chosen = each[index]![kind];
    const p = phases[index]!;
    const phase: PhaseDecision = { id: p.id, name: p.name, startDate: p.startDate, endDate: p.endDate, modeName: p.modeName, by, compared };
    const decision = { ...chosen.decision, phase };
    const rationale = caseRationale({ kind, bodyName, conditions: chosen.conditions, results: chosen.results, margins: input.margins, decision });
    return { ...chosen, decision, rationale, phaseIndex: index, scan: each[index]!.scan };
  };
  return { hot: pick('hot', 'heat'), cold: pick('cold', 'heat'), survival: pick('cold', 'environment') };
}

/** The least a dissipation gives over its cycle: a constant, or the lower of an on/off schedule's levels. */
export function leastDissipationW(d: PhaseNodeDissipation['dissipationW']): number {
  if (typeof d === 'number') return d;
  if (d.onS >= d.periodS) return d.onW;
  return d.onS <= 0 ? (d.offW ?? 0) : Math.min(d.onW, d.offW ?? 0);
}

/** Survival: each node a phase names keeps the least any phase gives it (and that phase's name); other nodes none. */
export function survivalDissipation(phases: readonly { name: string; dissipation: readonly PhaseNodeDissipation[] }[]): SurvivalDecision {
  const least = new Map<string, { node: string; dissipationW: number; phase: string }>();
  for (const phase of phases) {
    for (const d of phase.dissipation) {
      const w = leastDissipationW(d.dissipationW);
      const was = least.get(d.node);
      if (!was || w < was.dissipationW) least.set(d.node, { node: d.node, dissipationW: w, phase: phase.name });
    }
  }
  return { nodes: [...least.values()] };
}
