// The mission sweep's lowest and highest value of each quantity with its date (issue 17: the page
// reported only the last day). Common practice, no source.
import { describe, expect, it } from 'vitest';
import type { SweepDay } from '../../../shared/api/missions';
import { sweepExtremes } from './sweep-plot-data';

const day = (date: string, betaDeg: number, eclipseMin: number, absorbedW: number): SweepDay => ({
  type: 'day',
  index: 0,
  date,
  betaDeg,
  eclipseFraction: eclipseMin / 95,
  eclipseDurationS: eclipseMin * 60,
  solarDistanceAu: 1,
  solarFluxWm2: 1361,
  surfaces: [{ surfaceId: 's1', name: 'Radiator', absorbedW }],
  longestShadowS: eclipseMin * 60,
  longestShadowCastBy: eclipseMin > 0 ? ['earth'] : [],
  longestShadowStart: null,
});

const days = [day('2027-04-01', 20, 30, 12), day('2027-05-01', 75, 0, 18), day('2027-06-01', -10, 35, 9), day('2027-07-01', 75, 35, Number.NaN)];

describe('sweepExtremes', () => {
  it('gives each quantity its minimum and maximum with the date, the first on a tie', () => {
    const rows = sweepExtremes(days);
    const beta = rows.find((r) => r.label === 'Beta angle');
    expect(beta).toMatchObject({ unit: 'deg', min: { value: -10, date: '2027-06-01' }, max: { value: 75, date: '2027-05-01' } });
    const eclipse = rows.find((r) => r.label === 'Eclipse duration');
    expect(eclipse).toMatchObject({ unit: 'min', min: { value: 0, date: '2027-05-01' }, max: { value: 35, date: '2027-06-01' } });
  });

  it("lists each surface's orbit-average absorbed heat, skipping days without a value", () => {
    const radiator = sweepExtremes(days).find((r) => r.label.startsWith('Radiator'));
    expect(radiator).toMatchObject({ unit: 'W', min: { value: 9, date: '2027-06-01' }, max: { value: 18, date: '2027-05-01' } });
  });

  it("adds the longest shadow only about a moon (when the planet's shadow takes part), and nothing for no days", () => {
    expect(sweepExtremes(days).some((r) => r.label.startsWith('Longest shadow'))).toBe(false);
    const moon = days.map((d, i) => ({ ...d, longestShadowStart: i === 1 ? '2027-05-01T03:00:00Z' : null }));
    expect(sweepExtremes(moon).some((r) => r.label.startsWith('Longest shadow'))).toBe(true);
    expect(sweepExtremes([])).toEqual([]);
  });
});
