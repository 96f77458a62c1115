import { ChangeDetectionStrategy, Component, input, output } from '@angular/core';
import { MatButton } from '@angular/material/button';

/**
 * The buttons at the end of a table row (or list item): Edit (or Change) and Delete (or Remove,
 * Revoke), each labelled for screen readers with the row it acts on ("Delete mode Sun-safe").
 * Put it on the cell: `<td eclRowActions [name]="'mode ' + m.name" (edit)="…" (remove)="…">`;
 * buttons placed inside come first (e.g. "Environment") and show even when `changeable` is false.
 */
@Component({
  selector: '[eclRowActions]',
  imports: [MatButton],
  template: `
    <ng-content />
    @if (changeable()) {
      @if (editLabel(); as label) {
        <button mat-button type="button" (click)="edit.emit()" [attr.aria-label]="label + ' ' + name()">{{ label }}</button>
      }
      <button mat-button type="button" (click)="remove.emit()" [attr.aria-label]="removeLabel() + ' ' + name()">{{ removeLabel() }}</button>
    }
  `,
  styles: `
    :host { text-align: right; white-space: nowrap; }
    /* Three actions fit beside the figures at 1440 px without clipping the last (projected buttons too). */
    :host(.compact) button, :host(.compact) ::ng-deep button { min-width: 0; padding-inline: 8px; }
    /* On a phone the buttons stand one above the other so the row's text keeps its width. */
    @media (max-width: 600px) {
      :host(.stack-narrow) button { display: block; min-width: 0; }
    }
  `,
  host: { '[class.compact]': "layout() === 'compact'", '[class.stack-narrow]': "layout() === 'stack-narrow'" },
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RowActions {
  /** The row as the labels name it, e.g. "mode Sun-safe", "token CI", or just the row's name. */
  readonly name = input.required<string>();
  /** The edit button's word; null leaves it out (rows that can only be removed). */
  readonly editLabel = input<string | null>('Edit');
  readonly removeLabel = input('Delete');
  /** False hides the edit and remove buttons (a reader's view); buttons placed inside still show. */
  readonly changeable = input(true);
  readonly layout = input<'inline' | 'compact' | 'stack-narrow'>('inline');
  readonly edit = output();
  readonly remove = output();
}
