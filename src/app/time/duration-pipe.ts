import { Pipe, type PipeTransform } from '@angular/core';
import { durationText } from '../../../shared/physics/typed-units';

/** `{{ periodS | duration }}` → "95.60 min", "9.36 d": a duration in seconds in the unit that reads best. */
@Pipe({ name: 'duration' })
export class DurationPipe implements PipeTransform {
  transform(seconds: number | null | undefined): string {
    return seconds === null || seconds === undefined ? '' : durationText(seconds);
  }
}
