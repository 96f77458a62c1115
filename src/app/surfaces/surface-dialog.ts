import { DecimalPipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators } from '@angular/forms';
import { MAT_DIALOG_DATA, MatDialog, MatDialogActions, MatDialogContent, MatDialogTitle } from '@angular/material/dialog';
import { MatError, MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOptgroup, MatOption, MatSelect } from '@angular/material/select';
import type { Observable } from 'rxjs';
import type { Material, Surface, SurfaceCreate } from '../../../shared/api/missions';
import { MissionApi } from '../missions/mission-api';
import { readQuantityText } from '../missions/quantity-text';
import { PointingEditor, pointingForm, readPointingForm } from './pointing-editor';
import { DialogButtons } from '../shell/dialog-buttons';
import { SourceWordsPipe } from '../shell/source-words-pipe';
import { dialogSubmit, refusalDetails } from '../shell/dialog-submit';

export interface SurfaceDialogData {
  readonly missionId: string;
  readonly surface: Surface | null;
  readonly materials: readonly Material[];
}

type SurfaceField = 'name' | 'areaM2' | 'normal' | 'materialId';

/** Adds or edits one spacecraft surface: size, which way it faces, what it is covered with. */
@Component({
  selector: 'ecl-surface-dialog',
  imports: [
    SourceWordsPipe, ReactiveFormsModule, DecimalPipe, MatDialogTitle, MatDialogContent, MatDialogActions, DialogButtons, MatFormField, MatLabel,
    MatInput, MatError, MatHint, MatSuffix, MatSelect, MatOption, MatOptgroup, PointingEditor,
  ],
  templateUrl: './surface-dialog.html',
  styleUrl: './surface-dialog.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SurfaceDialog {
  private readonly api = inject(MissionApi);
  protected readonly data = inject<SurfaceDialogData>(MAT_DIALOG_DATA);
  protected readonly library = this.data.materials.filter((m) => m.workspaceId === null);
  protected readonly own = this.data.materials.filter((m) => m.workspaceId !== null);
  protected readonly problems = signal<Partial<Record<SurfaceField, string>>>({});

  private readonly start = this.data.surface;
  protected readonly form = inject(NonNullableFormBuilder).group({
    name: [this.start?.name ?? '', Validators.required],
    area: [this.start ? String(this.start.areaM2) : '', Validators.required],
    pointing: pointingForm(this.start?.normal ?? null),
    materialId: [this.start?.materialId ?? '', Validators.required],
  });
  protected readonly submit = dialogSubmit<Surface>(this.form);
  private readonly materialId = toSignal(this.form.controls.materialId.valueChanges, { initialValue: this.form.controls.materialId.value });
  private readonly areaText = toSignal(this.form.controls.area.valueChanges, { initialValue: this.form.controls.area.value });
  /** The area as the server will read it ("1.2 m²", "3 sq m", "5000 cm²"), or what is wrong with it. */
  protected readonly areaPreview = computed(() => {
    const text = this.areaText().trim();
    if (text === '') return null;
    const reading = readQuantityText(text, 'm^2');
    if (!reading.ok) return { ok: false, text: reading.message };
    return { ok: true, text: reading.bare ? null : `= ${reading.value.toLocaleString('en-US', { maximumSignificantDigits: 6 })} m²` };
  });
  protected readonly chosenMaterial = computed(() => this.data.materials.find((m) => m.id === this.materialId()) ?? null);

  static open(dialog: MatDialog, data: SurfaceDialogData): Observable<Surface | undefined> {
    return dialog.open<SurfaceDialog, SurfaceDialogData, Surface>(SurfaceDialog, { data, width: '600px' }).afterClosed();
  }

  protected save(): void {
    this.problems.set({});
    this.submit.submit(
      () => {
        const v = this.form.getRawValue();
        // A custom direction goes as a unit vector; the note beside the fields says it was scaled.
        const pointing = readPointingForm(this.form.controls.pointing);
        if (!pointing.ok) return null;
        const areaText = v.area.trim();
        // A bare number is m²; text with a unit ("5000 cm^2") goes as typed, the server converts it.
        const areaM2 = Number.isFinite(Number(areaText)) ? Number(areaText) : areaText;
        const body: SurfaceCreate = { name: v.name.trim(), areaM2, normal: pointing.normal, materialId: v.materialId };
        const existing = this.data.surface;
        return existing ? this.api.updateSurface(this.data.missionId, existing.id, body) : this.api.createSurface(this.data.missionId, body);
      },
      (failure) => {
        // Each detail under its field; the message above the buttons only for what no field shows.
        const details = refusalDetails(failure);
        const placed: Partial<Record<SurfaceField, string>> = {};
        for (const d of details) {
          const field = (d.path ?? '').split('.')[0] as SurfaceField;
          if (['name', 'areaM2', 'normal', 'materialId'].includes(field)) placed[field] = d.message;
        }
        this.problems.set(placed);
        return Object.keys(placed).length < details.length || details.length === 0 ? undefined : 'placed';
      },
    );
  }


}
