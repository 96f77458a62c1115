// Plot inputs and the CSV file from the sweep's day lines; x is the day's date (UTC midnight).
import type { SweepDay } from '../../../shared/api/missions';
import type { CsvColumn } from '../plots/csv-download';
import type { PlotSeries } from '../plots/plot-series';

// Distinct theme colours for up to six surfaces on one plot; dashes tell the next six apart.
const SURFACE_COLORS = ['--ecl-absorbed', '--ecl-solar', '--ecl-albedo', '--ecl-ir', '--mat-sys-primary', '--ecl-accent'];

const dateMs = (date: string): number => Date.parse(`${date.slice(0, 10)}T00:00:00Z`);

export interface SweepSeries {
  readonly beta: readonly PlotSeries[];
  readonly eclipse: readonly PlotSeries[];
  readonly absorbed: readonly PlotSeries[];
}

/** True when some day's longest shadow is cast (at least partly) by a planet over the orbited moon. */
export const hasParentShadow = (days: readonly SweepDay[]): boolean => days.some((d) => d.longestShadowStart !== null);

/** Who cast a day's longest shadow, in words: "Europa and Jupiter", or "none". */
export const castByText = (d: SweepDay): string =>
  d.longestShadowCastBy.length === 0 ? 'none' : d.longestShadowCastBy.map((id) => id.charAt(0).toUpperCase() + id.slice(1)).join(' and ');

export function sweepSeries(days: readonly SweepDay[]): SweepSeries {
  const names = days[0]?.surfaces.map((s) => ({ id: s.surfaceId, name: s.name })) ?? [];
  const eclipse: PlotSeries[] = [
    {
      id: 'eclipse',
      label: 'Eclipse duration',
      unit: 'min',
      colorVar: '--ecl-cold',
      points: days.map((d) => ({ x: dateMs(d.date), y: d.eclipseDurationS / 60 })),
    },
  ];
  if (hasParentShadow(days)) {
    // About a moon: the day's longest darkness, its planet's shadow included.
    eclipse.push({
      id: 'longest-shadow',
      label: "Longest shadow, the planet's included",
      unit: 'min',
      colorVar: '--ecl-accent',
      dash: true,
      points: days.map((d) => ({ x: dateMs(d.date), y: d.longestShadowS / 60 })),
    });
  }
  return {
    beta: [{ id: 'beta', label: 'Beta angle', unit: 'deg', colorVar: '--ecl-solar', points: days.map((d) => ({ x: dateMs(d.date), y: d.betaDeg })) }],
    eclipse,
    absorbed: names.map((s, i) => ({
      id: s.id,
      label: s.name,
      unit: 'W',
      colorVar: SURFACE_COLORS[i % SURFACE_COLORS.length],
      dash: i >= SURFACE_COLORS.length,
      points: days.map((d) => ({ x: dateMs(d.date), y: d.surfaces.find((x) => x.surfaceId === s.id)?.absorbedW ?? NaN })),
    })),
  };
}

export function sweepCsvColumns(days: readonly SweepDay[]): CsvColumn[] {
  const names = days[0]?.surfaces.map((s) => ({ id: s.surfaceId, name: s.name })) ?? [];
  return [
    { header: 'Date (UTC)', values: days.map((d) => d.date) },
    { header: 'Beta', unit: 'deg', values: days.map((d) => d.betaDeg) },
    { header: 'Eclipse fraction', values: days.map((d) => d.eclipseFraction) },
    { header: 'Eclipse duration', unit: 'min', values: days.map((d) => d.eclipseDurationS / 60) },
    { header: 'Sun distance', unit: 'AU', values: days.map((d) => d.solarDistanceAu) },
    { header: 'Solar flux', unit: 'W/m²', values: days.map((d) => d.solarFluxWm2) },
    ...names.map((s) => ({
      header: `${s.name} orbit-average absorbed`,
      unit: 'W',
      values: days.map((d) => d.surfaces.find((x) => x.surfaceId === s.id)?.absorbedW),
    })),
    { header: 'Phase', values: days.map((d) => d.phase ?? '') },
    { header: 'Longest shadow', unit: 'min', values: days.map((d) => d.longestShadowS / 60) },
    { header: 'Longest shadow cast by', values: days.map(castByText) },
  ];
}

export interface SweepPhaseRow {
  readonly name: string;
  readonly startDate: string;
  readonly endDate: string;
  readonly modeName: string;
  /** Days of the sweep shown in the phase. */
  readonly days: number;
  /** The largest and smallest spacecraft total of orbit-average absorbed power over those days, W; null without days. */
  readonly maxTotalW: number | null;
  readonly minTotalW: number | null;
}

/** Per phase of the sweep: its days shown and the range of the spacecraft's total absorbed power over them. */
export function sweepPhaseRows(phases: readonly { name: string; startDate: string; endDate: string; modeName: string }[], days: readonly SweepDay[]): SweepPhaseRow[] {
  return phases.map((p) => {
    const totals = days.filter((d) => d.phase === p.name).map((d) => d.surfaces.reduce((sum, s) => sum + s.absorbedW, 0));
    return { ...p, days: totals.length, maxTotalW: totals.length > 0 ? Math.max(...totals) : null, minTotalW: totals.length > 0 ? Math.min(...totals) : null };
  });
}
