// Hot and cold cases of a lunar orbiter: the surface temperature field's parameters at the ends of
// their published ranges, named in "why this case".
import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { deriveDesignCases, type CaseSurface } from './design-cases';
import { defaultMargins } from './design-environment';

// DOMAIN.md optical properties, BOL [S: F Table 11.3]
const whiteSilicone = { name: 'white silicone paint', absorptivityBol: 0.26, emissivityBol: 0.83, absorptivityEol: 0.5, emissivityEol: 0.83, source: 'F Table 11.3' };
const moon = getBody('moon');
const radiator: CaseSurface = { name: 'nadir radiator', normal: 'nadir', areaM2: 0.4, material: whiteSilicone };

describe('design cases of a lunar orbiter (100 km polar)', () => {
  const d = deriveDesignCases({
    bodyId: 'moon', orbit: { semiMajorAxisKm: moon.radiusKm + 100, eccentricity: 0, inclinationDeg: 90, raanDeg: 0, argPeriapsisDeg: 0 },
    orbitEpoch: '2028-01-01T00:00:00Z', startDate: '2028-01-01', endDate: '2028-03-31', surfaces: [radiator], margins: defaultMargins(),
  });

  it('hot takes the high ends of emissivity and night floor, cold the low ends (published ranges in bodies.ts: Vasavada et al. 2012, Williams et al. 2017; from memory)', () => {
    expect(d.hot.conditions.surfaceField).toEqual({ emissivity: moon.airless?.emissivity.max, nightFloorK: moon.airless?.nightFloorK.max });
    expect(d.cold.conditions.surfaceField).toEqual({ emissivity: moon.airless?.emissivity.min, nightFloorK: moon.airless?.nightFloorK.min });
    // a white radiator (alpha < epsilon) is hotter under darker ground, which emits more than it reflects
    expect(d.hot.conditions.albedo).toBe(moon.albedo.min);
    expect(d.hot.rationale.join(' ')).toMatch(/surface temperature field: Bond albedo 0\.070.*subsolar 3\d\d K.*night floor 120 K/);
  });

  it('the cold case\'s radiator sees a few W/m^2 over the night side, not a uniform OLR (LRO Diviner night 95-100 K; from memory)', () => {
    const ir = d.cold.results.surfaces[0]!.series.irWm2;
    expect(Math.min(...ir)).toBeLessThan(6);
    // the hot case passes near the subsolar point: about S (1 - A) F there
    expect(Math.max(...d.hot.results.surfaces[0]!.series.irWm2)).toBeGreaterThan(600);
  });
});
