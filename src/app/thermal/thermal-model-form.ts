// The model editor's reactive form: one FormArray per table (nodes, couplings, heaters, loops), each
// cell a control whose validator says, in the words the API would use, what the value must be and
// what it got. Cross-table checks (a coupling naming a node that is gone) re-run whenever the
// nodes change. contentOf() gives back what PATCH /thermal-models/:id takes.
import { AbstractControl, FormArray, FormControl, FormGroup, type ValidationErrors, type ValidatorFn } from '@angular/forms';
import type { SavedThermalNode, ThermalModelContent, ThermalModelContentInput } from '../../../shared/api/thermal-models';

type Schedule = Exclude<SavedThermalNode['dissipationW'], number | undefined>;
type Num = FormControl<number | null>;
type Text = FormControl<string>;
type Heater = ThermalModelContent['heaters'][number];
type Loop = ThermalModelContent['loops'][number];

const num = (value: number | undefined | null, ...validators: ValidatorFn[]): Num => new FormControl<number | null>(value ?? null, validators);
const text = (value: string, ...validators: ValidatorFn[]): Text => new FormControl<string>(value, { nonNullable: true, validators });

const fail = (message: string): ValidationErrors => ({ message });
const shown = (v: unknown) => (typeof v === 'string' ? JSON.stringify(v) : String(v));

/** The first message of a control (or of its group), for the line under the cell. */
export function errorOf(control: AbstractControl | null): string | null {
  const errors = control?.errors;
  if (!errors) return null;
  const message: unknown = errors['message'];
  return typeof message === 'string' ? message : null;
}

export const checks = {
  required: (label: string): ValidatorFn => (c) => (c.value === null || c.value === '' ? fail(`give ${label}`) : null),
  above: (label: string, unit: string, min = 0): ValidatorFn => (c) =>
    c.value === null || (typeof c.value === 'number' && c.value > min) ? null : fail(`${label} must be above ${min} ${unit} (got ${shown(c.value)})`),
  atLeast: (label: string, unit: string, min = 0): ValidatorFn => (c) =>
    c.value === null || (typeof c.value === 'number' && c.value >= min) ? null : fail(`${label} cannot be below ${min} ${unit} (got ${shown(c.value)})`),
  fraction: (label: string): ValidatorFn => (c) =>
    c.value === null || (typeof c.value === 'number' && c.value >= 0 && c.value <= 1) ? null : fail(`${label} is 0..1 (got ${shown(c.value)})`),
  celsius: (label: string): ValidatorFn => (c) =>
    c.value === null || (typeof c.value === 'number' && c.value >= -273.15) ? null : fail(`${label} cannot be below absolute zero, -273.15 °C (got ${shown(c.value)})`),
};

/** A node name some other table refers to must be one of the model's nodes. */
function knownNode(form: () => ModelForm | null): ValidatorFn {
  return (c) => {
    const names = nodeNames(form());
    if (names === null || c.value === '' || c.value === null) return null;
    const values: unknown[] = Array.isArray(c.value) ? c.value : [c.value];
    const missing = values.find((v) => typeof v === 'string' && !names.includes(v));
    return missing === undefined ? null : fail(`no node is named ${shown(missing)}`);
  };
}

function nodeChecks(group: AbstractControl): ValidationErrors | null {
  const v = (group as NodeForm).getRawValue();
  const hasCapacitance = v.capacitanceJK !== null || (v.massKg !== null && v.specificHeatJKgK !== null);
  if (v.fixedC === null && !hasCapacitance) return fail('give the capacitance (J/K), or mass and specific heat, or a fixed temperature');
  if (v.minC !== null && v.maxC !== null && v.maxC <= v.minC) return fail(`the maximum must be above the minimum (${v.minC} °C)`);
  if (v.radiatorAreaM2 !== null && v.radiatorAreaM2 > 0 && v.emissivity === null) return fail('a radiator needs its emissivity');
  return null;
}

