// The one pointing editor of the surface and attitude-mode dialogs (issue 19 item 2): a saved
// pointing opens in its own form's fields, the fields read back to the same pointing, and the
// preview says it in words or says what is missing. Common practice, no source.
import { TestBed } from '@angular/core/testing';
import type { SurfaceNormal } from '../../../shared/api/missions';
import { PointingEditor, pointingForm, readPointingForm } from './pointing-editor';

async function render(normal: SurfaceNormal | null, testid = 'mode-0') {
  const form = pointingForm(normal);
  const fixture = TestBed.createComponent(PointingEditor);
  fixture.componentRef.setInput('form', form);
  fixture.componentRef.setInput('testid', testid);
  await fixture.whenStable();
  const element: HTMLElement = fixture.nativeElement;
  const text = (id: string) => element.querySelector(`[data-testid="${testid}-${id}"]`)?.textContent?.trim() ?? null;
  const has = (id: string) => element.querySelector(`[data-testid="${testid}-${id}"]`) !== null;
  return { form, fixture, text, has };
}

describe('PointingEditor', () => {
  const saved: SurfaceNormal[] = [
    'nadir',
    'sun',
    { x: 0, y: 0.6, z: 0.8 },
    { inertial: { raDeg: 83.6, decDeg: 22 } },
    { trackSun: { axis: 'orbit-normal' } },
    { trackSun: { axis: 'both' } },
    { spin: { axis: 'sun', angleDeg: 90 } },
    { spin: { axis: { inertial: { raDeg: 10, decDeg: -30 } }, angleDeg: 45 } },
    { yawSteered: { normal: 'anti-orbit-normal' } },
  ];
  for (const normal of saved) {
    it(`reads ${JSON.stringify(normal)} back as it was saved`, () => {
      expect(readPointingForm(pointingForm(normal))).toEqual({ ok: true, normal });
    });
  }

  it('shows the spin fields for a spinner and says the pointing in words', async () => {
    const { text, has } = await render({ spin: { axis: 'sun', angleDeg: 90 } });
    expect(has('spin-axis')).toBe(true);
    expect(has('spin-angle')).toBe(true);
    expect(has('ra')).toBe(false);
    expect(text('pointing-preview')).toBe('Faces: on a body spinning about the Sun, 90° from the spin axis (loads averaged over a turn).');
  });

  it('follows a change of the fields: an angle out of range is said, not saved', async () => {
    const { form, fixture, text } = await render({ spin: { axis: 'sun', angleDeg: 90 } });
    form.controls.angleDeg.setValue('190');
    await fixture.whenStable();
    expect(text('pointing-preview')).toBe('The angle from the spin axis is 0 to 180°.');
    expect(readPointingForm(form).ok).toBe(false);
  });

  it('asks for right ascension and declination when the kind turns to inertial', async () => {
    const { form, fixture, has, text } = await render('nadir');
    expect(has('ra')).toBe(false);
    form.controls.kind.setValue('inertial');
    form.controls.decDeg.setValue('95');
    await fixture.whenStable();
    expect(has('ra')).toBe(true);
    expect(text('pointing-preview')).toBe('The declination is -90 to 90°.');
  });

  it('says when a custom direction was scaled to length 1', async () => {
    const { form, fixture, text } = await render({ x: 1, y: 0, z: 1 });
    await fixture.whenStable();
    expect(text('normal-note')).toBe('Length 1.414 scaled to 1: saved as (0.707, 0, 0.707).');
    form.controls.x.setValue(0);
    form.controls.z.setValue(0);
    await fixture.whenStable();
    expect(text('pointing-preview')).toBe('Give the direction: at least one of x, y and z must not be 0.');
  });
});
