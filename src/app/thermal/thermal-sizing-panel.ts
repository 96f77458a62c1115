// Sizing with the saved model: the radiator area that holds a node at its maximum less the margin
// in the hot case, and the heater power that holds a node at its minimum plus the margin in the
// cold case at minimum bus voltage with the duty cycle within the model's limit.
import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect, MatSelectTrigger } from '@angular/material/select';
import type { CaseSummary } from '../../../shared/api/cases';
import type { ThermalModelSizeResponse } from '../../../shared/api/thermal-models';
import { apiErrorMessage } from '../api/api-error-message';
import { CaseKindLabel } from '../cases/case-kind-label';
import { ThermalModelApi } from './thermal-api';
import { dutyPercent } from './thermal-run-plots';

@Component({
  selector: 'ecl-thermal-sizing-panel',
  imports: [DecimalPipe, MatButton, MatFormField, MatLabel, MatIcon, MatProgressBar, MatSelect, MatSelectTrigger, MatOption, CaseKindLabel],
  template: `
    <div class="pick-row">
      <mat-form-field appearance="outline">
        <mat-label>Hot case</mat-label>
        <mat-select [value]="hotId()" (valueChange)="hot.set($event)" data-testid="size-hot-case">
          <mat-select-trigger>@if (caseOf(hotId()); as c) { <ecl-case-kind [kind]="c.kind" /> {{ c.name }} · rev {{ c.revision }} }</mat-select-trigger>
          @for (c of hotCases(); track c.id) { <mat-option [value]="c.id"><ecl-case-kind [kind]="c.kind" /> {{ c.name }} · rev {{ c.revision }}</mat-option> }
        </mat-select>
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Radiator on node</mat-label>
        <mat-select [value]="radiatorNode()" (valueChange)="radiator.set($event)" data-testid="size-radiator-node">
          @for (n of nodes(); track n) { <mat-option [value]="n">{{ n }}</mat-option> }
        </mat-select>
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Cold case</mat-label>
        <mat-select [value]="coldId()" (valueChange)="cold.set($event)" data-testid="size-cold-case">
          <mat-select-trigger>@if (caseOf(coldId()); as c) { <ecl-case-kind [kind]="c.kind" /> {{ c.name }} · rev {{ c.revision }} }</mat-select-trigger>
          @for (c of coldCases(); track c.id) { <mat-option [value]="c.id"><ecl-case-kind [kind]="c.kind" /> {{ c.name }} · rev {{ c.revision }}</mat-option> }
        </mat-select>
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Heater on node</mat-label>
        <mat-select [value]="heaterNode()" (valueChange)="heater.set($event)" data-testid="size-heater-node">
          @for (n of heaterNodes(); track n) { <mat-option [value]="n">{{ n }}</mat-option> }
        </mat-select>
      </mat-form-field>
      @if (canRun()) {
        <button mat-flat-button type="button" (click)="size()" [disabled]="busy() || !hotId() || !coldId() || !radiatorNode()" data-testid="size-model"><mat-icon>straighten</mat-icon>Size</button>
      }
    </div>
    @if (busy()) {
      <mat-progress-bar mode="indeterminate" aria-label="Sizing: one periodic solve per trial" />
    }
    @if (failure(); as f) {
      <p class="ecl-error" role="alert">{{ f }}</p>
    }
    @if (answer(); as a) {
      <div class="cards" data-testid="sizing-results">
        <section class="card hot-card" aria-labelledby="size-radiator">
          <h4 id="size-radiator"><ecl-case-kind kind="hot" /> Radiator area</h4>
          @if (a.radiator.sizing?.note; as note) {
            <p class="big" data-testid="radiator-area">None needed</p>
            <p data-testid="radiator-note">{{ note }}</p>
          } @else if (a.radiator.sizing; as s) {
            <p class="big" data-testid="radiator-area">{{ s.areaM2 | number: '1.3-3' }} m²</p>
            <p>holds {{ s.node }} at or below {{ s.targetMaxC | number: '1.1-1' }} °C (maximum less {{ a.margins.hotK }} K) in “{{ a.radiator.case.name }}”; peak reached {{ s.achievedMaxC | number: '1.1-1' }} °C.</p>
            @if (s.equationAreaM2 !== null && s.equationAreaM2 > 0) {
              <p class="ecl-muted">Radiator equation with orbit-average loads: {{ s.equationAreaM2 | number: '1.3-3' }} m².</p>
            }
          } @else {
            <p class="big">Nothing fits</p>
            <p class="ecl-error" data-testid="radiator-refused">{{ a.radiator.refused }}</p>
          }
        </section>
        <section class="card cold-card" aria-labelledby="size-heater">
          <h4 id="size-heater"><ecl-case-kind kind="cold" /> Heater power</h4>
          @if (a.heater.sizing?.note; as note) {
            <p class="big" data-testid="heater-power">None needed</p>
            <p data-testid="heater-note">{{ note }}</p>
          } @else if (a.heater.sizing; as s) {
            <p class="big" data-testid="heater-power">{{ s.powerW | number: '1.2-2' }} W</p>
            <p>installed at nominal voltage; {{ s.powerAtMinVoltageW | number: '1.2-2' }} W at {{ s.minVoltageV ?? 'nominal' }}{{ s.minVoltageV ? ' V' : '' }},
              on {{ dutyPercent(s.dutyCycleAtMinVoltage) }} of the orbit (limit {{ dutyPercent(s.maxDutyCycle) }}), {{ s.orbitAverageAtMinVoltageW | number: '1.2-2' }} W orbit average.</p>
            <p class="ecl-muted">Holds {{ s.node }} at or above {{ s.targetMinC | number: '1.1-1' }} °C (minimum plus {{ a.margins.coldK }} K) in “{{ a.heater.case.name }}”; coldest {{ s.achievedMinC | number: '1.1-1' }} °C.</p>
          } @else {
            <p class="big">Nothing fits</p>
            <p class="ecl-error" data-testid="heater-refused">{{ a.heater.refused }}</p>
          }
        </section>
      </div>
    }
  `,
  styles: `
    .pick-row { display: flex; flex-wrap: wrap; gap: 12px; align-items: center; }
    .cards { display: grid; grid-template-columns: repeat(auto-fit, minmax(300px, 1fr)); gap: 16px; margin-top: 8px; }
    .card { padding: 12px 16px; border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; }
    .hot-card { border-left: 4px solid var(--ecl-hot); }
    .cold-card { border-left: 4px solid var(--ecl-cold); }
    h4 { display: flex; gap: 8px; align-items: center; margin: 0 0 4px; font: var(--mat-sys-title-small); }
    .big { font: var(--mat-sys-headline-small); font-variant-numeric: tabular-nums; margin: 4px 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThermalSizingPanel {
  readonly modelId = input.required<string>();
  readonly cases = input.required<readonly CaseSummary[]>();
  readonly nodes = input.required<readonly string[]>();
  readonly heaterNodes = input.required<readonly string[]>();
  readonly canRun = input(false);

  private readonly api = inject(ThermalModelApi);
  protected readonly hot = signal<string | null>(null);
  protected readonly cold = signal<string | null>(null);
  protected readonly radiator = signal<string | null>(null);
  protected readonly heater = signal<string | null>(null);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  protected readonly answer = signal<ThermalModelSizeResponse | null>(null);
  protected readonly dutyPercent = dutyPercent;

  private readonly ofKind = (kind: 'hot' | 'cold') => {
    const list = this.cases();
    const matching = list.filter((c) => c.kind === kind);
    return matching.length > 0 ? matching : list;
  };
  protected readonly hotCases = computed(() => this.ofKind('hot'));
  protected readonly coldCases = computed(() => this.ofKind('cold'));
  protected readonly hotId = computed(() => this.hot() ?? this.hotCases()[0]?.id ?? null);
  protected readonly coldId = computed(() => this.cold() ?? this.coldCases()[0]?.id ?? null);
  // A radiator is sized on a node that owns one; the editor lists every node, so default to the first.
  protected readonly radiatorNode = computed(() => this.radiator() ?? this.nodes().find((n) => /radiator/i.test(n)) ?? this.nodes()[0] ?? null);
  protected readonly heaterNode = computed(() => this.heater() ?? this.heaterNodes()[0] ?? this.radiatorNode());

  protected caseOf(id: string | null) {
    return this.cases().find((c) => c.id === id) ?? null;
  }

  protected size(): void {
    const [caseHotId, caseColdId, node] = [this.hotId(), this.coldId(), this.radiatorNode()];
    if (!caseHotId || !caseColdId || !node) return;
    const heaterNode = this.heaterNode();
    this.busy.set(true);
    this.failure.set(null);
    this.api.size(this.modelId(), { caseHotId, caseColdId, node, ...(heaterNode ? { heaterNode } : {}) }).subscribe({
      next: (a) => {
        this.busy.set(false);
        this.answer.set(a);
      },
      error: (e: unknown) => {
        this.busy.set(false);
        this.failure.set(apiErrorMessage(e));
      },
    });
  }
}
