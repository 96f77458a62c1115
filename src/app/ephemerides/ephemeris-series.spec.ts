import type { TrajectoryEnvironmentResponse } from '../../../shared/api/ephemerides';
import { absorbedSeries, altitudeSeries, eclipseBands, spanText } from './ephemeris-series';

const at = (minute: number, sunlit: number): TrajectoryEnvironmentResponse['points'][number] => ({
  epoch: new Date(Date.UTC(2027, 2, 20, 12, minute)).toISOString(),
  altitudeKm: 550,
  sunlit,
  surfaces: [
    { name: 'nadir', solarWm2: 0, albedoWm2: 0, irWm2: 200, absorbedW: 85 },
    { name: 'zenith', solarWm2: 1361 * sunlit, albedoWm2: 0, irWm2: 0, absorbedW: 340 * sunlit },
  ],
});

describe('eclipseBands', () => {
  it('shades penumbra and umbra from the sampled sunlit fraction, closing a band at the first sample after it', () => {
    const points = [at(0, 1), at(1, 0.5), at(2, 0), at(3, 0), at(4, 0.4), at(5, 1)];
    const t = (minute: number) => Date.UTC(2027, 2, 20, 12, minute);
    expect(eclipseBands(points)).toEqual([
      { from: t(1), to: t(2), label: 'Penumbra', kind: 'penumbra' },
      { from: t(2), to: t(4), label: 'Umbra', kind: 'eclipse' },
      { from: t(4), to: t(5), label: 'Penumbra', kind: 'penumbra' },
    ]);
  });

  it('closes a band still open at the end of the ephemeris at its last sample', () => {
    const bands = eclipseBands([at(0, 1), at(1, 0), at(2, 0)]);
    expect(bands).toEqual([{ from: Date.UTC(2027, 2, 20, 12, 1), to: Date.UTC(2027, 2, 20, 12, 2), label: 'Umbra', kind: 'eclipse' }]);
  });
});

describe('absorbedSeries', () => {
  it('gives one line per surface, named after it, in W', () => {
    const series = absorbedSeries([at(0, 1), at(1, 0)]);
    expect(series.map((s) => [s.label, s.unit])).toEqual([['nadir', 'W'], ['zenith', 'W']]);
    expect(series[1].points.map((p) => p.y)).toEqual([340, 0]);
  });
});

describe('altitudeSeries', () => {
  it('rounds to the metre so a circular orbit plots flat', () => {
    const points = [{ ...at(0, 1), altitudeKm: 550.0000001 }, { ...at(1, 1), altitudeKm: 549.9999998 }, { ...at(2, 1), altitudeKm: 551.2344 }];
    expect(altitudeSeries(points)[0].points.map((p) => p.y)).toEqual([550, 550, 551.234]);
  });
});

describe('spanText', () => {
  it('says hours and minutes, or days and hours', () => {
    expect(spanText('2027-03-20T12:00:00Z', '2027-03-20T16:05:00Z')).toBe('4 h 05 min');
    expect(spanText('2027-03-20T12:00:00Z', '2027-03-23T16:00:00Z')).toBe('3 d 4 h');
    expect(spanText('2027-03-20T12:00:00Z', '2027-03-20T12:20:00Z')).toBe('20 min');
  });
});
