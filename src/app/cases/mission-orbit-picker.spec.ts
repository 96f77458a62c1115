// The one mission and orbit picker of the case dialogs: both dialogs now say when the missions could
// not be loaded (one of them used not to) and give the mission's dates under the orbit.
// Common practice, no source.
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { Type } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import { describe, expect, it } from 'vitest';
import type { MissionDetail } from '../../../shared/api/missions';
import { CaseDeriveDialog, type CaseDeriveData } from './case-derive-dialog';
import { CustomCaseDialog } from './custom-case-dialog';
import { orbitHint } from './mission-orbit-picker';

const mission = (orbits: number): MissionDetail =>
  ({ id: 'm1', name: 'Kestrel-1', startDate: '2027-04-01', endDate: '2031-12-31', orbits: Array.from({ length: orbits }, (_, i) => ({ id: `o${i}`, name: `Orbit ${i}` })) }) as unknown as MissionDetail;

describe('orbitHint', () => {
  it("gives the mission's dates, says when it has no orbit or could not be loaded, and nothing before a choice", () => {
    expect(orbitHint({ status: 'ready', value: mission(2) })).toBe('Mission 2027-04-01 to 2031-12-31');
    expect(orbitHint({ status: 'ready', value: mission(0) })).toBe('This mission has no orbit yet.');
    expect(orbitHint({ status: 'failed', message: 'x' })).toBe("The mission's orbits could not be loaded.");
    expect(orbitHint({ status: 'ready', value: null })).toBe('');
    expect(orbitHint({ status: 'loading' })).toBe('');
  });
});

async function open(dialog: Type<unknown>, data: CaseDeriveData) {
  TestBed.configureTestingModule({
    imports: [dialog],
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      { provide: MAT_DIALOG_DATA, useValue: data },
      { provide: MatDialogRef, useValue: { close: () => undefined } },
    ],
  });
  const fixture = TestBed.createComponent(dialog);
  await fixture.whenStable();
  return { fixture, el: fixture.nativeElement as HTMLElement, http: TestBed.inject(HttpTestingController) };
}

describe.each([
  ['derive', CaseDeriveDialog],
  ['custom', CustomCaseDialog],
] as const)('the %s dialog', (prefix, dialog) => {
  it('says when the missions could not be loaded', async () => {
    const { fixture, el, http } = await open(dialog, { workspaceId: 'w1', missionId: null });
    http.expectOne((r) => r.url.endsWith('/missions')).flush({ error: { code: 'x', message: 'down' } }, { status: 503, statusText: 'down' });
    await fixture.whenStable();
    expect(el.querySelector(`[data-testid="${prefix}-mission"]`)).not.toBeNull();
    expect(el.textContent).toContain('The missions could not be loaded.');
  });

  it("shows the chosen mission's dates under its orbit and picks its first orbit", async () => {
    const { fixture, el, http } = await open(dialog, { workspaceId: 'w1', missionId: 'm1' });
    http.expectOne((r) => r.url.endsWith('/missions')).flush({ items: [] });
    http.expectOne((r) => r.url.endsWith('/missions/m1')).flush(mission(2));
    await fixture.whenStable();
    expect(el.textContent).toContain('Mission 2027-04-01 to 2031-12-31');
    expect(el.querySelector(`[data-testid="${prefix}-orbit"]`)?.textContent).toContain('Orbit 0');
  });
});
