import type { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';
import { isIsoDate } from './utc-time';

/**
 * A day typed as "YYYY-MM-DD" (the fields are plain text: the browser's date field writes the
 * locale's form, "06/01/2027"). An empty field passes; Validators.required says when it must not be.
 */
export const isoDateValidator: ValidatorFn = (control: AbstractControl<string>): ValidationErrors | null =>
  control.value === '' || isIsoDate(control.value) ? null : { isoDate: true };
