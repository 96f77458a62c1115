import { booleanAttribute, ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { ReactiveFormsModule, type AbstractControl, type FormControl } from '@angular/forms';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';

/**
 * One labelled text input of a reactive form with its unit, hint and error line, as the dialogs and
 * editors write them: `<ecl-field [control]="form.controls.radiusKm" label="Radius" unit="km"
 * [hint]="preview" [error]="problem('radiusKm')" testid="body-radius" />`.
 * `kind` gives the keyboard and help a value wants: 'date' (YYYY-MM-DD, numeric keys), 'decimal'
 * (a number, possibly with a unit typed after it), 'iso' (a time as ISO 8601: no spell check), 'number' (a plain number input whose value is a
 * number), 'text'. Lay it out as you would the form field (a class on the element sizes it).
 */
@Component({
  selector: 'ecl-field',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatInput, MatHint, MatError, MatSuffix],
  template: `
    <mat-form-field appearance="outline">
      <mat-label>{{ label() }}</mat-label>
      <!-- Two inputs because Angular picks the number value accessor from the static type attribute. -->
      @if (kind() === 'number') {
        <input matInput type="number" [formControl]="formControl()" [attr.step]="step()" [attr.data-testid]="testid()" />
      } @else {
        <input
          matInput
          type="text"
          [formControl]="formControl()"
          [attr.inputmode]="kind() === 'date' ? 'numeric' : kind() === 'decimal' ? 'decimal' : null"
          [attr.placeholder]="kind() === 'date' ? 'YYYY-MM-DD' : null"
          [attr.autocomplete]="kind() === 'date' ? 'off' : null"
          [attr.spellcheck]="kind() === 'decimal' || kind() === 'iso' ? 'false' : null"
          [attr.cdkFocusInitial]="initialFocus() ? '' : null"
          [attr.data-testid]="testid()"
        />
      }
      @if (unit(); as u) {
        <span matTextSuffix>{{ u }}</span>
      }
      @if (hint() !== null) {
        <mat-hint [attr.data-testid]="hintTestid()">{{ hint() }}</mat-hint>
      }
      <mat-error [attr.data-testid]="errorTestid()">{{ error() }}</mat-error>
    </mat-form-field>
  `,
  styles: `
    :host { display: inline-flex; flex-direction: column; min-width: 0; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LabelledField {
  /** The field's control (always a FormControl; typed loosely so a form's lookup by name can pass it). */
  readonly control = input.required<AbstractControl>();
  readonly label = input.required<string>();
  /** The line under an invalid field. */
  readonly error = input('');
  readonly kind = input<'text' | 'date' | 'decimal' | 'number' | 'iso'>('text');
  /** The unit shown after the value; null when none (or when the user types the unit). */
  readonly unit = input<string | null>(null);
  /** The line under a valid field; null for none ('' keeps an empty line in place). */
  readonly hint = input<string | null>(null);
  readonly step = input<string | number | null>(null);
  /** The dialog puts the cursor here when it opens. */
  readonly initialFocus = input(false, { transform: booleanAttribute });
  readonly testid = input<string | null>(null);
  readonly hintTestid = input<string | null>(null);
  readonly errorTestid = input<string | null>(null);

  protected readonly formControl = computed(() => this.control() as FormControl);
}
