import { describe, expect, it } from 'vitest';
import { pathWords, sourceWords, withoutIdentifiers } from './user-words';

describe('user words instead of our internals (common practice, no source)', () => {
  it('says API paths and code names as the forms label them', () => {
    expect(pathWords('orbit.periodS')).toBe('period');
    expect(pathWords('margins.heatLoadPercent')).toBe('heat-load margin');
    expect(pathWords('nodes.2.capacitanceJK')).toBe('node 3 heat capacity');
    expect(withoutIdentifiers('orbit.periodS: "14 q" is not a unit this field reads.')).toBe('period: "14 q" is not a unit this field reads.');
    expect(withoutIdentifiers('eclipseFraction must be 0..1 and tS increasing')).toBe('eclipse fraction must be 0..1 and time increasing');
  });

  it('leaves e-mail addresses, hosts, file-free sentences and abbreviations alone', () => {
    const text = 'Invitation sent to owner@kestrel.test, e.g. for the Kestrel team; see example.com.';
    expect(withoutIdentifiers(text)).toBe(text);
  });

  it('says where a value comes from without our notes\' shorthand', () => {
    const said = sourceWords("EOL absorptivity 0.5: middle of DOMAIN.md's range 0.4-0.6 (from memory, not yet confirmed against a published source)");
    expect(said).toContain('value not yet checked against its published source');
    expect(said).not.toMatch(/DOMAIN|\.md|from memory/);
    expect(sourceWords('WGS 84 equatorial radius (from memory)')).toBe('WGS 84 equatorial radius (value not yet checked against its published source)');
    expect(sourceWords('min/max PROVISIONAL: DOMAIN.md short-averaging extremes [M]')).not.toMatch(/PROVISIONAL|DOMAIN|\[M\]/);
  });
});
