// The analyst's path through missions: a new mission from nothing, an orbit typed with units, two
// surfaces, the environment with its plots and CSV, and the mission sweep streamed day by day.
import { readFile } from 'node:fs/promises';
import { expect, test, type Page } from '@playwright/test';
import { dialogReady, screenshot, signIn } from './session';

async function chooseOption(page: Page, selectTestId: string, option: RegExp | string): Promise<void> {
  await page.getByTestId(selectTestId).click();
  await page.getByRole('option', { name: option }).first().click();
}

async function addSurface(page: Page, name: string, area: string, faces: RegExp): Promise<void> {
  await page.getByTestId('surface-add').click();
  await dialogReady(page);
  await page.getByTestId('surface-name').fill(name);
  await page.getByTestId('surface-area').fill(area);
  await chooseOption(page, 'surface-normal', faces);
  await page.getByTestId('surface-material').click();
  await page.getByRole('option').first().click();
  await expect(page.getByTestId('surface-material-facts')).toContainText('Source');
  await page.getByTestId('surface-save').click();
  await expect(page.getByTestId('surface-row').filter({ hasText: name })).toBeVisible();
}

test('the analyst creates a mission, an orbit and surfaces, and reads the environment and the sweep', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'analyst@kestrel.test');

  // "/" lands on the missions list, with the seeded demo missions.
  await expect(page.getByRole('heading', { name: 'Missions' })).toBeVisible();
  await expect(page.getByTestId('mission-row').first()).toBeVisible();
  await screenshot(page, 'missions-list');

  const name = `Heron test ${Date.now()}`;
  await page.getByTestId('mission-new').click();
  await dialogReady(page);
  await page.getByTestId('mission-name').fill(name);
  await page.getByTestId('mission-start').fill('2027-03-20');
  await page.getByTestId('mission-end').fill('2027-05-20');
  await page.getByTestId('mission-description').fill('Browser test: a small Earth observer.');
  await page.getByTestId('mission-save').click();
  await expect(page.getByTestId('mission-title')).toHaveText(name);

  await page.getByTestId('orbit-add').click();
  await page.getByTestId('orbit-name').fill('Operational 550 km');
  await page.getByTestId('orbit-periapsisAltitude').fill('550 km');
  await page.getByTestId('orbit-apoapsisAltitude').fill('341.8 mi');
  await page.getByTestId('orbit-inclination').fill('97.6 deg');
  await expect(page.getByTestId('converted-apoapsisAltitude')).toHaveText('= 550.0738 km'); // 1 mi = 1.609344 km (NIST SP 811)
  // A circular 550 km Earth orbit has a period of about 95.6 min (Kepler's third law; common practice, no source).
  await expect(page.getByTestId('figure-period')).toHaveText(/^95\.[5-7]\d min$/);
  await expect(page.getByTestId('figure-eclipse-duration')).toContainText('min');
  await screenshot(page, 'orbit-editor-derived');

  // A wrong field is explained under the field, from the local check.
  await page.getByTestId('orbit-apoapsisAltitude').fill('500 km');
  await expect(page.getByTestId('error-apoapsisAltitude')).toHaveText('apoapsis is below periapsis by 50 km');
  await page.getByTestId('orbit-apoapsisAltitude').fill('550 km');
  await expect(page.getByTestId('figure-period')).toHaveText(/^95\.[5-7]\d min$/);
  await page.getByTestId('orbit-save').click();
  await expect(page.getByTestId('orbit-row')).toHaveCount(1);
  await expect(page.getByTestId('orbit-row-period')).toHaveText(/^95\.[5-7]\d min$/);

  await page.getByRole('tab', { name: 'Surfaces' }).click();
  await addSurface(page, 'Nadir panel', '0.5', /^Nadir/);
  await addSurface(page, 'Zenith radiator', '3000 cm^2', /^Zenith/);
  await expect(page.getByTestId('surface-row')).toHaveCount(2);
  await expect(page.getByTestId('surface-row').filter({ hasText: 'Zenith radiator' })).toContainText('0.300');

  await page.getByRole('tab', { name: 'Environment' }).click();
  await expect(page.getByTestId('result-period')).toHaveText(/^95\.[5-7]\d min$/);
  await expect(page.getByTestId('result-flux-plot').locator('svg.ecl-plot-svg')).toBeVisible();
  await expect(page.getByTestId('result-absorbed-plot').locator('svg.ecl-plot-svg')).toBeVisible();
  await expect(page.getByTestId('result-averages').locator('tbody tr')).toHaveCount(2);
  await expect(page.getByLabel('Design caution')).toBeVisible();
  // The flux and absorbed plots share the orbit's time axis: a drag across one zooms both, and the
  // other's reset shows the whole orbit in both again.
  const fluxSvg = page.getByTestId('result-flux-plot').locator('svg.ecl-plot-svg');
  await fluxSvg.scrollIntoViewIfNeeded();
  const box = await fluxSvg.boundingBox();
  if (!box) throw new Error('the flux plot has no box');
  await page.mouse.move(box.x + box.width * 0.3, box.y + box.height / 2);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width * 0.5, box.y + box.height / 2, { steps: 5 });
  await page.mouse.up();
  const lastTick = async (testId: string) => Number((await page.getByTestId(testId).locator('g[eclPlotXAxis] .ecl-axis-tick text').last().textContent()) ?? NaN);
  await expect(page.getByTestId('result-absorbed-plot').locator('.ecl-plot-zoom-reset')).toBeVisible();
  expect(await lastTick('result-absorbed-plot')).toBe(await lastTick('result-flux-plot'));
  expect(await lastTick('result-absorbed-plot')).toBeLessThan(60);
  await page.getByTestId('result-absorbed-plot').locator('.ecl-plot-zoom-reset').click();
  await expect(page.getByTestId('result-flux-plot').locator('.ecl-plot-zoom-reset')).toHaveCount(0);
  expect(await lastTick('result-flux-plot')).toBeGreaterThanOrEqual(80); // the whole 95.6 min orbit again
  await screenshot(page, 'orbit-environment-results');
  await page.getByTestId('result-averages').scrollIntoViewIfNeeded();
  await screenshot(page, 'orbit-environment-averages');

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('result-download').click()]);
  expect(download.suggestedFilename()).toMatch(/-profile\.csv$/);
  const csv = (await readFile(await download.path(), 'utf8')).replace(/^\uFEFF/, '');
  const [header, firstRow] = csv.split('\r\n');
  expect(header).toBe(
    'Time from periapsis (min),True anomaly (deg),Sunlit fraction,' +
      'Nadir panel solar (W/m²),Nadir panel albedo (W/m²),Nadir panel IR (W/m²),Nadir panel absorbed (W),' +
      'Zenith radiator solar (W/m²),Zenith radiator albedo (W/m²),Zenith radiator IR (W/m²),Zenith radiator absorbed (W),caution',
  );
  // Eleven numbers, then the preliminary-design caution (quoted: it holds commas).
  expect(firstRow.split(',').slice(0, 11).every((cell) => cell !== '' && Number.isFinite(Number(cell)))).toBe(true);
  expect(firstRow).toMatch(/preliminary-design/i);

  await page.getByRole('tab', { name: 'Mission sweep' }).click();
  await page.getByTestId('sweep-run').click();
  await expect(page.getByTestId('sweep-done')).toContainText('62 days', { timeout: 60_000 });
  await expect(page.getByTestId('sweep-beta-plot').locator('svg.ecl-plot-svg')).toBeVisible();
  await expect(page.getByTestId('sweep-absorbed-plot')).toContainText('Zenith radiator');
  // The sweep's plots share the mission's dates: + on the beta plot zooms all three, 0 on it shows all again.
  const sweepPlots = ['sweep-beta-plot', 'sweep-eclipse-plot', 'sweep-absorbed-plot'];
  await page.getByTestId('sweep-beta-plot').locator('svg.ecl-plot-svg').focus();
  await page.keyboard.press('Home');
  await page.keyboard.press('+');
  for (const id of sweepPlots) await expect(page.getByTestId(id).locator('.ecl-plot-zoom-reset')).toBeVisible();
  await page.keyboard.press('0');
  for (const id of sweepPlots) await expect(page.getByTestId(id).locator('.ecl-plot-zoom-reset')).toHaveCount(0);
  await screenshot(page, 'mission-sweep');
  await page.getByTestId('sweep-absorbed-plot').scrollIntoViewIfNeeded();
  await screenshot(page, 'mission-sweep-absorbed');
  const [sweepFile] = await Promise.all([page.waitForEvent('download'), page.getByTestId('sweep-download').click()]);
  const sweepCsv = (await readFile(await sweepFile.path(), 'utf8')).replace(/^\uFEFF/, '');
  expect(sweepCsv.split('\r\n')[0]).toMatch(/^Date \(UTC\),Beta \(deg\),Eclipse fraction,Eclipse duration \(min\)/);
});

