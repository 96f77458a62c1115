// Predicted temperatures against a node's limits with the project's margins: the prediction must
// stay at or above min + margin and at or below max - margin (DOMAIN.md "Margins"). The margin is
// the caller's choice; MIL-STD-1540's 11 K / 17 K are in thermal-model.ts with their source.
import type { LimitCheck, ThermalMargins, ThermalNodeInput } from './thermal-model';

function check(kind: LimitCheck['kind'], minC: number | undefined, maxC: number | undefined, marginK: number,
  predictedMinC: number, predictedMaxC: number): LimitCheck | null {
  if (minC === undefined && maxC === undefined) return null;
  const coldMarginK = minC === undefined ? null : predictedMinC - (minC + marginK);
  const hotMarginK = maxC === undefined ? null : maxC - marginK - predictedMaxC;
  return {
    kind,
    minC: minC ?? null,
    maxC: maxC ?? null,
    marginK,
    coldMarginK,
    hotMarginK,
    pass: (coldMarginK === null || coldMarginK >= 0) && (hotMarginK === null || hotMarginK >= 0),
  };
}

export function checkLimits(node: ThermalNodeInput, predictedMinC: number, predictedMaxC: number, margins: ThermalMargins = {}): LimitCheck[] {
  return [
    check('operating', node.minC, node.maxC, margins.operatingK ?? 0, predictedMinC, predictedMaxC),
    check('survival', node.survivalMinC, node.survivalMaxC, margins.survivalK ?? 0, predictedMinC, predictedMaxC),
  ].filter((c): c is LimitCheck => c !== null);
}
