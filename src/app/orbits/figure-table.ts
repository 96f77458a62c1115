import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, booleanAttribute, input } from '@angular/core';

/** A column of figures: its header (with the unit) and the DecimalPipe digits it is shown with. */
export interface FigureColumn {
  readonly label: string;
  readonly digits: string;
}

/** A row: its name (the row header), an optional line under the name, and one figure per column. */
export interface FigureRow {
  readonly name: string;
  readonly note?: string;
  readonly values: readonly number[];
}

let nextTitleId = 0;

/**
 * A titled table of figures per named row, as the environment results show them (orbit averages
 * per surface, per face of the default box): the title names the table for screen readers, row
 * names are row headers, figures align right.
 */
@Component({
  selector: 'ecl-figure-table',
  imports: [DecimalPipe],
  template: `
    <h3 [id]="titleId">{{ title() }}</h3>
    <div class="ecl-table-wrap">
      <table class="plain" [class.compact]="compact()" [attr.aria-labelledby]="titleId" [attr.data-testid]="testid()">
        <thead>
          <tr>
            <th scope="col">{{ nameHeader() }}</th>
            @for (c of columns(); track $index) {
              <th scope="col" class="num">{{ c.label }}</th>
            }
          </tr>
        </thead>
        <tbody>
          @for (row of rows(); track row.name) {
            <tr>
              <th scope="row">{{ row.name }}@if (row.note !== undefined) {<span class="note" [attr.data-testid]="noteTestid()">{{ row.note }}</span>}</th>
              @for (value of row.values; track $index) {
                <td class="num">{{ value | number: columns()[$index]?.digits }}</td>
              }
            </tr>
          }
        </tbody>
      </table>
    </div>
  `,
  styles: `
    /* The title and the table stand in the page's own column, spaced by its gap. */
    :host { display: contents; }
    h3 { margin: 8px 0 0; font: var(--mat-sys-title-small); }
    th .note {
      display: block;
      max-width: 28ch;
      font: var(--mat-sys-body-small);
      font-weight: 400;
      color: var(--mat-sys-on-surface-variant);
      white-space: normal;
    }
    /* A compact table fits a phone with narrower cells. */
    @media (max-width: 600px) {
      table.compact th, table.compact td { padding: 6px 6px; }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class FigureTable {
  readonly title = input.required<string>();
  /** The header over the row names, e.g. "Surface". */
  readonly nameHeader = input.required<string>();
  readonly columns = input.required<readonly FigureColumn[]>();
  readonly rows = input.required<readonly FigureRow[]>();
  readonly compact = input(false, { transform: booleanAttribute });
  readonly testid = input<string | null>(null);
  readonly noteTestid = input<string | null>(null);

  protected readonly titleId = `figure-table-${nextTitleId++}`;
}
