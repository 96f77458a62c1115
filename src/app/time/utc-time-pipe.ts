import { Pipe, type PipeTransform } from '@angular/core';
import { utcText, type UtcPrecision } from './utc-time';

/** `{{ at | utc: 'minute' }}` → "2027-06-01 12:30 UTC" (utc-time.ts): the template form of utcText. */
@Pipe({ name: 'utc' })
export class UtcTimePipe implements PipeTransform {
  transform(value: string | number | Date | null | undefined, precision: UtcPrecision = 'minute'): string {
    return utcText(value, precision);
  }
}
