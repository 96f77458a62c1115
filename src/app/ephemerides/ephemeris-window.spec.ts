import { describe, expect, it } from 'vitest';
import { isoFromUtcField, utcFieldValue, windowText } from './ephemeris-window';

describe('ephemeris window fields (read as UTC; common practice, no source)', () => {
  it('shows an epoch in the field without a zone and reads it back as the same UTC instant', () => {
    expect(utcFieldValue('2027-03-20T12:00:00.000Z')).toBe('2027-03-20 12:00:00');
    // ISO 8601 allows a space for the "T" by mutual agreement (ISO 8601-1:2019, 5.4.2); a Z or UTC may close it.
    expect(isoFromUtcField('2027-03-20 12:00:00')).toBe('2027-03-20T12:00:00.000Z');
    expect(isoFromUtcField(' 2027-03-20  23:05 UTC ')).toBe('2027-03-20T23:05:00.000Z');
    expect(isoFromUtcField('2027-03-20T23:05:00Z')).toBe('2027-03-20T23:05:00.000Z');
    expect(isoFromUtcField('2027-03-20T12:00:00')).toBe('2027-03-20T12:00:00.000Z');
    expect(isoFromUtcField('2027-03-20T13:35')).toBe('2027-03-20T13:35:00.000Z');
    expect(isoFromUtcField('2027-03-20T13:35:40.5')).toBe('2027-03-20T13:35:40.500Z');
  });

  it('refuses what is not a date and time', () => {
    for (const text of ['', '2027-03-20', '2027-02-30T00:00', '2027-03-20T24:00', 'noon', '03/20/2027, 12:00:00 AM']) expect(isoFromUtcField(text), text).toBeNull();
    expect(utcFieldValue('not a date')).toBe('');
  });

  it('writes a window on one day with the day once, across midnight with both', () => {
    expect(windowText('2027-03-20T12:00:00.000Z', '2027-03-20T13:35:40.000Z')).toBe('12:00:00 – 13:35:40 UTC on 2027-03-20');
    expect(windowText('2027-03-20T23:00:00.000Z', '2027-03-21T01:00:00.000Z')).toBe('2027-03-20 23:00:00 – 2027-03-21 01:00:00 UTC');
  });
});
