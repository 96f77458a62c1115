import { AbstractControl, ValidationErrors, ValidatorFn } from '@angular/forms';

/** The shared password rule (shared/api/auth.ts: 10 to 200 characters), for Angular forms. */
export const PASSWORD_MIN_LENGTH = 10;
export const PASSWORD_MAX_LENGTH = 200;

/** Group validator: the repeated password must equal the first one. */
export const matchingPasswords: ValidatorFn = (group: AbstractControl): ValidationErrors | null => {
  const first: unknown = group.get('password')?.value;
  const second: unknown = group.get('repeat')?.value;
  return first === second ? null : { mismatch: true };
};
