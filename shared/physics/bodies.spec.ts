import { describe, expect, it } from 'vitest';
import { bodyIds, bodySummaries, equilibriumOlrWm2, getBody } from './bodies';
import { PhysicsError } from './physics-error';

describe('body catalogue', () => {
  it('every body names a source for each value the API serves', () => {
    for (const b of bodySummaries()) {
      for (const field of ['gmKm3S2', 'radiusKm', 'j2', 'pole', 'albedo', 'olrWm2', 'solarDistanceAu']) {
        expect(b.sources[field], `${b.id}.${field}`).toMatch(/\w{4,}/);
      }
      expect(b.albedo.min).toBeLessThanOrEqual(b.albedo.nominal);
      expect(b.olrWm2.nominal).toBeLessThanOrEqual(b.olrWm2.max);
      expect(b.solarDistanceAu.min).toBeLessThan(b.solarDistanceAu.max);
    }
    expect(bodySummaries().map((b) => b.id)).toEqual([...bodyIds]);
  });

  it('Earth\'s design ranges are marked provisional (NASA/TM-2001-211221 tables not confirmed, DOMAIN.md)', () => {
    const earth = bodySummaries().find((b) => b.id === 'earth');
    expect(earth?.provisional).toBe(true);
    expect(earth?.sources['albedo']).toMatch(/PROVISIONAL/);
  });

  it('energy-balance OLR at 1 AU with albedo 0.3 is about 238 W/m^2 ((1-A) S/4; DOMAIN.md: ~240 W/m^2 at 24 h)', () => {
    expect(equilibriumOlrWm2(0.3, 1)).toBeCloseTo(238.2, 1);
    expect(getBody('earth').olrWm2.nominal).toBeGreaterThan(230);
    expect(getBody('earth').olrWm2.nominal).toBeLessThan(245);
  });

  it('surface gravity GM/R^2 of Earth is 9.798 m/s^2 and of Mars 3.71 m/s^2 (NASA fact sheets; from memory)', () => {
    const g = (id: string) => (getBody(id).gmKm3S2 / getBody(id).radiusKm ** 2) * 1000;
    expect(g('earth')).toBeCloseTo(9.798, 2);
    expect(g('mars')).toBeCloseTo(3.71, 1);
  });

  it('an unknown body is refused with the list of known ones', () => {
    expect(() => getBody('pluto')).toThrow(PhysicsError);
    expect(() => getBody('pluto')).toThrow(/"pluto" is not a body.*earth/);
  });
});
