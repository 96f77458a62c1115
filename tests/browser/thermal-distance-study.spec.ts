// The distance study (issue 14 item 3) on the two-loop demo model as the thermal engineer: the Sun
// at Venus, Earth and Mars distances and Earth's perihelion and aphelion; progress, then the flow and
// radiator plots, the table (radiator area shrinking with distance) and the CSV with the caution.
import { readFileSync } from 'node:fs';
import { expect, test } from '@playwright/test';
import { screenshot, signIn } from './session';

test('the two-loop demo\'s pump flow and radiator area against the distance from the Sun, tabled and exported', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1400, height: 1000 });
  await signIn(page, 'thermal@kestrel.test');
  await page.getByRole('link', { name: 'Thermal models' }).click();
  await page.getByRole('link', { name: 'Kestrel-1 pumped loops, 2 loops' }).click();
  await expect(page.getByRole('heading', { name: 'Distance study' })).toBeVisible();
  await page.getByTestId('study-distances').fill('0.72, 1, 1.52');
  await page.getByTestId('study-run').click();
  // Every distance's row, waited for as long as the study may take; the Stop button hidden right
  // after the click alone could pass before the page has drawn it, before the study has begun.
  const rows = page.getByTestId('study-table').locator('tbody tr');
  await expect(rows).toHaveCount(5, { timeout: 120_000 });
  await expect(page.getByTestId('study-stop')).toBeHidden();
  await expect(page.getByTestId('study-error')).toHaveCount(0);
  await expect(rows.first()).toContainText('0.720');
  await expect(page.getByTestId('study-table')).toContainText('hull loop flow');
  await expect(page.getByTestId('study-results')).not.toContainText('NaN');
  await expect(page.getByTestId('study-table')).not.toContainText('NaN');
  // Radiator area (the last column) shrinks as the Sun moves away (radiator equation, Gilmore).
  const areas = (await rows.locator('td:last-child').allInnerTexts()).map((t) => Number(t.replace(/[^\d.]/g, '')));
  expect(areas[0]).toBeGreaterThan(areas.at(-1) ?? Infinity);
  await page.getByTestId('study-table').scrollIntoViewIfNeeded();
  await screenshot(page, 'thermal-distance-study');

  const download = page.waitForEvent('download');
  await page.getByTestId('study-csv').click();
  const csv = readFileSync(await (await download).path(), 'utf8');
  expect(csv).toContain('Distance (AU)');
  expect(csv).toContain('hull loop flow, average (L/min)');
  expect(csv).toContain('Preliminary-design estimate');

  await page.setViewportSize({ width: 390, height: 900 });
  await screenshot(page, 'thermal-distance-study-390');
});
