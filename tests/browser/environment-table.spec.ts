// A workspace's environment table as its users meet it: a thermal engineer enters a row with its
// source and saves it, a viewer reads it but cannot change it; and the lunar orbiter's environment
// page says its planetary IR comes from the Moon's surface temperatures (the values are invented).
import { expect, test } from '@playwright/test';
import { screenshot, signIn } from './session';

test('a thermal engineer saves a row of the environment table; a viewer reads it', async ({ page }) => {
  await signIn(page, 'thermal@kestrel.test');
  await page.getByTestId('nav-environment').click();
  await expect(page.getByRole('heading', { name: 'Environment table' })).toBeVisible();
  await page.getByTestId('environment-add').click();
  const row = page.getByTestId('environment-row').first();
  await row.getByLabel('Inclination from (°)').fill('60');
  await row.getByLabel('to (°)').fill('90');
  await row.getByLabel('Averaging time (s)').fill('896');
  await row.getByLabel('Hot albedo').fill('0.31');
  await row.getByLabel('Hot OLR (W/m²)').fill('262');
  await row.getByLabel('Cold albedo').fill('0.18');
  await row.getByLabel('Cold OLR (W/m²)').fill('190');
  await row.getByLabel('Source').fill('team transcription, invented for the test');
  await page.getByTestId('environment-save').click();
  await expect(page.getByText('Environment table saved: 1 row(s).')).toBeVisible();
  await screenshot(page, 'environment-table-saved');

  await page.getByTestId('user-menu').click();
  await page.getByTestId('sign-out').click();
  await signIn(page, 'viewer@kestrel.test');
  await page.getByTestId('nav-environment').click();
  await expect(page.getByTestId('environment-row')).toHaveCount(1);
  await expect(page.getByTestId('environment-row').getByLabel('Source')).toHaveValue('team transcription, invented for the test');
  await expect(page.getByTestId('environment-row').getByLabel('Source')).toBeDisabled();
  await expect(page.getByTestId('environment-save')).toHaveCount(0);
});

test("the lunar orbiter's environment shows the ground's day and night temperatures and the albedo integral", async ({ page }) => {
  await signIn(page, 'thermal@kestrel.test');
  await page.getByTestId('nav-missions').click();
  await page.getByText('Kestrel Lunar pathfinder').first().click();
  await page.getByRole('tab', { name: 'Environment' }).click();
  // about 390 K under the Sun and 100 K at night (LRO Diviner, Williams et al. 2017; from memory)
  await expect(page.getByTestId('result-surface-field')).toContainText(/3[89]\d K \/ 100 K/);
  await expect(page.getByTestId('result-albedo-model')).toContainText('Lambertian');
  await screenshot(page, 'lunar-environment');
});
