// The two-loop demo model (issue 14): run on the demo hot and cold cases as the thermal engineer;
// each loop's control verdict, the controlled node against its band, the coolant along the path and
// the flow are shown, and the run's CSV carries the loops' columns and figures.
import { readFileSync } from 'node:fs';
import { expect, test, type Page } from '@playwright/test';
import { clickAndAwaitAnswer, screenshot, signIn, THERMAL_RUN_PATH } from './session';

async function runOn(page: Page, kind: RegExp): Promise<void> {
  await page.getByTestId('run-case').click();
  await page.getByRole('option', { name: kind }).first().click();
  await expect(page.getByRole('listbox')).toHaveCount(0);
  await clickAndAwaitAnswer(page, page.getByTestId('run-model'), THERMAL_RUN_PATH, 60_000);
  await expect(page.getByTestId('run-progress')).toBeHidden();
  await expect(page.getByTestId('run-results')).toContainText(kind);
}

test('the two-loop demo holds its set points through eclipse on the hot and cold cases, plotted and exported', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1440, height: 1000 });
  await signIn(page, 'thermal@kestrel.test');
  await page.getByRole('link', { name: 'Thermal models' }).click();
  await page.getByRole('link', { name: 'Kestrel-1 pumped loops, 2 loops' }).click();
  await expect(page.getByTestId('loops-table')).toBeVisible();
  // At 1440 px the loops' many fields wrap as labelled cards: no sideways scroll (nor at 390 px).
  const scrollsSideways = () => page.getByTestId('loops-table').evaluate((t) => t.parentElement!.scrollWidth > t.parentElement!.clientWidth + 1);
  expect(await scrollsSideways()).toBe(false);
  await page.setViewportSize({ width: 390, height: 1000 });
  await expect.poll(scrollsSideways).toBe(false); // once the narrow layout has settled
  await page.setViewportSize({ width: 1440, height: 1000 });
  await expect(page.getByLabel('Path of loop 1, one element per line: node: UA in W/K')).toHaveValue(/heat exchanger: 40\nhull: 3\nhull radiator: 30/);

  for (const kind of [/hot/, /cold/]) {
    await runOn(page, kind);
    const loops = page.getByTestId('loop-results');
    await expect(loops).toHaveCount(2);
    await expect(page.getByTestId('control-verdict')).toHaveText(['PASS ± 0.5 K', 'PASS ± 0.5 K']);
    await expect(loops.first()).toContainText('L/min');
    await expect(page.getByTestId('control-recoveries').first()).toContainText('After eclipse entry');
    await expect(page.getByTestId('loop-heat').first()).toContainText('hull radiator');
    await expect(page.getByTestId('run-results')).not.toContainText('NaN');
    // The loops' plots share the run's time axis: + on the temperature plot zooms them too, 0 shows all again.
    await page.getByTestId('plot-temperature').locator('svg.ecl-plot-svg').focus();
    await page.keyboard.press('Home');
    await page.keyboard.press('+');
    await expect(page.getByTestId('plot-loops').locator('.ecl-plot-zoom-reset')).toBeVisible();
    await expect(loops.first().locator('.ecl-plot-zoom-reset')).toHaveCount(2);
    await page.keyboard.press('0');
    await expect(page.getByTestId('run-results').locator('.ecl-plot-zoom-reset')).toHaveCount(0);
    await screenshot(page, `thermal-loops-${kind.source}`);
    // The page scrolls inside its shell: each loop's figures as an element.
    for (const i of [0, 1]) {
      await loops.nth(i).scrollIntoViewIfNeeded();
      await loops.nth(i).screenshot({ path: `tmp/screenshots/thermal-loops-${kind.source}-loop-${i + 1}.png` });
    }
  }

  const download = page.waitForEvent('download');
  await page.getByTestId('csv-temperatures').click();
  const csv = readFileSync(await (await download).path(), 'utf8');
  expect(csv).toContain('hull loop flow (L/min)');
  expect(csv).toContain('equipment loop coolant leaving power unit (°C)');
  expect(csv).toMatch(/holds power unit at 25 °C ± 0.5 K: largest deviation [\d.]+ K, [\d.]+ s per orbit outside the band: PASS/);
  expect(csv).toContain('Preliminary-design estimate');
});
