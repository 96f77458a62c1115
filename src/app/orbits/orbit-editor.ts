import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, DestroyRef, computed, ElementRef, OnInit, afterNextRender, inject, input, output, signal } from '@angular/core';
import { takeUntilDestroyed } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatButtonToggle, MatButtonToggleGroup } from '@angular/material/button-toggle';
import { ErrorStateMatcher } from '@angular/material/core';
import { HttpErrorResponse } from '@angular/common/http';
import { Observable, catchError, debounceTime, map, of, startWith, switchMap } from 'rxjs';
import type { BodySummaryResponse } from '../../../shared/api/environment';
import type { Orbit } from '../../../shared/api/missions';
import { apiErrorMessage } from '../api/api-error-message';
import { MissionApi } from '../missions/mission-api';
import { readQuantityText } from '../missions/quantity-text';
import { LabelledField } from '../shell/labelled-field';
import { meanAltitudeKm, orbitFigures, type OrbitFigures } from './orbit-figures';
import {
  NUMBER_FIELDS,
  ORIENTATION_FIELDS,
  SHAPE_FIELDS,
  buildOrbitForm,
  fieldOfPath,
  initialOrbitValue,
  orbitToSave,
  previewRequest,
  readOrbitForm,
  type FieldProblems,
  type OrbitDefinition,
  type OrbitField,
} from './orbit-form';
import { DurationPipe } from '../time/duration-pipe';

export type OrbitPreview =
  | { readonly kind: 'computing' }
  | { readonly kind: 'ready'; readonly figures: OrbitFigures }
  | { readonly kind: 'invalid'; readonly problems: FieldProblems; readonly message: string | null };

/** Our fields carry only the errors this editor sets (local checks, server details), so show them at once. */
class ShowWhenInvalid implements ErrorStateMatcher {
  isErrorState(control: { invalid: boolean } | null): boolean {
    return control?.invalid ?? false;
  }
}

/** Server error details mapped onto the fields they name; the rest becomes one message. */
export function problemsFromFailure(failure: unknown): { problems: FieldProblems; message: string | null } {
  const problems: FieldProblems = {};
  const body: unknown = failure instanceof HttpErrorResponse ? failure.error : null;
  const details: unknown = typeof body === 'object' && body !== null && 'error' in body && typeof body.error === 'object' && body.error !== null && 'details' in body.error ? body.error.details : [];
  let unplaced = false;
  for (const detail of Array.isArray(details) ? (details as unknown[]) : []) {
    if (typeof detail !== 'object' || detail === null || !('message' in detail) || typeof detail.message !== 'string') continue;
    const field = fieldOfPath('path' in detail && typeof detail.path === 'string' ? detail.path : undefined);
    if (field === null) unplaced = true;
    else problems[field] = detail.message;
  }
  const placed = Object.keys(problems).length > 0;
  return { problems, message: placed && !unplaced ? null : apiErrorMessage(failure) };
}