export function nodeGroup(node?: Partial<SavedThermalNode>) {
  const schedule = (d: SavedThermalNode['dissipationW'] | undefined) => new FormControl<Schedule | null>(typeof d === 'object' ? d : null);
  const constant = (d: SavedThermalNode['dissipationW'] | undefined, label: string) => num(typeof d === 'number' ? d : null, checks.atLeast(label, 'W'));
  return new FormGroup(
    {
      name: text(node?.name ?? '', checks.required('a name')),
      capacitanceJK: num(node?.capacitanceJK, checks.above('capacitance', 'J/K')),
      massKg: num(node?.massKg, checks.above('mass', 'kg')),
      specificHeatJKgK: num(node?.specificHeatJKgK, checks.above('specific heat', 'J/(kg K)')),
      initialC: num(node?.initialC ?? 20, checks.required('the initial temperature'), checks.celsius('initial temperature')),
      dissipationW: constant(node?.dissipationW, 'dissipation'),
      dissipationSchedule: schedule(node?.dissipationW),
      hotDissipationW: constant(node?.hotDissipationW, 'hot-case dissipation'),
      hotSchedule: schedule(node?.hotDissipationW),
      coldDissipationW: constant(node?.coldDissipationW, 'cold-case dissipation'),
      coldSchedule: schedule(node?.coldDissipationW),
      surfaceIds: new FormControl<string[]>([...(node?.surfaceIds ?? [])], { nonNullable: true }),
      radiatorAreaM2: num(node?.radiatorAreaM2, checks.atLeast('radiator area', 'm²')),
      emissivity: num(node?.emissivity, checks.fraction('emissivity')),
      sinkC: num(node?.sinkC, checks.celsius('sink temperature')),
      fixedC: num(node?.fixedC, checks.celsius('fixed temperature')),
      minC: num(node?.minC, checks.celsius('minimum')),
      maxC: num(node?.maxC, checks.celsius('maximum')),
      survivalMinC: num(node?.survivalMinC, checks.celsius('survival minimum')),
      survivalMaxC: num(node?.survivalMaxC, checks.celsius('survival maximum')),
    },
    { validators: nodeChecks },
  );
}
export type NodeForm = ReturnType<typeof nodeGroup>;

export function couplingGroup(form: () => ModelForm | null, c?: Partial<ThermalModelContent['couplings'][number]>) {
  return new FormGroup({
    from: text(c?.from ?? '', checks.required('a node'), knownNode(form)),
    to: text(c?.to ?? '', checks.required('a node'), knownNode(form)),
    conductanceWK: num(c?.conductanceWK ?? null, checks.required('the conductance'), checks.above('conductance', 'W/K')),
  }, { validators: sameEnds });
}
export type CouplingForm = ReturnType<typeof couplingGroup>;

export function radiativeGroup(form: () => ModelForm | null, c?: Partial<ThermalModelContent['radiativeCouplings'][number]>) {
  return new FormGroup({
    from: text(c?.from ?? '', checks.required('a node'), knownNode(form)),
    to: text(c?.to ?? '', checks.required('a node'), knownNode(form)),
    areaM2: num(c?.areaM2 ?? null, checks.required('the area'), checks.above('area', 'm²')),
    effectiveEmissivity: num(c?.effectiveEmissivity ?? null, checks.required('the effective emissivity'), checks.fraction('effective emissivity')),
    viewFactor: num(c?.viewFactor ?? 1, checks.required('the view factor'), checks.fraction('view factor')),
  }, { validators: sameEnds });
}
export type RadiativeForm = ReturnType<typeof radiativeGroup>;

function sameEnds(group: AbstractControl): ValidationErrors | null {
  const { from, to } = (group as CouplingForm).getRawValue();
  return from !== '' && from === to ? fail(`a coupling joins two different nodes (both are ${shown(to)})`) : null;
}

function heaterChecks(group: AbstractControl): ValidationErrors | null {
  const v = (group as HeaterForm).getRawValue();
  if (v.control === 'thermostat') {
    if (v.onC === null || v.offC === null) return fail('a thermostat needs its on and off temperatures');
    if (v.offC <= v.onC) return fail(`the off temperature must be above the on temperature (${v.onC} °C)`);
  } else if (v.setPointC === null) return fail('a PI controller needs its set point');
  const bus = [v.nominalV, v.minV, v.maxV];
  if (bus.some((x) => x !== null) && bus.some((x) => x === null)) return fail('give the bus voltage as minimum, nominal and maximum, or none');
  if (v.minV !== null && v.nominalV !== null && v.maxV !== null && !(v.minV <= v.nominalV && v.nominalV <= v.maxV)) {
    return fail(`the bus needs minimum ≤ nominal ≤ maximum (got ${v.minV}, ${v.nominalV}, ${v.maxV} V)`);
  }
  return null;
}

