import { quantityForServer, readQuantityText, unitsOfKind } from './quantity-text';

function valueOf(text: string, unit: Parameters<typeof readQuantityText>[1]): number {
  const reading = readQuantityText(text, unit);
  if (!reading.ok) throw new Error(reading.message);
  return reading.value;
}

function messageOf(text: string, unit: Parameters<typeof readQuantityText>[1]): string {
  const reading = readQuantityText(text, unit);
  return reading.ok ? `read as ${reading.value}` : reading.message;
}

describe('readQuantityText', () => {
  it('takes a bare number in the field unit', () => {
    expect(readQuantityText('550', 'km')).toEqual({ ok: true, value: 550, bare: true });
    expect(readQuantityText(' 97.6 ', 'deg')).toEqual({ ok: true, value: 97.6, bare: true });
    expect(valueOf('1e3', 'km')).toBe(1000);
  });

  it('converts lengths with the exact international and nautical miles (NIST SP 811, appendix B)', () => {
    expect(valueOf('550 km', 'km')).toBe(550);
    expect(valueOf('550000 m', 'km')).toBeCloseTo(550, 9);
    // 1 mi = 1609.344 m exactly, 1 nmi = 1852 m exactly.
    expect(valueOf('1 mi', 'km')).toBeCloseTo(1.609344, 12);
    expect(valueOf('341.8 mi', 'km')).toBeCloseTo(341.8 * 1.609344, 9);
    expect(valueOf('100 nmi', 'km')).toBeCloseTo(185.2, 9);
  });

  it('converts times between s, min and h (SI: 1 min = 60 s, 1 h = 3600 s)', () => {
    expect(valueOf('95 min', 's')).toBe(5700);
    expect(valueOf('1.5 h', 'min')).toBe(90);
    expect(valueOf('5700 s', 'min')).toBe(95);
    expect(valueOf('95min', 'min')).toBe(95);
  });

  it('converts radians to degrees (1 rad = 180/pi deg = 57.29578 deg, SI brochure table 4)', () => {
    expect(valueOf('1 rad', 'deg')).toBeCloseTo(57.29578, 5);
    expect(valueOf('97.6°', 'deg')).toBe(97.6);
    expect(valueOf('-45 deg', 'deg')).toBe(-45);
  });

  it('says when a quantity is of the wrong kind', () => {
    expect(messageOf('95 min', 'km')).toBe('"95 min" is a time, not a length');
    expect(messageOf('550 km', 'deg')).toBe('"550 km" is a length, not an angle');
  });

  it('names the units it reads when the unit is unknown', () => {
    expect(messageOf('12 kg', 'km')).toBe('"kg" is not a unit this field reads; use km, m, mi or nmi');
    expect(unitsOfKind('time')).toBe('s, min, h or d');
  });

  it('refuses empty and non-numeric text', () => {
    expect(messageOf('  ', 'km')).toBe('enter a value');
    expect(messageOf('km 550', 'km')).toBe('"km 550" does not start with a number');
  });
});

describe('quantityForServer', () => {
  it('writes the suffix unit beside a bare number when the server reads another unit', () => {
    expect(quantityForServer('95', 'min', 's')).toBe('95 min');
    expect(quantityForServer('550', 'km', 'km')).toBe(550);
  });

  it('keeps text with a unit as typed, for the server to read authoritatively', () => {
    expect(quantityForServer(' 341.8 mi ', 'km', 'km')).toBe('341.8 mi');
  });
});
