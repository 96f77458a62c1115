// The thermal engineer points surfaces beyond the local orbital frame (issue 19 item 1): a plate on a
// Sun-pointing spinner and a plate fixed in inertial space, typed in the surface editor with a
// preview in words; the surfaces table, the environment and the sweep say each surface's pointing.
// Screenshots wide and at 390 px, light and dark. The added surfaces are deleted at the end.
import { expect, test, type Page } from '@playwright/test';
import { dialogReady, screenshot, signIn } from './session';

async function choose(page: Page, selectTestId: string, option: RegExp): Promise<void> {
  await page.getByTestId(selectTestId).click();
  await page.getByRole('option', { name: option }).first().click();
}

async function deleteSurface(page: Page, name: string): Promise<void> {
  const row = page.getByTestId('surface-row').filter({ hasText: name });
  await row.getByRole('button', { name: `Delete ${name}` }).click();
  await dialogReady(page);
  await page.locator('mat-dialog-container').last().getByRole('button', { name: 'Delete' }).click();
  await expect(page.getByTestId('surface-row').filter({ hasText: name })).toHaveCount(0);
}

test('the thermal engineer adds a spinner plate and an inertial plate, and the pages say how each is pointed', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'thermal@kestrel.test');
  await page.getByTestId('mission-filter').fill('imaging');
  await page.getByTestId('mission-row').first().getByRole('link').click();
  await expect(page.getByTestId('orbit-row').first()).toBeVisible();
  await page.getByRole('tab', { name: 'Surfaces' }).click();

  // A drum panel on a spacecraft spinning about the Sun line, its normal 90° from the axis.
  await page.getByTestId('surface-add').click();
  await dialogReady(page);
  await page.getByTestId('surface-name').fill('Safe-mode drum panel');
  await page.getByTestId('surface-area').fill('0.4');
  await choose(page, 'surface-pointing-kind', /spinning body/);
  await choose(page, 'surface-spin-axis', /^The Sun$/);
  await page.getByTestId('surface-spin-angle').fill('190');
  await expect(page.getByTestId('surface-pointing-preview')).toHaveText('The angle from the spin axis is 0 to 180°.');
  await page.getByTestId('surface-spin-angle').fill('90');
  await expect(page.getByTestId('surface-pointing-preview')).toHaveText('Faces: on a body spinning about the Sun, 90° from the spin axis (loads averaged over a turn).');
  await choose(page, 'surface-material', /GaAs/);
  await screenshot(page, 'pointing-editor-spin-1280-light');
  await page.getByTestId('surface-save').click();
  await expect(page.getByTestId('surface-row').filter({ hasText: 'Safe-mode drum panel' })).toContainText('spinning about the Sun');

  // A star-tracker baffle face fixed in inertial space: the declination is checked as it is typed.
  await page.getByTestId('surface-add').click();
  await dialogReady(page);
  await page.getByTestId('surface-name').fill('Tracker baffle');
  await page.getByTestId('surface-area').fill('0.05');
  await choose(page, 'surface-pointing-kind', /inertial space/);
  await page.getByTestId('surface-ra').fill('83.6');
  await page.getByTestId('surface-dec').fill('95');
  await expect(page.getByTestId('surface-pointing-preview')).toHaveText('The declination is -90 to 90°.');
  await page.getByTestId('surface-dec').fill('22');
  await expect(page.getByTestId('surface-pointing-preview')).toContainText('right ascension 83.6°, declination 22°');
  await choose(page, 'surface-material', /black paint/);
  await page.emulateMedia({ colorScheme: 'dark' });
  await screenshot(page, 'pointing-editor-inertial-1280-dark');
  await page.emulateMedia({ colorScheme: 'light' });
  await page.getByTestId('surface-save').click();
  await expect(page.getByTestId('surface-row').filter({ hasText: 'Tracker baffle' })).toContainText('fixed in inertial space');

  // Editing keeps the form: the spinner opens as a spinner.
  await page.getByTestId('surface-row').filter({ hasText: 'Safe-mode drum panel' }).getByRole('button', { name: /edit/i }).click();
  await dialogReady(page);
  await expect(page.getByTestId('surface-pointing-preview')).toContainText('spinning about the Sun, 90°');
  await page.keyboard.press('Escape');

  await page.setViewportSize({ width: 390, height: 844 });
  await screenshot(page, 'pointing-surfaces-390-light');
  await page.emulateMedia({ colorScheme: 'dark' });
  await screenshot(page, 'pointing-surfaces-390-dark');
  await page.emulateMedia({ colorScheme: 'light' });
  await page.setViewportSize({ width: 1280, height: 900 });

  // The environment's averages say each surface's pointing under its name.
  await page.getByRole('tab', { name: 'Environment' }).click();
  const averages = page.getByTestId('result-averages');
  await expect(averages).toBeVisible({ timeout: 60_000 });
  await expect(averages.getByRole('row').filter({ hasText: 'Safe-mode drum panel' }).getByTestId('result-pointing')).toHaveText(/spinning about the Sun/);
  await expect(averages.getByRole('row').filter({ hasText: 'Tracker baffle' })).toContainText('fixed in inertial space');
  await expect(averages).not.toContainText('NaN');
  await averages.scrollIntoViewIfNeeded();
  await screenshot(page, 'pointing-environment-1280-light');
  await page.setViewportSize({ width: 390, height: 844 });
  await averages.scrollIntoViewIfNeeded();
  await screenshot(page, 'pointing-environment-390-light');
  await page.emulateMedia({ colorScheme: 'dark' });
  await screenshot(page, 'pointing-environment-390-dark');
  await page.emulateMedia({ colorScheme: 'light' });
  await page.setViewportSize({ width: 1280, height: 900 });

  // The sweep lists the surfaces with their pointing beside the plot of their loads.
  await page.getByRole('tab', { name: 'Mission sweep' }).click();
  await page.getByTestId('sweep-run').click();
  await expect(page.getByTestId('sweep-done')).toBeVisible({ timeout: 120_000 });
  await expect(page.getByTestId('sweep-pointing')).toContainText('Safe-mode drum panel on a body spinning about the Sun');
  await expect(page.getByTestId('sweep-pointing')).toContainText('Tracker baffle fixed in inertial space');
  await page.getByTestId('sweep-pointing').scrollIntoViewIfNeeded();
  await screenshot(page, 'pointing-sweep-1280-light');
  await page.setViewportSize({ width: 390, height: 844 });
  await page.emulateMedia({ colorScheme: 'dark' });
  await page.getByTestId('sweep-pointing').scrollIntoViewIfNeeded();
  await screenshot(page, 'pointing-sweep-390-dark');
  await page.emulateMedia({ colorScheme: 'light' });
  await page.setViewportSize({ width: 1280, height: 900 });

  await page.getByRole('tab', { name: 'Surfaces' }).click();
  await deleteSurface(page, 'Safe-mode drum panel');
  await deleteSurface(page, 'Tracker baffle');
});
