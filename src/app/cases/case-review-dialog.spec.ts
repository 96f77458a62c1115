import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MAT_DIALOG_DATA, MatDialogRef } from '@angular/material/dialog';
import type { CaseDetail } from '../../../shared/api/cases';
import { CaseReviewDialog, type CaseReviewData } from './case-review-dialog';
import { sampleCase } from './sample-case';

async function render(step: CaseReviewData['step'], loadCase: CaseDetail) {
  const closed: (CaseDetail | undefined)[] = [];
  TestBed.configureTestingModule({
    imports: [CaseReviewDialog],
    providers: [
      provideHttpClient(),
      provideHttpClientTesting(),
      { provide: MAT_DIALOG_DATA, useValue: { step, loadCase } satisfies CaseReviewData },
      { provide: MatDialogRef, useValue: { close: (value?: CaseDetail) => closed.push(value) } },
    ],
  });
  const fixture = TestBed.createComponent(CaseReviewDialog);
  await fixture.whenStable();
  const element: HTMLElement = fixture.nativeElement;
  const click = async (testId: string) => {
    const button = element.querySelector<HTMLButtonElement>(`[data-testid="${testId}"]`);
    if (!button) throw new Error(`no ${testId}`);
    button.click();
    await fixture.whenStable();
  };
  const text = (testId: string) => element.querySelector(`[data-testid="${testId}"]`)?.textContent?.trim() ?? null;
  return { fixture, element, click, text, closed, http: TestBed.inject(HttpTestingController) };
}

describe('CaseReviewDialog', () => {
  const inReview = sampleCase({ status: 'review' });
  const fourEyes = 'You wrote this revision; another thermal engineer or owner must release it.';

  it("shows the server's four-eyes 403 as it words it and stays open", async () => {
    const dialog = await render('release', inReview);
    expect(dialog.text('review-summary')).toContain(inReview.name);

    await dialog.click('review-confirm');
    const request = dialog.http.expectOne(`/api/v1/cases/${inReview.id}/release`);
    expect(request.request.method).toBe('POST');
    request.flush({ error: { code: 'forbidden', message: fourEyes } }, { status: 403, statusText: 'Forbidden' });
    await dialog.fixture.whenStable();

    expect(dialog.text('review-error')).toBe(fourEyes);
    expect(dialog.element.querySelector('[data-testid="review-error"]')?.getAttribute('role')).toBe('alert');
    expect(dialog.closed).toEqual([]);
    expect(dialog.text('release-done')).toBeNull();
    dialog.http.verify();
  });

  it('shows the checksum the release was given before closing with the released case', async () => {
    const dialog = await render('release', inReview);
    await dialog.click('review-confirm');
    const released = { ...inReview, status: 'released' as const, checksum: 'ab'.repeat(32), releasedAt: '2027-05-02T10:00:00.000Z', releasedBy: { id: 'u2', name: 'Owner', email: 'owner@kestrel.test' } };
    dialog.http.expectOne(`/api/v1/cases/${inReview.id}/release`).flush(released);
    await dialog.fixture.whenStable();

    expect(dialog.text('release-checksum')).toBe('ab'.repeat(32));
    expect(dialog.closed).toEqual([]);
    await dialog.click('release-close');
    expect(dialog.closed).toEqual([released]);
  });

  it('submits a draft for review and closes with the answer', async () => {
    const draft = sampleCase({ status: 'draft' });
    const dialog = await render('submit', draft);
    await dialog.click('review-confirm');
    const request = dialog.http.expectOne(`/api/v1/cases/${draft.id}/submit`);
    request.flush({ ...draft, status: 'review' });
    await dialog.fixture.whenStable();
    expect(dialog.closed.map((c) => c?.status)).toEqual(['review']);
  });
});