export function heaterGroup(form: () => ModelForm | null, h?: Partial<Heater>) {
  const { name, node, powerW, control, onC, offC, setPointC, busVoltage, ...extra } = h ?? {};
  return new FormGroup({
    name: text(name ?? ''),
    node: text(node ?? '', checks.required('a node'), knownNode(form)),
    powerW: num(powerW ?? null, checks.required('the installed power'), checks.atLeast('installed power', 'W')),
    control: new FormControl<'thermostat' | 'pi'>(control ?? 'thermostat', { nonNullable: true }),
    onC: num(onC, checks.celsius('on temperature')),
    offC: num(offC, checks.celsius('off temperature')),
    setPointC: num(setPointC, checks.celsius('set point')),
    nominalV: num(busVoltage?.nominalV, checks.above('nominal voltage', 'V')),
    minV: num(busVoltage?.minV, checks.above('minimum voltage', 'V')),
    maxV: num(busVoltage?.maxV, checks.above('maximum voltage', 'V')),
    /** Controller gains the table does not show, kept as they were. */
    extra: new FormControl<Partial<Heater>>(extra, { nonNullable: true }),
  }, { validators: heaterChecks });
}
export type HeaterForm = ReturnType<typeof heaterGroup>;

/** A closed loop's path as typed: one element per line, "node: UA" (W/K). */
export function parsePath(textValue: string): { path: { node: string; conductanceWK: number }[]; problem: string | null } {
  const path: { node: string; conductanceWK: number }[] = [];
  const lines = textValue.split('\n').map((l) => l.trim()).filter((l) => l !== '');
  for (const line of lines) {
    const at = line.lastIndexOf(':');
    const node = (at < 0 ? line : line.slice(0, at)).trim();
    const ua = at < 0 ? NaN : Number(line.slice(at + 1).trim());
    if (node === '' || !(ua > 0)) return { path, problem: `each line is "node: UA in W/K" with UA above 0 (got ${shown(line)})` };
    path.push({ node, conductanceWK: ua });
  }
  return { path, problem: lines.length ? null : 'a closed loop passes at least one node: one line per element, "node: UA"' };
}

export const pathText = (path: readonly { node: string; conductanceWK: number }[] | undefined) => (path ?? []).map((e) => `${e.node}: ${e.conductanceWK}`).join('\n');

function loopChecks(group: AbstractControl): ValidationErrors | null {
  const v = (group as LoopForm).getRawValue();
  if (v.minFlowKgS !== null && v.nominalFlowKgS !== null && v.maxFlowKgS !== null && !(v.minFlowKgS <= v.nominalFlowKgS && v.nominalFlowKgS <= v.maxFlowKgS)) {
    return fail(`the flows need minimum ≤ nominal ≤ maximum (got ${v.minFlowKgS}, ${v.nominalFlowKgS}, ${v.maxFlowKgS} kg/s)`);
  }
  if (v.minFlowKgS !== null && v.maxFlowKgS !== null && v.minFlowKgS < v.maxFlowKgS) {
    if (v.controlNode === '') return fail('the flow can vary: choose the one node it controls');
    if (v.setPointC === null) return fail('a controlled loop needs its set point');
  }
  if (v.closed && v.fluidMassKg === null) return fail('a closed loop needs the mass of its coolant');
  if (!v.closed && v.inletC === null) return fail('an open loop needs its inlet temperature');
  if (!v.closed && v.nodes.length === 0) return fail('a loop cools at least one node');
  return null;
}

/** The path's nodes must be the model's. */
function pathNodes(form: () => ModelForm | null): ValidatorFn {
  return (c) => {
    const group = c.parent as LoopForm | null;
    if (!group || !group.controls.closed.value) return null;
    const { path, problem } = parsePath(String(c.value));
    if (problem) return fail(problem);
    const names = nodeNames(form());
    const missing = names === null ? undefined : path.find((e) => !names.includes(e.node));
    if (missing) return fail(`no node is named ${shown(missing.node)}`);
    const twice = path.find((e, i) => path.findIndex((f) => f.node === e.node) !== i);
    return twice ? fail(`the path passes ${shown(twice.node)} twice`) : null;
  };
}

