// Orbits that make little physical sense, said without refusing them: beyond the central body's
// sphere of influence (another body's gravity rules there, so the two-body orbit cannot hold), across
// the orbits of the planet's moons, or inside a giant planet's Roche limit where rings and debris orbit.
// Sources: Laplace's sphere of influence r = a (m / M)^(2/5) (Vallado ch. 12; Curtis, Orbital
// Mechanics for Engineering Students, sect. 8.5); the fluid-body Roche limit d = 2.44 R (rho_planet /
// rho_moon)^(1/3) for an icy body of 1000 kg/m^3 (Roche 1849, as in Murray & Dermott, Solar System
// Dynamics, ch. 4; from memory). GM of the Sun 1.32712440018e11 km^3/s^2 (IAU 2015, from memory).
import { allBodies, getBody, type Body } from './bodies';
import { AU_KM } from './constants';
import type { Orbit } from './orbit-definition';

const GM_SUN_KM3_S2 = 1.32712440018e11;
/** Gravitational constant, km^3 / (kg s^2). */
const G_KM3_KG_S2 = 6.6743e-20;
const ICY_MOON_DENSITY_KG_M3 = 1000;

const km = (x: number): string => `${Math.round(x).toLocaleString('en-US')} km`;

/** Laplace's sphere of influence of a body about what it orbits (the Sun for a planet, its planet for a moon), km. */
export function sphereOfInfluenceKm(body: Body): number {
  if (body.parentOrbit && body.parentId) {
    return body.parentOrbit.semiMajorAxisKm * (body.gmKm3S2 / getBody(body.parentId).gmKm3S2) ** 0.4;
  }
  return body.semiMajorAxisAu * AU_KM * (body.gmKm3S2 / GM_SUN_KM3_S2) ** 0.4;
}

/** The planet's fluid-body Roche limit for an icy body of 1000 kg/m^3, km. */
export function rocheLimitKm(planet: Body): number {
  const volumeM3 = (4 / 3) * Math.PI * (planet.radiusKm * 1000) ** 3;
  const densityKgM3 = planet.gmKm3S2 / G_KM3_KG_S2 / volumeM3;
  return 2.44 * planet.radiusKm * (densityKgM3 / ICY_MOON_DENSITY_KG_M3) ** (1 / 3);
}

/** Plain-words warnings for `orbit` about `body`; [] for an orbit that makes sense. */
export function orbitWarnings(body: Body, orbit: Orbit): string[] {
  const warnings: string[] = [];
  const soi = sphereOfInfluenceKm(body);
  const ruler = body.parentId ? getBody(body.parentId).name : 'the Sun';
  if (orbit.apoapsisKm > soi) {
    warnings.push(
      `the orbit reaches ${km(orbit.apoapsisKm)} from ${body.name}'s centre, beyond its sphere of influence (${km(soi)}, ` +
      `a (m/M)^(2/5)): there ${ruler}'s gravity dominates and this orbit about ${body.name} cannot hold as given; results are indicative only`,
    );
  }
  if (body.kind === 'planet') {
    const moons = allBodies().filter((m) => m.parentId === body.id && m.parentOrbit);
    for (const moon of moons) {
      const o = moon.parentOrbit!;
      const [inner, outer] = [o.semiMajorAxisKm * (1 - o.eccentricity), o.semiMajorAxisKm * (1 + o.eccentricity)];
      if (orbit.periapsisKm <= outer && orbit.apoapsisKm >= inner) {
        warnings.push(`the orbit (${km(orbit.periapsisKm)} to ${km(orbit.apoapsisKm)} from ${body.name}'s centre) crosses ${moon.name}'s orbit (${km(o.semiMajorAxisKm)}): close passes perturb it and are not modelled`);
      }
    }
    // Every giant planet has rings; a rocky planet's Roche limit says nothing useful about an orbiter.
    if (body.radiusKm > 20000) {
      const roche = rocheLimitKm(body);
      if (orbit.periapsisKm < roche) {
        warnings.push(`periapsis (${km(orbit.periapsisKm)} from the centre) is inside ${body.name}'s Roche limit (${km(roche)} for an icy body), where rings and debris orbit`);
      }
    }
  }
  return warnings;
}
