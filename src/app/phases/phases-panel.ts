import { ChangeDetectionStrategy, Component, computed, inject, input, output } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButton } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIcon } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { BehaviorSubject, combineLatest, filter, switchMap, type Observable } from 'rxjs';
import type { Surface } from '../../../shared/api/missions';
import type { AttitudeMode, MissionPhase } from '../../../shared/api/phases';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { ConfirmDialog } from '../shell/confirm-dialog';
import { ModeDialog } from './mode-dialog';
import { PhaseApi } from './phase-api';
import { PhaseDialog, type PhaseDialogData } from './phase-dialog';
import { dissipationText, pointingText } from './phase-words';

/** A mission's attitude modes (how each surface is pointed) and its phases (dates, mode, dissipation per node). */
@Component({
  selector: 'ecl-phases-panel',
  imports: [MatButton, MatIcon],
  template: `
    <section aria-labelledby="modes-heading">
      <h2 id="modes-heading">Attitude modes</h2>
      <p class="ecl-muted">Each surface is defined once, facing as on the Surfaces tab; a mode points the surfaces it lists, the others keep their own facing.</p>
      @if (modes().length === 0) {
        <p class="ecl-muted" data-testid="mode-empty">No attitude modes yet.</p>
      } @else {
        <div class="ecl-table-wrap">
          <table class="plain" data-testid="mode-table">
            <thead>
              <tr><th scope="col">Mode</th><th scope="col">Pointing</th>@if (canEdit()) {<th scope="col"><span class="ecl-visually-hidden">Actions</span></th>}</tr>
            </thead>
            <tbody>
              @for (m of modes(); track m.id) {
                <tr data-testid="mode-row">
                  <th scope="row">{{ m.name }}@if (m.description) {<div class="note">{{ m.description }}</div>}</th>
                  <td>{{ pointingText(m) }}</td>
                  @if (canEdit()) {
                    <td class="row-actions">
                      <button mat-button type="button" (click)="editMode(m)" [attr.aria-label]="'Edit mode ' + m.name">Edit</button>
                      <button mat-button type="button" (click)="deleteMode(m)" [attr.aria-label]="'Delete mode ' + m.name">Delete</button>
                    </td>
                  }
                </tr>
              }
            </tbody>
          </table>
        </div>
      }
      @if (canEdit()) {
        <div class="actions"><button mat-stroked-button type="button" (click)="editMode(null)" data-testid="mode-add"><mat-icon>add</mat-icon>Add mode</button></div>
      }
    </section>

    <section aria-labelledby="phases-heading">
      <h2 id="phases-heading">Phases</h2>
      <p class="ecl-muted">The mission sweep and the hot and cold cases are computed phase by phase, each with its mode's pointing; a thermal model run on a phase's case takes its dissipation.</p>
      @if (phases().length === 0) {
        <p class="ecl-muted" data-testid="phase-empty">No phases yet: the whole mission is computed with the surfaces as defined.</p>
      } @else {
        <div class="ecl-table-wrap">
          <table class="plain" data-testid="phase-table">
            <thead>
              <tr>
                <th scope="col">Phase</th><th scope="col">From (UTC)</th><th scope="col">To (UTC)</th><th scope="col">Attitude mode</th><th scope="col">Dissipation</th>
                @if (canEdit()) {<th scope="col"><span class="ecl-visually-hidden">Actions</span></th>}
              </tr>
            </thead>
            <tbody>
              @for (p of phases(); track p.id) {
                <tr data-testid="phase-row">
                  <th scope="row">{{ p.name }}@if (p.description) {<div class="note">{{ p.description }}</div>}</th>
                  <td class="date">{{ p.startDate }}</td>
                  <td class="date">{{ p.endDate }}</td>
                  <td>{{ p.modeName }}</td>
                  <td>
                    @if (p.dissipation.length === 0) { <span class="ecl-muted">each node as in its model</span> }
                    <ul class="dissipation">
                      @for (d of p.dissipation; track d.node) { <li>{{ d.node }}: {{ dissipationText(d.dissipationW) }}</li> }
                    </ul>
                  </td>
                  @if (canEdit()) {
                    <td class="row-actions">
                      <button mat-button type="button" (click)="editPhase(p)" [attr.aria-label]="'Edit phase ' + p.name">Edit</button>
                      <button mat-button type="button" (click)="deletePhase(p)" [attr.aria-label]="'Delete phase ' + p.name">Delete</button>
                    </td>
                  }
                </tr>
              }
            </tbody>
          </table>
        </div>
      }
      @if (canEdit()) {
        <div class="actions">
          <button mat-stroked-button type="button" (click)="editPhase(null)" [disabled]="modes().length === 0" data-testid="phase-add"><mat-icon>add</mat-icon>Add phase</button>
          @if (modes().length === 0) { <span class="ecl-muted">Add an attitude mode first.</span> }
        </div>
      }
    </section>
  `,
  styles: `
    :host { display: flex; flex-direction: column; gap: 24px; }
    section { display: flex; flex-direction: column; gap: 8px; }
    h2 { font: var(--mat-sys-title-medium); margin: 0; }
    p { margin: 0; }
    table.plain th, table.plain td { vertical-align: top; }
    .note { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); font-weight: normal; }
    .date { white-space: nowrap; font-variant-numeric: tabular-nums; }
    .dissipation { margin: 0; padding: 0; list-style: none; }
    .row-actions { text-align: right; white-space: nowrap; }
    .actions { display: flex; gap: 8px; align-items: center; flex-wrap: wrap; }
    @media (max-width: 600px) {
      table.plain th, table.plain td { padding: 6px 6px; }
      .row-actions button { display: block; min-width: 0; }
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhasesPanel {
  private readonly api = inject(PhaseApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly refresh = new BehaviorSubject<void>(undefined);

  readonly missionId = input.required<string>();
  readonly surfaces = input.required<readonly Surface[]>();
  /** The mission's dates, which every phase lies within. */
  readonly missionDates = input<PhaseDialogData['missionDates']>(null);
  /** Thermal engineers and owners change modes and phases (the server says so too). */
  readonly canEdit = input(false);
  /** A mode or phase was added, changed or removed. */
  readonly changed = output<void>();

  protected readonly pointingText = pointingText;
  protected readonly dissipationText = dissipationText;
  private readonly modeState = toSignal(combineLatest([toObservable(this.missionId), this.refresh]).pipe(switchMap(([id]) => this.api.modes(id).pipe(loaded()))));
  private readonly phaseState = toSignal(combineLatest([toObservable(this.missionId), this.refresh]).pipe(switchMap(([id]) => this.api.phases(id).pipe(loaded()))));
  protected readonly modes = computed<AttitudeMode[]>(() => {
    const s = this.modeState();
    return s?.status === 'ready' ? s.value : [];
  });
  protected readonly phases = computed<MissionPhase[]>(() => {
    const s = this.phaseState();
    return s?.status === 'ready' ? s.value : [];
  });

  private after<T>(opened: Observable<T | undefined>, done: string): void {
    opened.pipe(filter((saved) => saved !== undefined)).subscribe(() => {
      this.snackBar.open(done, undefined, { duration: 3000 });
      this.refresh.next();
      this.changed.emit();
    });
  }

  protected editMode(mode: AttitudeMode | null): void {
    this.after(ModeDialog.open(this.dialog, { missionId: this.missionId(), mode, surfaces: this.surfaces() }), 'Attitude mode saved.');
  }

  protected editPhase(phase: MissionPhase | null): void {
    this.after(PhaseDialog.open(this.dialog, { missionId: this.missionId(), phase, modes: this.modes(), missionDates: this.missionDates() }), 'Phase saved.');
  }

  private remove(title: string, message: string, request: () => Observable<void>): void {
    ConfirmDialog.ask(this.dialog, { title, message, confirmLabel: 'Delete' })
      .pipe(filter((yes) => yes), switchMap(request))
      .subscribe({
        next: () => {
          this.refresh.next();
          this.changed.emit();
        },
        error: (failure: unknown) => this.snackBar.open(apiErrorMessage(failure), 'Close'),
      });
  }

  protected deleteMode(mode: AttitudeMode): void {
    this.remove(`Delete the attitude mode ${mode.name}?`, 'A mode that a phase flies is kept until the phase flies another.', () => this.api.deleteMode(this.missionId(), mode.id));
  }

  protected deletePhase(phase: MissionPhase): void {
    this.remove(`Delete the phase ${phase.name}?`, 'Its days are then computed with the surfaces as defined. Cases derived in it keep their record.', () => this.api.deletePhase(this.missionId(), phase.id));
  }
}
