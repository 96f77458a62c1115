import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { defineOrbit } from './orbit-definition';
import { orbitWarnings, rocheLimitKm, sphereOfInfluenceKm } from './orbit-warnings';

describe('orbits that make little sense are warned about, not refused', () => {
  it('gives Earth a sphere of influence of about 925,000 km and the Moon about 66,000 km (Curtis, Orbital Mechanics, table 8.1 / sect. 8.5; from memory)', () => {
    expect(sphereOfInfluenceKm(getBody('earth')) / 925000).toBeCloseTo(1, 1);
    expect(sphereOfInfluenceKm(getBody('moon')) / 66200).toBeCloseTo(1, 1);
  });

  it('warns of a Europa orbit reaching beyond Europa\'s sphere of influence, naming the radius (Laplace a (m/M)^(2/5), closed form)', () => {
    const europa = getBody('europa');
    const radius = sphereOfInfluenceKm(europa);
    expect(radius).toBeGreaterThan(9000);
    expect(radius).toBeLessThan(10500);
    const far = orbitWarnings(europa, defineOrbit({ periapsisAltitudeKm: 200, apoapsisAltitudeKm: 20000 }, europa));
    expect(far).toHaveLength(1);
    expect(far[0]).toContain(`${Math.round(radius).toLocaleString('en-US')} km`);
    expect(far[0]).toContain('Jupiter');
    expect(orbitWarnings(europa, defineOrbit({ periapsisAltitudeKm: 100, apoapsisAltitudeKm: 100 }, europa))).toEqual([]);
  });

  it('warns of a Jupiter orbit with e = 0.94 crossing the Galilean moons\' orbits (closed form: periapsis a(1-e), apoapsis a(1+e))', () => {
    const jupiter = getBody('jupiter');
    const orbit = defineOrbit({ semiMajorAxisKm: 2_000_000, eccentricity: 0.94 }, jupiter);
    const warnings = orbitWarnings(jupiter, orbit);
    for (const name of ['Io', 'Europa', 'Ganymede', 'Callisto']) expect(warnings.some((w) => w.includes(`crosses ${name}'s orbit`)), name).toBe(true);
  });

  it('puts Saturn\'s Roche limit for ice near 2.2 Saturn radii, where the main rings end (Murray & Dermott ch. 4; from memory), and warns inside it', () => {
    const saturn = getBody('saturn');
    expect(rocheLimitKm(saturn) / saturn.radiusKm).toBeGreaterThan(1.9);
    expect(rocheLimitKm(saturn) / saturn.radiusKm).toBeLessThan(2.4);
    const low = orbitWarnings(saturn, defineOrbit({ periapsisAltitudeKm: 20000, apoapsisAltitudeKm: 30000 }, saturn));
    expect(low.some((w) => w.includes('Roche limit'))).toBe(true);
  });

  it('says nothing of an ordinary low Earth orbit', () => {
    const earth = getBody('earth');
    expect(orbitWarnings(earth, defineOrbit({ periapsisAltitudeKm: 550, apoapsisAltitudeKm: 550 }, earth))).toEqual([]);
  });
});
