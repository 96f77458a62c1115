// Shared steps of the browser tests: signing in through the real sign-in page.
import { expect, type Page } from '@playwright/test';

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
