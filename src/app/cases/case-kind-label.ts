import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';
import type { CaseKind } from '../../../shared/api/case-content';
import { cssColor } from '../plots/plot-colors';
import { KIND_LOOKS } from './case-labels';

/** "Hot" or "Cold" with its icon in its tone: the word carries the meaning, the colour backs it up. */
@Component({
  selector: 'ecl-case-kind',
  imports: [MatIcon],
  template: `
    <span class="kind" [style.color]="color()" [attr.data-kind]="kind()">
      <mat-icon aria-hidden="true">{{ look().icon }}</mat-icon>{{ look().label }}
    </span>
  `,
  styles: `
    .kind {
      display: inline-flex;
      align-items: center;
      gap: 2px;
      font-weight: 600;
      white-space: nowrap;
    }
    mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseKindLabel {
  readonly kind = input.required<CaseKind>();
  protected readonly look = computed(() => KIND_LOOKS[this.kind()]);
  protected readonly color = computed(() => cssColor(this.look().colorVar));
}