/** Defines or edits one orbit; derived figures follow the typing, checked by the server's physics. */
@Component({
  selector: 'ecl-orbit-editor',
  imports: [DurationPipe, ReactiveFormsModule, DecimalPipe, MatButton, MatButtonToggleGroup, MatButtonToggle, LabelledField],
  templateUrl: './orbit-editor.html',
  styleUrl: './orbit-editor.css',
  providers: [{ provide: ErrorStateMatcher, useClass: ShowWhenInvalid }],
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class OrbitEditor implements OnInit {
  private readonly api = inject(MissionApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly host = inject<ElementRef<HTMLElement>>(ElementRef);

  constructor() {
    // Opened by "Add orbit" or "Edit", which then disappear: the focus goes to the orbit's first
    // field rather than falling to the page body, so keyboard users carry on where they clicked.
    // No scrolling by the focus itself: at 390 px it would slide the tab sideways; the editor is
    // brought into view by its own left edge instead.
    afterNextRender(() => {
      this.host.nativeElement.querySelector<HTMLInputElement>('input')?.focus({ preventScroll: true });
      this.host.nativeElement.scrollIntoView?.({ block: 'nearest', inline: 'start' });
    });
  }

  readonly missionId = input.required<string>();
  readonly missionStartDate = input.required<string>();
  readonly body = input.required<BodySummaryResponse>();
  /** The orbit to edit; null adds a new one. */
  readonly orbit = input<Orbit | null>(null);
  readonly saved = output<Orbit>();
  readonly cancelled = output<void>();

  protected readonly form = buildOrbitForm(inject(NonNullableFormBuilder));
  protected readonly fields = NUMBER_FIELDS;
  protected readonly definitions: readonly { id: OrbitDefinition; label: string }[] = [
    { id: 'altitudes', label: 'Periapsis and apoapsis' },
    { id: 'semi-major-axis', label: 'Semi-major axis and e' },
    { id: 'period', label: 'Period and e' },
  ];
  private readonly shapeFields = signal(SHAPE_FIELDS.altitudes);
  /** The number fields in their two rows: the size and shape (as the definition chosen asks), then the orientation. */
  protected readonly numberRows = computed(() => [this.shapeFields(), ORIENTATION_FIELDS]);
  private readonly previewState = signal<OrbitPreview>({ kind: 'computing' });
  readonly preview = this.previewState.asReadonly();
  protected readonly saveFailure = signal<string | null>(null);
  protected readonly saving = signal(false);
  protected readonly sunSyncNote = signal<string | null>(null);

  ngOnInit(): void {
    this.form.setValue(initialOrbitValue(this.orbit(), this.missionStartDate()));
    this.shapeFields.set(SHAPE_FIELDS[this.form.controls.definition.value]);
    this.form.controls.definition.valueChanges
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe((d) => this.shapeFields.set(SHAPE_FIELDS[d]));
    this.form.valueChanges
      .pipe(
        // Typing "550 km" is six changes; one request after a pause of ~300 ms, the stale one cancelled.
        debounceTime(300),
        startWith(null),
        switchMap(() => this.computePreview()),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe((preview) => {
        this.previewState.set(preview);
        if (preview.kind !== 'computing') this.showProblems(preview.kind === 'invalid' ? preview.problems : {});
      });
  }

  private computePreview(): Observable<OrbitPreview> {
    const value = this.form.getRawValue();
    const reading = readOrbitForm(value, this.body());
    const { name: _name, ...problems } = reading.problems; // the name matters only for saving
    if (Object.keys(problems).length > 0) return of<OrbitPreview>({ kind: 'invalid', problems, message: null });
    return this.api.compute(previewRequest(this.body().id, reading, value.epoch)).pipe(
      map((answer): OrbitPreview => ({ kind: 'ready', figures: orbitFigures(answer, this.body()) })),
      catchError((failure: unknown) => of<OrbitPreview>({ kind: 'invalid', ...problemsFromFailure(failure) })),
      startWith<OrbitPreview>({ kind: 'computing' }),
    );
  }

  /** Every field's error comes from here, so a problem fixed in another field clears too. */
  private showProblems(problems: FieldProblems): void {
    for (const [key, control] of Object.entries(this.form.controls)) {
      const message = problems[key as OrbitField];
      control.setErrors(message ? { problem: message } : null);
    }
  }

  protected problemOf(field: OrbitField): string {
    const errors = this.form.controls[field].errors;
    const problem: unknown = errors?.['problem'];
    return typeof problem === 'string' ? problem : '';
  }

  /** The suffix says what a bare number means; once a unit is typed it would only contradict it. */
  protected typedUnit(field: keyof typeof NUMBER_FIELDS): boolean {
    const unit = NUMBER_FIELDS[field].unit;
    if (unit === null) return false;
    const reading = readQuantityText(this.form.controls[field].value, unit);
    return reading.ok && !reading.bare;
  }

  /** "= 550.07 km" under a field typed in another unit, so the conversion can be checked at a glance. */
  protected converted(field: keyof typeof NUMBER_FIELDS): string {
    const unit = NUMBER_FIELDS[field].unit;
    if (unit === null) return '';
    const text = this.form.controls[field].value;
    const reading = readQuantityText(text, unit);
    if (!reading.ok || reading.bare || new RegExp(`\\d\\s*${unit}\\s*$`).test(text.trim())) return '';
    return `= ${Number(reading.value.toPrecision(7))} ${unit}`;
  }

  protected fillSunSynchronous(): void {
    const reading = readOrbitForm(this.form.getRawValue(), this.body());
    const altitudeKm = meanAltitudeKm(reading.orbit, this.body());
    if (altitudeKm === null || !Number.isFinite(altitudeKm)) {
      this.sunSyncNote.set('Give the orbit size first: the inclination follows from the altitude.');
      return;
    }
    this.sunSyncNote.set(null);
    this.api.sunSynchronous(this.body().id, altitudeKm).subscribe({
      next: (answer) => {
        if ('inclinationDeg' in answer) {
          this.form.controls.inclination.setValue(answer.inclinationDeg.toFixed(2));
          this.sunSyncNote.set(`Sun-synchronous at ${altitudeKm.toFixed(0)} km around ${this.body().name}: ${answer.inclinationDeg.toFixed(2)} deg.`);
        } else {
          this.sunSyncNote.set(answer.none);
        }
      },
      error: (failure: unknown) => this.sunSyncNote.set(apiErrorMessage(failure)),
    });
  }

  protected save(): void {
    const value = this.form.getRawValue();
    const { problems } = readOrbitForm(value, this.body());
    if (value.name.trim() === '') problems.name = 'give the orbit a name';
    if (Object.keys(problems).length > 0) {
      this.showProblems(problems);
      return;
    }
    const body = orbitToSave(value);
    const existing = this.orbit();
    this.saving.set(true);
    this.saveFailure.set(null);
    const request = existing ? this.api.updateOrbit(this.missionId(), existing.id, body) : this.api.createOrbit(this.missionId(), body);
    request.subscribe({
      next: (orbit) => {
        this.saving.set(false);
        this.saved.emit(orbit);
      },
      error: (failure: unknown) => {
        this.saving.set(false);
        const placed = problemsFromFailure(failure);
        this.showProblems(placed.problems);
        this.saveFailure.set(placed.message);
      },
    });
  }

  protected cancel(): void {
    this.cancelled.emit();
  }
}
