// Plot inputs from a case's results: the incident fluxes and absorbed loads of one surface (or
// of the spacecraft as a whole) around the orbit, with the eclipse shaded, in minutes.
import type { CaseResultsContent } from '../../../shared/api/case-content';
import { shadowKind, type PlotBand, type PlotSeries } from '../plots/plot-series';

/** The picker's value for the sum over every surface. */
export const WHOLE_SPACECRAFT = '';

type Results = CaseResultsContent;
type SeriesKey = keyof Results['surfaces'][number]['series'];

function minutes(results: Results): number[] {
  return results.tS.map((t) => t / 60);
}

function line(results: Results, id: string, label: string, unit: string, colorVar: string, values: readonly number[], dash = false): PlotSeries {
  const x = minutes(results);
  return { id, label, unit, colorVar, dash, points: values.map((y, i) => ({ x: x[i], y })) };
}

/** Each series summed over the surfaces, sample by sample. */
function summed(results: Results, key: SeriesKey): number[] {
  return results.tS.map((_, i) => results.surfaces.reduce((sum, s) => sum + (s.series[key][i] ?? 0), 0));
}

/**
 * Eclipse bands from the sunlit fraction: full shadow (0) is the umbra, anything between 0 and 1
 * the penumbra. About a moon, samples in the planet's shadow (parentSunlit < 1) are their own kind,
 * shaded as on the orbit's environment page and labelled with the planet's name when it is given.
 * A run that reaches the end of the orbit closes at the last sample.
 */
export function eclipseBands(results: Results, parentName: string | null = null): PlotBand[] {
  const x = minutes(results);
  const bands: PlotBand[] = [];
  const parent = results.parentSunlit;
  const kindAt = (i: number): PlotBand['kind'] | null => shadowKind(results.sunlit[i], parent?.[i]);
  const labels: Record<string, string> = {
    eclipse: 'Eclipse (umbra)', penumbra: 'Penumbra', 'parent-shadow': parentName ? `In ${parentName}'s shadow` : "In the planet's shadow",
  };
  let start = -1;
  let kind: PlotBand['kind'] | null = null;
  for (let i = 0; i <= x.length; i++) {
    const here = i < x.length ? kindAt(i) : null;
    if (here === kind) continue;
    if (kind !== null) bands.push({ from: x[start], to: x[Math.min(i, x.length - 1)], kind, label: labels[kind] ?? '' });
    start = i;
    kind = here;
  }
  return bands;
}

/** Incident fluxes on one surface, W/m²; none for the whole spacecraft (a sum of fluxes means nothing). */
export function incidentSeries(results: Results, surface: string): PlotSeries[] {
  const s = results.surfaces.find((x) => x.name === surface);
  if (!s) return [];
  return [
    line(results, 'solar', 'Solar', 'W/m²', '--ecl-solar', s.series.solarWm2),
    line(results, 'albedo', 'Albedo', 'W/m²', '--ecl-albedo', s.series.albedoWm2),
    line(results, 'ir', 'Planetary IR', 'W/m²', '--ecl-ir', s.series.irWm2),
  ];
}

/** Absorbed loads, W: per component and in total, for one surface or summed over all. */
export function absorbedSeries(results: Results, surface: string): PlotSeries[] {
  const pick = (key: SeriesKey): readonly number[] =>
    surface === WHOLE_SPACECRAFT ? summed(results, key) : (results.surfaces.find((x) => x.name === surface)?.series[key] ?? []);
  return [
    line(results, 'absorbed', 'Absorbed, total', 'W', '--ecl-absorbed', pick('absorbedW')),
    line(results, 'solarW', 'Solar absorbed', 'W', '--ecl-solar', pick('solarW'), true),
    line(results, 'albedoW', 'Albedo absorbed', 'W', '--ecl-albedo', pick('albedoW'), true),
    line(results, 'irW', 'IR absorbed', 'W', '--ecl-ir', pick('irW'), true),
  ];
}
