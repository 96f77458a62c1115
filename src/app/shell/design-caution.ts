import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatIcon } from '@angular/material/icon';

/** The caution's words, for files a page writes (CSV). */
export const DESIGN_CAUTION_TEXT =
  "Preliminary-design estimate from simplified models. Verify with detailed analysis, a correlated model and thermal test under the project's standards and qualified practitioners.";

/** The caution every result page carries (PRODUCT.md); crewed vehicles get the extra sentence. */
@Component({
  selector: 'ecl-design-caution',
  imports: [MatIcon],
  template: `
    <aside class="caution" aria-label="Design caution">
      <mat-icon aria-hidden="true">info</mat-icon>
      <p>
        {{ text }}
        @if (crewed()) {
          <strong>Habitability and touch-temperature limits are not checked.</strong>
        }
      </p>
    </aside>
  `,
  styles: `
    .caution {
      display: flex;
      gap: 8px;
      align-items: flex-start;
      padding: 8px 12px;
      border-left: 3px solid var(--ecl-accent);
      background: var(--mat-sys-surface-container-low);
      color: var(--mat-sys-on-surface-variant);
      font: var(--mat-sys-body-small);
    }
    mat-icon {
      font-size: 18px;
      width: 18px;
      height: 18px;
      flex: none;
    }
    p {
      margin: 0;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DesignCaution {
  protected readonly text = DESIGN_CAUTION_TEXT;
  readonly crewed = input(false);
}
