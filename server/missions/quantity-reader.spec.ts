// The mathjs-free path of quantity-reader.ts against readQuantity itself (shared/physics/units.ts,
// built on the mathjs Unit system): where it answers, it must answer what mathjs would.
import { describe, expect, it } from 'vitest';
import { readQuantity } from '../../shared/physics/units';
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
