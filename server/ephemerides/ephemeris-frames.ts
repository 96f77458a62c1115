// Which declared frames an ephemeris may be in: inertial, ICRF-aligned, centred on the mission's
// body (DOMAIN.md "Ephemerides"). GCRF is the ICRF centred on the Earth, so only the Earth takes it.
import { ephemerisFrames, type EphemerisFrame } from '../../shared/api/ephemerides';
import type { Body } from '../../shared/physics/bodies';

export function framesFor(body: Body): readonly EphemerisFrame[] {
  return body.id === 'earth' ? ephemerisFrames : ephemerisFrames.filter((f) => f !== 'GCRF');
}

/** The frame in upper case when accepted for the body, or the sentence saying why not. */
export function checkFrame(body: Body, declared: string): { frame: EphemerisFrame } | { refused: string } {
  const upper = declared.trim().toUpperCase();
  const allowed = framesFor(body);
  const found = allowed.find((f) => f === upper);
  if (found) return { frame: found };
  if (upper === 'GCRF') return { refused: `GCRF is centred on the Earth; this mission is about ${body.name}: use ICRF (centred on ${body.name})` };
  return { refused: `"${declared}" is not an inertial frame Eclipta reads; use one of ${allowed.join(', ')} (centred on ${body.name})` };
}

/** An OEM CENTER_NAME names the mission's body (EARTH, MOON, MARS, …). */
export const centreMatches = (body: Body, centre: string): boolean => {
  const c = centre.trim().toUpperCase();
  return c === body.id.toUpperCase() || c === body.name.toUpperCase();
};
