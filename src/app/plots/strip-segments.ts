// On/off intervals of a strip-plot row (a heater, a dissipation schedule): union, on-fraction and
// state at an instant. Pure, so a duty cycle shown on a plot is the one tested here.

export interface Segment {
  readonly from: number;
  readonly to: number;
}

/** Sorted union of the segments; reversed ones are turned round and empty ones dropped. */
export function mergeSegments(segments: readonly Segment[]): Segment[] {
  const sorted = segments
    .map((s) => ({ from: Math.min(s.from, s.to), to: Math.max(s.from, s.to) }))
    .filter((s) => s.to > s.from)
    .sort((a, b) => a.from - b.from);
  const merged: Segment[] = [];
  for (const s of sorted) {
    const last = merged[merged.length - 1];
    if (last && s.from <= last.to) merged[merged.length - 1] = { from: last.from, to: Math.max(last.to, s.to) };
    else merged.push(s);
  }
  return merged;
}

/** Segments cut to [from, to]. */
export function clipSegments(segments: readonly Segment[], domain: readonly [number, number]): Segment[] {
  return mergeSegments(segments)
    .map((s) => ({ from: Math.max(s.from, domain[0]), to: Math.min(s.to, domain[1]) }))
    .filter((s) => s.to > s.from);
}

/** Fraction of the domain spent on (the duty cycle over that window), 0 to 1. */
export function onFraction(segments: readonly Segment[], domain: readonly [number, number]): number {
  const span = domain[1] - domain[0];
  if (!(span > 0)) return 0;
  const on = clipSegments(segments, domain).reduce((sum, s) => sum + (s.to - s.from), 0);
  return on / span;
}

/** On at x: a segment includes its start and excludes its end, so back-to-back segments never overlap. */
export function isOnAt(segments: readonly Segment[], x: number): boolean {
  return segments.some((s) => x >= Math.min(s.from, s.to) && x < Math.max(s.from, s.to));
}
