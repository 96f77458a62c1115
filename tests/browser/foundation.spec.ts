// The foundation as its users meet it: each demo role signs in and sees its own navigation, a wrong
// password is explained, and a password reset works end to end through the local SMTP fake.
import { expect, test } from '@playwright/test';
import { screenshot, signIn } from './session';

const navigationByRole = [
  { email: 'owner@kestrel.test', role: 'owner', label: 'Owner', shows: ['missions', 'overview', 'cases', 'thermal', 'members', 'audit', 'tokens', 'mail'], hides: [] },
  { email: 'analyst@kestrel.test', role: 'analyst', label: 'Mission analyst', shows: ['overview', 'cases', 'tokens'], hides: ['thermal', 'members', 'audit', 'mail'] },
  { email: 'thermal@kestrel.test', role: 'thermal', label: 'Thermal engineer', shows: ['overview', 'cases', 'thermal', 'tokens'], hides: ['members', 'audit', 'mail'] },
  { email: 'viewer@kestrel.test', role: 'viewer', label: 'Viewer', shows: ['overview', 'cases', 'tokens'], hides: ['thermal', 'members', 'audit', 'mail'] },
];

for (const { email, role, label, shows, hides } of navigationByRole) {
  test(`${role} signs in and sees the ${role}'s navigation`, async ({ page }) => {
    await signIn(page, email);
    await page.getByTestId('nav-overview').click(); // "/" lands on the missions list
    // The role in words (roleLabels), never its identifier.
    await expect(page.getByTestId('overview-role')).toHaveText(label);
    for (const id of shows) await expect(page.getByTestId(`nav-${id}`)).toBeVisible();
    for (const id of hides) await expect(page.getByTestId(`nav-${id}`)).toHaveCount(0);
    await screenshot(page, `signed-in-${role}`);
  });
}

test('a member of another workspace does not see Kestrel', async ({ page }) => {
  await signIn(page, 'owner@plover.test');
  await page.getByTestId('nav-overview').click();
  await expect(page.getByTestId('overview-title')).toContainText('Plover');
  await page.getByTestId('workspace-switcher').click();
  await expect(page.getByRole('option', { name: /Kestrel/ })).toHaveCount(0);
});

test('a wrong password shows the sign-in message', async ({ page }) => {
  await page.goto('/sign-in');
  await page.getByTestId('sign-in-email').fill('analyst@kestrel.test');
  await page.getByTestId('sign-in-password').fill('not-the-password');
  await page.getByTestId('sign-in-submit').click();
  await expect(page.getByTestId('sign-in-error')).toHaveText(/e-mail address or password is not right/);
  await screenshot(page, 'sign-in-wrong-password');
});

test('a password reset by e-mail works end to end', async ({ browser }) => {
  const newPassword = 'plover-new-password-1';

  const requester = await browser.newPage();
  await requester.goto('/reset-password');
  await requester.getByTestId('reset-email').fill('owner@plover.test');
  await requester.getByRole('button', { name: /send/i }).click();
  await expect(requester.getByTestId('reset-sent')).toBeVisible();

  // The instance administrator reads what the local SMTP fake received.
  const admin = await browser.newPage();
  await signIn(admin, 'owner@kestrel.test');
  await admin.getByTestId('nav-mail').click();
  const message = admin.getByTestId('mail-row').filter({ hasText: 'owner@plover.test' }).first();
  await message.getByRole('button').click();
  const body = admin.getByTestId('mail-body');
  await expect(body).toContainText('/reset-password/');
  await screenshot(admin, 'mail-outbox-reset');
  const link = await body.getByRole('link', { name: /reset-password/ }).first().getAttribute('href');
  expect(link).toMatch(/\/reset-password\/[A-Za-z0-9_-]+$/);

  await requester.goto(new URL(link as string).pathname);
  const passwords = requester.locator('input[type="password"]');
  await passwords.nth(0).fill(newPassword);
  await passwords.nth(1).fill(newPassword);
  await requester.getByRole('button', { name: /set|save|change/i }).click();
  await expect(requester.getByTestId('reset-done-sign-in')).toBeVisible();

  await signIn(requester, 'owner@plover.test', newPassword);
  await requester.getByTestId('nav-overview').click();
  await expect(requester.getByTestId('overview-title')).toContainText('Plover');
});
