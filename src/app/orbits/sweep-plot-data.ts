// Plot inputs and the CSV file from the sweep's day lines; x is the day's date (UTC midnight).
import type { SweepDay } from '../../../shared/api/missions';
import type { CsvColumn } from '../plots/csv-download';
import { seriesLook } from '../plots/plot-colors';
import type { PlotSeries } from '../plots/plot-series';

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
      ...seriesLook(i),
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
    { header: 'Longest shadow', unit: 'min', values: days.map((d) => d.longestShadowS / 60) },
    { header: 'Longest shadow cast by', values: days.map(castByText) },
  ];
}
