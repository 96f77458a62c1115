import { unit } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { PhysicsError } from './physics-error';
import { readQuantity, readSi } from './units';

describe('reading quantities', () => {
  it('agrees with mathjs directly for the field units Eclipta uses (reference library)', () => {
    const cases: [string, string][] = [['550 km', 'm'], ['341.8 mi', 'm'], ['20 degC', 'K'], ['97.6 deg', 'rad'], ['95 min', 's'], ['1361 W/m^2', 'W/m^2']];
    for (const [text, si] of cases) expect(readSi(text, si)).toBeCloseTo(unit(text).toNumber(si), 9);
  });

  it('the international mile is exactly 1609.344 m (NIST SP 811) and 0 degC is 273.15 K (SI brochure)', () => {
    expect(readQuantity('1 mi', 'm')).toBeCloseTo(1609.344, 9);
    expect(readQuantity('0 degC', 'K')).toBeCloseTo(273.15, 9);
    expect(readQuantity('341.8 mi', 'km')).toBeCloseTo(550.0737792, 7);
  });

  it('a bare number takes the field\'s default unit', () => {
    expect(readQuantity(550, 'm', 'km')).toBe(550000);
    expect(readQuantity('95', 's', 'min')).toBe(5700);
    expect(readSi(20, 'degC')).toBeCloseTo(293.15, 9);
  });

  it('refuses the wrong dimension by naming it: "5 kg" is a mass, not a length', () => {
    expect(() => readQuantity('5 kg', 'km', 'km', 'orbit.periapsisAltitudeKm')).toThrow('"5 kg" is a mass, not a length');
    expect(() => readQuantity('3 h', 'deg')).toThrow('"3 h" is a time, not an angle');
    try {
      readQuantity('5 kg', 'km', 'km', 'orbit.periapsisAltitudeKm');
    } catch (error) {
      expect(error).toBeInstanceOf(PhysicsError);
      expect((error as PhysicsError).details[0].path).toBe('orbit.periapsisAltitudeKm');
    }
  });

  it('refuses unknown units, empty input and units without a number', () => {
    expect(() => readQuantity('5 furlongz', 'km')).toThrow(/"5 furlongz" is not a quantity/);
    expect(() => readQuantity('  ', 'km')).toThrow('enter a value');
    expect(() => readQuantity('km', 'km')).toThrow('has a unit but no number');
    expect(() => readQuantity(Number.NaN, 'km')).toThrow(/not a finite number/);
  });
});
