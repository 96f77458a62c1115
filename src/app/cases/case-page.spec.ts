import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { CaseStatus } from '../../../shared/api/case-content';
import type { CaseActionName } from '../../../shared/api/cases';
import type { Role } from '../../../shared/api/workspaces';
import { CurrentWorkspace } from '../workspace/current-workspace';
import { CasePage } from './case-page';
import { sampleCase } from './sample-case';

async function render(role: Role, status: CaseStatus, actions: CaseActionName[] = []) {
  TestBed.configureTestingModule({
    imports: [CasePage],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: CurrentWorkspace, useValue: { role: signal(role) } }],
  });
  const fixture = TestBed.createComponent(CasePage);
  fixture.componentRef.setInput('workspaceId', 'ws-1');
  fixture.componentRef.setInput('caseId', 'case-1');
  await fixture.whenStable();
  const http = TestBed.inject(HttpTestingController);
  http.expectOne('/api/v1/cases/case-1').flush(sampleCase({ status, actions, checksum: status === 'draft' ? null : 'cd'.repeat(32) }));
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
});
