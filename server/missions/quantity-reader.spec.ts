// The server's reader of typed quantities (quantity-reader.ts) against readQuantity itself
// (shared/physics/units.ts, built on the mathjs Unit system): where the typed-unit table answers,
// it must answer what mathjs would; a unit outside the table is mathjs's, loaded when first needed.
import { describe, expect, it } from 'vitest';
import { canReadQuantity, readQuantity } from '../../shared/physics/units';
import { normaliseUnitText, typedUnitNames } from '../../shared/physics/typed-units';
import { convertTypedValue, withQuantityReader, type ReadQuantity } from './quantity-reader';

const reading = (work: (read: ReadQuantity) => number) => withQuantityReader(work);

describe('withQuantityReader', () => {
  // First in the file: mathjs is not loaded yet. 1 ft = 0.3048 m exactly (NIST SP 811, appendix B).
  it('loads mathjs for a unit outside the table only when a quantity asks for it, and runs the work again', async () => {
    let runs = 0;
    const km = await reading((read) => {
      runs++;
      return read('300000 ft', 'km', 'orbit.periapsisAltitudeKm');
    });
    expect(km).toBeCloseTo(91.44, 9);
    expect(runs).toBe(2);
    runs = 0;
    await reading((read) => (runs++, read('300000 ft', 'km', 'x')));
    expect(runs).toBe(1);
  });

  it('passes every other error of the work on unchanged', async () => {
    await expect(reading(() => {
      throw new RangeError('not ours');
    })).rejects.toThrow('not ours');
  });
});

describe('reading without mathjs', () => {
  it.each([
    [550, 'km'], ['550', 'km'], [' 97.6 ', 'deg'], ['480 km', 'km'], ['160   deg', 'deg'], ['-1.5e3 s', 's'], ['2.25 m^2', 'm^2'], ['.5 km', 'km'],
  ] as const)('reads %j in %s as readQuantity (mathjs) does', async (input, unit) => {
    const own = await reading((read) => read(input, unit, 'value'));
    // mathjs goes through SI and back, so it may differ in the last bit
    expect(own).toBeCloseTo(readQuantity(input, unit), 9);
  });

  it.each([
    ['341.8 mi', 'km'], ['480km', 'km'], ['95 min', 's'],
  ] as const)('reads %j in %s with the table as mathjs does', async (input, unit) => {
    expect(await reading((read) => read(input, unit, 'value'))).toBeCloseTo(readQuantity(input, unit), 9);
  });

  it.each([['', 'km'], ['km', 'km'], ['1e999 km', 'km'], [Number.NaN, 'km'], ['5 mkm', 'km']] as const)('refuses %j in %s in words, as mathjs refuses it', async (input, unit) => {
    await expect(reading((read) => read(input, unit, 'value'))).rejects.toThrow(/enter a value|does not start with a number|not a finite number|not a unit this field reads/);
    expect(() => readQuantity(input, unit)).toThrow();
  });
});

describe('the reader', () => {
  it('converts other units (1 mi = 1.609344 km exactly, by definition)', async () => {
    expect(await reading((read) => read('341.8 mi', 'km', 'orbit.apoapsisAltitudeKm'))).toBeCloseTo(341.8 * 1.609344, 9);
  });

  it('refuses a quantity of the wrong kind with the field path, as readQuantity does', async () => {
    await expect(reading((read) => read('95 min', 'km', 'orbit.periapsisAltitudeKm'))).rejects.toThrow(/"95 min" is a time, not a length/);
  });

  it('reads days, superscripts and "sq m" with the table the client previews with (SI brochure table 8: 1 d = 86 400 s)', async () => {
    expect(await reading((read) => read('14 d', 's', 'orbit.periodS'))).toBe(1209600);
    expect(await reading((read) => read('9 days', 's', 'orbit.periodS'))).toBe(777600);
    expect(await reading((read) => read('1.2 m²', 'm^2', 'areaM2'))).toBe(1.2);
    expect(await reading((read) => read('3 sq m', 'm^2', 'areaM2'))).toBe(3);
  });

  it('never passes a parser message on: unreadable text is refused in words', async () => {
    for (const text of ['1.2 m²²', '4 @@', '1.2 "m']) {
      let message = '';
      try {
        await reading((read) => read(text, 'm^2', 'areaM2'));
      } catch (error) {
        message = (error as Error).message;
      }
      expect(message, text).toMatch(/not a unit this field reads|does not start with a number/);
      expect(message, text).not.toMatch(/Unexpected|index|char/i);
    }
  });

  it('agrees with mathjs on every spelling of the table mathjs also reads', async () => {
    const target = { length: 'm', time: 's', angle: 'rad', area: 'm^2', volume: 'm^3' } as const;
    let compared = 0;
    for (const { name, kind } of typedUnitNames()) {
      const text = `2.5 ${normaliseUnitText(name)}`;
      if (!canReadQuantity(text)) continue;
      compared++;
      expect(await reading((read) => read(text, target[kind], 'value')), text).toBeCloseTo(readQuantity(text, target[kind]), 9);
    }
    expect(compared).toBeGreaterThan(20);
  });
});

describe('convertTypedValue (POST /units/convert)', () => {
  it('reads a unit of the table as the forms do, and any other with mathjs (0 degC = 273.15 K, SI brochure 2.3.1)', async () => {
    expect(await convertTypedValue('14 d', 'h')).toBe(336);
    expect(await convertTypedValue('0 degC', 'K')).toBeCloseTo(273.15, 9);
  });
});
