import { contentOf, errorOf, modelForm, rowsFor } from './thermal-model-form';
import type { ThermalModelContent } from '../../../shared/api/thermal-models';

const content: ThermalModelContent = {
  nodes: [
    { name: 'battery', capacitanceJK: 2400, initialC: 15, dissipationW: 2, coldDissipationW: { onW: 4, offW: 1, periodS: 5700, onS: 600 }, minC: 0, maxC: 30, surfaceIds: [] },
    { name: 'panel', massKg: 1.1, specificHeatJKgK: 900, initialC: 0, surfaceIds: ['s-1'] },
  ],
  couplings: [{ from: 'battery', to: 'panel', conductanceWK: 0.5 }],
  radiativeCouplings: [],
  heaters: [{ node: 'battery', powerW: 10, control: 'thermostat', onC: 5, offC: 8, busVoltage: { nominalV: 28, minV: 24, maxV: 32 } }],
  loops: [],
  margins: { operatingK: 3 },
  maxDutyCycle: 0.75,
};

describe('the thermal model form', () => {
  it('gives back the model it was built from, schedules included', () => {
    const form = modelForm(content);
    expect(form.valid).toBe(true);
    expect(contentOf(form)).toEqual({ ...content, margins: { operatingK: 3 } });
  });

  it('says what a conductance must be and what it got', () => {
    const form = modelForm(content);
    const conductance = form.controls.couplings.at(0).controls.conductanceWK;
    conductance.setValue(-1);
    expect(errorOf(conductance)).toBe('conductance must be above 0 W/K (got -1)');
    expect(form.valid).toBe(false);
  });

  it('flags a coupling and a heater whose node was renamed away, and clears it when the name returns', () => {
    const form = modelForm(content);
    const name = form.controls.nodes.at(0).controls.name;
    name.setValue('cell pack');
    expect(errorOf(form.controls.couplings.at(0).controls.from)).toBe('no node is named "battery"');
    expect(errorOf(form.controls.heaters.at(0).controls.node)).toBe('no node is named "battery"');
    name.setValue('battery');
    expect(errorOf(form.controls.couplings.at(0).controls.from)).toBeNull();
  });

  it('checks a row as a whole: thermostat band, bus range, capacitance, a coupling to itself, names used twice', () => {
    const form = modelForm(content);
    const heater = form.controls.heaters.at(0);
    heater.patchValue({ offC: 4 });
    expect(errorOf(heater)).toBe('the off temperature must be above the on temperature (5 °C)');
    heater.patchValue({ offC: 8, minV: 30 });
    expect(errorOf(heater)).toBe('the bus needs minimum ≤ nominal ≤ maximum (got 30, 28, 32 V)');
    const panel = form.controls.nodes.at(1);
    panel.patchValue({ massKg: null });
    expect(errorOf(panel)).toMatch(/^give the capacitance/);
    const coupling = rowsFor(form).coupling();
    coupling.patchValue({ from: 'panel', to: 'panel', conductanceWK: 1 });
    expect(errorOf(coupling)).toBe('a coupling joins two different nodes (both are "panel")');
    panel.controls.name.setValue('battery');
    expect(errorOf(form)).toBe('node name "battery" is used twice');
  });

  it('keeps a closed loop as it came (path in order, the one controlled node) and asks for the controlled node when the flow can vary', () => {
    const loop = {
      name: 'battery loop', path: [{ node: 'panel', conductanceWK: 20 }, { node: 'battery', conductanceWK: 8 }], fluidMassKg: 0.5, densityKgM3: 1040,
      specificHeatJKgK: 3600, controlNode: 'battery', setPointC: 15, bandK: 0.2, minFlowKgS: 0.001, nominalFlowKgS: 0.005, maxFlowKgS: 0.02, proportionalKgSK: 0.001,
    };
    const form = modelForm({ ...content, loops: [loop] });
    expect(form.valid).toBe(true);
    expect(contentOf(form).loops).toEqual([loop]);
    const row = form.controls.loops.at(0);
    row.patchValue({ controlNode: '' });
    expect(errorOf(row)).toBe('the flow can vary: choose the one node it controls');
    row.patchValue({ controlNode: 'battery', path: 'panel: 20\nbox: 3' });
    expect(errorOf(row.controls.path)).toBe('no node is named "box"');
    row.patchValue({ path: 'panel 20' });
    expect(errorOf(row.controls.path)).toBe('each line is "node: UA in W/K" with UA above 0 (got "panel 20")');
  });
});
