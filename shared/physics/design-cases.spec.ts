// Hot and cold case derivation against hand calculations from published values.
import { describe, expect, it } from 'vitest';
import { getBody } from './bodies';
import { deriveDesignCases, type CaseSurface } from './design-cases';
import { defaultMargins } from './design-environment';

// DOMAIN.md optical properties, BOL [S: F Table 11.3, G App. A]; EOL white silicone 0.4-0.6 [M]
const whiteSilicone = { name: 'white silicone paint', absorptivityBol: 0.26, emissivityBol: 0.83, absorptivityEol: 0.5, emissivityEol: 0.83, source: 'F Table 11.3' };
const gaas = { name: 'GaAs solar cells', absorptivityBol: 0.88, emissivityBol: 0.8, absorptivityEol: 0.9, emissivityEol: 0.8, source: 'F Table 11.3' };

const earth = getBody('earth');
const R = earth.radiusKm;
const leo = (altitudeKm: number, inclinationDeg: number) => ({ semiMajorAxisKm: R + altitudeKm, eccentricity: 0, inclinationDeg, raanDeg: 40, argPeriapsisDeg: 0 });
const derive = (surfaces: CaseSurface[], startDate: string, endDate: string, altitudeKm = 500, inclinationDeg = 51.6) =>
  deriveDesignCases({ bodyId: 'earth', orbit: leo(altitudeKm, inclinationDeg), orbitEpoch: '2028-01-01T00:00:00Z', startDate, endDate, surfaces, margins: defaultMargins() });

const nadirRadiator: CaseSurface = { name: 'nadir radiator', normal: 'nadir', areaM2: 0.4, material: whiteSilicone };
const sidePanel: CaseSurface = { name: 'side panel', normal: 'orbit-normal', areaM2: 0.5, material: gaas };
const sunPanel: CaseSurface = { name: 'sun panel', normal: 'sun', areaM2: 1, material: gaas };

