// The orbit view on a saved orbit's environment: the picture, its scrubber by keyboard, and its
// link both ways with the load plots' read-out cursor; screenshots light and dark, wide and narrow.
import { expect, test, type Page } from '@playwright/test';
import { api, screenshot, signIn } from './session';

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

test('without surfaces the environment shows the six body-frame faces and a Sun-pointing plate, and its plot zooms by drag and keys', async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 900 });
  await signIn(page, 'thermal@kestrel.test');
  const me = await api(page).get('/auth/me');
  const workspaceId = (me['workspaces'] as { workspaceId: string }[])[0].workspaceId;
  const name = `Bare bus ${Date.now()}`;
  const mission = await api(page).send('post', '/missions', { workspaceId, name, bodyId: 'earth', startDate: '2027-03-01', endDate: '2027-03-31' });
  await api(page).send('post', `/missions/${String(mission['id'])}/orbits`, {
    name: 'SSO 540 km', periapsisAltitudeKm: '540 km', apoapsisAltitudeKm: '540 km', inclinationDeg: '97.5 deg', epoch: '2027-03-20T12:00:00Z',
  });
  await page.goto(`/w/${workspaceId}/missions/${String(mission['id'])}`);
  await page.getByRole('tab', { name: 'Environment' }).click();

  await expect(page.getByTestId('result-faces')).toBeVisible();
  const rows = page.getByTestId('result-faces-table').locator('tbody tr');
  await expect(rows).toHaveCount(7);
  await expect(rows.first()).toContainText('Ram face (+x)');
  const plate = rows.filter({ hasText: 'Sun-pointing plate' });
  // 540 km, beta near 0: in sunlight about 63 % of the orbit at about 1,370 W/m^2 (from memory: the
  // solar constant at 1 AU, the eclipse of a low orbit at beta 0)
  const plateSolar = Number(((await plate.locator('td').first().textContent()) ?? '').replace(/,/g, ''));
  expect(plateSolar).toBeGreaterThan(800);
  expect(plateSolar).toBeLessThan(900);
  await expect(page.getByTestId('result-flux-plot')).toContainText('Solar');
  await expect(page.getByTestId('result-absorbed-plot')).toHaveCount(0);
  await page.getByTestId('result-faces-table').scrollIntoViewIfNeeded();
  await screenshot(page, 'environment-default-faces-1440-light');

  // zoom: a drag across the plot narrows the time axis, the reset button shows the whole orbit again
  const plot = page.getByTestId('result-flux-plot');
  const svg = plot.locator('svg.ecl-plot-svg');
  const lastTick = async () => Number((await plot.locator('g[eclPlotXAxis] .ecl-axis-tick text').last().textContent()) ?? NaN);
  expect(await lastTick()).toBeGreaterThan(80);
  await svg.scrollIntoViewIfNeeded();
  const box = await svg.boundingBox();
  if (!box) throw new Error('the plot has no box');
  await page.mouse.move(box.x + box.width * 0.3, box.y + box.height / 2);
  await page.mouse.down();
  await page.mouse.move(box.x + box.width * 0.5, box.y + box.height / 2, { steps: 5 });
  await page.mouse.up();
  await expect(plot.locator('.ecl-plot-zoom-reset')).toBeVisible();
  expect(await lastTick()).toBeLessThan(60);
  await plot.locator('.ecl-plot-zoom-reset').click();
  await expect(plot.locator('.ecl-plot-zoom-reset')).toHaveCount(0);
  expect(await lastTick()).toBeGreaterThan(80);

  // and by keyboard: + zooms about the cursor, 0 shows the whole range
  await svg.focus();
  await page.keyboard.press('Home');
  await page.keyboard.press('+');
  await expect(plot.locator('.ecl-plot-zoom-reset')).toBeVisible();
  expect(await lastTick()).toBeLessThan(60);
  await page.keyboard.press('0');
  await expect(plot.locator('.ecl-plot-zoom-reset')).toHaveCount(0);

  await page.emulateMedia({ colorScheme: 'dark' });
  await page.getByTestId('result-faces-table').scrollIntoViewIfNeeded();
  await screenshot(page, 'environment-default-faces-1440-dark');
  await page.setViewportSize({ width: 390, height: 844 });
  await page.getByTestId('result-faces-table').scrollIntoViewIfNeeded();
  await screenshot(page, 'environment-default-faces-390-dark');
});

test("draws an eccentric orbit that is never shaded with the Sun where the answer's sunDirection puts it", async ({ page }) => {
  await page.setViewportSize({ width: 1440, height: 900 });
  await signIn(page, 'thermal@kestrel.test');
  const me = await api(page).get('/auth/me');
  const workspaceId = (me['workspaces'] as { workspaceId: string }[])[0].workspaceId;
  const mission = await api(page).send('post', '/missions', { workspaceId, name: `High ellipse ${Date.now()}`, bodyId: 'earth', startDate: '2027-06-01', endDate: '2027-06-30' });
  // Solstice Sun (RA 90°, dec 23.4°) on a polar orbit with its node at RA 0: beta = asin(−cos 23.4°) ≈ −66.5°,
  // so the shadow reaches R / |sin β| ≈ 6,950 km behind Earth, short of the 7,378 km periapsis radius: never shaded (closed form, cylindrical shadow).
  const orbit = await api(page).send('post', `/missions/${String(mission['id'])}/orbits`, {
    name: 'High ellipse', periapsisAltitudeKm: '1000 km', apoapsisAltitudeKm: '40000 km', inclinationDeg: '90 deg', raanDeg: '0 deg', argPeriapsisDeg: '45 deg', epoch: '2027-06-21T12:00:00Z',
  });
  const answer = await api(page).send('post', `/missions/${String(mission['id'])}/orbits/${String(orbit['id'])}/environment`, {});
  const sun = answer['sunDirection'] as { x: number; y: number; z: number };
  expect(answer['eclipseFraction']).toBe(0);
  await page.goto(`/w/${workspaceId}/missions/${String(mission['id'])}`);
  await page.getByRole('tab', { name: 'Environment' }).click();
  const view = page.getByTestId('orbit-view');
  await expect(view).toBeVisible();
  await expect(view.locator('path.arc-band')).toHaveCount(0);
  // the Sun is drawn to the left: periapsis, at angle −az from the Sun's in-plane direction, is turned to 180° − az on screen (y down)
  const az = Math.atan2(sun.y, sun.x);
  const centre = view.locator('circle.body');
  const marker = view.locator('g.periapsis rect');
  const [cx, cy] = [Number(await centre.getAttribute('cx')), Number(await centre.getAttribute('cy'))];
  const [px, py] = [Number(await marker.getAttribute('x')) + 4, Number(await marker.getAttribute('y')) + 4];
  const drawn = Math.atan2(-(py - cy), px - cx);
  const expected = Math.PI - az;
  expect(Math.abs(Math.atan2(Math.sin(drawn - expected), Math.cos(drawn - expected)))).toBeLessThan(0.02);
  await view.scrollIntoViewIfNeeded();
  await screenshot(page, 'orbit-view-eccentric-unshaded-1440-light');
  // the top bar's Workspace label lies wholly inside the bar (it was clipped at the top edge)
  await page.evaluate('window.scrollTo(0, 0)');
  const bar = await page.locator('.top-bar').boundingBox();
  const label = await page.locator('.workspace-switcher mat-label').boundingBox();
  expect(bar && label && label.y >= bar.y).toBe(true);
  await page.screenshot({ path: 'tmp/screenshots/top-bar-workspace-1440-light.png', clip: { x: 1000, y: 0, width: 440, height: 70 } });
});
