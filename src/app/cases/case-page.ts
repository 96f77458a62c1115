import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input, linkedSignal, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatSlideToggle } from '@angular/material/slide-toggle';
import { Router, RouterLink } from '@angular/router';
import { combineLatest, filter, switchMap } from 'rxjs';
import type { CaseDetail } from '../../../shared/api/cases';
import { whyRecordOf } from '../../../shared/api/case-content';
import { caseFactors, type CaseFactor } from '../../../shared/physics/case-why';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { DesignCaution } from '../shell/design-caution';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { caseActions, type CaseAction } from './case-actions';
import { CaseApi } from './case-api';
import { CaseCompareDialog } from './case-compare-dialog';
import { CaseEditDialog } from './case-edit-dialog';
import { CaseInputsPanel } from './case-inputs-panel';
import { CaseKindLabel } from './case-kind-label';
import { CaseLoadsPanel } from './case-loads-panel';
import { CaseReviewDialog } from './case-review-dialog';
import { CaseStatusChip } from './case-status-chip';
import { UtcTimePipe } from '../time/utc-time-pipe';
import { SourceWordsPipe } from '../shell/source-words-pipe';

/** A line of the "why" list: a deciding factor, or one factor's rows per item (material). */
interface FactorItem {
  key: CaseFactor['key'];
  title: string;
  figure: string;
  text: string;
  rows: { about: string; figure: string }[];
}

