import { describe, expect, it } from 'vitest';
import { clipSegments, isOnAt, mergeSegments, onFraction } from './strip-segments';

describe('strip segments', () => {
  it('merges overlapping and touching segments and turns reversed ones round', () => {
    expect(mergeSegments([{ from: 30, to: 40 }, { from: 0, to: 10 }, { from: 35, to: 50 }, { from: 12, to: 10 }, { from: 60, to: 60 }])).toEqual([
      { from: 0, to: 12 },
      { from: 30, to: 50 },
    ]);
  });

  it('gives the on-fraction over a window, overlaps counted once', () => {
    // 0-10 and 5-20 cover 0-20: 20 of 100.
    expect(onFraction([{ from: 0, to: 10 }, { from: 5, to: 20 }], [0, 100])).toBeCloseTo(0.2, 12);
    // Clipped to the window 10-60: 10-20 and 50-60 of 50.
    expect(onFraction([{ from: 0, to: 20 }, { from: 50, to: 80 }], [10, 60])).toBeCloseTo(0.4, 12);
    expect(onFraction([], [0, 10])).toBe(0);
    expect(onFraction([{ from: 0, to: 1 }], [5, 5])).toBe(0);
  });

  it('clips segments to the window', () => {
    expect(clipSegments([{ from: -5, to: 5 }, { from: 90, to: 120 }, { from: 200, to: 210 }], [0, 100])).toEqual([
      { from: 0, to: 5 },
      { from: 90, to: 100 },
    ]);
  });

  it('counts a segment on from its start and off from its end', () => {
    const s = [{ from: 10, to: 20 }, { from: 20, to: 25 }];
    expect(isOnAt(s, 9.99)).toBe(false);
    expect(isOnAt(s, 10)).toBe(true);
    expect(isOnAt(s, 20)).toBe(true);
    expect(isOnAt(s, 25)).toBe(false);
  });
});
