import type { EnvironmentResponse } from '../../../shared/api/environment';
import { eclipseBands, profileCsvColumns } from './environment-plot-data';

type Sample = EnvironmentResponse['profile'][number];

const sample = (tS: number, sunlit: number): Sample => ({
  tS,
  trueAnomalyDeg: tS / 10,
  sunlit,
  surfaces: [{ name: 'nadir, deck', solarWm2: 0, albedoWm2: 1, irWm2: 2, absorbedW: 3 }],
});

describe('eclipseBands', () => {
  it('shades each run of samples with sunlit < 1, out to the midpoints with the sunlit neighbours', () => {
    // Samples every 60 s; shadow (with a penumbra sample at 0.5) from 180 s to 300 s.
    const profile = [0, 60, 120, 180, 240, 300, 360, 420].map((t) => sample(t, t >= 180 && t <= 300 ? (t === 180 ? 0.5 : 0) : 1));
    expect(eclipseBands(profile)).toEqual([{ from: 2.5, to: 5.5, label: 'Eclipse', kind: 'eclipse' }]);
  });

  it('keeps a shadow that wraps around periapsis as two bands at the ends', () => {
    const profile = [0, 60, 120, 180].map((t) => sample(t, t === 0 || t === 180 ? 0 : 1));
    expect(eclipseBands(profile).map((b) => [b.from, b.to])).toEqual([
      [0, 0.5],
      [2.5, 3],
    ]);
  });

  it("shades the planet's shadow about a moon as its own kind, named, apart from the moon's own eclipse", () => {
    // 0-120 s in Jupiter's shadow, 240-300 s in Europa's own
    const profile = [0, 60, 120, 180, 240, 300, 360].map((t) => ({
      ...sample(t, t <= 120 || (t >= 240 && t <= 300) ? 0 : 1),
      parentSunlit: t <= 120 ? 0 : 1,
    }));
    expect(eclipseBands(profile, 'jupiter')).toEqual([
      { from: 0, to: 2.5, label: "In Jupiter's shadow", kind: 'parent-shadow' },
      { from: 3.5, to: 5.5, label: 'Eclipse', kind: 'eclipse' },
    ]);
    expect(profileCsvColumns(profile).map((c) => c.header)).toContain('Sunlit fraction past the planet');
  });

  it('gives no band for an orbit always in sunlight', () => {
    expect(eclipseBands([sample(0, 1), sample(60, 1)])).toEqual([]);
  });
});

describe('profileCsvColumns', () => {
  it('names each surface column with its unit and keeps a comma in the name for the CSV quoting', () => {
    const headers = profileCsvColumns([sample(0, 1)]).map((c) => `${c.header}${c.unit ? ` (${c.unit})` : ''}`);
    expect(headers).toEqual([
      'Time from periapsis (min)',
      'True anomaly (deg)',
      'Sunlit fraction',
      'nadir, deck solar (W/m²)',
      'nadir, deck albedo (W/m²)',
      'nadir, deck IR (W/m²)',
      'nadir, deck absorbed (W)',
    ]);
  });
});
