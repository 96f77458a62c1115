import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormArray, FormGroup, NonNullableFormBuilder, ReactiveFormsModule, Validators, type FormControl } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogContent, MatDialogRef, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatLabel } from '@angular/material/form-field';
import { MatIcon } from '@angular/material/icon';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import type { Observable } from 'rxjs';
import type { AttitudeMode, MissionPhase, PhaseDissipation } from '../../../shared/api/phases';
import { dialogSubmit, placedBeside } from '../shell/dialog-submit';
import { isoDateValidator } from '../time/iso-date-validator';
import { PhaseApi } from './phase-api';

export interface PhaseDialogData {
  readonly missionId: string;
  readonly phase: MissionPhase | null;
  readonly modes: readonly AttitudeMode[];
  /** The mission's dates (a phase lies within them); null when not known. */
  readonly missionDates: { readonly startDate: string; readonly endDate: string } | null;
}

interface DissipationRow {
  node: FormControl<string>;
  watts: FormControl<string>;
  offW: FormControl<string>;
  onS: FormControl<string>;
  periodS: FormControl<string>;
}

const numberText = /^\s*\d+(\.\d+)?\s*$/;

/** Adds or edits a phase: its dates (UTC days, both included), its attitude mode and each node's dissipation. */
@Component({
  selector: 'ecl-phase-dialog',
  imports: [ReactiveFormsModule, MatButton, MatIconButton, MatIcon, MatDialogTitle, MatDialogContent, MatDialogActions, MatFormField, MatLabel, MatInput, MatError, MatSelect, MatOption],
  template: `
    <h2 mat-dialog-title>{{ data.phase ? 'Edit the phase' : 'New phase' }}</h2>
    <form [formGroup]="form" (ngSubmit)="save()" novalidate>
      <mat-dialog-content class="fields">
        <mat-form-field appearance="outline">
          <mat-label>Phase name</mat-label>
          <input matInput formControlName="name" data-testid="phase-name" cdkFocusInitial />
          <mat-error>{{ problems()['name'] ?? 'Give the phase a name, e.g. commissioning.' }}</mat-error>
        </mat-form-field>
        <div class="pair">
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>From (UTC date)</mat-label>
            <input matInput type="text" inputmode="numeric" autocomplete="off" placeholder="YYYY-MM-DD" formControlName="startDate" data-testid="phase-start" />
            <mat-error data-testid="phase-start-error">{{ problems()['startDate'] ?? 'Give the first day as YYYY-MM-DD.' }}</mat-error>
          </mat-form-field>
          <mat-form-field appearance="outline" subscriptSizing="dynamic">
            <mat-label>To (UTC date, included)</mat-label>
            <input matInput type="text" inputmode="numeric" autocomplete="off" placeholder="YYYY-MM-DD" formControlName="endDate" data-testid="phase-end" />
            <mat-error data-testid="phase-end-error">{{ problems()['endDate'] ?? 'Give the last day as YYYY-MM-DD.' }}</mat-error>
          </mat-form-field>
        </div>
        @if (data.missionDates; as m) {
          <p class="ecl-muted hint" data-testid="phase-mission-dates">The mission runs {{ m.startDate }} to {{ m.endDate }} (UTC); a phase lies within them and shares no day with another phase.</p>
        }
        <mat-form-field appearance="outline">
          <mat-label>Attitude mode</mat-label>
          <mat-select formControlName="modeId" data-testid="phase-mode">
            @for (m of data.modes; track m.id) {
              <mat-option [value]="m.id">{{ m.name }}</mat-option>
            }
          </mat-select>
          <mat-error>{{ problems()['modeId'] ?? 'Choose the mode the spacecraft flies in this phase.' }}</mat-error>
        </mat-form-field>
        <h3>Dissipation per thermal-model node</h3>
        <p class="ecl-muted hint">A constant in W, or give an off level, the on time and the cycle (s) for an on/off schedule. A node not listed keeps its model's own value.</p>
        @for (row of rows.controls; track row; let i = $index) {
          <div class="row" [formGroup]="row" [attr.data-testid]="'phase-node-' + i">
            <mat-form-field appearance="outline" subscriptSizing="dynamic" class="node">
              <mat-label>Node</mat-label>
              <input matInput formControlName="node" [attr.data-testid]="'phase-node-name-' + i" />
            </mat-form-field>
            <mat-form-field appearance="outline" subscriptSizing="dynamic" class="num">
              <mat-label>W (on)</mat-label>
              <input matInput inputmode="decimal" formControlName="watts" [attr.data-testid]="'phase-node-w-' + i" />
            </mat-form-field>
            <mat-form-field appearance="outline" subscriptSizing="dynamic" class="num">
              <mat-label>Off W</mat-label>
              <input matInput inputmode="decimal" formControlName="offW" />
            </mat-form-field>
            <mat-form-field appearance="outline" subscriptSizing="dynamic" class="num">
              <mat-label>On, s</mat-label>
              <input matInput inputmode="decimal" formControlName="onS" />
            </mat-form-field>
            <mat-form-field appearance="outline" subscriptSizing="dynamic" class="num">
              <mat-label>Cycle, s</mat-label>
              <input matInput inputmode="decimal" formControlName="periodS" />
            </mat-form-field>
            <button mat-icon-button type="button" (click)="rows.removeAt(i)" [attr.aria-label]="'Remove node row ' + (i + 1)"><mat-icon>close</mat-icon></button>
          </div>
        }
        <div><button mat-stroked-button type="button" (click)="addRow()" data-testid="phase-node-add"><mat-icon>add</mat-icon>Add node</button></div>
        @if (rowProblem() ?? submit.failure(); as message) {
          <p class="ecl-error" role="alert" data-testid="phase-form-error">{{ message }}</p>
        }
      </mat-dialog-content>
      <mat-dialog-actions align="end">
        <button mat-button type="button" (click)="dialogRef.close()">Cancel</button>
        <button mat-flat-button type="submit" [disabled]="submit.busy()" data-testid="phase-save">{{ data.phase ? 'Save' : 'Add phase' }}</button>
      </mat-dialog-actions>
    </form>
  `,
  styles: `
    .fields { display: flex; flex-direction: column; gap: 6px; min-width: min(560px, 80vw); }
    .pair { display: flex; flex-wrap: wrap; gap: 0 12px; }
    .pair mat-form-field { flex: 1 1 180px; }
    h3 { font: var(--mat-sys-title-small); margin: 8px 0 0; }
    .hint { margin: 0 0 4px; font: var(--mat-sys-body-small); }
    .row { display: flex; flex-wrap: wrap; gap: 6px; align-items: center; }
    .row .node { flex: 2 1 140px; }
    .row .num { flex: 1 1 80px; max-width: 120px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PhaseDialog {
  private readonly api = inject(PhaseApi);
  private readonly fb = inject(NonNullableFormBuilder);
  protected readonly data = inject<PhaseDialogData>(MAT_DIALOG_DATA);
  protected readonly dialogRef = inject<MatDialogRef<PhaseDialog, MissionPhase>>(MatDialogRef);
  /** A refusal for the node rows, which no single field shows. */
  protected readonly rowProblem = signal<string | null>(null);
  protected readonly problems = signal<Partial<Record<'name' | 'startDate' | 'endDate' | 'modeId', string>>>({});

  protected readonly rows = new FormArray<FormGroup<DissipationRow>>((this.data.phase?.dissipation ?? []).map((d) => this.row(d)));
  protected readonly form = this.fb.group({
    name: [this.data.phase?.name ?? '', Validators.required],
    startDate: [this.data.phase?.startDate ?? '', [Validators.required, isoDateValidator]],
    endDate: [this.data.phase?.endDate ?? '', [Validators.required, isoDateValidator]],
    modeId: [this.data.phase?.modeId ?? this.data.modes[0]?.id ?? '', Validators.required],
  });

  protected readonly submit = dialogSubmit<MissionPhase>(new FormGroup({ phase: this.form, rows: this.rows }));

  static open(dialog: MatDialog, data: PhaseDialogData): Observable<MissionPhase | undefined> {
    return dialog.open<PhaseDialog, PhaseDialogData, MissionPhase>(PhaseDialog, { data, width: '680px', maxWidth: '95vw' }).afterClosed();
  }

  private row(d?: PhaseDissipation): FormGroup<DissipationRow> {
    const w = d?.dissipationW;
    const s = typeof w === 'object' ? w : null;
    const text = (x: number | undefined) => (x === undefined ? '' : String(x));
    return this.fb.group({
      node: [d?.node ?? '', Validators.required],
      watts: [typeof w === 'number' ? String(w) : text(s?.onW), [Validators.required, Validators.pattern(numberText)]],
      offW: [text(s?.offW), Validators.pattern(numberText)],
      onS: [text(s?.onS), Validators.pattern(numberText)],
      periodS: [text(s?.periodS), Validators.pattern(numberText)],
    });
  }

  protected addRow(): void {
    this.rows.push(this.row());
  }

  protected save(): void {
    this.problems.set({});
    const v = this.form.getRawValue();
    if (v.startDate && v.endDate && v.endDate < v.startDate) this.showProblem('endDate', 'the phase ends before it starts');
    this.rowProblem.set(this.rows.invalid ? 'Each node row needs a name and its power in W (numbers only).' : null);
    if (this.rows.invalid) this.rows.markAllAsTouched();
    this.submit.submit(
      () => this.api.savePhase(this.data.missionId, this.data.phase?.id ?? null, { ...v, name: v.name.trim(), dissipation: this.dissipation() }),
      placedBeside(this.form.controls, (field, message) => this.showProblem(field, message)),
    );
  }

  /** The node rows as the API takes them: a constant, or an on/off schedule when a cycle is given. */
  private dissipation(): PhaseDissipation[] {
    return this.rows.getRawValue().map((r) => {
      const onW = Number(r.watts);
      if (r.periodS.trim() === '') return { node: r.node.trim(), dissipationW: onW };
      const schedule = { onW, periodS: Number(r.periodS), onS: Number(r.onS || '0') };
      return { node: r.node.trim(), dissipationW: r.offW.trim() === '' ? schedule : { ...schedule, offW: Number(r.offW) } };
    });
  }

  private showProblem(field: keyof typeof this.form.controls, message: string): void {
    this.problems.update((p) => ({ ...p, [field]: message }));
    const control = this.form.controls[field];
    control.setErrors({ problem: message });
    control.markAsTouched();
  }
}
