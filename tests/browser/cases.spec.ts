// Issue 5 end to end: a thermal engineer derives the hot and cold cases of a demo mission, the
// four-eyes rule stops him releasing his own, the owner releases, a viewer downloads both exports,
// and a new revision with other margins is released and compared with the first.
import { readFile } from 'node:fs/promises';
import { expect, test, type Browser, type Page } from '@playwright/test';
import { dialogReady, screenshot, signIn } from './session';

const mission = 'Kestrel-1 imaging smallsat';
const orbit = 'Operational SSO 540 km';
const prefix = 'Browser SSO';

async function as(browser: Browser, email: string): Promise<Page> {
  const page = await browser.newPage({ acceptDownloads: true });
  await signIn(page, email);
  return page;
}

async function openLibrary(page: Page): Promise<void> {
  await page.getByTestId('nav-cases').click();
  await expect(page.getByRole('heading', { name: 'Load cases' })).toBeVisible();
}

/**
 * Picks an option, retrying while the list fills: a picker whose options load after the one before
 * it was chosen (a mission's orbits) may open empty or not open while it is still disabled.
 */
async function choose(page: Page, selectTestId: string, option: string): Promise<void> {
  await expect(async () => {
    if ((await page.getByRole('listbox').count()) === 0) await page.getByTestId(selectTestId).click();
    await page.getByRole('option', { name: option, exact: true }).click({ timeout: 3_000 });
  }).toPass({ timeout: 30_000 });
  await expect(page.getByRole('listbox')).toHaveCount(0);
}

/** The shell scrolls inside its content pane, so a full-page shot needs a tall window to show a long page. */
async function tallScreenshot(page: Page, name: string, height: number): Promise<void> {
  await page.setViewportSize({ width: 1280, height });
  await screenshot(page, name);
  await page.setViewportSize({ width: 1280, height: 720 });
}

async function release(page: Page): Promise<string> {
  await page.getByTestId('case-release').click();
  await page.getByTestId('review-confirm').click();
  const checksum = (await page.getByTestId('release-checksum').textContent())?.trim() ?? '';
  expect(checksum).toMatch(/^[0-9a-f]{64}$/);
  return checksum;
}