/** One load case: why it is the worst case, its loads around the orbit, its inputs, and its life cycle. */
@Component({
  selector: 'ecl-case-page',
  imports: [
    UtcTimePipe, DecimalPipe, RouterLink, MatButton, MatIcon, MatSlideToggle, DesignCaution, CaseKindLabel, CaseStatusChip,
    CaseInputsPanel, CaseLoadsPanel, MatFormField, MatLabel, MatInput, MatCheckbox, SourceWordsPipe,
  ],
  templateUrl: './case-page.html',
  styleUrl: './case-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class CasePage {
  readonly workspaceId = input.required<string>();
  readonly caseId = input.required<string>();

  private readonly api = inject(CaseApi);
  private readonly dialog = inject(MatDialog);
  private readonly router = inject(Router);
  private readonly role = inject(CurrentWorkspace).role;
  private readonly reload = signal(0);

  protected readonly state = toSignal(
    combineLatest([toObservable(this.caseId), toObservable(this.reload)]).pipe(switchMap(([id]) => this.api.get(id).pipe(loaded()))),
    { initialValue: { status: 'loading' as const } },
  );
  private readonly current = computed(() => {
    const s = this.state();
    return s.status === 'ready' ? s.value : null;
  });
  protected readonly actions = computed(() => {
    const c = this.current();
    return c ? caseActions(c, this.role()) : new Set<CaseAction>();
  });
  /** The deciding factors, built from the case's own record (the same words as its exports). */
  protected readonly factors = computed(() => {
    const c = this.current();
    return c ? caseFactors(whyRecordOf(c.kind, c.inputs, c.results)) : [];
  });
  /**
   * The factors as the page lists them: a factor given per item (each material's properties) is one
   * entry with a short row per item, so a phone reads "EOL properties" once, not a sentence per material.
   */
  protected readonly factorItems = computed(() => {
    const items: FactorItem[] = [];
    for (const f of this.factors()) {
      const last = items.at(-1);
      if (f.about !== undefined && last?.key === f.key) {
        last.rows.push({ about: f.about, figure: f.figure });
        continue;
      }
      const perItem = f.about !== undefined;
      items.push({ key: f.key, title: f.title, figure: perItem ? '' : f.figure, text: perItem ? '' : (f.short ?? f.text), rows: perItem ? [{ about: f.about ?? '', figure: f.figure }] : [] });
    }
    return items;
  });
  protected readonly sources = computed(() => [...new Set(this.factors().flatMap((f) => f.sources))]);
  protected readonly subscribed = linkedSignal(() => this.current()?.subscribed ?? false);
  protected readonly busy = signal(false);
  protected readonly failure = signal<string | null>(null);

  protected exportUrl(format: 'json' | 'csv'): string {
    return this.api.exportUrl(this.caseId(), format);
  }

  protected fileName(c: CaseDetail, format: 'json' | 'csv'): string {
    return `${c.name.replace(/[^A-Za-z0-9-]+/g, '-').toLowerCase()}-rev${c.revision}.${format}`;
  }

  protected editCase(c: CaseDetail): void {
    this.dialog
      .open<CaseEditDialog, CaseDetail, CaseDetail>(CaseEditDialog, { data: c, width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((saved) => saved !== undefined))
      .subscribe(() => this.reload.update((n) => n + 1));
  }

  protected submitCase(c: CaseDetail): void {
    this.review(c, 'submit');
  }

  protected releaseCase(c: CaseDetail): void {
    this.review(c, 'release');
  }

  /** The new-revision form: open, its reason, and whether to derive from the current inputs. */
  protected readonly revising = signal(false);
  protected readonly revisionReason = signal('');
  protected readonly fromCurrent = linkedSignal(() => (this.current()?.inputChanges.length ?? 0) > 0 && !this.current()?.currentInputsBlocked);

  protected startRevision(c: CaseDetail): void {
    const reason = this.revisionReason().trim();
    if (reason === '') {
      this.failure.set('Say why this revision is made: it is shown in the history, the comparison, the exports and the mail.');
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    this.api.newRevision(c.id, reason, this.fromCurrent() && !c.currentInputsBlocked).subscribe({
      next: (draft) => {
        this.busy.set(false);
        this.revising.set(false);
        this.revisionReason.set('');
        void this.router.navigate(['/w', this.workspaceId(), 'cases', draft.id]);
      },
      error: (failure: unknown) => {
        this.busy.set(false);
        this.failure.set(apiErrorMessage(failure));
      },
    });
  }

  protected compareWith(c: CaseDetail): void {
    this.dialog
      .open<CaseCompareDialog, CaseDetail, string>(CaseCompareDialog, { data: c, width: '560px', maxWidth: '95vw' })
      .afterClosed()
      .pipe(filter((otherId): otherId is string => typeof otherId === 'string' && otherId !== ''))
      .subscribe((otherId) => void this.router.navigate(['/w', this.workspaceId(), 'cases', c.id, 'compare', otherId]));
  }

  protected toggleSubscription(c: CaseDetail, wanted: boolean): void {
    this.failure.set(null);
    this.subscribed.set(wanted);
    this.api.setSubscribed(c.id, wanted).subscribe({
      next: (now) => this.subscribed.set(now),
      error: (failure: unknown) => {
        this.subscribed.set(!wanted);
        this.failure.set(apiErrorMessage(failure));
      },
    });
  }

  protected readonly commentText = signal('');

  /** Adds the comment, or with `returning` sends the case back to its author with it. */
  protected sendComment(c: CaseDetail, returning: boolean): void {
    const text = this.commentText().trim();
    if (text === '') {
      this.failure.set(returning ? 'Write what the author should change before returning the case.' : 'Write the comment first.');
      return;
    }
    this.busy.set(true);
    this.failure.set(null);
    const done = {
      next: () => {
        this.busy.set(false);
        this.commentText.set('');
        this.reload.update((n) => n + 1);
      },
      error: (failure: unknown) => {
        this.busy.set(false);
        this.failure.set(apiErrorMessage(failure));
      },
    };
    if (returning) this.api.returnToAuthor(c.id, text).subscribe(done);
    else this.api.comment(c.id, text).subscribe(done);
  }

  private review(c: CaseDetail, step: 'submit' | 'release'): void {
    CaseReviewDialog.open(this.dialog, { step, loadCase: c })
      .pipe(filter((answer) => answer !== undefined))
      .subscribe(() => this.reload.update((n) => n + 1));
  }
}
