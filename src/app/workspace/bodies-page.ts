import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, inject, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { NonNullableFormBuilder, ReactiveFormsModule, Validators, type AbstractControl, type ValidatorFn } from '@angular/forms';
import { MatButton } from '@angular/material/button';
import { MatCheckbox } from '@angular/material/checkbox';
import { MatFormField, MatLabel } from '@angular/material/form-field';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatSnackBar } from '@angular/material/snack-bar';
import { startWith, Subject, switchMap } from 'rxjs';
import type { CustomBodyInput, CustomBodyResponse } from '../../../shared/api/custom-bodies';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded } from '../api/loaded';
import { AuthSession } from '../auth/auth-session';
import { readQuantityText, type FieldUnit } from '../missions/quantity-text';
import { DesignCaution } from '../shell/design-caution';
import { SourceWordsPipe } from '../shell/source-words-pipe';
import { pathWords } from '../shell/user-words';
import { LabelledField } from '../shell/labelled-field';
import { RowActions } from '../shell/row-actions';
import { WorkspaceApi } from './workspace-api';

const PLANETS = [
  ['mercury', 'Mercury'], ['venus', 'Venus'], ['earth', 'Earth'], ['mars', 'Mars'],
  ['jupiter', 'Jupiter'], ['saturn', 'Saturn'], ['uranus', 'Uranus'], ['neptune', 'Neptune'],
] as const;
type PlanetId = (typeof PLANETS)[number][0];

/** A min / nominal / max triple of the form, its label, unit and limits. */
const RANGES = [
  { key: 'albedo', label: 'Bond albedo', unit: '', low: 0, high: 1, step: 0.01, airless: false },
  { key: 'olrWm2', label: 'OLR', unit: 'W/m²', low: 0, high: 20000, step: 1, airless: false },
  { key: 'emissivity', label: 'Surface emissivity', unit: '', low: 0.01, high: 1, step: 0.01, airless: true },
  { key: 'nightFloorK', label: 'Night floor temperature', unit: 'K', low: 0, high: 500, step: 1, airless: true },
] as const;
type RangeKey = (typeof RANGES)[number]['key'];
const ENDS = [['min', 'least'], ['nominal', 'nominal'], ['max', 'greatest']] as const;

const SOURCES = [
  ['gmKm3S2', 'GM'], ['radiusKm', 'radius'], ['j2', 'J2'], ['place', 'orbit'], ['albedo', 'albedo'], ['olrWm2', 'OLR'],
  ['emissivity', 'emissivity'], ['nightFloorK', 'night floor'],
] as const;

/** A typed quantity field ("1737.4 km", "3.55 d"): valid when the shared table reads it. */
const typedIn = (unit: FieldUnit): ValidatorFn => (control) => {
  const text = String(control.value ?? '').trim();
  if (text === '') return null;
  const reading = readQuantityText(text, unit);
  return reading.ok ? (reading.value > 0 ? null : { problem: 'must be above 0' }) : { problem: reading.message };
};

/**
 * The workspace's own central bodies (an asteroid, a moon the catalogue lacks): GM, radius, where
 * it is, albedo and OLR ranges, and for an airless body its surface temperature field; each value
 * with its source. Missions of the workspace may then orbit them. Every member reads the list;
 * owners, thermal engineers and analysts add and change bodies.
 */
