import { describe, expect, it } from 'vitest';
import { isIsoDate, utcText, utcTickLabel } from './utc-time';

describe('UTC times as ISO 8601 with a 24-hour clock (ISO 8601-1:2019, 5.2.2 and 5.3.1.2)', () => {
  it('writes a moment in UTC whatever the browser zone, the clock running 00 to 23', () => {
    expect(utcText('2027-06-01T00:30:00.000Z')).toBe('2027-06-01 00:30 UTC');
    expect(utcText('2027-06-01T13:05:09.000Z', 'second')).toBe('2027-06-01 13:05:09 UTC');
    expect(utcText(Date.UTC(2027, 5, 1, 23, 59), 'date')).toBe('2027-06-01');
  });

  it('writes nothing for no moment and for text that is not a date (never "Invalid Date" or NaN)', () => {
    for (const value of [null, undefined, '', 'soon', Number.NaN]) expect(utcText(value)).toBe('');
  });

  it('labels time axis ticks without AM or PM: the clock within a day, the ISO date at midnight', () => {
    expect(utcTickLabel(new Date(Date.UTC(2027, 5, 1, 12, 30)))).toBe('12:30');
    expect(utcTickLabel(new Date(Date.UTC(2027, 5, 1, 1, 0)))).toBe('01:00');
    expect(utcTickLabel(new Date(Date.UTC(2027, 5, 1, 13, 0, 15)))).toBe('13:00:15');
    expect(utcTickLabel(new Date(Date.UTC(2027, 5, 2)))).toBe('2027-06-02');
    expect(utcTickLabel(new Date(Date.UTC(2027, 6, 1)))).toBe('2027-07');
    expect(utcTickLabel(new Date(Date.UTC(2028, 0, 1)))).toBe('2028');
    for (let hour = 0; hour < 24; hour++) expect(utcTickLabel(new Date(Date.UTC(2027, 5, 1, hour, 15)))).not.toMatch(/AM|PM/);
  });

  it('knows a calendar day from text that only looks like one (Gregorian calendar, common practice)', () => {
    expect(isIsoDate('2028-02-29')).toBe(true);
    expect(isIsoDate('2027-02-29')).toBe(false);
    expect(isIsoDate('06/01/2027')).toBe(false);
    expect(isIsoDate('2027-6-1')).toBe(false);
  });
});
