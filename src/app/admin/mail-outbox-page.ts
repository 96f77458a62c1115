import { HttpClient } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { EMPTY, BehaviorSubject, switchMap } from 'rxjs';
import type { MailMessage, MailSummary } from '../../../shared/api/workspaces';
import { apiPath } from '../api/api-path';
import { loaded } from '../api/loaded';
import { mailTextParts } from './mail-text-parts';
import { UtcTimePipe } from '../time/utc-time-pipe';

/** The mail the instance sent (caught by the local SMTP server), for administrators and demos. */
@Component({
  selector: 'ecl-mail-outbox-page',
  imports: [UtcTimePipe, MatButton],
  templateUrl: './mail-outbox-page.html',
  styleUrl: './mail-outbox-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MailOutboxPage {
  private readonly http = inject(HttpClient);
  private readonly refresh = new BehaviorSubject<void>(undefined);

  protected readonly list = toSignal(
    this.refresh.pipe(switchMap(() => this.http.get<{ items: MailSummary[] }>(apiPath('admin', 'mail')).pipe(loaded()))),
    { requireSync: true },
  );
  protected readonly selectedId = signal<string | null>(null);
  protected readonly message = toSignal(
    toObservable(this.selectedId).pipe(
      switchMap((id) => (id === null ? EMPTY : this.http.get<MailMessage>(apiPath('admin', 'mail', id)).pipe(loaded()))),
    ),
  );
  protected readonly bodyParts = computed(() => {
    const state = this.message();
    return state?.status === 'ready' ? mailTextParts(state.value.text) : [];
  });

  protected reload(): void {
    this.refresh.next();
  }

  protected open(mail: MailSummary): void {
    this.selectedId.set(mail.id);
  }
}
