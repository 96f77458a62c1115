// The workspace overview says what needs the member (issue 15 item 7), walked as the owner (a
// reviewer) and the thermal engineer (an author): a case waiting for review, a draft returned with
// a comment, the cases they follow, a released case whose mission changed; then the comparison's
// per-surface load difference plot (issue 15 item 4). Screenshots at 1440 px and 390 px.
import { expect, test, type Page } from '@playwright/test';
import { api, as, screenshot } from './session';

const mission = 'Kestrel-1 imaging smallsat';

async function shots(page: Page, name: string, ready: string): Promise<void> {
  await page.setViewportSize({ width: 1440, height: 900 });
  await screenshot(page, `${name}-1440`);
  await page.setViewportSize({ width: 390, height: 844 });
  await page.reload();
  await expect(page.getByTestId(ready)).toBeVisible();
  await page.getByTestId(ready).scrollIntoViewIfNeeded();
  await screenshot(page, `${name}-390`);
  // A string: the browser specs type-check under the server config, which has no DOM types.
  const overflow = Number(await page.evaluate('document.documentElement.scrollWidth - document.documentElement.clientWidth'));
  expect(overflow, 'no sideways scrolling at 390 px').toBeLessThanOrEqual(0);
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.reload();
  await expect(page.getByTestId(ready)).toBeVisible();
}

test('the overview lists what needs me, and compare plots the load differences', async ({ browser }) => {
  test.setTimeout(120_000);
  const thermal = await as(browser, 'thermal@kestrel.test');
  const owner = await as(browser, 'owner@kestrel.test');
  const missions = (await api(thermal).get('/missions')).items as { id: string; name: string }[];
  const m = missions.find((x) => x.name === mission)!;
  const orbits = (await api(thermal).get(`/missions/${m.id}/orbits`)).items as { id: string }[];
  const derived = (await api(thermal).send('post', `/missions/${m.id}/cases/derive`, { orbitId: orbits[0]!.id, name: 'Overview walk' })).items as { id: string; name: string; workspaceId: string }[];
  const [hot, cold] = [derived[0]!, derived[1]!];
  const ws = hot.workspaceId;
  await api(thermal).send('post', `/cases/${hot.id}/submit`);
  await api(thermal).send('post', `/cases/${cold.id}/submit`);
  await api(owner).send('post', `/cases/${hot.id}/return`, { text: 'Use the end-of-life property set, please.' });
  await api(owner).send('post', `/cases/${cold.id}/release`);
  await api(thermal).send('post', `/cases/${cold.id}/subscription`);
  // The radiator grows: the released cold case is no longer current with its mission.
  const surfaces = (await api(thermal).get(`/missions/${m.id}/surfaces`)).items as { id: string; name: string; areaM2: number }[];
  const surface = surfaces[0]!;
  await api(thermal).send('patch', `/missions/${m.id}/surfaces/${surface.id}`, { areaM2: surface.areaM2 * 1.25 });
  // A second draft in review waits for the owner.
  const again = (await api(thermal).send('post', `/missions/${m.id}/cases/derive`, { orbitId: orbits[0]!.id, name: 'Overview review' })).items as { id: string; name: string }[];
  await api(thermal).send('post', `/cases/${again[0]!.id}/submit`);

  await owner.goto(`/w/${ws}/overview`);
  await expect(owner.getByTestId('overview-review')).toContainText(again[0]!.name);
  await expect(owner.getByTestId('overview-review')).not.toContainText(hot.name);
  await expect(owner.getByTestId('overview-returned')).toContainText('None of your drafts was returned.');
  await expect(owner.getByTestId('overview-stale')).toContainText(cold.name);
  await shots(owner, 'overview-owner', 'overview-review');

  await thermal.goto(`/w/${ws}/overview`);
  await expect(thermal.getByTestId('overview-review')).not.toContainText(again[0]!.name);
  await expect(thermal.getByTestId('overview-returned')).toContainText('Use the end-of-life property set, please.');
  await expect(thermal.getByTestId('overview-followed')).toContainText(cold.name);
  await expect(thermal.getByTestId('overview-stale')).toContainText(cold.name);
  await shots(thermal, 'overview-thermal', 'overview-returned');
  await thermal.getByTestId('overview-returned').getByRole('link', { name: hot.name }).click();
  await expect(thermal).toHaveURL(new RegExp(`/cases/${hot.id}$`));

  // A revision derived again from the grown radiator, compared with the release: the plot and its table.
  const revised = (await api(thermal).send('post', `/cases/${cold.id}/revisions`, { reason: 'Radiator grew', fromCurrentInputs: true })) as { id: string };
  await thermal.goto(`/w/${ws}/cases/${cold.id}/compare/${revised.id}`);
  const plot = thermal.getByTestId('compare-load-plot');
  await expect(plot.locator('svg rect').first()).toBeVisible();
  await expect(plot.locator('table tbody tr')).toHaveCount(surfaces.length);
  await expect(plot.locator('table tbody tr').filter({ hasText: surface.name })).toContainText('+');
  await plot.scrollIntoViewIfNeeded();
  await shots(thermal, 'compare-load-plot', 'compare-load-plot');
});
