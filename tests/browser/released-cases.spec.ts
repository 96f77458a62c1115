// Issue 12 in the browser: the owner who tries to delete a mission holding released cases is told
// which cases keep it (and offered to archive it), other roles see no Delete; and a thermal
// engineer whose draft was changed by someone else while he edited it gets a readable conflict and
// can load the latest.
import { expect, test, type Browser, type Page } from '@playwright/test';
import { dialogReady, screenshot, signIn } from './session';

const mission = 'Kestrel-1 imaging smallsat';

async function as(browser: Browser, email: string): Promise<Page> {
  const page = await browser.newPage();
  await signIn(page, email);
  return page;
}

/** Same-origin API calls with the page's session (the Origin header as the app's own pages send it). */
function api(page: Page) {
  const origin = new URL(page.url()).origin;
  const headers = { Origin: origin };
  return {
    get: async (path: string) => (await page.request.get(`${origin}/api/v1${path}`, { headers })).json() as Promise<Record<string, unknown>>,
    send: async (method: 'post' | 'patch', path: string, data: object = {}) => {
      const res = await page.request[method](`${origin}/api/v1${path}`, { headers, data });
      expect(res.ok(), await res.text()).toBe(true);
      return (await res.json()) as Record<string, unknown>;
    },
  };
}

async function openMission(page: Page): Promise<void> {
  await page.getByRole('link', { name: mission, exact: true }).click();
  await expect(page.getByTestId('mission-title')).toContainText(mission);
}

test('deleting a mission with released cases: only the owner sees Delete, and is told why it stays', async ({ browser }) => {
  const analyst = await as(browser, 'analyst@kestrel.test');
  await openMission(analyst);
  await expect(analyst.getByTestId('mission-edit')).toBeVisible();
  await expect(analyst.getByTestId('mission-delete')).toHaveCount(0);
  await analyst.close();

  const owner = await as(browser, 'owner@kestrel.test');
  await openMission(owner);
  await owner.getByTestId('mission-delete').click();
  await dialogReady(owner);
  await owner.getByTestId('confirm').click();
  const refusal = owner.getByTestId('mission-delete-refused');
  await expect(refusal).toContainText(`The mission "${mission}" holds`);
  await expect(refusal).toContainText('(released)');
  await expect(refusal).toContainText('archive it instead');
  await expect(refusal.getByRole('button', { name: 'Archive it instead' })).toBeVisible();
  await screenshot(owner, 'mission-delete-refused');
  // still there
  await expect(owner.getByTestId('mission-title')).toContainText(mission);
  await owner.close();
});

test('a stale edit of a draft gets a readable conflict, and the latest can be loaded', async ({ browser }) => {
  const thermal = await as(browser, 'thermal@kestrel.test');
  const owner = await as(browser, 'owner@kestrel.test');
  const released = (await api(thermal).get('/cases?status=released&kind=hot')).items as { id: string; missionName: string }[];
  const source = released.find((c) => c.missionName === mission)!;
  const draft = await api(thermal).send('post', `/cases/${source.id}/revisions`);

  await thermal.goto(`/w/${String(draft.workspaceId)}/cases/${String(draft.id)}`);
  await expect(thermal.getByTestId('case-status')).toContainText(/draft/i);
  await thermal.getByTestId('case-edit').click();
  await dialogReady(thermal);
  await thermal.getByTestId('edit-name').fill('Hot case, thermal rename');

  // meanwhile the owner renames the same draft
  await api(owner).send('patch', `/cases/${String(draft.id)}`, { version: draft.version, name: 'Hot case, owner rename' });

  await thermal.getByTestId('edit-save').click();
  const error = thermal.getByTestId('edit-error');
  await expect(error).toContainText('was changed by someone else while you edited it');
  await expect(error).toContainText('Reload it to see the change');
  await screenshot(thermal, 'case-edit-conflict');
  await thermal.getByTestId('edit-reload').click();
  await expect(thermal.locator('mat-dialog-container')).toHaveCount(0);
  await expect(thermal.getByTestId('case-name')).toHaveText('Hot case, owner rename');
  await owner.close();
  await thermal.close();
});
