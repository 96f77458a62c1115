// The mathjs-free path of quantity-reader.ts against readQuantity itself (shared/physics/units.ts,
// built on the mathjs Unit system): where it answers, it must answer what mathjs would.
import { describe, expect, it } from 'vitest';
import { readQuantity } from '../../shared/physics/units';
import { normaliseUnitText } from '../../shared/physics/typed-units';
import { loadUnits, readQuantityIn, valueInOwnUnit } from './quantity-reader';

describe('valueInOwnUnit', () => {
  it.each([
    [550, 'km'], ['550', 'km'], [' 97.6 ', 'deg'], ['480 km', 'km'], ['160   deg', 'deg'], ['-1.5e3 s', 's'], ['2.25 m^2', 'm^2'], ['.5 km', 'km'],
  ] as const)('reads %j in %s as readQuantity (mathjs) does', (input, unit) => {
    const own = valueInOwnUnit(input, unit);
    expect(own).toBeDefined();
    // mathjs goes through SI and back, so it may differ in the last bit
    expect(own).toBeCloseTo(readQuantity(input, unit), 9);
  });

  it.each([
    ['341.8 mi', 'km'], ['480km', 'km'], ['5 mkm', 'km'], ['95 min', 's'], ['', 'km'], ['km', 'km'], ['1e999 km', 'km'], [Number.NaN, 'km'], ['20 degC', 'K'],
  ] as const)('leaves %j in %s to the unit system', (input, unit) => {
    expect(valueInOwnUnit(input, unit)).toBeUndefined();
  });
});

describe('readQuantityIn', () => {
  it('converts other units once the unit system is loaded (1 mi = 1.609344 km exactly, by definition)', async () => {
    await loadUnits();
    expect(readQuantityIn('341.8 mi', 'km', 'orbit.apoapsisAltitudeKm')).toBeCloseTo(341.8 * 1.609344, 9);
  });

  it('refuses a quantity of the wrong kind with the field path, as readQuantity does', async () => {
    await loadUnits();
    expect(() => readQuantityIn('95 min', 'km', 'orbit.periapsisAltitudeKm')).toThrow(/"95 min" is a time, not a length/);
  });
});

describe('readQuantityIn with the typed-unit table the client previews with (shared/physics/typed-units.ts)', () => {
  it('reads days, superscripts and "sq m" without mathjs (SI brochure table 8: 1 d = 86 400 s)', () => {
    expect(readQuantityIn('14 d', 's', 'orbit.periodS')).toBe(1209600);
    expect(readQuantityIn('9 days', 's', 'orbit.periodS')).toBe(777600);
    expect(readQuantityIn('1.2 m²', 'm^2', 'areaM2')).toBe(1.2);
    expect(readQuantityIn('3 sq m', 'm^2', 'areaM2')).toBe(3);
  });

  it('never passes a parser message on: unreadable text is refused in words', async () => {
    await loadUnits();
    for (const text of ['1.2 m²²', '4 @@', '1.2 "m']) {
      let message = '';
      try {
        readQuantityIn(text, 'm^2', 'areaM2');
      } catch (error) {
        message = (error as Error).message;
      }
      expect(message, text).toMatch(/not a unit this field reads|does not start with a number/);
      expect(message, text).not.toMatch(/Unexpected|index|char/i);
    }
  });

  it('agrees with mathjs on every spelling of the table mathjs also reads', async () => {
    const units = await loadUnits();
    const { typedUnitNames } = await import('../../shared/physics/typed-units');
    const target = { length: 'm', time: 's', angle: 'rad', area: 'm^2', volume: 'm^3' } as const;
    let compared = 0;
    for (const { name, kind } of typedUnitNames()) {
      const text = `2.5 ${normaliseUnitText(name)}`;
      if (!units.canReadQuantity(text)) continue;
      compared++;
      expect(readQuantityIn(text, target[kind], 'value'), text).toBeCloseTo(readQuantity(text, target[kind]), 9);
    }
    expect(compared).toBeGreaterThan(20);
  });
});
