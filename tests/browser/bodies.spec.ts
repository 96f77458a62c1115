// A workspace's own bodies as their users meet them: a thermal engineer adds an invented asteroid
// with typed units, is told which field is wrong and why, saves it, sees it in the list and offered
// as a mission's central body; a viewer reads the list but cannot change it. Screenshots in light
// and dark, at 1440 and 390 px (tmp/screenshots/bodies-*.png).
import { expect, test } from '@playwright/test';
import { screenshot, signIn } from './session';

test('a thermal engineer adds a body with typed units and named field messages; a viewer reads it', async ({ page }) => {
  await signIn(page, 'thermal@kestrel.test');
  await page.getByTestId('nav-bodies').click();
  await expect(page.getByRole('heading', { name: 'Bodies', exact: true })).toBeVisible();
  await page.getByTestId('body-add').click();
  await page.getByTestId('body-name').fill('Invented asteroid');
  await page.getByTestId('body-gm').fill('0.45');
  await page.getByTestId('body-radius').fill('75 mi');
  // the radius typed in miles is previewed in km (1 mi = 1.609344 km)
  await expect(page.getByText('= 120.701 km')).toBeVisible();
  await page.getByTestId('body-minAu').fill('2.4');
  await page.getByTestId('body-meanAu').fill('2.6');
  await page.getByTestId('body-maxAu').fill('2.8');
  for (const [end, albedo, olr] of [['min', '0.05', '30'], ['nominal', '1.4', '45'], ['max', '0.1', '50']] as const) {
    await page.getByTestId(`body-albedo-${end}`).fill(albedo);
    await page.getByTestId(`body-olrWm2-${end}`).fill(olr);
  }
  await page.getByTestId('body-airless').click();
  for (const [end, emissivity, floor] of [['min', '0.9', '60'], ['nominal', '0.95', '70'], ['max', '0.97', '80']] as const) {
    await page.getByTestId(`body-emissivity-${end}`).fill(emissivity);
    await page.getByTestId(`body-nightFloorK-${end}`).fill(floor);
  }
  await page.getByTestId('body-save').click();
  // the field and the limit it broke, in words
  await expect(page.getByText('nominal bond albedo must be at most 1')).toBeVisible();
  await screenshot(page, 'bodies-field-message');
  await page.getByTestId('body-albedo-nominal').fill('0.08');
  await page.getByTestId('body-save').click();
  await expect(page.getByText('Body "Invented asteroid" saved.')).toBeVisible();
  const row = page.getByTestId('body-row').filter({ hasText: 'Invented asteroid' });
  await expect(row).toContainText('airless');
  await expect(row).toContainText('about the Sun, 2.4–2.8 AU');
  await expect(row).toContainText('radius 120.701 km');
  await screenshot(page, 'bodies-list');
  await page.emulateMedia({ colorScheme: 'dark' });
  await page.setViewportSize({ width: 390, height: 844 });
  await screenshot(page, 'bodies-390-dark');
  await page.getByTestId('body-add').click();
  await screenshot(page, 'bodies-390-dark-form');
  await page.emulateMedia({ colorScheme: 'light' });
  await page.setViewportSize({ width: 1440, height: 900 });

  // offered as the central body of a new mission
  await page.getByTestId('nav-missions').click();
  await page.getByRole('button', { name: /new mission/i }).first().click();
  await page.getByTestId('mission-body').click();
  await expect(page.getByRole('option', { name: /Invented asteroid \(the workspace’s own body\)/ })).toHaveCount(1);
  await page.getByRole('option', { name: /Invented asteroid/ }).click();
  await page.getByTestId('mission-name').fill('Asteroid flyer');
  await page.getByTestId('mission-start').fill('2030-01-01');
  await page.getByTestId('mission-end').fill('2030-12-31');
  await page.getByTestId('mission-save').click();
  await expect(page.locator('mat-dialog-container')).toHaveCount(0);
  await expect(page.getByRole('heading', { name: 'Asteroid flyer' })).toBeVisible();
  await expect(page.getByText('Invented asteroid').first()).toBeVisible();
  await screenshot(page, 'bodies-mission-page');
  // the mission names its body as the workspace entered it
  await page.getByTestId('nav-missions').click();
  await expect(page.getByRole('row').filter({ hasText: 'Asteroid flyer' })).toContainText('Invented asteroid');

  await page.getByTestId('user-menu').click();
  await page.getByTestId('sign-out').click();
  await signIn(page, 'viewer@kestrel.test');
  await page.getByTestId('nav-bodies').click();
  await expect(page.getByTestId('body-row')).toHaveCount(1);
  await expect(page.getByText('you can read them')).toBeVisible();
  await expect(page.getByTestId('body-add')).toHaveCount(0);
});
