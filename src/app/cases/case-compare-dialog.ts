import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOptgroup, MatOption, MatSelect } from '@angular/material/select';
import type { CaseSummary } from '../../../shared/api/cases';
import { loaded } from '../api/loaded';
import { CaseApi } from './case-api';
import { KIND_LOOKS, STATUS_LABELS } from './case-labels';

/** Picks the case to compare with: another revision of the same series first, then the mission's other cases. */
@Component({
  selector: 'ecl-case-compare-dialog',
  imports: [ReactiveFormsModule, MatButton, MatDialogTitle, MatDialogContent, MatDialogActions, MatDialogClose, MatFormField, MatLabel, MatSelect, MatOption, MatOptgroup],
  template: `
    <h2 mat-dialog-title>Compare {{ base.name }} (revision {{ base.revision }}) with…</h2>
    <mat-dialog-content>
      @if (candidates(); as state) {
        @if (state.status === 'loading') {
          <p class="ecl-muted" role="status">Loading the mission's cases…</p>
        } @else if (state.status === 'failed') {
          <p class="ecl-error" role="alert">{{ state.message }}</p>
        } @else if (state.sameSeries.length + state.others.length === 0) {
          <p class="ecl-muted">This mission has no other case to compare with.</p>
        } @else {
          <mat-form-field appearance="outline" class="pick">
            <mat-label>Case</mat-label>
            <mat-select [formControl]="choice" data-testid="compare-pick">
              @if (state.sameSeries.length > 0) {
                <mat-optgroup label="Other revisions of this case">
                  @for (c of state.sameSeries; track c.id) {
                    <mat-option [value]="c.id">{{ describe(c) }}</mat-option>
                  }
                </mat-optgroup>
              }
              @if (state.others.length > 0) {
                <mat-optgroup label="Other cases of the mission">
                  @for (c of state.others; track c.id) {
                    <mat-option [value]="c.id">{{ describe(c) }}</mat-option>
                  }
                </mat-optgroup>
              }
            </mat-select>
          </mat-form-field>
        }
      }
    </mat-dialog-content>
    <mat-dialog-actions align="end">
      <button mat-button type="button" mat-dialog-close>Cancel</button>
      <button mat-flat-button type="button" [mat-dialog-close]="choice.value" [disabled]="choice.invalid" data-testid="compare-go">Compare</button>
    </mat-dialog-actions>
  `,
  styles: `
    .pick {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseCompareDialog {
  protected readonly base = inject<CaseSummary>(MAT_DIALOG_DATA);
  protected readonly choice = new FormControl<string>('', { nonNullable: true, validators: Validators.required });
  private readonly list = toSignal(inject(CaseApi).list({ missionId: this.base.missionId }).pipe(loaded()), { requireSync: true });

  protected readonly candidates = computed(() => {
    const state = this.list();
    if (state.status !== 'ready') return state;
    const others = state.value.filter((c) => c.id !== this.base.id);
    const byRevision = (a: CaseSummary, b: CaseSummary) => b.revision - a.revision;
    return {
      status: 'ready' as const,
      sameSeries: others.filter((c) => c.seriesId === this.base.seriesId).sort(byRevision),
      others: others.filter((c) => c.seriesId !== this.base.seriesId),
    };
  });

  protected describe(c: CaseSummary): string {
    return `${c.name} · ${KIND_LOOKS[c.kind].label} · revision ${c.revision} · ${STATUS_LABELS[c.status]}`;
  }
}
