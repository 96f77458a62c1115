import { mailTextParts } from './mail-text-parts';

describe('mailTextParts', () => {
  it('turns web addresses into links and leaves the sentence around them as text', () => {
    const parts = mailTextParts('Open http://localhost:4300/invite/abc123. It expires in 7 days.');
    expect(parts).toEqual([
      { text: 'Open ' },
      { text: 'http://localhost:4300/invite/abc123', href: 'http://localhost:4300/invite/abc123' },
      { text: '. It expires in 7 days.' },
    ]);
  });

  it('does not make links of other schemes', () => {
    const parts = mailTextParts('javascript:alert(1) and mailto:someone@kestrel.test');
    expect(parts.every((p) => p.href === undefined)).toBe(true);
    expect(parts.map((p) => p.text).join('')).toBe('javascript:alert(1) and mailto:someone@kestrel.test');
  });
});
