import type { CaseResultsContent } from '../../../shared/api/case-content';
import { WHOLE_SPACECRAFT, absorbedSeries, eclipseBands, incidentSeries } from './case-plots';

function surface(name: string, absorbed: number[]): CaseResultsContent['surfaces'][number] {
  const zero = absorbed.map(() => 0);
  const load = { solarWm2: 0, albedoWm2: 0, irWm2: 0, solarW: 0, albedoW: 0, irW: 0, absorbedW: 0 };
  return {
    name,
    areaM2: 1,
    absorptivity: 0.5,
    emissivity: 0.8,
    series: { solarWm2: absorbed.map((a) => a * 10), albedoWm2: zero, irWm2: zero, solarW: absorbed, albedoW: zero, irW: zero, absorbedW: absorbed },
    orbitAverage: { ...load, absorbedWithMarginW: 0 },
    peak: load,
  };
}

// Six samples a minute apart: sunlit, penumbra, umbra, umbra, penumbra, sunlit.
const results: CaseResultsContent = {
  periodS: 360,
  betaDeg: 0,
  solarFluxWm2: 1361,
  eclipseFraction: 0.5,
  eclipseDurationS: 180,
  umbraDurationS: 120,
  penumbraDurationS: 120,
  tS: [0, 60, 120, 180, 240, 300],
  sunlit: [1, 0.5, 0, 0, 0.4, 1],
  surfaces: [surface('Radiator', [4, 2, 0, 0, 2, 4]), surface('Array', [10, 5, 0, 0, 5, 10])],
  total: { orbitAverageAbsorbedW: 0, orbitAverageWithMarginW: 0, peakAbsorbedW: 0 },
};

describe('case plots', () => {
  it('shades the umbra and the penumbra from the sunlit fraction, in minutes', () => {
    expect(eclipseBands(results)).toEqual([
      { from: 1, to: 2, kind: 'penumbra', label: 'Penumbra' },
      { from: 2, to: 4, kind: 'eclipse', label: 'Eclipse (umbra)' },
      { from: 4, to: 5, kind: 'penumbra', label: 'Penumbra' },
    ]);
  });

  it("shades a moon orbiter's time in its planet's shadow apart from the moon's own, named after the planet (as the environment page; common practice, no source)", () => {
    // samples 1-3 dark: 1 and 2 behind the planet, 3 the moon's own umbra, 4 its penumbra
    const moon = { ...results, sunlit: [1, 0, 0, 0, 0.5, 1], parentSunlit: [1, 0, 0, 1, 1, 1] };
    expect(eclipseBands(moon, 'Jupiter')).toEqual([
      { from: 1, to: 3, kind: 'parent-shadow', label: "In Jupiter's shadow" },
      { from: 3, to: 4, kind: 'eclipse', label: 'Eclipse (umbra)' },
      { from: 4, to: 5, kind: 'penumbra', label: 'Penumbra' },
    ]);
    // the moon's own umbra where it closes what the planet's penumbra leaves (the lunar orbiter's cold case in Earth's penumbra)
    const penumbral = { ...results, sunlit: [0, 0, 0.3, 0.2, 0, 0], parentSunlit: [0.85, 0.8, 0.7, 0.2, 0, 0] };
    expect(eclipseBands(penumbral, 'Earth').map((band) => [band.kind, band.from, band.to])).toEqual([['eclipse', 0, 2], ['parent-shadow', 2, 5]]);
    // a case stored before the planet's shadow was kept apart: one sunlit series, bands as before
    expect(eclipseBands(results, 'Jupiter').map((band) => band.kind)).toEqual(['penumbra', 'eclipse', 'penumbra']);
  });

  it('sums the absorbed loads over the surfaces for the whole spacecraft', () => {
    const total = absorbedSeries(results, WHOLE_SPACECRAFT).find((s) => s.id === 'absorbed');
    expect(total?.points.map((p) => p.y)).toEqual([14, 7, 0, 0, 7, 14]);
    expect(total?.points.map((p) => p.x)).toEqual([0, 1, 2, 3, 4, 5]);
  });

  it('plots one surface on its own and gives no incident flux for the whole spacecraft', () => {
    expect(absorbedSeries(results, 'Radiator')[0].points.map((p) => p.y)).toEqual([4, 2, 0, 0, 2, 4]);
    expect(incidentSeries(results, 'Radiator')[0].points[0].y).toBe(40);
    expect(incidentSeries(results, WHOLE_SPACECRAFT)).toEqual([]);
  });
});
