import type { CaseComparison } from '../../../shared/api/cases';
import { comparisonRows, loadDifferenceRows } from './case-comparison-page';
import { sampleCase } from './sample-case';

describe('comparisonRows', () => {
  const a = sampleCase({ revision: 1, status: 'superseded' });
  const b = sampleCase({ id: 'case-2', revision: 2, status: 'released' });
  const comparison: CaseComparison = {
    a,
    b,
    inputs: [
      { path: 'margins.heatLoadPercent', a: 25, b: 30, changed: true },
      { path: 'conditions.properties', a: 'eol', b: 'eol', changed: false },
    ],
    surfaces: [
      { name: 'Radiator', solarW: { a: 20, b: 20, difference: 0 }, albedoW: null, irW: null, absorbedW: { a: 34, b: 30.6, difference: -3.4 }, peakAbsorbedW: null },
    ],
    total: { orbitAverageAbsorbedW: { a: 68, b: 68, difference: 0 } },
  };

  it('splits the inputs into changed and unchanged, with the difference in the unit', () => {
    const rows = comparisonRows(comparison);
    expect(rows.changedInputs.map((r) => [r.label, r.a, r.b, r.difference?.absolute, r.difference?.percent])).toEqual([
      // a percentage differs in percentage points (common practice, no source)
      ['Heat-load margin', '25.0 %', '30.0 %', '+5.0 percentage points', ''],
    ]);
    expect(rows.sameInputs.map((r) => r.label)).toEqual(['Property set']);
  });

  it('marks a fall in a surface load as changed and a surface missing from one case as such', () => {
    const radiator = comparisonRows(comparison).surfaces[0].rows;
    const absorbed = radiator.find((r) => r.label === 'Absorbed, orbit average');
    expect(absorbed).toMatchObject({ a: '34.00 W', b: '30.60 W', changed: true });
    expect(absorbed?.difference).toEqual({ absolute: '\u22123.40 W', percent: '\u221210.0 %', changed: true });
    expect(radiator.find((r) => r.label === 'Solar absorbed, orbit average')?.changed).toBe(false);
    expect(radiator.find((r) => r.label === 'IR absorbed, orbit average')).toMatchObject({ a: '—', difference: null });
  });
});

describe('comparisonRows with margins', () => {
  it('adds the orbit averages with margin, which a margin-only revision changes', () => {
    const a = sampleCase();
    const b = sampleCase({ id: 'case-2', revision: 2 });
    const bResults = {
      ...b.results,
      surfaces: b.results.surfaces.map((s) => ({ ...s, orbitAverage: { ...s.orbitAverage, absorbedWithMarginW: 44.2 } })),
      total: { ...b.results.total, orbitAverageWithMarginW: 88.4 },
    };
    const comparison: CaseComparison = {
      a, b, inputs: [],
      surfaces: [{ name: 'Radiator', solarW: null, albedoW: null, irW: null, absorbedW: { a: 34, b: 34, difference: 0 }, peakAbsorbedW: null }],
      total: { orbitAverageAbsorbedW: { a: 68, b: 68, difference: 0 } },
    };
    const rows = comparisonRows(comparison, { a: a.results, b: bResults });
    // sampleCase gives 42.5 W with margin per surface and 85 W in total.
    expect(rows.surfaces[0].rows.at(-1)).toMatchObject({ label: 'Absorbed with margin, orbit average', a: '42.50 W', b: '44.20 W', changed: true });
    expect(rows.totals.map((t) => [t.changed, t.difference?.absolute])).toEqual([[false, '0.00 W'], [true, '+3.40 W']]);
  });
});

describe('loadDifferenceRows', () => {
  it('gives per surface the orbit-average and peak absorbed differences new − old, null where a case has none (common practice, no source)', () => {
    const comparison: CaseComparison = {
      a: sampleCase({ revision: 1, status: 'superseded' }),
      b: sampleCase({ id: 'case-2', revision: 2, status: 'released' }),
      inputs: [],
      surfaces: [
        { name: 'Radiator', solarW: null, albedoW: null, irW: null, absorbedW: { a: 34, b: 30.6, difference: 30.6 - 34 }, peakAbsorbedW: { a: 50, b: 62, difference: 12 } },
        { name: 'Antenna', solarW: null, albedoW: null, irW: null, absorbedW: null, peakAbsorbedW: null },
      ],
      total: { orbitAverageAbsorbedW: { a: 68, b: 68, difference: 0 } },
    };
    const rows = loadDifferenceRows(comparison);
    expect(rows.map((r) => r.label)).toEqual(['Radiator', 'Antenna']);
    expect(rows[0]!.values[0]).toBeCloseTo(-3.4, 10);
    expect(rows[0]!.values[1]).toBe(12);
    expect(rows[1]!.values).toEqual([null, null]);
  });
});
