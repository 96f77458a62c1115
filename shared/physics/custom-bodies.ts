// A workspace's own central bodies (an asteroid, a moon the catalogue lacks) as the physics takes
// them: the same Body record as the built-in catalogue, built from what an engineer enters (GM,
// radius, optional J2, where it is - its distance from the Sun, or the planet it orbits with the
// orbit's radius and period - albedo and OLR ranges, and for a body without a thick atmosphere its
// surface temperature field's emissivity and night floor), each value with its source text.
// Where it is: a body about the Sun moves on a Keplerian ellipse with perihelion and aphelion at the
// given least and greatest distances, in the ecliptic, perihelion at ecliptic longitude 0 at J2000
// (its true orientation and phase are not asked for: the Sun's direction through the year is then
// only indicative, its distance range exact); its equator is taken in the ecliptic. A body about a
// planet keeps a circle in the planet's equator at the given radius and period (moon-ephemeris.ts
// 'mean-elements', mean longitude 0 at J2000), so the planet's shadow falls on it as on a built-in
// moon; its equator is the planet's.
// Leaves out: the true heliocentric orientation and phase of a body about the Sun, eccentric or
// inclined orbits about a planet, and any pole the engineer might know. Sources: Vallado ch. 2
// (Kepler's equation, the conic); Meeus ch. 22 (mean obliquity of J2000, from memory).
import { getBody, type AirlessSurface, type Body, type CustomBodyId, type HeliocentricOrbit, type PlanetId, type Range } from './bodies';
import { J2000_JD, OBLIQUITY_J2000_DEG } from './constants';
import { solveKepler, trueAnomalyFromEccentric } from './kepler';

/** Custom body ids: the prefix keeps them apart from the catalogue's lowercase English names. */
export const CUSTOM_BODY_PREFIX = 'custom-';
export const isCustomBodyId = (id: string): id is CustomBodyId => id.startsWith(CUSTOM_BODY_PREFIX) && id.length > CUSTOM_BODY_PREFIX.length;

/** Where a custom body is: about the Sun (distances in AU) or about one of the catalogue's planets. */
export type CustomBodyPlace =
  | { kind: 'sun'; meanAu: number; minAu: number; maxAu: number }
  | { kind: 'planet'; parentId: PlanetId; orbitRadiusKm: number; periodDays: number };

/** What an engineer enters for a body of their own (shared/api/custom-bodies.ts validates it). */
export interface CustomBodyDefinition {
  id: CustomBodyId;
  name: string;
  gmKm3S2: number;
  radiusKm: number;
  /** 0 when not known. */
  j2: number;
  place: CustomBodyPlace;
  albedo: Range;
  olrWm2: Range;
  /** Present for a body without a thick atmosphere: its IR comes from the surface temperature field. */
  airless: { emissivity: Range; nightFloorK: Range } | null;
  /** Source text per value: gmKm3S2, radiusKm, j2, place, albedo, olrWm2, emissivity, nightFloorK. */
  sources: Record<string, string>;
}

const DAYS_PER_YEAR = 365.25;
// The ecliptic's north pole in ICRF: right ascension 270 deg, declination 90 deg - obliquity.
const ECLIPTIC_POLE = { alpha0Deg: 270, alphaRateDegPerCentury: 0, delta0Deg: 90 - OBLIQUITY_J2000_DEG, deltaRateDegPerCentury: 0, terms: [] };

/** The catalogue's Body for a custom definition. */
export function customBody(def: CustomBodyDefinition): Body {
  const source = (key: string): string => def.sources[key]?.trim() || 'entered by the workspace, no source given';
  const airless: AirlessSurface | null = def.airless
    ? { ...def.airless, sources: { emissivity: source('emissivity'), nightFloorK: source('nightFloorK') } }
    : null;
  const common = {
    id: def.id, name: def.name, gmKm3S2: def.gmKm3S2, radiusKm: def.radiusKm, j2: def.j2,
    albedo: { ...def.albedo }, olrWm2: { ...def.olrWm2 }, provisional: false, airless,
    custom: true,
  };
  const sources = {
    gmKm3S2: source('gmKm3S2'), radiusKm: source('radiusKm'), j2: source('j2'), albedo: source('albedo'), olrWm2: source('olrWm2'),
  };
  if (def.place.kind === 'planet') {
    const planet = getBody(def.place.parentId);
    return {
      ...common,
      kind: 'moon', planetId: planet.planetId, parentId: planet.planetId,
      parentOrbit: {
        theory: 'mean-elements', semiMajorAxisKm: def.place.orbitRadiusKm, eccentricity: 0, periodDays: def.place.periodDays,
        meanPlane: 'parent-equator', meanLongitudeJ2000Deg: 0,
        source: `${source('place')}; a circle in ${planet.name}'s equator, mean longitude 0 at J2000 (not asked for)`,
      },
      pole: planet.pole,
      semiMajorAxisAu: planet.semiMajorAxisAu, eccentricity: planet.eccentricity, solarYearDays: planet.solarYearDays,
      heliocentric: null,
      sources: { ...sources, solarDistanceAu: `${planet.sources['solarDistanceAu'] ?? planet.name}, plus the body's own orbit (${source('place')})` },
    };
  }
  const { minAu, maxAu } = def.place;
  const aAu = (minAu + maxAu) / 2;
  const e = (maxAu - minAu) / (maxAu + minAu);
  const heliocentric: HeliocentricOrbit = { aAu, e, yearDays: DAYS_PER_YEAR * aAu ** 1.5, meanAu: def.place.meanAu, minAu, maxAu };
  return {
    ...common,
    kind: 'planet', planetId: 'earth', parentId: null, parentOrbit: null,
    pole: ECLIPTIC_POLE,
    semiMajorAxisAu: def.place.meanAu, eccentricity: e, solarYearDays: heliocentric.yearDays,
    heliocentric,
    sources: {
      ...sources,
      solarDistanceAu: `${source('place')}; a Keplerian ellipse in the ecliptic through the least and greatest distances, perihelion at longitude 0 at J2000 (not asked for)`,
    },
  };
}

/**
 * Heliocentric ecliptic longitude, latitude (rad) and distance (AU) of a body on a HeliocentricOrbit
 * at a Julian ephemeris date: Kepler's equation for the mean anomaly since perihelion at J2000.
 */
export function keplerHeliocentric(orbit: HeliocentricOrbit, jde: number): { lon: number; lat: number; range: number } {
  const meanAnomaly = ((2 * Math.PI) / orbit.yearDays) * (jde - J2000_JD);
  const eccentric = solveKepler(meanAnomaly % (2 * Math.PI), orbit.e);
  const nu = trueAnomalyFromEccentric(eccentric, orbit.e);
  return { lon: nu, lat: 0, range: orbit.aAu * (1 - orbit.e * Math.cos(eccentric)) };
}