test('a viewer reads a mission but is offered no changes, and can run and cancel the sweep', async ({ page }) => {
  await page.setViewportSize({ width: 1280, height: 900 });
  await signIn(page, 'viewer@kestrel.test');
  await expect(page.getByRole('heading', { name: 'Missions' })).toBeVisible();
  await expect(page.getByTestId('mission-new')).toHaveCount(0);
  await page.getByTestId('mission-filter').fill('imaging');
  await expect(page.getByTestId('mission-row')).toHaveCount(1);
  await page.getByTestId('mission-row').first().getByRole('link').click();
  await expect(page.getByTestId('mission-title')).toBeVisible();
  await expect(page.getByTestId('orbit-row').first()).toBeVisible();
  await expect(page.getByTestId('orbit-add')).toHaveCount(0);
  await expect(page.getByTestId('mission-edit')).toHaveCount(0);
  await page.getByRole('tab', { name: 'Surfaces' }).click();
  await expect(page.getByTestId('surface-row').first()).toBeVisible();
  await expect(page.getByTestId('surface-add')).toHaveCount(0);
  await screenshot(page, 'mission-viewer-surfaces');

  // A multi-year sweep streams long enough to show its progress and to be cancelled. The server
  // computes it in a fraction of a second, so the network is slowed (Chromium's own throttling,
  // about 100 kB/s) for the stream to take seconds, as over a slow link.
  const network = await page.context().newCDPSession(page);
  const throttle = (bytesPerSecond: number) =>
    network.send('Network.emulateNetworkConditions', { offline: false, latency: 0, downloadThroughput: bytesPerSecond, uploadThroughput: -1 });
  await throttle(100_000);
  await page.getByRole('tab', { name: 'Mission sweep' }).click();
  await page.getByTestId('sweep-run').click();
  await expect(page.getByTestId('sweep-progress')).toBeVisible();
  await page.getByTestId('sweep-cancel').click();
  await expect(page.getByText(/^Cancelled after \d+ of \d+ days/)).toBeVisible();

  // The whole sweep is some 220 kB compressed (1,736 days): at 400 kB/s its progress showed for about
  // half a second, a window Playwright's polling could step over; at 150 kB/s about 1.5 s.
  await throttle(150_000);
  await page.getByTestId('sweep-run').click();
  await expect(page.getByTestId('sweep-progress')).toContainText(/[1-9]\d* of \d+ days/);
  await screenshot(page, 'mission-sweep-progress');
  await expect(page.getByTestId('sweep-done')).toContainText('days from 2027-04-01', { timeout: 60_000 });
});