describe('deriveDesignCases over a whole year (Earth, 500 km, 51.6 deg)', () => {
  const d = derive([nadirRadiator, sidePanel], '2028-01-01', '2028-12-31');

  it('takes perihelion flux 1408 W/m^2 for hot and aphelion 1317 W/m^2 for cold (DOMAIN.md: G Table 2.1 scaled to TSI 1361)', () => {
    expect(d.scan.spansFullYear).toBe(true);
    // 1361 / (1 - 0.0167)^2 = 1407.7; 1361 / (1 + 0.0167)^2 = 1316.6 (eccentricity from the JPL mean elements)
    expect(d.hot.results.solarFluxWm2).toBeCloseTo(1407.7, 0);
    expect(d.cold.results.solarFluxWm2).toBeCloseTo(1316.6, 0);
    expect(d.hot.rationale[0]).toMatch(/solar flux 1408 W\/m² at 0\.9833 AU \(perihelion/);
    expect(d.cold.rationale[0]).toMatch(/solar flux 1317 W\/m² at 1\.0167 AU \(aphelion/);
  });

  it("uses Earth's provisional hot and cold sets: albedo 0.50 with OLR 350, albedo 0.06 with OLR 110 (DOMAIN.md short-averaging extremes [M], not TM pairs)", () => {
    expect([d.hot.conditions.albedo, d.hot.conditions.olrWm2]).toEqual([0.5, 350]);
    expect([d.cold.conditions.albedo, d.cold.conditions.olrWm2]).toEqual([0.06, 110]);
    expect(d.hot.provisional).toBe(true);
    expect(d.hot.environmentSource).toMatch(/PROVISIONAL/);
  });

  it('uses EOL absorptivity in the hot case and BOL in the cold case (DOMAIN.md "Cases")', () => {
    expect(d.hot.results.surfaces[0]?.absorptivity).toBe(0.5);
    expect(d.cold.results.surfaces[0]?.absorptivity).toBe(0.26);
    expect(d.hot.rationale.join('\n')).toMatch(/EOL absorptivity 0\.50 and emissivity 0\.83 for white silicone paint/);
    expect(d.cold.rationale.join('\n')).toMatch(/BOL absorptivity 0\.26/);
  });

  it('gives a nadir plate the planetary IR A eps OLR (R/(R+h))^2 (Howell catalogue, plate facing the body)', () => {
    const F = (R / (R + 500)) ** 2;
    expect(d.hot.results.surfaces[0]?.orbitAverage.irW).toBeCloseTo(0.4 * 0.83 * 350 * F, 2);
    expect(d.cold.results.surfaces[0]?.orbitAverage.irW).toBeCloseTo(0.4 * 0.83 * 110 * F, 2);
  });

  it('puts the orbit-normal panel hottest at the largest beta, with no eclipse above beta* = asin(R/(R+h)) (Gilmore ch. 2)', () => {
    const side = d.hot.surfaceDrivers[1];
    // |beta| <= i + obliquity = 51.6 + 23.44 = 75.0 deg; beta* = asin(6378.137 / 6878.137) = 68.0 deg
    expect(side?.betaDeg).toBeGreaterThan(70);
    expect(side?.betaDeg).toBeLessThanOrEqual(75.05);
    expect(d.scan.betaMaxDeg).toBeLessThanOrEqual(75.05);
  });

  it('applies the 25 % heat-load margin up for hot and down for cold (MIL-STD-1540 via Gilmore ch. 19)', () => {
    const hot = d.hot.results.surfaces[0]!.orbitAverage;
    const cold = d.cold.results.surfaces[0]!.orbitAverage;
    expect(hot.absorbedWithMarginW).toBeCloseTo(hot.absorbedW * 1.25, 3);
    expect(cold.absorbedWithMarginW).toBeCloseTo(cold.absorbedW * 0.75, 3);
    expect(defaultMargins().temperatureMarginC).toBe(17);
  });
});

describe('deriveDesignCases with a Sun-pointed array', () => {
  // 400 km: longest eclipse about 36 min, no eclipse above beta* about 70.2 deg (DOMAIN.md [calc], Gilmore ch. 2 formulas)
  const d = derive([sunPanel], '2028-01-01', '2028-12-31', 400, 51.6);

  it('picks a near-zero beta with the longest eclipses for cold (about 36 min at 400 km)', () => {
    const c = d.cold.results;
    // Cylindrical shadow f = acos(sqrt(h^2 + 2Rh) / ((R+h) cos beta)) / pi (Gilmore ch. 2); the conical shadow with half the penumbra is within 1 %
    const h = 400;
    const f = Math.acos(Math.sqrt(h * h + 2 * R * h) / ((R + h) * Math.cos((c.betaDeg * Math.PI) / 180))) / Math.PI;
    expect(c.eclipseDurationS / (f * c.periodS)).toBeCloseTo(1, 1);
    expect(c.eclipseDurationS / 60).toBeGreaterThan(35);
    expect(c.eclipseDurationS / 60).toBeLessThan(37.5);
    // the smallest total absorbed load sits within a few degrees of beta 0, where eclipses are longest
    expect(Math.abs(d.cold.conditions.betaDeg)).toBeLessThan(10);
    expect(d.cold.rationale[1]).toMatch(/smallest total orbit-average absorbed load/);
  });

  it('picks the shortest eclipse (none) for hot and says so', () => {
    expect(d.hot.results.eclipseDurationS).toBe(0);
    expect(Math.abs(d.hot.conditions.betaDeg)).toBeGreaterThan(70.2);
    expect(d.hot.rationale[1]).toMatch(/shortest eclipse \(0\.0 min\)/);
    // A Sun-pointed plate in full sun absorbs A alpha S on average, plus albedo and IR (EOL alpha 0.90)
    expect(d.hot.results.surfaces[0]!.orbitAverage.solarW).toBeCloseTo(1 * 0.9 * d.hot.results.solarFluxWm2, 0);
  });
});

describe('deriveDesignCases over part of a year', () => {
  it('takes the closest Sun distance within the mission, not perihelion (June-July, near aphelion)', () => {
    const d = derive([nadirRadiator], '2028-06-01', '2028-07-31');
    expect(d.scan.spansFullYear).toBe(false);
    // Earth is 1.014 AU from the Sun on 1 June and 1.0167 AU at aphelion (early July) (astronomical almanac, from memory)
    expect(d.hot.conditions.solarDistanceAu).toBeCloseTo(1.014, 2);
    expect(d.hot.rationale[0]).toMatch(/closest the mission comes to the Sun, reached 2028-06-01/);
    expect(d.hot.decision.sun).toMatchObject({ basis: 'mission', date: '2028-06-01' });
    expect(d.hot.results.solarFluxWm2).toBeLessThan(1330);
  });
});
