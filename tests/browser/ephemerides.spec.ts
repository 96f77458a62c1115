// The analyst uploads the circular-orbit fixture to the demo Earth mission, sees the transfer and
// processing progress, the summary and the plots; then a broken file explained row by row. A
// thermal engineer then narrows the plots to a window and saves it as a load case.
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test } from '@playwright/test';
import { dialogReady, screenshot, signIn } from './session';

const fixtures = path.resolve(import.meta.dirname, '..', '..', 'fixtures', 'ephemerides');

test('an analyst uploads a trajectory, sees the plots, and a broken file is explained row by row', async ({ page }) => {
  await signIn(page, 'analyst@kestrel.test');
  const missions = await page.request.get('/api/v1/missions');
  expect(missions.ok()).toBe(true);
  const body = (await missions.json()) as { items: { id: string; workspaceId: string; bodyId: string; name: string }[] };
  const mission = body.items.find((m) => m.bodyId === 'earth');
  if (!mission) throw new Error('the demo seed has no Earth mission');

  await page.goto(`/w/${mission.workspaceId}/missions/${mission.id}/ephemerides`);
  await expect(page.getByRole('heading', { name: 'Ephemerides', level: 1 })).toBeVisible();
  await expect(page.getByTestId('ephemerides-empty')).toBeVisible();

  // Slow the answer a little so the processing stage is on screen long enough to see.
  await page.route('**/ephemerides', async (route) => {
    if (route.request().method() === 'POST') await new Promise((r) => setTimeout(r, 600));
    await route.continue();
  });
  await page.getByTestId('ephemeris-file-input').setInputFiles(path.join(fixtures, 'leo-circular.csv'));
  await expect(page.getByTestId('ephemeris-file-name')).toHaveText('leo-circular.csv');
  await page.getByTestId('ephemeris-name').fill('Kestrel-1 nominal, 4 h');
  await page.getByTestId('ephemeris-send').click();
  await expect(page.getByTestId('ephemeris-progress-sending').or(page.getByTestId('ephemeris-progress-processing'))).toBeVisible();
  await screenshot(page, 'ephemerides-1-uploading');
  await expect(page.getByTestId('ephemeris-upload-done')).toContainText('241 rows');

  await expect(page.getByTestId('ephemerides-list')).toContainText('Kestrel-1 nominal, 4 h');
  await expect(page.getByTestId('ephemeris-rows')).toHaveText('241');
  await expect(page.getByTestId('ephemeris-altitude')).toHaveText('550.0 – 550.0 km');
  await expect(page.getByTestId('ephemeris-plots').locator('ecl-time-series-plot')).toHaveCount(4);
  await expect(page.getByTestId('ephemeris-averages')).toContainText('Solar array');
  await expect(page.getByLabel('Design caution')).toBeVisible();
  // The shell scrolls inside its content pane, so a tall window shows the whole page in one picture.
  await page.setViewportSize({ width: 1280, height: 2600 });
  await screenshot(page, 'ephemerides-2-plots');
  await page.setViewportSize({ width: 1280, height: 900 });

  // A broken file: the refusal and its rows in a table; nothing added to the list.
  await page.getByTestId('ephemeris-file-input').setInputFiles(path.join(fixtures, 'bad', 'repeated-epoch.csv'));
  await page.getByTestId('ephemeris-send').click();
  const problems = page.getByTestId('ephemeris-problems');
  await expect(problems).toBeVisible();
  await expect(problems.locator('tbody tr').first()).toContainText('5');
  await expect(problems).toContainText('repeated epoch: row 4 has the same one');
  await expect(page.getByTestId('ephemeris-refusal')).toContainText('nothing was kept');
  await expect(page.getByTestId('ephemerides-list').locator('tbody tr')).toHaveCount(1);
  await page.getByTestId('ephemeris-refusal').scrollIntoViewIfNeeded();
  await screenshot(page, 'ephemerides-3-refused');

  await page.getByTestId('ephemeris-file-input').setInputFiles(path.join(fixtures, 'bad', 'metres.csv'));
  await page.getByTestId('ephemeris-send').click();
  await expect(problems).toContainText('looks like metres; Eclipta expects km');
  await expect(problems.locator('tbody tr')).toHaveCount(12);
});

test('a thermal engineer narrows the plots to one orbit by keyboard and saves that window as a load case', async ({ page }) => {
  await signIn(page, 'thermal@kestrel.test');
  const missions = (await (await page.request.get('/api/v1/missions')).json()) as { items: { id: string; workspaceId: string; bodyId: string }[] };
  const mission = missions.items.find((m) => m.bodyId === 'earth');
  if (!mission) throw new Error('the demo seed has no Earth mission');
  // the 4 h circular-orbit fixture, uploaded through the API (the analyst's screen is the first test)
  const uploaded = await page.request.post(`/api/v1/missions/${mission.id}/ephemerides`, {
    multipart: { frame: 'EME2000', name: 'Kestrel-1 for a case', file: { name: 'leo-circular.csv', mimeType: 'text/csv', buffer: readFileSync(path.join(fixtures, 'leo-circular.csv')) } },
  });
  expect(uploaded.status()).toBe(201);
  const ephemerisId = ((await uploaded.json()) as { id: string }).id;

  await page.goto(`/w/${mission.workspaceId}/missions/${mission.id}/ephemerides`);
  await page.getByRole('row', { name: /Kestrel-1 for a case/ }).getByRole('button', { name: 'Show' }).click();
  await expect(page.getByTestId('ephemeris-window-shown')).toContainText('241 rows');
  // one orbit of the 550 km circle (95.6 min): typed, then Enter
  await page.getByTestId('ephemeris-window-from').fill('2027-03-20T12:00:00');
  await page.getByTestId('ephemeris-window-to').fill('2027-03-20T13:36:00');
  await page.getByTestId('ephemeris-window-to').press('Enter');
  await expect(page.getByTestId('ephemeris-window-shown')).toContainText('97 rows, 12:00:00 – 13:36:00 UTC on 2027-03-20');
  await expect(page.getByTestId('ephemeris-averages')).toBeVisible();
  await screenshot(page, 'ephemerides-4-window');

  await page.getByTestId('ephemeris-make-case').click();
  await dialogReady(page);
  await page.getByTestId('ephemeris-case-name').fill('Kestrel-1 one orbit from the file');
  await page.getByTestId('ephemeris-case-submit').click();
  await expect(page).toHaveURL(/\/cases\/[0-9a-f-]{36}$/);
  await expect(page.getByRole('heading', { name: 'Kestrel-1 one orbit from the file', level: 1 })).toBeVisible();
  await expect(page.getByTestId('case-trajectory')).toContainText('Kestrel-1 for a case');
  await expect(page.getByTestId('case-trajectory')).toContainText('97');
  await expect(page.getByText('Time from the first row of the ephemeris window')).toBeVisible();
  await screenshot(page, 'ephemerides-5-case');
  // the saved case names the ephemeris it came from
  const caseId = page.url().split('/').at(-1);
  const detail = (await (await page.request.get(`/api/v1/cases/${caseId}`)).json()) as { inputs: { ephemeris: { id: string; rows: number } } };
  expect(detail.inputs.ephemeris).toMatchObject({ id: ephemerisId, rows: 97 });
});