@Component({
  selector: 'ecl-bodies-page',
  imports: [
    RowActions,
    ReactiveFormsModule, DesignCaution, SourceWordsPipe, LabelledField, MatFormField, MatLabel, MatSelect, MatOption,
    MatButton, MatCheckbox,
  ],
  templateUrl: './bodies-page.html',
  styleUrl: './environment-table-page.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BodiesPage {
  private readonly api = inject(WorkspaceApi);
  private readonly snackBar = inject(MatSnackBar);
  private readonly session = inject(AuthSession);
  private readonly fb = inject(NonNullableFormBuilder);

  /** From the route /w/:workspaceId/bodies. */
  readonly workspaceId = input.required<string>();

  protected readonly planets = PLANETS;
  protected readonly ranges = RANGES;
  protected readonly ends = ENDS;
  protected readonly sources = SOURCES;
  protected readonly canEdit = computed(() => {
    const role = this.session.workspaces().find((w) => w.workspaceId === this.workspaceId())?.role;
    return role === 'owner' || role === 'thermal' || role === 'analyst';
  });
  private readonly reload = new Subject<void>();
  protected readonly list = toSignal(
    toObservable(this.workspaceId).pipe(switchMap((id) => this.reload.pipe(startWith(undefined), switchMap(() => this.api.customBodies(id).pipe(loaded()))))),
  );
  /** The body being edited (null: a new one); undefined while the form is closed. */
  protected readonly editing = signal<CustomBodyResponse | null | undefined>(undefined);
  protected readonly failure = signal<string | null>(null);
  protected readonly busy = signal(false);
  /** Server refusals by form control. */
  protected readonly problems = signal<Record<string, string>>({});

  private readonly rangeControls = Object.fromEntries(
    RANGES.flatMap((r) => ENDS.map(([end]) => [`${r.key}_${end}`, this.fb.control<number | null>(null, [Validators.required, Validators.min(r.low), Validators.max(r.high)])])),
  );
  protected readonly form = this.fb.group({
    name: ['', [Validators.required, Validators.maxLength(80)]],
    gmKm3S2: this.fb.control<number | null>(null, [Validators.required, Validators.min(1e-12), Validators.max(2e8)]),
    radiusKm: ['', [Validators.required, typedIn('km')]],
    j2: this.fb.control<number | null>(0, [Validators.min(-0.1), Validators.max(0.1)]),
    placeKind: this.fb.control<'sun' | 'planet'>('sun'),
    meanAu: this.fb.control<number | null>(null, [Validators.min(1e-6), Validators.max(1000)]),
    minAu: this.fb.control<number | null>(null, [Validators.min(1e-6), Validators.max(1000)]),
    maxAu: this.fb.control<number | null>(null, [Validators.min(1e-6), Validators.max(1000)]),
    parentId: this.fb.control<PlanetId>('jupiter'),
    orbitRadiusKm: ['', typedIn('km')],
    periodDays: ['', typedIn('d')],
    airless: false,
    ...this.rangeControls,
    ...Object.fromEntries(SOURCES.map(([key]) => [`source_${key}`, this.fb.control('', Validators.maxLength(300))])),
  });
  protected readonly placeKind = toSignal(this.form.controls.placeKind.valueChanges, { initialValue: this.form.controls.placeKind.value });
  protected readonly airless = toSignal(this.form.controls.airless.valueChanges, { initialValue: false });
  private readonly typedValues = toSignal(this.form.valueChanges, { initialValue: this.form.value });
  /** What the typed fields will be read as ("= 1,737.4 km"), or null. */
  protected readonly previews = computed(() => {
    const v = this.typedValues() as Record<string, unknown>;
    const preview = (key: string, unit: FieldUnit, shown: string): string | null => {
      const reading = readQuantityText(String(v[key] ?? '').trim(), unit);
      return reading.ok && !reading.bare ? `= ${reading.value.toLocaleString('en-US', { maximumSignificantDigits: 6 })} ${shown}` : null;
    };
    return { radiusKm: preview('radiusKm', 'km', 'km'), orbitRadiusKm: preview('orbitRadiusKm', 'km', 'km'), periodDays: preview('periodDays', 'd', 'd') };
  });

  protected control(name: string): AbstractControl {
    return (this.form.controls as unknown as Record<string, AbstractControl>)[name]!;
  }

  /** The message beside a field: the server's refusal, else what its validators found, in words naming the field. */
  protected problem(name: string, label: string): string {
    const server = this.problems()[name];
    if (server) return server;
    const errors = this.control(name).errors ?? {};
    if (errors['required']) return `give the ${label}`;
    if (errors['problem']) return `${label}: ${String(errors['problem'])}`;
    if (errors['min']) return `${label} must be at least ${(errors['min'] as { min: number }).min}`;
    if (errors['max']) return `${label} must be at most ${(errors['max'] as { max: number }).max}`;
    if (errors['maxlength']) return `${label} is too long`;
    return '';
  }

  protected placeText(b: CustomBodyResponse): string {
    if (b.place.kind === 'sun') return `about the Sun, ${b.place.minAu}–${b.place.maxAu} AU (mean ${b.place.meanAu} AU)`;
    const parent = PLANETS.find(([id]) => id === (b.place as { parentId: string }).parentId)?.[1] ?? '';
    return `about ${parent}, ${b.place.orbitRadiusKm.toLocaleString('en-US')} km, period ${b.place.periodDays.toLocaleString('en-US', { maximumSignificantDigits: 6 })} d`;
  }

  /** Each value's source as entered, or that none was given. */
  protected sourcesText(b: CustomBodyResponse): string {
    const given = SOURCES.filter(([key]) => b.sources[key]).map(([key, label]) => `${label}: ${b.sources[key]}`);
    return given.length > 0 ? `Sources: ${given.join('; ')}` : 'No source given for its values.';
  }

  protected open(body: CustomBodyResponse | null): void {
    this.problems.set({});
    this.failure.set(null);
    const ranges = Object.fromEntries(
      RANGES.flatMap((r) => ENDS.map(([end]) => {
        const source = r.airless ? body?.airless?.[r.key as 'emissivity' | 'nightFloorK'] : body?.[r.key as 'albedo' | 'olrWm2'];
        return [`${r.key}_${end}`, source?.[end] ?? null];
      })),
    );
    this.form.reset({
      name: body?.name ?? '', gmKm3S2: body?.gmKm3S2 ?? null, radiusKm: body ? String(body.radiusKm) : '', j2: body?.j2 ?? 0,
      placeKind: body?.place.kind ?? 'sun',
      meanAu: body?.place.kind === 'sun' ? body.place.meanAu : null,
      minAu: body?.place.kind === 'sun' ? body.place.minAu : null,
      maxAu: body?.place.kind === 'sun' ? body.place.maxAu : null,
      parentId: body?.place.kind === 'planet' ? body.place.parentId : 'jupiter',
      orbitRadiusKm: body?.place.kind === 'planet' ? String(body.place.orbitRadiusKm) : '',
      periodDays: body?.place.kind === 'planet' ? String(body.place.periodDays) : '',
      airless: body ? body.airless !== null : false,
      ...ranges,
      ...Object.fromEntries(SOURCES.map(([key]) => [`source_${key}`, body?.sources[key] ?? ''])),
    } as never);
    this.editing.set(body);
  }

  protected close(): void {
    this.editing.set(undefined);
  }

  protected save(): void {
    this.problems.set({});
    const v = this.form.getRawValue() as unknown as Record<string, unknown>;
    const sun = v['placeKind'] === 'sun';
    const needed = sun ? ['meanAu', 'minAu', 'maxAu'] : ['orbitRadiusKm', 'periodDays'];
    const rangeKeys = RANGES.filter((r) => !r.airless || v['airless']).flatMap((r) => ENDS.map(([end]) => `${r.key}_${end}`));
    const words: Record<string, string> = {
      meanAu: 'mean distance from the Sun', minAu: 'least distance from the Sun', maxAu: 'greatest distance from the Sun',
      orbitRadiusKm: 'orbit radius', periodDays: 'orbit period',
    };
    for (const key of needed) if (v[key] === null || v[key] === '') this.showProblem(key, `give the ${words[key]}`);
    const fields = ['name', 'gmKm3S2', 'radiusKm', 'j2', ...needed, ...rangeKeys, ...SOURCES.map(([k]) => `source_${k}`)];
    if (fields.some((f) => this.control(f).invalid) || Object.keys(this.problems()).length > 0) {
      fields.forEach((f) => this.control(f).markAsTouched());
      this.failure.set('Some values need attention: see the fields marked below.');
      return;
    }
    const range = (key: RangeKey) => ({ min: Number(v[`${key}_min`]), nominal: Number(v[`${key}_nominal`]), max: Number(v[`${key}_max`]) });
    // A bare number is in the field's unit; text with a unit goes as typed, the server reads it with the same table.
    const typed = (key: string): string | number => {
      const text = String(v[key] ?? '').trim();
      return Number.isFinite(Number(text)) ? Number(text) : text;
    };
    const body: CustomBodyInput = {
      name: String(v['name']).trim(), gmKm3S2: Number(v['gmKm3S2']), radiusKm: typed('radiusKm'), j2: Number(v['j2'] ?? 0),
      place: sun
        ? { kind: 'sun', meanAu: Number(v['meanAu']), minAu: Number(v['minAu']), maxAu: Number(v['maxAu']) }
        : { kind: 'planet', parentId: v['parentId'] as PlanetId, orbitRadiusKm: typed('orbitRadiusKm'), periodDays: typed('periodDays') },
      albedo: range('albedo'), olrWm2: range('olrWm2'),
      airless: v['airless'] ? { emissivity: range('emissivity'), nightFloorK: range('nightFloorK') } : null,
      sources: Object.fromEntries(SOURCES.map(([k]) => [k, String(v[`source_${k}`] ?? '').trim()])),
    };
    const existing = this.editing();
    const request = existing ? this.api.updateCustomBody(this.workspaceId(), existing.id, body) : this.api.createCustomBody(this.workspaceId(), body);
    this.busy.set(true);
    this.failure.set(null);
    request.subscribe({
      next: (saved) => {
        this.busy.set(false);
        this.editing.set(undefined);
        this.reload.next();
        this.snackBar.open(`Body "${saved.name}" saved.`, undefined, { duration: 3000 });
      },
      error: (failure: unknown) => {
        this.busy.set(false);
        const details = failure instanceof HttpErrorResponse ? (failure.error as { error?: { details?: { path?: string; message: string }[] } } | null)?.error?.details ?? [] : [];
        let unplaced = details.length === 0;
        for (const d of details) {
          const name = d.path?.replace(/^(place|airless)\./, '').replace(/^sources\./, 'source_').replace(/\./g, '_');
          if (name && name in this.form.controls) this.showProblem(name, `${pathWords(d.path ?? '')}: ${d.message}`);
          else unplaced = true;
        }
        this.failure.set(unplaced ? apiErrorMessage(failure) : 'Some values need attention: see the fields marked below.');
      },
    });
  }

  protected remove(body: CustomBodyResponse): void {
    this.api.deleteCustomBody(this.workspaceId(), body.id).subscribe({
      next: () => {
        this.reload.next();
        this.snackBar.open(`Body "${body.name}" deleted.`, undefined, { duration: 3000 });
      },
      error: (failure: unknown) => this.failure.set(apiErrorMessage(failure)),
    });
  }

  private showProblem(name: string, message: string): void {
    this.problems.update((p) => ({ ...p, [name]: message }));
    this.control(name).setErrors({ problem: message });
    this.control(name).markAsTouched();
  }
}
