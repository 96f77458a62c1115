// Plot colours come only from the theme's custom properties (styles.scss) so one flux component
// has one colour on every page; the fallbacks (the light theme's values) keep a plot legible where
// the theme is not loaded, e.g. in an embedded page or a test.

const FALLBACKS: Readonly<Record<string, string>> = {
  '--ecl-solar': '#c27c00',
  '--ecl-albedo': '#3f7fbf',
  '--ecl-ir': '#b02a4a',
  '--ecl-absorbed': '#2e2a4f',
  '--ecl-eclipse-band': 'rgb(23 48 93 / 0.14)',
  '--ecl-series-1': '#2e2a4f',
  '--ecl-series-2': '#c27c00',
  '--ecl-series-3': '#0f8a7e',
  '--ecl-series-4': '#b0306e',
  '--ecl-series-5': '#3f7fbf',
  '--ecl-series-6': '#6b7d12',
  '--ecl-hot': '#b8431a',
  '--ecl-cold': '#1d6fa3',
  '--ecl-accent': '#7e5601',
  '--mat-sys-primary': '#4b5e8f',
  '--mat-sys-on-surface': '#1a1b21',
  '--mat-sys-on-surface-variant': '#44464f',
  '--mat-sys-outline': '#75777f',
  '--mat-sys-outline-variant': '#c5c6d0',
  '--mat-sys-surface-container': '#eeedf4',
  '--mat-sys-error': '#ba1a1a',
};

/** `var(--name, fallback)` for a style binding; an unknown property falls back to the text colour. */
export function cssColor(customProperty: string): string {
  const name = customProperty.startsWith('--') ? customProperty : `--${customProperty}`;
  return `var(${name}, ${FALLBACKS[name] ?? 'currentColor'})`;
}

/** The series colours in order (styles.scss --ecl-series-N): far apart in hue in both themes. */
export const SERIES_COLORS = ['--ecl-series-1', '--ecl-series-2', '--ecl-series-3', '--ecl-series-4', '--ecl-series-5', '--ecl-series-6'] as const;

/** The i-th series of one kind on a plot (surfaces, loops): its colour, and dashed from the seventh on. */
export function seriesLook(i: number): { readonly colorVar: string; readonly dash: boolean } {
  return { colorVar: SERIES_COLORS[i % SERIES_COLORS.length], dash: Math.floor(i / SERIES_COLORS.length) % 2 === 1 };
}
