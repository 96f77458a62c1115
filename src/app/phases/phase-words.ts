import type { SurfaceNormal } from '../../../shared/api/missions';
import type { AttitudeMode, PhaseDissipation } from '../../../shared/api/phases';
import { describeNormal } from '../surfaces/surface-normals';

/** A phase's dissipation of one node in words: "18 W" or its on/off schedule. */
export function dissipationText(d: PhaseDissipation['dissipationW']): string {
  if (typeof d === 'number') return `${d} W`;
  return `${d.onW} W for ${d.onS} s every ${d.periodS} s${d.offW ? `, else ${d.offW} W` : ''}`;
}

/** A mode's pointing in words: each surface it points and where; "as defined" when it points none. */
export function pointingText(mode: AttitudeMode): string {
  const listed = mode.pointing.map((p) => `${p.surfaceName} → ${describeNormal(p.normal as SurfaceNormal)}`);
  const own = listed.length === 0 ? 'every surface as defined' : `${listed.join('; ')}; the others as defined`;
  return mode.yawSteering ? `${own}; yaw steered` : own;
}
