import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CaseDetail } from '../../../shared/api/cases';
import { PROPERTY_SET_LABELS } from './case-labels';
import { DurationPipe } from '../time/duration-pipe';
import { fieldWords, sourceWords } from '../shell/user-words';
import { SourceWordsPipe } from '../shell/source-words-pipe';

interface ConstantRow {
  readonly label: string;
  readonly value: string;
  readonly source: string;
}

const range = (r: { min: number; nominal: number; max: number }, digits: number, unit = ''): string =>
  `${r.min.toFixed(digits)} / ${r.nominal.toFixed(digits)} / ${r.max.toFixed(digits)}${unit ? ` ${unit}` : ''}`;

/** Every input of a case as it was snapshotted: orbit, conditions, eclipse, margins, body constants with sources. */
@Component({
  selector: 'ecl-case-inputs',
  imports: [SourceWordsPipe, DurationPipe, DecimalPipe],
  templateUrl: './case-inputs-panel.html',
  styleUrl: './case-inputs-panel.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseInputsPanel {
  readonly loadCase = input.required<CaseDetail>();
  protected readonly inputs = computed(() => this.loadCase().inputs);
  protected readonly results = computed(() => this.loadCase().results);
  /** Where the Sun distance comes from, with its own date (it may differ from the beta's day). */
  protected readonly sunNote = computed(() => {
    const i = this.inputs();
    const sun = i.decision?.sun;
    if (!sun || (i.handEdited ?? []).includes('solarDistanceAu')) return null;
    if (sun.basis === 'mission') return `closest/farthest of the mission, ${sun.date}`.replace('closest/farthest', this.loadCase().kind === 'hot' ? 'closest' : 'farthest');
    return `${sun.basis} of ${i.body.name}'s orbit; the mission comes nearest to it on ${sun.date}`;
  });
  protected readonly propertyLabels = PROPERTY_SET_LABELS;

  /** The body's constants beside the source each was taken from; sources with no value shown come last. */
  protected readonly constants = computed((): ConstantRow[] => {
    const body = this.inputs().body;
    const source = (key: string) => sourceWords(body.sources[key] ?? '—');
    const rows: ConstantRow[] = [
      { label: 'Gravitational parameter', value: `${body.gmKm3S2.toFixed(4)} km³/s²`, source: source('gmKm3S2') },
      { label: 'Equatorial radius', value: `${body.radiusKm.toFixed(3)} km`, source: source('radiusKm') },
      { label: 'J2', value: body.j2.toExponential(5), source: source('j2') },
      {
        label: 'Distance from the Sun (min / mean / max)',
        value: `${body.solarDistanceAu.min.toFixed(4)} / ${body.solarDistanceAu.mean.toFixed(4)} / ${body.solarDistanceAu.max.toFixed(4)} AU`,
        source: source('solarDistanceAu'),
      },
      { label: 'Albedo (min / nominal / max)', value: range(body.albedo, 3), source: source('albedo') },
      { label: 'OLR (min / nominal / max)', value: range(body.olrWm2, 1, 'W/m²'), source: source('olrWm2') },
    ];
    const shown = new Set(['gmKm3S2', 'radiusKm', 'j2', 'solarDistanceAu', 'albedo', 'olrWm2']);
    const rest = Object.entries(body.sources)
      .filter(([key]) => !shown.has(key))
      .map(([key, text]) => ({ label: fieldWords(key).replace(/^./, (c) => c.toUpperCase()), value: '', source: sourceWords(text) }));
    return [...rows, ...rest];
  });
}
