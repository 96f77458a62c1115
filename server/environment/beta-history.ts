// The beta history over a date range (POST /environment/beta-history): the mission sweep's
// geometry without loads, with the assumptions it rests on.
import type { z } from 'zod';
import type { betaHistoryRequest, BetaHistoryResponse } from '../../shared/api/environment';
import { DAY_MS } from '../../shared/physics/constants';
import { sweepMission } from '../../shared/physics/mission-sweep';


const BETA_HISTORY_ASSUMPTIONS = [
  'the node and the periapsis drift at their first-order J2 secular rates from the orbit epoch; size, shape and inclination stay fixed',
  'the Sun from VSOP87 and the IAU pole of the body; a moon sees the Sun from its planet',
  'eclipseFraction counts umbra plus half of penumbra (conical shadow, Sun as a uniform disk, no atmosphere), the Sun held fixed over each orbit',
];

export function betaHistory(request: z.output<typeof betaHistoryRequest>): BetaHistoryResponse {
  const fromMs = Date.parse(request.from);
  const sweep = sweepMission({
    bodyId: request.bodyId,
    orbit: request.orbit,
    epochStart: new Date(fromMs),
    orbitEpoch: request.epoch ?? new Date(fromMs),
    days: (Date.parse(request.to) - fromMs) / DAY_MS,
    stepDays: request.stepDays,
  });
  return {
    bodyId: sweep.bodyId,
    periodS: sweep.periodS,
    nodalRateDegPerDay: sweep.nodalRateDegPerDay,
    apsidalRateDegPerDay: sweep.apsidalRateDegPerDay,
    items: sweep.rows.map((r) => ({
      date: r.date, betaDeg: r.betaDeg, raanDeg: r.raanDeg, solarDistanceAu: r.solarDistanceAu, solarFluxWm2: r.solarFluxWm2,
      eclipseFraction: r.eclipseFraction, eclipseDurationS: r.eclipseDurationS,
    })),
    minBetaDeg: sweep.minBetaDeg,
    maxBetaDeg: sweep.maxBetaDeg,
    assumptions: BETA_HISTORY_ASSUMPTIONS,
  };
}