export function loopGroup(form: () => ModelForm | null, l?: Partial<Loop>) {
  const { name, nodes, path, inletC, specificHeatJKgK, effectiveness, setPointC, controlNode, fluidMassKg, densityKgM3, bandK, minFlowKgS, maxFlowKgS, nominalFlowKgS, ...extra } = l ?? {};
  const group = new FormGroup({
    name: text(name ?? '', checks.required('a name')),
    closed: new FormControl<boolean>(l === undefined || (path !== undefined && inletC === undefined), { nonNullable: true }),
    nodes: new FormControl<string[]>([...(nodes ?? [])], { nonNullable: true, validators: [knownNode(form)] }),
    path: text(pathText(path), pathNodes(form)),
    controlNode: text(controlNode ?? '', knownNode(form)),
    inletC: num(inletC ?? null, checks.celsius('inlet temperature')),
    fluidMassKg: num(fluidMassKg ?? null, checks.above('coolant mass', 'kg')),
    densityKgM3: num(densityKgM3 ?? null, checks.above('coolant density', 'kg/m³')),
    specificHeatJKgK: num(specificHeatJKgK ?? null, checks.required('the coolant specific heat'), checks.above('specific heat', 'J/(kg K)')),
    effectiveness: num(effectiveness, checks.fraction('effectiveness')),
    setPointC: num(setPointC ?? null, checks.celsius('set point')),
    bandK: num(bandK ?? null, checks.above('control band', 'K')),
    minFlowKgS: num(minFlowKgS ?? 0, checks.required('the minimum flow'), checks.atLeast('minimum flow', 'kg/s')),
    maxFlowKgS: num(maxFlowKgS ?? null, checks.required('the maximum flow'), checks.above('maximum flow', 'kg/s')),
    nominalFlowKgS: num(nominalFlowKgS ?? null, checks.required('the nominal flow'), checks.above('nominal flow', 'kg/s')),
    /** Controller gains and feedforward the table does not show, kept as they were. */
    extra: new FormControl<Partial<Loop>>(extra, { nonNullable: true }),
  }, { validators: loopChecks });
  group.controls.closed.valueChanges.subscribe(() => group.controls.path.updateValueAndValidity());
  return group;
}
export type LoopForm = ReturnType<typeof loopGroup>;

export interface ModelFormControls {
  nodes: FormArray<NodeForm>;
  couplings: FormArray<CouplingForm>;
  radiativeCouplings: FormArray<RadiativeForm>;
  heaters: FormArray<HeaterForm>;
  loops: FormArray<LoopForm>;
  operatingK: Num;
  survivalK: Num;
  maxDutyCycle: Num;
  /** Solver options the editor does not show (tolerance, orbits, substeps), kept as they were. */
  solver: FormControl<Pick<ThermalModelContent, 'toleranceK' | 'maxOrbits' | 'substeps'>>;
}
export type ModelForm = FormGroup<ModelFormControls>;

function nodeNames(form: ModelForm | null): string[] | null {
  return form ? form.controls.nodes.controls.map((n) => n.controls.name.value.trim()) : null;
}

function duplicateNames(group: AbstractControl): ValidationErrors | null {
  const names = nodeNames(group as ModelForm) ?? [];
  const twice = names.find((n, i) => n !== '' && names.indexOf(n) !== i);
  return twice === undefined ? null : fail(`node name ${shown(twice)} is used twice`);
}

export function modelForm(content?: ThermalModelContent): ModelForm {
  let form: ModelForm | null = null;
  const self = () => form;
  const built: ModelForm = new FormGroup<ModelFormControls>(
    {
      nodes: new FormArray((content?.nodes ?? []).map((n) => nodeGroup(n))),
      couplings: new FormArray((content?.couplings ?? []).map((c) => couplingGroup(self, c))),
      radiativeCouplings: new FormArray((content?.radiativeCouplings ?? []).map((c) => radiativeGroup(self, c))),
      heaters: new FormArray((content?.heaters ?? []).map((h) => heaterGroup(self, h))),
      loops: new FormArray((content?.loops ?? []).map((l) => loopGroup(self, l))),
      operatingK: num(content?.margins.operatingK, checks.atLeast('operating margin', 'K')),
      survivalK: num(content?.margins.survivalK, checks.atLeast('survival margin', 'K')),
      maxDutyCycle: num(content?.maxDutyCycle ?? 0.75, checks.required('the duty-cycle limit'), checks.above('duty-cycle limit', ''), checks.fraction('duty-cycle limit')),
      solver: new FormControl({ toleranceK: content?.toleranceK, maxOrbits: content?.maxOrbits, substeps: content?.substeps }, { nonNullable: true }),
    },
    { validators: duplicateNames },
  );
  form = built;
  revalidateReferences(built, false);
  // Renaming or removing a node can break a reference in another table: check them all again.
  built.controls.nodes.valueChanges.subscribe(() => revalidateReferences(built));
  return built;
}

