// The one submit of the form dialogs (issue 18: four copies had drifted; two left the form editable
// while busy). Common practice, no source.
import { HttpErrorResponse } from '@angular/common/http';
import { FormControl, FormGroup, FormGroupDirective, Validators } from '@angular/forms';
import { Subject } from 'rxjs';
import { describe, expect, it } from 'vitest';
import { DialogSubmit, pageSubmit, refusalDetails } from './dialog-submit';

function setUp() {
  const form = new FormGroup({ name: new FormControl('', { nonNullable: true, validators: Validators.required }) });
  const closed: string[] = [];
  const submit = new DialogSubmit<string>({ close: (v?: string) => closed.push(v ?? '') }, form);
  return { form, closed, submit };
}

const refusal = new HttpErrorResponse({ status: 409, error: { error: { code: 'conflict', message: 'the draft changed since you opened it' } } });

describe('DialogSubmit', () => {
  it('sends nothing for an invalid form and shows its errors', () => {
    const { form, submit } = setUp();
    let built = 0;
    submit.submit(() => {
      built++;
      return new Subject<string>();
    });
    expect(built).toBe(0);
    expect(form.controls.name.touched).toBe(true);
    expect(submit.busy()).toBe(false);
  });

  it('disables the form while the request runs and closes with the answer', () => {
    const { form, closed, submit } = setUp();
    form.controls.name.setValue('Hot case');
    const answer = new Subject<string>();
    let sentName = '';
    submit.submit(() => {
      // the request is built from the values as typed, before the form is disabled
      sentName = form.getRawValue().name;
      expect(form.disabled).toBe(false);
      return answer;
    });
    expect(sentName).toBe('Hot case');
    expect(submit.busy()).toBe(true);
    expect(form.disabled).toBe(true);
    answer.next('saved');
    expect(closed).toEqual(['saved']);
  });

  it("on a refusal enables the form again, shows the server's message and tells the dialog", () => {
    const { form, closed, submit } = setUp();
    form.controls.name.setValue('Hot case');
    const answer = new Subject<string>();
    const heard: unknown[] = [];
    submit.submit(() => answer, (failure) => {
      heard.push(failure);
    });
    answer.error(refusal);
    expect(closed).toEqual([]);
    expect(submit.busy()).toBe(false);
    expect(form.enabled).toBe(true);
    expect(submit.failure()).toBe('the draft changed since you opened it');
    expect(heard).toEqual([refusal]);
    // the next attempt clears the old message
    submit.submit(() => new Subject<string>());
    expect(submit.failure()).toBeNull();
  });

  it('leaves the general message out when the dialog placed every detail beside its field, and sends nothing for a null request', () => {
    const { form, submit } = setUp();
    form.controls.name.setValue('Radiator');
    const answer = new Subject<string>();
    const detailed = new HttpErrorResponse({
      status: 400,
      error: { error: { code: 'invalid', message: 'name: already taken', details: [{ path: 'name', message: 'already taken' }] } },
    });
    let details: unknown = null;
    submit.submit(() => answer, (failure) => {
      details = refusalDetails(failure);
      return 'placed';
    });
    answer.error(detailed);
    expect(details).toEqual([{ path: 'name', message: 'already taken' }]);
    expect(submit.failure()).toBeNull();
    expect(form.enabled).toBe(true);
    submit.submit(() => null);
    expect(submit.busy()).toBe(false);
    expect(refusalDetails(new Error('not an answer'))).toEqual([]);
  });

  it('send() skips the form check (reloading what the server holds)', () => {
    const { closed, submit } = setUp();
    const answer = new Subject<string>();
    submit.send(answer);
    expect(submit.busy()).toBe(true);
    answer.next('latest');
    expect(closed).toEqual(['latest']);
  });

  it('pageSubmit: the answer readies the form for the next one, emptied and not shown as submitted, and goes to the page', () => {
    const form = new FormGroup({ name: new FormControl('', { nonNullable: true, validators: Validators.required }) });
    const directive = new FormGroupDirective([], []);
    directive.form = form;
    const made: string[] = [];
    const submit = pageSubmit<string>(form, () => directive, (answer) => made.push(answer));
    form.controls.name.setValue('power budget import');
    directive.onSubmit(new Event('submit'));
    const answer = new Subject<string>();
    submit.submit(() => answer);
    expect(directive.submitted).toBe(true);
    expect(form.disabled).toBe(true);
    answer.next('made');
    expect(made).toEqual(['made']);
    expect(submit.busy()).toBe(false);
    expect(form.enabled).toBe(true);
    // the emptied name is invalid, but neither touched nor submitted: no red error under it
    expect(form.controls.name.value).toBe('');
    expect(form.controls.name.invalid).toBe(true);
    expect(form.controls.name.touched).toBe(false);
    expect(directive.submitted).toBe(false);
  });

  it('pageSubmit: a refusal keeps what was typed and shows the message; nothing reaches the page', () => {
    const form = new FormGroup({ name: new FormControl('', { nonNullable: true, validators: Validators.required }) });
    const made: string[] = [];
    const submit = pageSubmit<string>(form, () => undefined, (answer) => made.push(answer));
    form.controls.name.setValue('ci@kestrel.test');
    const answer = new Subject<string>();
    submit.submit(() => answer);
    answer.error(refusal);
    expect(made).toEqual([]);
    expect(form.enabled).toBe(true);
    expect(form.controls.name.value).toBe('ci@kestrel.test');
    expect(submit.failure()).toBe('the draft changed since you opened it');
  });
});
