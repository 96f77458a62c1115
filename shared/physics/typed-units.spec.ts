import { describe, expect, it } from 'vitest';
import { durationText, normaliseUnitText, readTypedQuantity, unitsOfKind } from './typed-units';

function valueOf(text: string, unit: string): number {
  const reading = readTypedQuantity(text, unit);
  if (!reading.ok) throw new Error(reading.message);
  return reading.value;
}

function messageOf(text: string, unit: string): string {
  const reading = readTypedQuantity(text, unit);
  return reading.ok ? `read as ${reading.value}` : reading.message;
}

describe('typed units: periods and durations in days', () => {
  it('reads days as 86,400 s (SI brochure, 9th ed., table 8: 1 d = 24 h = 86 400 s)', () => {
    expect(valueOf('14 d', 's')).toBe(14 * 86400);
    expect(valueOf('9 days', 'min')).toBe(9 * 1440);
    expect(valueOf('1 day', 'h')).toBe(24);
    expect(valueOf('9.36d', 'min')).toBeCloseTo(13478.4, 9);
  });

  it('reads hours and minutes spelled out (SI brochure table 8: 1 h = 60 min = 3600 s)', () => {
    expect(valueOf('2 hours', 'min')).toBe(120);
    expect(valueOf('95 minutes', 's')).toBe(5700);
    expect(unitsOfKind('time')).toBe('s, min, h or d');
  });
});

describe('typed units: areas and volumes with superscripts and "sq"', () => {
  it('reads "m²" as m^2 and other areas (NIST SP 811 appendix B: 1 ft = 0.3048 m, 1 in = 0.0254 m exactly)', () => {
    expect(valueOf('1.2 m²', 'm^2')).toBe(1.2);
    expect(valueOf('1.2m²', 'm^2')).toBe(1.2);
    expect(valueOf('3 sq m', 'm^2')).toBe(3);
    expect(valueOf('3 sq. m', 'm^2')).toBe(3);
    expect(valueOf('3 square metres', 'm^2')).toBe(3);
    expect(valueOf('5000 cm²', 'm^2')).toBeCloseTo(0.5, 12);
    expect(valueOf('5000 cm^2', 'm^2')).toBeCloseTo(0.5, 12);
    expect(valueOf('10 sq ft', 'm^2')).toBeCloseTo(0.9290304, 12);
    expect(valueOf('144 in²', 'm^2')).toBeCloseTo(0.09290304, 12);
  });

  it('reads volumes with "³" (SI brochure table 8: 1 L = 1 dm³ = 10⁻³ m³)', () => {
    expect(valueOf('2 L', 'm^3')).toBeCloseTo(0.002, 15);
    expect(valueOf('1 m³', 'cm^3')).toBeCloseTo(1e6, 6);
    expect(normaliseUnitText(' m ³ ')).toBe('m^3');
  });
});

describe('typed units: refusals in words, never a parser message', () => {
  it('says what is wrong with the text', () => {
    expect(messageOf('14 d', 'km')).toBe('"14 d" is a time, not a length');
    expect(messageOf('1.2 m²', 's')).toBe('"1.2 m²" is an area, not a time');
    expect(messageOf('12 kg', 'km')).toBe('"kg" is not a unit this field reads; use km, m, mi or nmi');
    expect(messageOf('2 furlongs', 'm^2')).toBe('"furlongs" is not a unit this field reads; use m², cm², mm², ft² or in²');
    expect(messageOf('m² 1.2', 'm^2')).toBe('"m² 1.2" does not start with a number');
    expect(messageOf('', 's')).toBe('enter a value');
  });

  it('reads a typographic minus (U+2212) as a minus sign', () => {
    expect(valueOf('−45 deg', 'deg')).toBe(-45);
  });
});

describe('durations in the unit that reads best (common practice, no source)', () => {
  it('keeps a low orbit in minutes and a 9-day orbit in days', () => {
    expect(durationText(5739)).toBe('95.65 min');
    expect(durationText(13482.78 * 60)).toBe('9.36 d');
    expect(durationText(45)).toBe('45.00 s');
    expect(durationText(12 * 3600)).toBe('12.00 h');
    expect(durationText(Number.NaN)).toBe('–');
  });
});
