import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { LabelledField } from './labelled-field';

// Common practice, no source: what a typed field must keep when it moves into a shared component.
@Component({
  imports: [ReactiveFormsModule, LabelledField],
  template: `
    <form [formGroup]="form">
      <ecl-field [control]="form.controls.gm" kind="number" label="GM" unit="km³/s²" testid="gm" errorTestid="gm-error" error="give the GM" />
      <ecl-field [control]="form.controls.start" kind="date" label="Start (UTC date)" testid="start" />
      <ecl-field [control]="form.controls.radius" label="Radius" unit="km" hint="= 6378 km" testid="radius" hintTestid="radius-hint" />
    </form>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly form = new FormGroup({
    gm: new FormControl<number | null>(null, Validators.required),
    start: new FormControl('', { nonNullable: true }),
    radius: new FormControl('', { nonNullable: true }),
  });
}

async function render() {
  const fixture = TestBed.createComponent(Host);
  await fixture.whenStable();
  const element: HTMLElement = fixture.nativeElement;
  const input = (testid: string) => element.querySelector<HTMLInputElement>(`[data-testid="${testid}"]`)!;
  return { fixture, element, input };
}

describe('LabelledField', () => {
  it('keeps a number field a number (the number value accessor), and a typed field its text', async () => {
    const { fixture, input } = await render();
    input('gm').value = '398600.4';
    input('gm').dispatchEvent(new Event('input'));
    input('radius').value = '6378 km';
    input('radius').dispatchEvent(new Event('input'));
    expect(fixture.componentInstance.form.getRawValue()).toEqual({ gm: 398600.4, start: '', radius: '6378 km' });
  });

  it('gives a date field the numeric keys and the YYYY-MM-DD pattern', async () => {
    const { input } = await render();
    expect(input('start').getAttribute('inputmode')).toBe('numeric');
    expect(input('start').getAttribute('placeholder')).toBe('YYYY-MM-DD');
  });

  it('shows its unit and hint, and its error line once the invalid field is touched', async () => {
    const { fixture, element } = await render();
    expect(element.textContent).toContain('km³/s²');
    expect(element.querySelector('[data-testid="radius-hint"]')?.textContent?.trim()).toBe('= 6378 km');
    expect(element.querySelector('[data-testid="gm-error"]')).toBeNull();
    fixture.componentInstance.form.controls.gm.markAsTouched();
    fixture.componentInstance.form.updateValueAndValidity();
    fixture.changeDetectorRef.markForCheck();
    await fixture.whenStable();
    expect(element.querySelector('[data-testid="gm-error"]')?.textContent?.trim()).toBe('give the GM');
  });
});
