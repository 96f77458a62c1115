// The words a load case keeps beside its numbers: its assumptions, its attitude and where its albedo
// and OLR come from. Built from the case's own conditions, so what a case says is what it computed.
import type { Body } from './bodies';
import { caseModelAssumptions, type CaseConditions, type CaseSurface } from './design-cases';
import { designPairs } from './design-environment';
import { pointingAssumptions, pointingWords } from './pointing-words';

/** A case's assumptions: the fixed ones and the albedo, IR and sampling models its conditions use. */
export const caseAssumptions = (conditions: CaseConditions): string[] => [
  'eclipseFraction counts umbra plus half of penumbra (conical shadow, Sun as a uniform disk, no atmosphere)',
  ...caseModelAssumptions(conditions),
  ...pointingAssumptions(conditions.surfaces.map((s) => s.normal)),
  'surfaces are flat plates fixed in the local orbital frame (x ram, y orbit normal, z zenith), pointed at the Sun, fixed in inertial space, turned by Sun-tracking drives, on a spinner (loads averaged over a turn) or on a yaw-steered spacecraft; no shadowing between them',
  'the worst Sun distance and the worst beta are combined even when they fall on different days (conservative)',
  'the Sun is held fixed over the orbit; tS counts from periapsis (from the ascending node for a circular orbit)',
];

/** How the surfaces are pointed, in words (pointing-words.ts), as a case records its attitude. */
export const attitudeText = (list: readonly CaseSurface[]): string =>
  `surface pointing: ${list.map((s) => `${s.name} ${pointingWords(s.normal)}`).join('; ')}`;

/**
 * A single case's albedo and OLR in words: where they come from (the body's nominal values unless
 * the user gave either) and the rationale line, which names the body's design pairs beside them.
 */
/** A case's `environmentSource` when the user gave its albedo or OLR (a new revision keeps them). */
export const USER_GIVEN_SOURCE = 'entered by the user';

export function pairWords(body: Body, inclinationDeg: number, albedo: number, olrWm2: number, userGiven: boolean): { source: string; rationale: string } {
  const pairs = designPairs(body, inclinationDeg);
  return {
    source: userGiven ? USER_GIVEN_SOURCE : `${body.name} nominal: ${body.sources['albedo'] ?? ''}`,
    rationale: `albedo ${albedo.toFixed(2)} with OLR ${olrWm2.toFixed(0)} W/m², ${userGiven ? 'given by the user' : `${body.name}'s nominal values; design pairs: hot ${pairs.hot.albedo}/${pairs.hot.olrWm2.toFixed(0)}, cold ${pairs.cold.albedo}/${pairs.cold.olrWm2.toFixed(0)}`}`,
  };
}
