// Hot and cold design cases of a mission flown in phases (issue 19 item 3): each phase is derived on
// its own date range with its attitude mode's pointing (design-cases.ts), and the hot case is the
// phase whose hot case absorbs the most (the cold case: the least) orbit-average environmental load
// on the spacecraft as a whole. The chosen case keeps which phase drove it and every phase's figure,
// so "why this case" can compare them (case-why.ts phaseFactor).
// Leaves out: dissipation in the choice -- a phase is chosen by the environment it puts on the
// spacecraft; its dissipation applies when a thermal model runs on the case. Slews between modes.
import { caseRationale } from './case-why';
import { deriveDesignCases, type CaseSurface, type DerivationInput, type DerivedCase, type ScanSummary } from './design-cases';
import { getBody } from './bodies';
import { maxBy } from './design-scan';

export interface PhaseToDerive {
  id: string;
  name: string;
  startDate: string;
  endDate: string;
  modeName: string;
  /** The mission's surfaces pointed by the phase's mode. */
  surfaces: CaseSurface[];
}

export interface PhaseDecision {
  id: string;
  name: string;
  startDate: string;
  endDate: string;
  modeName: string;
  /** Every phase's own case of this kind: its total orbit-average absorbed load, W (no margin). */
  compared: { name: string; orbitAverageAbsorbedW: number }[];
}

export interface PhasedCase extends DerivedCase {
  phaseIndex: number;
  scan: ScanSummary;
}

/** The hot and the cold case over a mission's phases; each names the phase that drove it. */
export function derivePhasedCases(input: Omit<DerivationInput, 'startDate' | 'endDate' | 'surfaces'>, phases: readonly PhaseToDerive[]): { hot: PhasedCase; cold: PhasedCase } {
  if (phases.length === 0) throw new RangeError('derivePhasedCases needs at least one phase');
  const each = phases.map((p) => deriveDesignCases({ ...input, startDate: p.startDate, endDate: p.endDate, surfaces: p.surfaces }));
  const bodyName = getBody(input.bodyId).name;
  const pick = (kind: 'hot' | 'cold'): PhasedCase => {
    const sign = kind === 'hot' ? 1 : -1;
    const index = maxBy(phases.map((_, i) => i), (i) => sign * each[i]![kind].results.total.orbitAverageAbsorbedW);
    const chosen = each[index]![kind];
    const p = phases[index]!;
    const phase: PhaseDecision = {
      id: p.id, name: p.name, startDate: p.startDate, endDate: p.endDate, modeName: p.modeName,
      compared: phases.map((q, i) => ({ name: q.name, orbitAverageAbsorbedW: each[i]![kind].results.total.orbitAverageAbsorbedW })),
    };
    const decision = { ...chosen.decision, phase };
    const rationale = caseRationale({ kind, bodyName, conditions: chosen.conditions, results: chosen.results, margins: input.margins, decision });
    return { ...chosen, decision, rationale, phaseIndex: index, scan: each[index]!.scan };
  };
  return { hot: pick('hot'), cold: pick('cold') };
}
