// Plot inputs and the CSV file from one orbit's environment answer. x is minutes from periapsis
// (from the ascending node for a circular orbit), as the profile's tS counts (API.md).
import type { EnvironmentResponse } from '../../../shared/api/environment';
import type { CsvColumn } from '../plots/csv-download';
import { shadowKind, type PlotBand, type PlotSeries } from '../plots/plot-series';

type Profile = EnvironmentResponse['profile'];

const minutes = (s: number): number => s / 60;

/** A body's name from its id, as the catalogue spells the built-in ones. */
export const bodyName = (id: string): string => id.charAt(0).toUpperCase() + id.slice(1);

/**
 * The eclipse as shaded bands: each run of samples with sunlit < 1 (umbra and penumbra), widened to
 * the midpoints with its sunlit neighbours so a band covers the time the samples stand for. About a
 * moon, runs in the planet's shadow are their own kind and label ("In Jupiter's shadow").
 */
export function eclipseBands(profile: Profile, parentBodyId: string | null = null): PlotBand[] {
  const bands: PlotBand[] = [];
  const n = profile.length;
  const edge = (i: number, j: number): number => minutes((profile[i].tS + profile[j].tS) / 2);
  // this page shades the moon's own umbra and penumbra alike
  const kindAt = (k: number): 'parent-shadow' | 'eclipse' | null => {
    const kind = shadowKind(profile[k].sunlit, profile[k].parentSunlit);
    return kind === 'penumbra' ? 'eclipse' : kind;
  };
  const parentLabel = parentBodyId ? `In ${bodyName(parentBodyId)}'s shadow` : 'Eclipse';
  let i = 0;
  while (i < n) {
    const kind = kindAt(i);
    if (kind === null) {
      i++;
      continue;
    }
    let j = i;
    while (j + 1 < n && kindAt(j + 1) === kind) j++;
    const from = i === 0 ? minutes(profile[0].tS) : edge(i - 1, i);
    const to = j === n - 1 ? minutes(profile[n - 1].tS) : edge(j, j + 1);
    bands.push({ from, to, label: kind === 'parent-shadow' ? parentLabel : 'Eclipse', kind });
    i = j + 1;
  }
  return bands;
}

/** Solar, albedo and planetary IR flux on one surface, W/m². */
export function fluxSeries(profile: Profile, surfaceIndex: number): PlotSeries[] {
  const of = (pick: (s: Profile[number]['surfaces'][number]) => number) =>
    profile.map((p) => ({ x: minutes(p.tS), y: pick(p.surfaces[surfaceIndex]) }));
  return [
    { id: 'solar', label: 'Solar', unit: 'W/m²', colorVar: '--ecl-solar', points: of((s) => s.solarWm2) },
    { id: 'albedo', label: 'Albedo', unit: 'W/m²', colorVar: '--ecl-albedo', points: of((s) => s.albedoWm2) },
    { id: 'ir', label: 'Planetary IR', unit: 'W/m²', colorVar: '--ecl-ir', points: of((s) => s.irWm2), dash: true },
  ];
}

/** The heat one surface absorbs, W (area × (α (solar + albedo) + ε IR)). */
export function absorbedSeries(profile: Profile, surfaceIndex: number): PlotSeries[] {
  const name = profile[0]?.surfaces[surfaceIndex]?.name ?? 'surface';
  return [
    {
      id: 'absorbed',
      label: `Absorbed by ${name}`,
      unit: 'W',
      colorVar: '--ecl-absorbed',
      points: profile.map((p) => ({ x: minutes(p.tS), y: p.surfaces[surfaceIndex].absorbedW })),
    },
  ];
}

/** Every sample of the profile, every surface: one row a sample, units in the header. */
export function profileCsvColumns(profile: Profile, weightsS: readonly number[] | null = null): CsvColumn[] {
  const names = profile[0]?.surfaces.map((s) => s.name) ?? [];
  const columns: CsvColumn[] = [
    { header: 'Time from periapsis', unit: 'min', values: profile.map((p) => minutes(p.tS)) },
    // samples not evenly spaced in time (dense at periapsis): each one's share of the period
    ...(weightsS ? [{ header: 'Share of the period', unit: 's', values: [...weightsS] }] : []),
    { header: 'True anomaly', unit: 'deg', values: profile.map((p) => p.trueAnomalyDeg) },
    { header: 'Sunlit fraction', values: profile.map((p) => p.sunlit) },
  ];
  if (profile.some((p) => p.parentSunlit !== undefined)) {
    columns.push({ header: 'Sunlit fraction past the planet', values: profile.map((p) => p.parentSunlit ?? 1) });
  }
  names.forEach((name, i) => {
    columns.push(
      { header: `${name} solar`, unit: 'W/m²', values: profile.map((p) => p.surfaces[i].solarWm2) },
      { header: `${name} albedo`, unit: 'W/m²', values: profile.map((p) => p.surfaces[i].albedoWm2) },
      { header: `${name} IR`, unit: 'W/m²', values: profile.map((p) => p.surfaces[i].irWm2) },
      { header: `${name} absorbed`, unit: 'W', values: profile.map((p) => p.surfaces[i].absorbedW) },
    );
  });
  return columns;
}