/** Factories bound to this form, for the editor's "Add" buttons. */
export const rowsFor = (form: ModelForm) => ({
  coupling: () => couplingGroup(() => form),
  radiative: () => radiativeGroup(() => form),
  heater: () => heaterGroup(() => form),
  loop: () => loopGroup(() => form),
});

export function revalidateReferences(form: ModelForm, show = true): void {
  const refs = [
    ...form.controls.couplings.controls.flatMap((c) => [c.controls.from, c.controls.to]),
    ...form.controls.radiativeCouplings.controls.flatMap((c) => [c.controls.from, c.controls.to]),
    ...form.controls.heaters.controls.map((h) => h.controls.node),
    ...form.controls.loops.controls.flatMap((l) => [l.controls.nodes, l.controls.path, l.controls.controlNode]),
  ];
  for (const control of refs) {
    control.updateValueAndValidity({ emitEvent: false });
    if (show) control.markAsTouched();
  }
}

const given = <K extends string, V>(key: K, value: V | null | undefined): { [P in K]?: V } =>
  (value === null || value === undefined ? {} : { [key]: value }) as { [P in K]?: V };

/** The model as the API takes it. */
export function contentOf(form: ModelForm): ThermalModelContentInput {
  const v = form.getRawValue();
  return {
    nodes: v.nodes.map((n) => ({
      name: n.name.trim(),
      initialC: n.initialC ?? 20,
      ...given('capacitanceJK', n.capacitanceJK),
      ...given('massKg', n.massKg),
      ...given('specificHeatJKgK', n.specificHeatJKgK),
      ...given('dissipationW', n.dissipationSchedule ?? n.dissipationW),
      ...given('hotDissipationW', n.hotSchedule ?? n.hotDissipationW),
      ...given('coldDissipationW', n.coldSchedule ?? n.coldDissipationW),
      surfaceIds: n.surfaceIds,
      ...given('radiatorAreaM2', n.radiatorAreaM2),
      ...given('emissivity', n.emissivity),
      ...given('sinkC', n.sinkC),
      ...given('fixedC', n.fixedC),
      ...given('minC', n.minC),
      ...given('maxC', n.maxC),
      ...given('survivalMinC', n.survivalMinC),
      ...given('survivalMaxC', n.survivalMaxC),
    })),
    couplings: v.couplings.map((c) => ({ from: c.from, to: c.to, conductanceWK: c.conductanceWK ?? 0 })),
    radiativeCouplings: v.radiativeCouplings.map((c) => ({
      from: c.from, to: c.to, areaM2: c.areaM2 ?? 0, effectiveEmissivity: c.effectiveEmissivity ?? 0, viewFactor: c.viewFactor ?? 0,
    })),
    heaters: v.heaters.map((h) => ({
      ...h.extra,
      ...given('name', h.name.trim() || null),
      node: h.node,
      powerW: h.powerW ?? 0,
      control: h.control,
      ...(h.control === 'thermostat' ? { ...given('onC', h.onC), ...given('offC', h.offC) } : given('setPointC', h.setPointC)),
      ...(h.nominalV !== null && h.minV !== null && h.maxV !== null ? { busVoltage: { nominalV: h.nominalV, minV: h.minV, maxV: h.maxV } } : {}),
    })),
    loops: v.loops.map((l) => ({
      ...l.extra,
      name: l.name.trim(),
      ...(l.closed
        ? { path: parsePath(l.path).path, ...given('fluidMassKg', l.fluidMassKg), ...given('densityKgM3', l.densityKgM3) }
        : { nodes: l.nodes, inletC: l.inletC ?? 0, ...given('effectiveness', l.effectiveness), ...given('densityKgM3', l.densityKgM3) }),
      specificHeatJKgK: l.specificHeatJKgK ?? 0,
      ...given('controlNode', l.controlNode || null),
      ...given('setPointC', l.setPointC),
      ...given('bandK', l.bandK),
      minFlowKgS: l.minFlowKgS ?? 0, maxFlowKgS: l.maxFlowKgS ?? 0, nominalFlowKgS: l.nominalFlowKgS ?? 0,
    })),
    margins: { ...given('operatingK', v.operatingK), ...given('survivalK', v.survivalK) },
    maxDutyCycle: v.maxDutyCycle ?? 0.75,
    ...given('toleranceK', v.solver.toleranceK),
    ...given('maxOrbits', v.solver.maxOrbits),
    ...given('substeps', v.solver.substeps),
  };
}

export function describeSchedule(s: Schedule): string {
  return `${s.onW} W for ${s.onS} s every ${s.periodS} s${s.offW ? `, else ${s.offW} W` : ''}`;
}
