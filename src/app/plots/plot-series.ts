// The data shapes every Eclipta plot accepts. Kept apart from the components so pages can build
// plot inputs (from API answers) without importing a component.

export interface PlotPoint {
  /** Plot x: a number in the axis unit, or ms since the Unix epoch when the plot's xKind is 'date'. */
  readonly x: number;
  /** NaN marks a gap: the line breaks there. */
  readonly y: number;
}

export interface PlotSeries {
  readonly id: string;
  readonly label: string;
  readonly unit: string;
  /** A CSS custom property name, e.g. '--ecl-solar'; see plot-colors.ts for the known ones. */
  readonly colorVar: string;
  /** Sorted by x ascending: lookups and thinning rely on it. */
  readonly points: readonly PlotPoint[];
  readonly dash?: boolean;
}

export type BandKind = 'eclipse' | 'penumbra' | 'parent-shadow' | 'limit' | 'custom';

/**
 * Which shadow a sample is in, from the combined sunlit share and, about a moon, the share past its
 * planet alone (combined = max(0, moon's + planet's - 1)): the moon's own umbra where it closes what
 * the planet leaves (combined 0 with the planet's share above 0), else the planet's shadow where the
 * planet darkens, else the moon's (or planet's) own umbra or penumbra; null in full sun.
 */
export function shadowKind(sunlit: number, parentSunlit = 1): 'eclipse' | 'penumbra' | 'parent-shadow' | null {
  if (sunlit <= 0 && parentSunlit > 0) return 'eclipse';
  if (parentSunlit < 1) return 'parent-shadow';
  return sunlit <= 0 ? 'eclipse' : sunlit < 1 ? 'penumbra' : null;
}

/** A shaded x range behind the data, e.g. an eclipse from entry to exit. */
export interface PlotBand {
  readonly from: number;
  readonly to: number;
  readonly label: string;
  readonly kind: BandKind;
}

/** A horizontal limit, e.g. a maximum operating temperature. */
export interface LimitLine {
  readonly y: number;
  readonly label: string;
  readonly kind: 'hot' | 'cold';
}

export type XKind = 'number' | 'date';

/** One row of a strip plot: the x ranges in which something (a heater) is on. */
export interface StripRow {
  readonly label: string;
  readonly segments: readonly { readonly from: number; readonly to: number }[];
  /** Defaults to the theme's primary colour. */
  readonly colorVar?: string;
  /**
   * The on fraction (0..1) shown beside the row when the caller computed it over more than is drawn
   * (a duty cycle over a thermostat's several-orbit cycle), so plot and table show one figure;
   * otherwise the drawn segments' share of the x range.
   */
  readonly duty?: number;
}

/** Minimum plot margins in px, so plots stacked one above the other share their x positions. */
export interface PlotGutters {
  readonly left?: number;
  readonly right?: number;
}

/**
 * Where y can physically lie, so an axis never runs past it: 'non-negative' (fluxes, heat, flows,
 * durations), 'fraction' (0..1, a sunlit fraction), 'beta' (−90..90°), or [low, high] (±Infinity for
 * an open end).
 */
export type PhysicalRange = 'non-negative' | 'fraction' | 'beta' | readonly [number, number];

export function physicalRange(range: PhysicalRange | undefined): readonly [number, number] | undefined {
  switch (range) {
    case 'non-negative':
      return [0, Infinity];
    case 'fraction':
      return [0, 1];
    case 'beta':
      return [-90, 90];
    default:
      return range;
  }
}
