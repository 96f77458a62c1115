// Shared steps of the browser tests: signing in through the real sign-in page.
import { expect, type Browser, type Locator, type Page } from '@playwright/test';

export const demoPassword = process.env['ECLIPTA_DEMO_PASSWORD'] ?? 'eclipta-demo';

export async function signIn(page: Page, email: string, password = demoPassword): Promise<void> {
  await page.goto('/sign-in');
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(password);
  await page.getByTestId('sign-in-submit').click();
  await expect(page.getByTestId('user-menu')).toBeVisible();
}

export async function screenshot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: `tmp/screenshots/${name}.png`, fullPage: true });
}

/**
 * Waits until a dialog that was just opened has taken the focus. Material moves the focus into a
 * dialog once it has opened; a field filled before that can lose its text to the field the
 * dialog focuses (Playwright inserts text where the focus is).
 */
export async function dialogReady(page: Page): Promise<void> {
  await expect(page.locator('mat-dialog-container').last()).toBeVisible();
  await expect(page.locator('mat-dialog-container').last().locator(':focus')).toHaveCount(1);
}

/**
 * Clicks a control that POSTs to a path matching `path` and waits (up to `timeout`) for the answer.
 * A progress bar checked with toBeHidden right after the click can pass before the page has drawn
 * it, that is before the work has begun; the answer is what says the work is done.
 */
export async function clickAndAwaitAnswer(page: Page, control: Locator, path: RegExp, timeout: number): Promise<void> {
  const answered = page.waitForResponse((r) => r.request().method() === 'POST' && path.test(new URL(r.url()).pathname), { timeout });
  await control.click();
  await answered;
}

/** The POST a thermal model run sends (src/app/thermal/thermal-api.ts). */
export const THERMAL_RUN_PATH = /^\/api\/v1\/thermal-models\/[^/]+\/run$/;

/** A new page signed in as `email`. */
export async function as(browser: Browser, email: string): Promise<Page> {
  const page = await browser.newPage();
  await signIn(page, email);
  return page;
}

/** Same-origin API calls with the page's session (the Origin header as the app's own pages send it). */
export function api(page: Page) {
  const origin = new URL(page.url()).origin;
  const headers = { Origin: origin };
  return {
    get: async (path: string) => (await page.request.get(`${origin}/api/v1${path}`, { headers })).json() as Promise<Record<string, unknown>>,
    send: async (method: 'post' | 'patch', path: string, data: object = {}) => {
      const res = await page.request[method](`${origin}/api/v1${path}`, { headers, data });
      expect(res.ok(), await res.text()).toBe(true);
      return (await res.json()) as Record<string, unknown>;
    },
  };
}
