import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ApplicationRef, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { CaseStatus } from '../../../shared/api/case-content';
import type { CaseActionName, CaseDetail } from '../../../shared/api/cases';
import type { Role } from '../../../shared/api/workspaces';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { CasePage } from './case-page';
import { sampleCase } from './sample-case';

async function render(role: Role, status: CaseStatus, actions: CaseActionName[] = [], more: Partial<CaseDetail> = {}) {
  TestBed.configureTestingModule({
    imports: [CasePage],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: CurrentWorkspace, useValue: { role: signal(role) } }],
  });
  const fixture = TestBed.createComponent(CasePage);
  fixture.componentRef.setInput('workspaceId', 'ws-1');
  fixture.componentRef.setInput('caseId', 'case-1');
  await fixture.whenStable();
  const http = TestBed.inject(HttpTestingController);
  http.expectOne('/api/v1/cases/case-1').flush(sampleCase({ status, actions, checksum: status === 'draft' ? null : 'cd'.repeat(32), ...more }));
  await fixture.whenStable();
  const element: HTMLElement = fixture.nativeElement;
  const has = (testId: string) => element.querySelector(`[data-testid="${testId}"]`) !== null;
  return { element, has, http };
}

describe('CasePage', () => {
  it('gives a viewer no way to change a released case, but the exports and the subscription', async () => {
    const page = await render('viewer', 'released');
    for (const action of ['case-edit', 'case-submit', 'case-release', 'case-new-revision']) expect(page.has(action)).toBe(false);
    expect(page.element.querySelector('[data-testid="export-json"]')?.getAttribute('href')).toBe('/api/v1/cases/case-1/export?format=json');
    expect(page.element.querySelector('[data-testid="export-csv"]')?.getAttribute('download')).toBe('operational-hot-rev1.csv');
    expect(page.has('case-subscribe')).toBe(true);
    expect(page.element.querySelector('[data-testid="case-checksum"]')?.textContent?.trim()).toBe('cd'.repeat(32));
  });

  it('offers a thermal engineer edit and submit on a draft, and shows the rationale and the caution', async () => {
    const page = await render('thermal', 'draft', ['edit', 'submit', 'comment']);
    expect(page.has('case-edit')).toBe(true);
    expect(page.has('case-submit')).toBe(true);
    expect(page.has('case-release')).toBe(false);
    expect(page.element.querySelector('[data-testid="case-rationale"]')?.textContent).toContain('Perihelion Sun drove it');
    expect(page.element.querySelector('ecl-design-caution')).not.toBeNull();
  });

  it('shows the author of a case in review no release and no return, only the comment box (four eyes)', async () => {
    const page = await render('thermal', 'review', ['comment']);
    expect(page.has('case-release')).toBe(false);
    expect(page.has('case-return')).toBe(false);
    expect(page.has('case-comment-text')).toBe(true);
  });

  it('says why a new revision cannot be computed again when the ephemeris is gone, and offers no such choice', async () => {
    const why = 'The ephemeris "Launch-provider trajectory" this case was computed along was deleted from the mission: a new revision can keep its stored inputs and loads only.';
    const page = await render('thermal', 'released', ['newRevision'], { inputChanges: ['ephemeris "Launch-provider trajectory" was deleted'], currentInputsBlocked: why });
    expect(page.element.querySelector('[data-testid="case-stale"]')?.textContent).toContain('ephemeris "Launch-provider trajectory" was deleted');
    (page.element.querySelector('[data-testid="case-revise-current"]') as HTMLButtonElement).click();
    await TestBed.inject(ApplicationRef).whenStable();
    expect(page.element.querySelector('[data-testid="case-revision-blocked"]')?.textContent?.trim()).toBe(why);
    expect(page.has('case-revision-current')).toBe(false);
  });

  it('offers a custom case to be computed again on its date with the current surfaces', async () => {
    const page = await render('thermal', 'released', ['newRevision'], { kind: 'custom', inputChanges: ['surface "Radiator" area: 0.5 m² -> 0.8 m²'] });
    (page.element.querySelector('[data-testid="case-revise-current"]') as HTMLButtonElement).click();
    await TestBed.inject(ApplicationRef).whenStable();
    const choice = page.element.querySelector('[data-testid="case-revision-current"]');
    expect(choice?.textContent).toContain('same date and fixed values');
    expect(choice?.querySelector('input')?.checked).toBe(true);
  });
});