test('derive, review, release, export and compare a load case', async ({ browser }) => {
  test.setTimeout(240_000);

  const thermal = await as(browser, 'thermal@kestrel.test');
  await openLibrary(thermal);
  await thermal.getByTestId('derive-cases').click();
  await dialogReady(thermal);
  await choose(thermal, 'derive-mission', mission);
  await choose(thermal, 'derive-orbit', orbit);
  await thermal.getByTestId('derive-name').fill(prefix);
  // The defaults are shown as defaults, with their source.
  await expect(thermal.getByText('25 % (default, MIL-STD-1540 via Gilmore Ch. 19)')).toBeVisible();
  await expect(thermal.getByRole('listbox')).toHaveCount(0);
  await tallScreenshot(thermal, 'cases-derive-dialog', 1000);
  await thermal.getByTestId('derive-submit').click();
  await expect(thermal.getByTestId('derive-submit')).toHaveCount(0, { timeout: 120_000 });

  const table = thermal.getByTestId('case-table');
  await expect(table.getByRole('link', { name: `${prefix} hot` })).toBeVisible();
  await expect(table.getByRole('link', { name: `${prefix} cold` })).toBeVisible();
  await expect(table.locator(`[data-case="${prefix} hot"]`)).toContainText('Hot');
  await expect(table.locator(`[data-case="${prefix} cold"]`)).toContainText('Cold');
  await screenshot(thermal, 'cases-library');

  await table.getByRole('link', { name: `${prefix} hot` }).click();
  await expect(thermal.getByTestId('case-name')).toHaveText(`${prefix} hot`);
  await expect(thermal.getByTestId('case-rationale')).toBeVisible();
  await expect(thermal.getByTestId('case-property-set')).toContainText('EOL');
  await expect(thermal.getByTestId('plot-absorbed').locator('svg').first()).toBeVisible();
  const firstUrl = thermal.url();
  await tallScreenshot(thermal, 'cases-case-page', 3400);

  await test.step('the author submits and may not release his own case', async () => {
    await thermal.getByTestId('case-submit').click();
    await thermal.getByTestId('review-confirm').click();
    await expect(thermal.getByTestId('case-status')).toHaveText('In review');
    // Four eyes: the author is never offered a release the server would refuse (the API's refusal
    // is tested in tests/api/cases.test.ts).
    await expect(thermal.getByTestId('case-release')).toHaveCount(0);
    await screenshot(thermal, 'cases-release-four-eyes');
  });

  const owner = await as(browser, 'owner@kestrel.test');
  let firstChecksum = '';
  await test.step('the owner releases it', async () => {
    await owner.goto(firstUrl);
    firstChecksum = await release(owner);
    await screenshot(owner, 'cases-released');
    await owner.getByTestId('release-close').click();
    await expect(owner.getByTestId('case-status')).toHaveText('Released');
    await expect(owner.getByTestId('case-checksum')).toHaveText(firstChecksum);
  });

  await test.step('a viewer sees the released case only and downloads both exports', async () => {
    const viewer = await as(browser, 'viewer@kestrel.test');
    await openLibrary(viewer);
    const rows = viewer.getByTestId('case-table');
    await expect(rows.getByRole('link', { name: `${prefix} hot` })).toBeVisible();
    await expect(rows.getByRole('link', { name: `${prefix} cold` })).toHaveCount(0); // still a draft
    await rows.getByRole('link', { name: `${prefix} hot` }).click();
    for (const action of ['case-edit', 'case-submit', 'case-release', 'case-new-revision']) await expect(viewer.getByTestId(action)).toHaveCount(0);

    const [json] = await Promise.all([viewer.waitForEvent('download'), viewer.getByTestId('export-json').click()]);
    const exported: unknown = JSON.parse(await readFile(await json.path(), 'utf8'));
    expect(exported).toMatchObject({ format: 'eclipta.load-case', checksum: firstChecksum, status: 'released' });

    const [csv] = await Promise.all([viewer.waitForEvent('download'), viewer.getByTestId('export-csv').click()]);
    const lines = (await readFile(await csv.path(), 'utf8')).split('\r\n');
    // One header row with units (the tidy CSV: tests/api/case-export.test.ts reads it back).
    const header = lines[0];
    expect(header).toContain('time from periapsis (s)');
    expect(header).toContain('absorbed total (W)');
    expect(header).toContain('solar incident (W/m^2)');
    expect(lines.some((line) => line.includes(firstChecksum))).toBe(true);
    await viewer.close();
  });

  let secondUrl = '';
  await test.step('a new revision with another margin is submitted and released', async () => {
    await thermal.goto(firstUrl);
    await thermal.getByTestId('case-new-revision').click();
    await thermal.getByTestId('case-revision-reason').fill('A second revision for the comparison');
    await thermal.getByTestId('case-revision-start').click();
    await expect(thermal.getByTestId('case-revision')).toHaveText('Revision 2');
    await expect(thermal.getByTestId('case-status')).toHaveText('Draft');
    secondUrl = thermal.url();
    await thermal.getByTestId('case-edit').click();
    await dialogReady(thermal);
    await thermal.getByTestId('edit-heat-margin').fill('30');
    await thermal.getByTestId('edit-save').click();
    await expect(thermal.getByTestId('case-heat-margin')).toContainText('30 %');
    await thermal.getByTestId('case-submit').click();
    await thermal.getByTestId('review-confirm').click();
    await expect(thermal.getByTestId('case-status')).toHaveText('In review');

    await owner.goto(secondUrl);
    const secondChecksum = await release(owner);
    expect(secondChecksum).not.toBe(firstChecksum);
    await owner.getByTestId('release-close').click();
    await expect(owner.getByTestId('case-status')).toHaveText('Released');
  });

  await test.step('the two revisions compare side by side', async () => {
    await owner.getByTestId('case-compare').click();
    await owner.getByTestId('compare-pick').click();
    await owner.getByRole('option', { name: new RegExp(`${prefix} hot .* revision 1 `) }).click();
    await owner.getByTestId('compare-go').click();
    await expect(owner.getByRole('heading', { name: 'Compare load cases' })).toBeVisible();
    // The older revision is always A and the newer B, so differences read new − old.
    await expect(owner.getByTestId('compare-side-A')).toContainText('Revision 1');
    await expect(owner.getByTestId('compare-side-B')).toContainText('Revision 2');
    const margin = owner.getByTestId('compare-inputs').locator('tr', { hasText: 'Heat-load margin' }).first();
    await expect(margin).toContainText('30.0 %');
    await expect(margin).toContainText('+5.0 percentage points');
    await expect(owner.getByTestId('compare-total').filter({ hasText: 'with margin' })).toContainText('changed');
    // Revision 2's larger margin gives the larger load with margin: B − A is positive.
    await expect(owner.getByTestId('compare-total').filter({ hasText: 'with margin' })).toContainText('+');
    await tallScreenshot(owner, 'cases-comparison', 2600);
  });
});

test('a thermal engineer adds a custom case with a fixed beta angle', async ({ page }) => {
  test.setTimeout(120_000);
  await signIn(page, 'thermal@kestrel.test');
  await openLibrary(page);
  await page.getByTestId('new-custom-case').click();
  await dialogReady(page);
  await choose(page, 'custom-mission', mission);
  await choose(page, 'custom-orbit', orbit);
  await page.getByTestId('custom-name').fill('Browser beta zero');
  await page.getByTestId('custom-date').fill('2028-03-20');
  await page.getByTestId('custom-beta').fill('0');
  await page.getByTestId('custom-attitude').fill('safe mode, array to Sun');
  await expect(page.getByRole('listbox')).toHaveCount(0);
  await tallScreenshot(page, 'cases-custom-dialog', 1000);
  await page.getByTestId('custom-submit').click();
  await expect(page.getByTestId('case-name')).toHaveText('Browser beta zero', { timeout: 60_000 });
  await expect(page.getByTestId('case-beta')).toHaveText('0.00 deg');
  await expect(page.locator('ecl-case-kind')).toContainText('Custom');
});
