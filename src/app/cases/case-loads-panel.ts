import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, input, signal } from '@angular/core';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
import type { CaseResultsContent } from '../../../shared/api/case-content';
import { sharedZoom } from '../plots/plot-cursor';
import { TimeSeriesPlot } from '../plots/time-series-plot';
import { isBodyId, getBody } from '../../../shared/physics/bodies';
import { WHOLE_SPACECRAFT, absorbedSeries, eclipseBands, incidentSeries } from './case-plots';

/** The planet's name about a moon; null for a planet or an unknown body. */
function parentName(bodyId: string | null): string | null {
  const parentId = bodyId && isBodyId(bodyId) ? getBody(bodyId).parentId : null;
  return parentId ? getBody(parentId).name : null;
}

/** The case's loads around the orbit for a chosen surface (or all), and the table of orbit averages and peaks. */
@Component({
  selector: 'ecl-case-loads',
  imports: [DecimalPipe, MatFormField, MatLabel, MatSelect, MatOption, TimeSeriesPlot],
  templateUrl: './case-loads-panel.html',
  styleUrl: './case-loads-panel.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseLoadsPanel {
  readonly results = input.required<CaseResultsContent>();
  /** Names the CSV files the plots offer. */
  readonly caseName = input('case');
  /** True for a case computed along an ephemeris window: time then counts from the window's first row. */
  readonly fromEphemeris = input(false);
  /** The case's body: about a moon the plot names its planet's shadow, shaded apart from the moon's own. */
  readonly bodyId = input<string | null>(null);

  protected readonly whole = WHOLE_SPACECRAFT;
  protected readonly surface = signal(WHOLE_SPACECRAFT);
  /** The incident and absorbed plots share the orbit's time axis: they zoom together, and line up. */
  protected readonly zoom = sharedZoom(this.results);
  protected readonly gutters = { left: 64 };
  protected readonly bands = computed(() => eclipseBands(this.results(), parentName(this.bodyId())));
  protected readonly incident = computed(() => incidentSeries(this.results(), this.surface()));
  protected readonly absorbed = computed(() => absorbedSeries(this.results(), this.surface()));
  protected readonly surfaceLabel = computed(() => (this.surface() === WHOLE_SPACECRAFT ? 'the whole spacecraft' : this.surface()));
  protected readonly fileStem = computed(() =>
    `${this.caseName()}-${this.surface() === WHOLE_SPACECRAFT ? 'spacecraft' : this.surface()}`.replace(/[^A-Za-z0-9-]+/g, '-').toLowerCase(),
  );
}
