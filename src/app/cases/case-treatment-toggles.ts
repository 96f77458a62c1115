import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';

/** A single case's property set (BOL or EOL) and whether its heat-load margin is added (hot) or taken off (cold). */
@Component({
  selector: 'ecl-case-treatment-toggles',
  imports: [ReactiveFormsModule, MatButtonToggleGroup, MatButtonToggle],
  template: `
    <div class="toggle-row">
      <span class="toggle-label">Property set</span>
      <mat-button-toggle-group [formControl]="properties()" aria-label="Property set">
        <mat-button-toggle value="bol">BOL</mat-button-toggle>
        <mat-button-toggle value="eol">EOL</mat-button-toggle>
      </mat-button-toggle-group>
      <span class="toggle-label">Margin</span>
      <mat-button-toggle-group [formControl]="marginDirection()" aria-label="Margin direction">
        <mat-button-toggle value="increase">adds (hot)</mat-button-toggle>
        <mat-button-toggle value="decrease">takes off (cold)</mat-button-toggle>
      </mat-button-toggle-group>
    </div>
  `,
  styles: `
    .toggle-row { display: flex; flex-wrap: wrap; align-items: center; gap: 12px; margin-bottom: 8px; }
    .toggle-label { min-width: 80px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseTreatmentToggles {
  readonly properties = input.required<FormControl<'bol' | 'eol'>>();
  readonly marginDirection = input.required<FormControl<'increase' | 'decrease'>>();
}
