// The model's tables: nodes, conductive and radiative couplings, heaters and coolant loops, each a
// Material table of form cells with the cell's problem written under it. The page owns the form
// (and disables it for members who may only read); this component only draws and edits it.
import { NgTemplateOutlet } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, effect, input, signal } from '@angular/core';
import { type AbstractControl, type FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatButton, MatIconButton } from '@angular/material/button';
import { MatIcon } from '@angular/material/icon';
import { MatOption, MatSelect } from '@angular/material/select';
import { MatTableModule } from '@angular/material/table';
import type { Surface } from '../../../shared/api/missions';
import { describeSchedule, errorOf, nodeGroup, rowsFor, type ModelForm, type NodeForm } from './thermal-model-form';

@Component({
  selector: 'ecl-thermal-model-editor',
  imports: [ReactiveFormsModule, NgTemplateOutlet, MatTableModule, MatSelect, MatOption, MatButton, MatIconButton, MatIcon],
  templateUrl: './thermal-model-editor.html',
  styleUrl: './thermal-model-editor.css',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ThermalModelEditor {
  readonly form = input.required<ModelForm>();
  readonly surfaces = input<readonly Surface[]>([]);
  readonly readOnly = input(false);

  /** Bumped on every form event, so the OnPush template redraws errors that another cell caused. */
  protected readonly version = signal(0);

  // A node's fields in two tables of about eight columns, so both fit a 1440 px screen.
  protected readonly nodeColumns = ['name', 'capacitanceJK', 'massKg', 'specificHeatJKgK', 'initialC', 'dissipationW', 'hotDissipationW', 'coldDissipationW', 'remove'];
  protected readonly nodeLimitColumns = ['node', 'surfaceIds', 'radiatorAreaM2', 'emissivity', 'fixedC', 'minC', 'maxC', 'survivalMinC', 'survivalMaxC'];
  protected readonly couplingColumns = ['from', 'to', 'conductanceWK', 'remove'];
  protected readonly radiativeColumns = ['from', 'to', 'areaM2', 'effectiveEmissivity', 'viewFactor', 'remove'];
  protected readonly heaterColumns = ['name', 'node', 'powerW', 'control', 'onC', 'offC', 'setPointC', 'minV', 'nominalV', 'maxV', 'remove'];
  protected readonly loopColumns = ['name', 'closed', 'nodes', 'controlNode', 'inletC', 'fluidMassKg', 'densityKgM3', 'specificHeatJKgK', 'effectiveness', 'setPointC', 'bandK', 'minFlowKgS', 'nominalFlowKgS', 'maxFlowKgS', 'remove'];

  protected readonly rows = computed(() => {
    this.version();
    const c = this.form().controls;
    return {
      nodes: [...c.nodes.controls],
      couplings: [...c.couplings.controls],
      radiative: [...c.radiativeCouplings.controls],
      heaters: [...c.heaters.controls],
      loops: [...c.loops.controls],
    };
  });
  protected readonly nodeNames = computed(() => this.rows().nodes.map((n) => n.controls.name.value.trim()).filter((n) => n !== ''));
  protected readonly describeSchedule = describeSchedule;

  constructor() {
    effect((onCleanup) => {
      const subscription = this.form().events.subscribe(() => this.version.update((v) => v + 1));
      onCleanup(() => subscription.unsubscribe());
    });
  }

  /** The problem to show under a cell: once the cell was touched, or at once for a loaded model's references. */
  protected problem(control: AbstractControl | null): string | null {
    this.version();
    return control && (control.touched || control.dirty) ? errorOf(control) : null;
  }

  protected rowProblem(control: AbstractControl): string | null {
    this.version();
    return control.touched || control.dirty ? errorOf(control) : null;
  }

  protected modelProblem(): string | null {
    this.version();
    return errorOf(this.form());
  }

  protected surfaceName(id: string): string {
    return this.surfaces().find((s) => s.id === id)?.name ?? `missing surface ${id}`;
  }

  /** Surfaces free to pick for this node: its own, and those no other node owns. */
  protected surfacesFor(node: NodeForm): readonly Surface[] {
    this.version();
    const others = new Set(this.rows().nodes.filter((n) => n !== node).flatMap((n) => n.controls.surfaceIds.value));
    return this.surfaces().filter((s) => !others.has(s.id));
  }

  protected addNode(): void {
    const n = this.rows().nodes.length + 1;
    this.form().controls.nodes.push(nodeGroup({ name: `node ${n}`, capacitanceJK: 1000, initialC: 20 }));
  }

  protected addCoupling(): void {
    const names = this.nodeNames();
    const row = rowsFor(this.form()).coupling();
    row.patchValue({ from: names[0] ?? '', to: names[1] ?? '' });
    this.form().controls.couplings.push(row);
  }

  protected addRadiative(): void {
    const names = this.nodeNames();
    const row = rowsFor(this.form()).radiative();
    row.patchValue({ from: names[0] ?? '', to: names[1] ?? '' });
    this.form().controls.radiativeCouplings.push(row);
  }

  protected addHeater(): void {
    const row = rowsFor(this.form()).heater();
    row.patchValue({ node: this.nodeNames()[0] ?? '', onC: 0, offC: 5 });
    this.form().controls.heaters.push(row);
  }

  protected addLoop(): void {
    const row = rowsFor(this.form()).loop();
    row.patchValue({ name: `loop ${this.rows().loops.length + 1}`, specificHeatJKgK: 3500, densityKgM3: 1040 });
    this.form().controls.loops.push(row);
  }

  protected remove(list: 'nodes' | 'couplings' | 'radiativeCouplings' | 'heaters' | 'loops', index: number): void {
    this.form().controls[list].removeAt(index);
    this.form().markAsDirty();
  }

  /** Replaces an on/off schedule by its mean, as a constant the table can edit. */
  protected makeConstant(schedule: FormControl<ReturnType<typeof nodeGroup>['controls']['dissipationSchedule']['value']>, constant: FormControl<number | null>): void {
    const s = schedule.value;
    if (!s) return;
    constant.setValue(Math.round(((s.onW * s.onS + (s.offW ?? 0) * (s.periodS - s.onS)) / s.periodS) * 1000) / 1000);
    schedule.setValue(null);
    schedule.markAsDirty();
  }
}
