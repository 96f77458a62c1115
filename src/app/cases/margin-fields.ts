import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { startWith, switchMap } from 'rxjs';
import { MARGIN_DEFAULTS, heatLoadMarginHint, temperatureMarginHint } from './case-margins';

export type MarginGroup = FormGroup<{ heatLoadPercent: FormControl<number>; temperatureMarginC: FormControl<number> }>;

/** The two margins as a form group, within the API's ranges, starting at the given values (the defaults). */
export function marginGroup(fb: NonNullableFormBuilder, initial: { heatLoadPercent: number; temperatureMarginC: number } = MARGIN_DEFAULTS): MarginGroup {
  return fb.group({
    heatLoadPercent: [initial.heatLoadPercent, [Validators.required, Validators.min(0), Validators.max(200)]],
    temperatureMarginC: [initial.temperatureMarginC, [Validators.required, Validators.min(0), Validators.max(100)]],
  });
}

/** The heat-load and temperature margin fields, each with a hint that says whether it is the default and where that comes from. */
@Component({
  selector: 'ecl-margin-fields',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatHint, MatError, MatSuffix, MatInput],
  template: `
    <div class="row" [formGroup]="group()">
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>Heat-load margin</mat-label>
        <input matInput type="number" min="0" max="200" formControlName="heatLoadPercent" [attr.data-testid]="testId('heat-margin')" />
        <span matTextSuffix>%</span>
        <mat-hint>{{ heatHint() }}</mat-hint>
        <mat-error>0 to 200 %.</mat-error>
      </mat-form-field>
      <mat-form-field appearance="outline" subscriptSizing="dynamic">
        <mat-label>Temperature margin</mat-label>
        <input matInput type="number" min="0" max="100" formControlName="temperatureMarginC" [attr.data-testid]="testId('temperature-margin')" />
        <span matTextSuffix>K</span>
        <mat-hint>{{ temperatureHint() }}</mat-hint>
        <mat-error>0 to 100 K.</mat-error>
      </mat-form-field>
    </div>
  `,
  styles: `
    .row { align-items: flex-start; display: flex; flex-wrap: wrap; gap: 12px; }
    .row mat-form-field { flex: 1 1 220px; }
    mat-form-field mat-hint { white-space: normal; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MarginFields {
  readonly group = input.required<MarginGroup>();
  /** Names the inputs' test ids: "<prefix>-heat-margin" and "<prefix>-temperature-margin". */
  readonly testIdPrefix = input<string | null>(null);

  private readonly values = toSignal(toObservable(this.group).pipe(switchMap((g) => g.valueChanges.pipe(startWith(g.getRawValue())))));
  protected readonly heatHint = computed(() => heatLoadMarginHint(this.values()?.heatLoadPercent ?? null));
  protected readonly temperatureHint = computed(() => temperatureMarginHint(this.values()?.temperatureMarginC ?? null));

  protected testId(name: string): string | null {
    const prefix = this.testIdPrefix();
    return prefix ? `${prefix}-${name}` : null;
  }
}
