import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { MeResponse } from '../../../shared/api/auth';
import { AuthSession } from './auth-session';
import { SignInPage } from './sign-in-page';

async function render(returnUrl?: string) {
  TestBed.configureTestingModule({
    imports: [SignInPage],
    providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])],
  });
  const fixture = TestBed.createComponent(SignInPage);
  if (returnUrl) fixture.componentRef.setInput('returnUrl', returnUrl);
  await fixture.whenStable();
  const element: HTMLElement = fixture.nativeElement;
  const type = (testId: string, value: string) => {
    const input = element.querySelector<HTMLInputElement>(`[data-testid="${testId}"]`);
    if (!input) throw new Error(`no ${testId}`);
    input.value = value;
    input.dispatchEvent(new Event('input'));
  };
  const submit = async () => {
    element.querySelector<HTMLButtonElement>('[data-testid="sign-in-submit"]')?.click();
    await fixture.whenStable();
  };
  return { fixture, element, type, submit, http: TestBed.inject(HttpTestingController) };
}

describe('SignInPage', () => {
  it("shows the server's 401 message inline", async () => {
    const page = await render();
    page.type('sign-in-email', 'analyst@kestrel.test');
    page.type('sign-in-password', 'not the password');
    await page.submit();

    const request = page.http.expectOne('/api/v1/auth/sign-in');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'analyst@kestrel.test', password: 'not the password' });
    request.flush(
      { error: { code: 'unauthorized', message: 'The e-mail address or password is not right.' } },
      { status: 401, statusText: 'Unauthorized' },
    );
    await page.fixture.whenStable();

    expect(page.element.querySelector('[data-testid="sign-in-error"]')?.textContent?.trim()).toBe(
      'The e-mail address or password is not right.',
    );
    expect(TestBed.inject(AuthSession).signedIn()).toBe(false);
    page.http.verify();
  });

  it("shows the server's 429 message when there were too many tries", async () => {
    const page = await render();
    page.type('sign-in-email', 'analyst@kestrel.test');
    page.type('sign-in-password', 'x');
    await page.submit();
    page.http
      .expectOne('/api/v1/auth/sign-in')
      .flush(
        { error: { code: 'too-many-requests', message: 'Too many sign-in attempts; try again in 15 minutes.' } },
        { status: 429, statusText: 'Too Many Requests' },
      );
    await page.fixture.whenStable();
    expect(page.element.querySelector('[role="alert"]')?.textContent).toContain('try again in 15 minutes');
  });

  it('sends nothing while a field is empty', async () => {
    const page = await render();
    page.type('sign-in-email', 'analyst@kestrel.test');
    await page.submit();
    page.http.expectNone('/api/v1/auth/sign-in');
    expect(page.element.textContent).toContain('Enter your password.');
  });

  it('signs in and goes to the return URL, but never to another site', async () => {
    const me: MeResponse = {
      user: { id: 'u-2', email: 'analyst@kestrel.test', name: 'Analyst', isAdmin: false },
      workspaces: [{ workspaceId: 'ws-kestrel', workspaceName: 'Kestrel', role: 'analyst' }],
      auth: { kind: 'session', readOnly: false },
    };
    for (const [returnUrl, expected] of [
      ['/w/ws-kestrel/cases', '/w/ws-kestrel/cases'],
      ['//elsewhere.example/phish', '/'],
    ] as const) {
      TestBed.resetTestingModule();
      const page = await render(returnUrl);
      const navigate = vi.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
      page.type('sign-in-email', 'analyst@kestrel.test');
      page.type('sign-in-password', 'eclipta-demo');
      await page.submit();
      page.http.expectOne('/api/v1/auth/sign-in').flush(me);
      await page.fixture.whenStable();
      expect(navigate).toHaveBeenCalledWith(expected);
      expect(TestBed.inject(AuthSession).user()?.email).toBe('analyst@kestrel.test');
    }
  });
});
