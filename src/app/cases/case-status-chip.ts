import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { CaseStatus } from '../../../shared/api/case-content';
import { STATUS_LABELS } from './case-labels';

/** The status as a small outlined chip; released is filled so it stands out in a long list. */
@Component({
  selector: 'ecl-case-status',
  template: `<span class="chip" [class]="'chip status-' + status()">{{ label() }}</span>`,
  styles: `
    .chip {
      display: inline-block;
      padding: 1px 10px;
      border-radius: 12px;
      border: 1px solid var(--mat-sys-outline);
      font: var(--mat-sys-label-medium);
      white-space: nowrap;
    }
    .status-review {
      border-color: var(--ecl-accent);
      color: var(--ecl-accent);
    }
    .status-released {
      background: var(--mat-sys-primary);
      border-color: var(--mat-sys-primary);
      color: var(--mat-sys-on-primary);
    }
    .status-superseded {
      border-style: dashed;
      color: var(--mat-sys-on-surface-variant);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseStatusChip {
  readonly status = input.required<CaseStatus>();
  protected readonly label = computed(() => STATUS_LABELS[this.status()]);
}
