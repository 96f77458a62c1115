import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButton } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogClose, MatDialogContent, MatDialogRef, MatDialogTitle } from '@angular/material/dialog';
import { MatProgressBar } from '@angular/material/progress-bar';
import type { Observable } from 'rxjs';
import type { CaseDetail } from '../../../shared/api/cases';
import { apiErrorMessage } from '../api/api-error-message';
import { CaseApi } from './case-api';
import { CaseKindLabel } from './case-kind-label';
import { PROPERTY_SET_LABELS } from './case-labels';
import { UtcTimePipe } from '../time/utc-time-pipe';

export interface CaseReviewData {
  /** submit: draft -> in review; release: in review -> released. */
  readonly step: 'submit' | 'release';
  readonly loadCase: CaseDetail;
}

/**
 * Submitting for review and releasing: a summary of what is being signed off, then the server's
 * answer. The server decides four-eyes release; its refusal is shown here as it words it.
 */
@Component({
  selector: 'ecl-case-review-dialog',
  imports: [UtcTimePipe, DecimalPipe, MatButton, MatDialogTitle, MatDialogContent, MatDialogActions, MatDialogClose, MatProgressBar, CaseKindLabel],
  templateUrl: './case-review-dialog.html',
  styleUrl: './case-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CaseReviewDialog {
  private readonly api = inject(CaseApi);
  private readonly dialogRef = inject<MatDialogRef<CaseReviewDialog, CaseDetail>>(MatDialogRef);
  protected readonly data = inject<CaseReviewData>(MAT_DIALOG_DATA);
  protected readonly c = this.data.loadCase;
  protected readonly propertyLabels = PROPERTY_SET_LABELS;

  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);
  /** The released case, kept open so the engineer sees the checksum it was given. */
  protected readonly released = signal<CaseDetail | null>(null);

  static open(dialog: MatDialog, data: CaseReviewData): Observable<CaseDetail | undefined> {
    return dialog.open<CaseReviewDialog, CaseReviewData, CaseDetail>(CaseReviewDialog, { data, width: '560px' }).afterClosed();
  }

  protected confirm(): void {
    this.busy.set(true);
    this.failure.set(null);
    const call = this.data.step === 'submit' ? this.api.submit(this.c.id) : this.api.release(this.c.id);
    call.subscribe({
      next: (answer) => {
        this.busy.set(false);
        if (this.data.step === 'release') this.released.set(answer);
        else this.dialogRef.close(answer);
      },
      error: (failure: unknown) => {
        this.busy.set(false);
        this.failure.set(apiErrorMessage(failure));
      },
    });
  }

  protected finish(): void {
    this.dialogRef.close(this.released() ?? undefined);
  }
}
