import { ChangeDetectionStrategy, Component, computed, effect, input, signal } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatFormField, MatHint, MatLabel, MatSuffix } from '@angular/material/form-field';
import { MatInput } from '@angular/material/input';
import { MatOption, MatSelect } from '@angular/material/select';
import type { SurfaceNormal } from '../../../shared/api/missions';
import { pointingWords } from '../../../shared/physics/pointing-words';
import { customDirection, LOCAL_NAMES, NORMAL_LABELS, POINTING_KIND_LIST, POINTING_KINDS, pointingFields, pointingFromFields, type PointingFields, type PointingReading } from './surface-normals';

/** The editor's controls: one per field of PointingFields, so the raw value is the fields. */
export type PointingForm = FormGroup<{ [K in keyof PointingFields]: FormControl<PointingFields[K]> }>;

/** The controls for a saved pointing (or the default facing when there is none). */
export function pointingForm(normal: SurfaceNormal | null): PointingForm {
  const f = pointingFields(normal);
  const c = <T>(v: T) => new FormControl<T>(v, { nonNullable: true });
  return new FormGroup({
    kind: c(f.kind), face: c(f.face), x: c(f.x), y: c(f.y), z: c(f.z), raDeg: c(f.raDeg), decDeg: c(f.decDeg),
    driveAxis: c(f.driveAxis), spinAxis: c(f.spinAxis), angleDeg: c(f.angleDeg),
  });
}

/** The pointing the controls give, or the sentence saying what is missing. */
export function readPointingForm(form: PointingForm): PointingReading {
  const v = form.getRawValue();
  return pointingFromFields({ ...v, raDeg: String(v.raDeg), decDeg: String(v.decDeg), angleDeg: String(v.angleDeg) });
}

/**
 * Every form a surface's pointing takes (local orbital, Sun, inertial, Sun-tracking, spinning,
 * yaw-steered), with a live preview in words; used by the surface dialog and the attitude-mode dialog.
 * `testid` prefixes each field's test id (e.g. "surface" gives "surface-pointing-kind").
 */
@Component({
  selector: 'ecl-pointing-editor',
  imports: [ReactiveFormsModule, MatFormField, MatLabel, MatInput, MatHint, MatSuffix, MatSelect, MatOption],
  templateUrl: './pointing-editor.html',
  styleUrl: './pointing-editor.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PointingEditor {
  readonly form = input.required<PointingForm>();
  readonly testid = input('surface');
  readonly label = input('Pointing');
  protected readonly localNames = LOCAL_NAMES;
  protected readonly normalLabels = NORMAL_LABELS;
  protected readonly kinds = POINTING_KIND_LIST;
  protected readonly kindLabels = POINTING_KINDS;

  /** Bumped on every change of the controls, so the computed values below follow them. */
  private readonly changes = signal(0);
  protected readonly values = computed(() => {
    this.changes();
    return this.form().getRawValue();
  });
  protected readonly kind = computed(() => this.values().kind);
  /** The pointing in words for the preview, or what is missing. */
  protected readonly preview = computed(() => {
    this.changes();
    const p = readPointingForm(this.form());
    return p.ok ? { ok: true, text: `Faces: ${pointingWords(p.normal)}.` } : { ok: false, text: p.message };
  });
  /** The custom direction scaled to length 1, and a sentence saying so when the typed one was not. */
  protected readonly direction = computed(() => {
    const { x, y, z } = this.values();
    return customDirection(Number(x), Number(y), Number(z));
  });
  protected readonly directionNote = computed(() => {
    const d = this.direction();
    if (d === null) return 'Give the direction: at least one of x, y and z must not be 0.';
    if (Math.abs(d.typedLength - 1) <= 1e-9) return null;
    const f = (v: number) => (Math.round(v * 1000) / 1000).toString();
    return `Length ${d.typedLength.toLocaleString('en-US', { maximumFractionDigits: 3 })} scaled to 1: saved as (${f(d.unit.x)}, ${f(d.unit.y)}, ${f(d.unit.z)}).`;
  });

  constructor() {
    effect((onCleanup) => {
      const sub = this.form().valueChanges.subscribe(() => this.changes.update((n) => n + 1));
      onCleanup(() => sub.unsubscribe());
    });
  }

  protected id(name: string): string {
    return `${this.testid()}-${name}`;
  }
}
