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

/** One quantity's lowest and highest value over the days swept, each with its (first) date. */
export interface SweepExtreme {
  readonly label: string;
  readonly unit: string;
  /** DecimalPipe digits for the values. */
  readonly digits: string;
  readonly min: { readonly value: number; readonly date: string };
  readonly max: { readonly value: number; readonly date: string };
}

/**
 * Each quantity of the sweep answer at its minimum and maximum over the days (the first day on a
 * tie; days without a finite value are skipped): beta, eclipse duration and fraction, Sun distance
 * and flux, each surface's orbit-average absorbed heat, and about a moon the longest shadow.
 */
export function sweepExtremes(days: readonly SweepDay[]): SweepExtreme[] {
  const names = days[0]?.surfaces.map((s) => ({ id: s.surfaceId, name: s.name })) ?? [];
  const quantities: { label: string; unit: string; digits: string; of: (d: SweepDay) => number | undefined }[] = [
    { label: 'Beta angle', unit: 'deg', digits: '1.1-1', of: (d) => d.betaDeg },
    { label: 'Eclipse duration', unit: 'min', digits: '1.2-2', of: (d) => d.eclipseDurationS / 60 },
    { label: 'Eclipse fraction', unit: '%', digits: '1.2-2', of: (d) => d.eclipseFraction * 100 },
    { label: 'Sun distance', unit: 'AU', digits: '1.4-4', of: (d) => d.solarDistanceAu },
    { label: 'Solar flux', unit: 'W/m²', digits: '1.0-0', of: (d) => d.solarFluxWm2 },
    ...names.map((s) => ({
      label: `${s.name}, orbit-average absorbed`,
      unit: 'W',
      digits: '1.2-2',
      of: (d: SweepDay) => d.surfaces.find((x) => x.surfaceId === s.id)?.absorbedW,
    })),
    ...(hasParentShadow(days) ? [{ label: "Longest shadow, the planet's included", unit: 'min', digits: '1.1-1', of: (d: SweepDay) => d.longestShadowS / 60 }] : []),
  ];
  return quantities.flatMap((q) => {
    let min: { value: number; date: string } | null = null;
    let max: { value: number; date: string } | null = null;
    for (const d of days) {
      const value = q.of(d);
      if (value === undefined || !Number.isFinite(value)) continue;
      if (min === null || value < min.value) min = { value, date: d.date.slice(0, 10) };
      if (max === null || value > max.value) max = { value, date: d.date.slice(0, 10) };
    }
    return min && max ? [{ label: q.label, unit: q.unit, digits: q.digits, min, max }] : [];
  });
}
