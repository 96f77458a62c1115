import { DecimalPipe } from '@angular/common';
import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, DestroyRef, inject, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatFormField, MatHint, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatProgressBar } from '@angular/material/progress-bar';
import { MatOption, MatSelect } from '@angular/material/select';
import type { Subscription } from 'rxjs';
import type { EphemerisSummary } from '../../../shared/api/ephemerides';
import { ephemerisFrames } from '../../../shared/api/plain-lists';
import type { ErrorDetail } from '../../../shared/api/errors';
import { apiErrorMessage } from '../api/api-error-message';
import { EphemerisApi, type UploadProgress } from './ephemeris-api';

/** The server's refusal of a file: its sentence and the rows it names. */
interface Refusal {
  message: string;
  rows: readonly ErrorDetail[];
}

function refusalOf(failure: unknown): Refusal {
  const message = apiErrorMessage(failure);
  if (failure instanceof HttpErrorResponse && typeof failure.error === 'object' && failure.error !== null) {
    const details: unknown = (failure.error as { error?: { details?: unknown } }).error?.details;
    if (Array.isArray(details)) {
      const rows = details.filter((d): d is ErrorDetail => typeof d === 'object' && d !== null && typeof (d as ErrorDetail).message === 'string');
      if (rows.some((d) => d.row !== undefined)) return { message: (failure.error as { error: { message: string } }).error.message, rows };
    }
  }
  return { message, rows: [] };
}

/** Drop or choose a trajectory file, declare its frame, and send it with progress; a refusal lists its rows. */
@Component({
  selector: 'ecl-ephemeris-upload',
  imports: [FormsModule, DecimalPipe, MatButton, MatIcon, MatFormField, MatLabel, MatHint, MatInput, MatSelect, MatOption, MatProgressBar],
  templateUrl: './ephemeris-upload.html',
  styleUrl: './ephemeris-upload.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class EphemerisUpload {
  private readonly api = inject(EphemerisApi);
  private running: Subscription | null = null;

  readonly missionId = input.required<string>();
  readonly uploaded = output<EphemerisSummary>();

  protected readonly frames = ephemerisFrames;
  protected readonly file = signal<File | null>(null);
  protected readonly dragging = signal(false);
  protected readonly progress = signal<UploadProgress | null>(null);
  protected readonly refusal = signal<Refusal | null>(null);
  protected frame = 'EME2000';
  protected name = '';
  protected epoch = '';

  constructor() {
    inject(DestroyRef).onDestroy(() => this.running?.unsubscribe());
  }

  protected percent(p: UploadProgress): number {
    return p.stage === 'sending' && p.total ? Math.round((100 * p.loaded) / p.total) : 0;
  }

  protected chooseFile(event: Event): void {
    const target = event.target;
    if (target instanceof HTMLInputElement && target.files?.[0]) this.take(target.files[0]);
    if (target instanceof HTMLInputElement) target.value = '';
  }

  protected dragOver(event: DragEvent): void {
    event.preventDefault();
    if (event.dataTransfer) event.dataTransfer.dropEffect = 'copy';
    this.dragging.set(true);
  }

  protected dropFile(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    const dropped = event.dataTransfer?.files?.[0];
    if (dropped) this.take(dropped);
  }

  private take(file: File): void {
    this.file.set(file);
    // "As the OEM file says" only fits an OEM; a CSV must declare its frame.
    if (this.frame === '' && !/\.oem$/i.test(file.name)) this.frame = 'EME2000';
    this.refusal.set(null);
    this.progress.set(null);
  }

  protected busy(): boolean {
    const p = this.progress();
    return p !== null && p.stage !== 'done';
  }

  protected sendFile(): void {
    const file = this.file();
    if (!file || this.busy()) return;
    this.refusal.set(null);
    this.progress.set({ stage: 'sending', loaded: 0, total: file.size });
    this.running = this.api.upload(this.missionId(), { file, frame: this.frame, name: this.name, epoch: this.epoch }).subscribe({
      next: (p) => {
        this.progress.set(p);
        if (p.stage === 'done') {
          this.file.set(null);
          this.name = '';
          // The next file starts from the usual choices, not the last file's.
          this.frame = 'EME2000';
          this.epoch = '';
          this.uploaded.emit(p.summary);
        }
      },
      error: (failure: unknown) => {
        this.progress.set(null);
        this.refusal.set(refusalOf(failure));
      },
    });
  }

  protected cancelUpload(): void {
    this.running?.unsubscribe();
    this.running = null;
    this.progress.set(null);
  }
}
