// The orbit view on a saved orbit's environment: the picture, its scrubber by keyboard, and its
// link both ways with the load plots' read-out cursor; screenshots light and dark, wide and narrow.
import { expect, test, type Page } from '@playwright/test';
import { screenshot, signIn } from './session';

async function openEnvironment(page: Page, filter: string): Promise<void> {
  await page.getByTestId('mission-filter').fill(filter);
  await expect(page.getByTestId('mission-row')).toHaveCount(1);
  await page.getByTestId('mission-row').first().getByRole('link').click();
  await expect(page.getByTestId('orbit-row').first()).toBeVisible();
  await page.getByRole('tab', { name: 'Environment' }).click();
  await expect(page.getByTestId('orbit-view')).toBeVisible();
}

/** Dark at 1440 px, then dark and light at 390 px with the view scrolled into sight. */
async function darkAndNarrow(page: Page, name: string): Promise<void> {
  await page.emulateMedia({ colorScheme: 'dark' });
  await screenshot(page, `${name}-1440-dark`);
  await page.setViewportSize({ width: 390, height: 844 });
  await page.getByTestId('orbit-view').scrollIntoViewIfNeeded();
  await screenshot(page, `${name}-390-dark`);
  await page.emulateMedia({ colorScheme: 'light' });
  await screenshot(page, `${name}-390-light`);
}

const plotReadout = (page: Page) => page.getByTestId('result-flux-plot').locator('.ecl-plot-tooltip-x');

test('the orbit view scrubs the spacecraft and moves the load plots\' cursor, and follows it back', async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 900 });
  await signIn(page, 'analyst@kestrel.test');
  await openEnvironment(page, 'imaging');

  const view = page.getByTestId('orbit-view');
  await expect(view.locator('svg[role="img"]')).toHaveAttribute('aria-label', /^Orbit around Earth seen from above its plane/);
  await expect(page.getByTestId('orbit-view-beta')).toHaveText(/^β = -?\d+\.\d°$/);
  // the plots show no cursor until the scrubber or the pointer moves
  await expect(plotReadout(page)).toHaveCount(0);

  const scrub = page.getByTestId('orbit-view-scrub');
  await scrub.focus();
  await page.keyboard.press('End');
  await expect(page.getByTestId('orbit-view-readout')).not.toContainText(/^\s*0\.0 min/);
  const readout = (await page.getByTestId('orbit-view-readout').textContent()) ?? '';
  const minutes = /^([\d.]+) min after periapsis/.exec(readout.trim())?.[1];
  expect(minutes).toBeTruthy();
  // the plot's cursor reads the same time as the orbit view's spacecraft
  await expect(plotReadout(page)).toBeVisible();
  const plotMinutes = Number(((await plotReadout(page).textContent()) ?? '').replace(/[^\d.]/g, ''));
  expect(Math.abs(plotMinutes - Number(minutes))).toBeLessThan(1);
  const before = await page.getByTestId('orbit-view-craft').getAttribute('cx');
  await page.keyboard.press('Home');
  await expect(plotReadout(page)).toHaveText(/^0 min$/);
  await expect(page.getByTestId('orbit-view-craft')).not.toHaveAttribute('cx', before ?? '');
  await screenshot(page, 'orbit-view-kestrel-1440-light');

  // the reverse: the plot's cursor, moved by keyboard, moves the spacecraft and the scrubber
  const plot = page.getByTestId('result-flux-plot').locator('svg.ecl-plot-svg');
  await plot.focus();
  await page.keyboard.press('End');
  await expect(plotReadout(page)).not.toHaveText('0 min');
  const plotMinutesNow = Number(((await plotReadout(page).textContent()) ?? '').replace(/[^\d.]/g, ''));
  await expect(page.getByTestId('orbit-view-readout')).not.toContainText(/^\s*0\.0 min/);
  const viewMinutes = Number(/^([\d.]+)/.exec(((await page.getByTestId('orbit-view-readout').textContent()) ?? '').trim())?.[1]);
  expect(Math.abs(viewMinutes - plotMinutesNow)).toBeLessThan(1);
  await expect.poll(async () => Number(await scrub.inputValue())).toBeGreaterThan(0);

  await darkAndNarrow(page, 'orbit-view-kestrel');
});

test('about Europa the part of the orbit in Jupiter\'s shadow is drawn in the planet\'s shadow style', async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 900 });
  await signIn(page, 'analyst@kestrel.test');
  await openEnvironment(page, 'Europa');
  await expect(page.getByTestId('orbit-view').locator('path.arc-band[data-kind="parent-shadow"]').first()).toBeVisible();
  await expect(page.getByTestId('orbit-view')).toContainText("In Jupiter's shadow");
  await screenshot(page, 'orbit-view-europa-1440-light');
  await darkAndNarrow(page, 'orbit-view-europa');
});
