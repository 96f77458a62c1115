import { formatDifference, formatInputValue, inputDifference, labelOfPath, unitOfPath } from './case-differences';

describe('formatDifference', () => {
  it('signs a rise with + and a fall with a true minus, in the unit and in percent of A', () => {
    expect(formatDifference({ a: 80, b: 100, difference: 20 }, 'W')).toEqual({ absolute: '+20.00 W', percent: '+25.0 %', changed: true });
    expect(formatDifference({ a: 100, b: 80, difference: -20 }, 'W')).toEqual({ absolute: '\u221220.00 W', percent: '\u221220.0 %', changed: true });
  });

  it('takes the percentage of |A| so a negative base keeps the sign of the change', () => {
    expect(formatDifference({ a: -10, b: -5, difference: 5 }, 'deg').percent).toBe('+50.0 %');
  });

  it('does not call floating noise a change', () => {
    const same = formatDifference({ a: 123.456, b: 123.456 + 1e-12, difference: 1e-12 }, 'W');
    expect(same.changed).toBe(false);
    expect(same.absolute).toBe('0.00 W');
    expect(same.percent).toBe('0.0 %');
  });

  it('still shows a real change smaller than the rounding', () => {
    const small = formatDifference({ a: 10, b: 10.001, difference: 0.001 }, 'W');
    expect(small.changed).toBe(true);
    expect(small.absolute).toBe('+0.0010 W');
  });

  it('says n/a for the percentage when A is zero', () => {
    expect(formatDifference({ a: 0, b: 3, difference: 3 }, 'W').percent).toBe('n/a (A is 0)');
  });
});

describe('input values', () => {
  it('reads the unit from the field name (API.md: units in the name)', () => {
    expect(unitOfPath('orbit.periapsisAltitudeKm')).toBe('km');
    expect(unitOfPath('conditions.olrWm2')).toBe('W/m²');
    expect(unitOfPath('conditions.surfaces[2].areaM2')).toBe('m²');
    expect(unitOfPath('body.gmKm3S2')).toBe('km³/s²');
    expect(unitOfPath('margins.heatLoadPercent')).toBe('%');
    expect(unitOfPath('conditions.albedo')).toBe('');
    expect(unitOfPath('conditions.steps')).toBe('');
  });

  it('writes numbers with their unit and differences only between numbers', () => {
    expect(formatInputValue('conditions.betaDeg', 21.456)).toBe('21.46 deg');
    expect(formatInputValue('conditions.properties', 'eol')).toBe('eol');
    // sources are text for people: our notes' shorthand said in words (the same rule as the case page's)
    expect(formatInputValue('environmentSource', 'Earth nominal: fact sheet (from memory)')).toBe('Earth nominal: fact sheet (value not yet checked against its published source)');
    expect(inputDifference('margins.heatLoadPercent', 25, 30)?.absolute).toBe('+5.0 percentage points');
    expect(inputDifference('conditions.properties', 'bol', 'eol')).toBeNull();
  });
});

describe('labelOfPath', () => {
  it('names inputs in words, never as field paths (issue 15 item 4)', () => {
    expect(labelOfPath('margins.heatLoadPercent')).toBe('Heat-load margin');
    expect(labelOfPath('conditions.surfaces[1].areaM2')).toBe('Surface 2 area');
    expect(labelOfPath('conditions.surfaces[0].material.absorptivityEol')).toBe('Surface 1 material EOL absorptivity');
    expect(labelOfPath('body.gmKm3S2')).not.toMatch(/\./);
  });
});
