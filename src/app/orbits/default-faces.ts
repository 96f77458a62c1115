// What the environment tab shows before a mission has surfaces: the incident fluxes on the six faces
// of a box flying in the local orbital frame and on a plate facing the Sun, asked of the stateless
// compute route (API.md "Environment computation") with the saved orbit, its epoch and the same
// sampling as the saved orbit's answer, so the plots line up with the orbit view sample by sample.
import type { EnvironmentRequestInput, EnvironmentResponse } from '../../../shared/api/environment';
import type { MissionDetail, Orbit } from '../../../shared/api/missions';

/** The faces, in the local orbital frame's axes (x toward ram, y toward the orbit normal, z toward zenith). */
export const DEFAULT_FACES = [
  { name: 'Ram face (+x)', normal: 'ram' },
  { name: 'Wake face (−x)', normal: 'wake' },
  { name: 'Orbit-normal face (+y)', normal: 'orbit-normal' },
  { name: 'Anti-orbit-normal face (−y)', normal: 'anti-orbit-normal' },
  { name: 'Zenith face (+z)', normal: 'zenith' },
  { name: 'Nadir face (−z)', normal: 'nadir' },
  { name: 'Sun-pointing plate', normal: 'sun' },
] as const;

/**
 * The compute request for the default faces. Only incident fluxes are shown, so each face is 1 m²
 * with absorptivity and emissivity 1 (its "absorbed" is then simply the incident total).
 */
export function defaultFacesRequest(
  mission: Pick<MissionDetail, 'bodyId'>,
  orbit: Pick<Orbit, 'semiMajorAxisKm' | 'eccentricity' | 'inclinationDeg' | 'raanDeg' | 'argPeriapsisDeg' | 'epoch'>,
  sampling: EnvironmentResponse['sampling'],
  steps = 360,
): EnvironmentRequestInput {
  return {
    bodyId: mission.bodyId,
    orbit: {
      semiMajorAxisKm: orbit.semiMajorAxisKm,
      eccentricity: orbit.eccentricity,
      inclinationDeg: orbit.inclinationDeg,
      raanDeg: orbit.raanDeg,
      argPeriapsisDeg: orbit.argPeriapsisDeg,
    },
    epoch: orbit.epoch,
    steps,
    ...(sampling ? { sampling } : {}),
    surfaces: DEFAULT_FACES.map((f) => ({ name: f.name, normal: f.normal, areaM2: 1, absorptivity: 1, emissivity: 1 })),
  };
}

/** Each face's orbit-average incident fluxes, W/m², and their total. */
export function faceAverages(answer: EnvironmentResponse): { name: string; solarWm2: number; albedoWm2: number; irWm2: number; totalWm2: number }[] {
  return answer.orbitAverage.surfaces.map((s) => ({
    name: s.name,
    solarWm2: s.solarWm2,
    albedoWm2: s.albedoWm2,
    irWm2: s.irWm2,
    totalWm2: s.solarWm2 + s.albedoWm2 + s.irWm2,
  }));
}
