// Plot inputs from the environment along an ephemeris: altitude, sunlit fraction and each surface's
// loads against UTC time, and the eclipse bands (umbra and penumbra) to shade behind them.
import type { TrajectoryEnvironmentResponse } from '../../../shared/api/ephemerides';
import { seriesLook } from '../plots/plot-colors';
import type { PlotBand, PlotSeries } from '../plots/plot-series';

type Points = TrajectoryEnvironmentResponse['points'];

const times = (points: Points): number[] => points.map((p) => Date.parse(p.epoch));

/** Altitude to the metre: finer digits are rounding in the file, and would fill a flat orbit's axis with noise. */
export function altitudeSeries(points: Points): PlotSeries[] {
  const t = times(points);
  const y = (km: number) => Math.round(km * 1000) / 1000;
  return [{ id: 'altitude', label: 'Altitude', unit: 'km', colorVar: '--mat-sys-primary', points: points.map((p, i) => ({ x: t[i], y: y(p.altitudeKm) })) }];
}

export function sunlitSeries(points: Points): PlotSeries[] {
  const t = times(points);
  return [{ id: 'sunlit', label: 'Sunlit fraction', unit: '', colorVar: '--ecl-solar', points: points.map((p, i) => ({ x: t[i], y: p.sunlit })) }];
}

/** One surface's incident solar, albedo and IR (W/m²) and its absorbed power on a second plot. */
export function fluxSeries(points: Points, surfaceIndex: number): PlotSeries[] {
  const t = times(points);
  const of = (key: 'solarWm2' | 'albedoWm2' | 'irWm2') => points.map((p, i) => ({ x: t[i], y: p.surfaces[surfaceIndex]?.[key] ?? NaN }));
  return [
    { id: 'solar', label: 'Solar', unit: 'W/m²', colorVar: '--ecl-solar', points: of('solarWm2') },
    { id: 'albedo', label: 'Albedo', unit: 'W/m²', colorVar: '--ecl-albedo', points: of('albedoWm2') },
    { id: 'ir', label: 'Planetary IR', unit: 'W/m²', colorVar: '--ecl-ir', points: of('irWm2') },
  ];
}

/** Absorbed power of every surface, each its own line in the series colours (dashed alternately so they stay apart without colour). */
export function absorbedSeries(points: Points): PlotSeries[] {
  const t = times(points);
  const names = points[0]?.surfaces.map((s) => s.name) ?? [];
  return names.map((name, k) => ({
    id: `absorbed-${k}`,
    label: name,
    unit: 'W',
    colorVar: seriesLook(k).colorVar,
    dash: k % 2 === 1,
    points: points.map((p, i) => ({ x: t[i], y: p.surfaces[k]?.absorbedW ?? NaN })),
  }));
}

/**
 * Eclipse bands from the sampled sunlit fraction: umbra where it is 0, penumbra where it is
 * between 0 and 1. A band runs between sample times (half a step of uncertainty at each edge).
 */
export function eclipseBands(points: Points): PlotBand[] {
  const t = times(points);
  const bands: PlotBand[] = [];
  let open: { kind: 'eclipse' | 'penumbra'; from: number } | null = null;
  const kindOf = (sunlit: number): 'eclipse' | 'penumbra' | null => (sunlit <= 0 ? 'eclipse' : sunlit < 1 ? 'penumbra' : null);
  points.forEach((p, i) => {
    const kind = kindOf(p.sunlit);
    if (open && open.kind !== kind) {
      bands.push({ from: open.from, to: t[i], label: open.kind === 'eclipse' ? 'Umbra' : 'Penumbra', kind: open.kind });
      open = null;
    }
    if (kind && !open) open = { kind, from: t[i] };
  });
  const last = t[t.length - 1];
  if (open !== null && last !== undefined) {
    const still: { kind: 'eclipse' | 'penumbra'; from: number } = open;
    bands.push({ from: still.from, to: last, label: still.kind === 'eclipse' ? 'Umbra' : 'Penumbra', kind: still.kind });
  }
  return bands;
}

/** "2 h 05 min", "3 d 4 h": the span of an ephemeris for people. */
export function spanText(startEpoch: string, endEpoch: string): string {
  const s = Math.max(0, (Date.parse(endEpoch) - Date.parse(startEpoch)) / 1000);
  const d = Math.floor(s / 86400);
  const h = Math.floor((s % 86400) / 3600);
  const m = Math.round((s % 3600) / 60);
  if (d > 0) return `${d} d ${h} h`;
  if (h > 0) return `${h} h ${String(m).padStart(2, '0')} min`;
  return `${Math.round(s / 60 * 10) / 10} min`;
}
