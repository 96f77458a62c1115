// The everyday interface (issue 17): every role lands on its missions, signed out or not; units are
// read as engineers type them (days, superscripts, "sq m"); times read as ISO 8601 on a 24-hour UTC
// clock; and no page shows our internals (identifiers, field paths, file names, NaN).
import { expect, test, type Page } from '@playwright/test';
import { clickAndAwaitAnswer, dialogReady, demoPassword, screenshot, signIn, THERMAL_RUN_PATH } from './session';

const roles = ['owner', 'analyst', 'thermal', 'viewer'] as const;

async function signInHere(page: Page, email: string): Promise<void> {
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(demoPassword);
  await page.getByTestId('sign-in-submit').click();
  await expect(page.getByTestId('user-menu')).toBeVisible();
}

for (const role of roles) {
  test(`landing: the ${role}, signed out, opens "/" and after signing in lands on the missions, not API tokens`, async ({ page }) => {
    await page.goto('/');
    await expect(page).toHaveURL(/\/sign-in/);
    await signInHere(page, `${role}@kestrel.test`);
    await expect(page).toHaveURL(/\/w\/[^/]+\/missions$/);
    await expect(page.getByRole('heading', { name: 'Missions' })).toBeVisible();
    // Signed in, "/" goes there too.
    await page.goto('/');
    await expect(page).toHaveURL(/\/w\/[^/]+\/missions$/);
  });
}

test('landing: the return URL still brings a signed-out user back to the page they asked for', async ({ page }) => {
  await signIn(page, 'analyst@kestrel.test');
  const workspaceUrl = page.url().replace(/\/missions$/, '');
  await page.getByTestId('user-menu').click();
  await page.getByRole('menuitem', { name: /sign out/i }).click();
  await expect(page).toHaveURL(/\/sign-in/);
  await page.goto(`${workspaceUrl}/cases`);
  await expect(page).toHaveURL(/\/sign-in\?returnUrl=/);
  await signInHere(page, 'analyst@kestrel.test');
  await expect(page).toHaveURL(/\/w\/[^/]+\/cases$/);
});

test('units as typed: a 9-day period, "1.2 m²" and "3 sq m" areas, a custom normal scaled to 1; times on a 24-hour UTC clock', async ({ page }) => {
  test.setTimeout(120_000);
  await page.setViewportSize({ width: 1440, height: 900 });
  await signIn(page, 'analyst@kestrel.test');
  await page.getByTestId('mission-new').click();
  await dialogReady(page);
  await page.getByTestId('mission-name').fill(`Everyday units ${Date.now()}`);
  // The date fields read ISO 8601 text, not the browser's locale form.
  await expect(page.getByTestId('mission-start')).toHaveAttribute('placeholder', 'YYYY-MM-DD');
  await page.getByTestId('mission-start').fill('2027-03-20');
  await page.getByTestId('mission-end').fill('2027-03-24');
  await page.getByTestId('mission-save').click();
  await expect(page.getByTestId('mission-title')).toBeVisible();

  await page.getByTestId('orbit-add').click();
  // The button goes away: the focus moves to the new orbit's first field, not the page body.
  await expect(page.getByTestId('orbit-name')).toBeFocused();
  await page.getByTestId('orbit-name').fill('Nine-day orbit');
  await page.getByTestId('definition-period').click();
  // 9 d = 9 × 86,400 s (SI brochure, table 8); the form's field is in minutes: 12,960 min.
  await page.getByTestId('orbit-period').fill('9 days');
  await expect(page.getByTestId('converted-period')).toHaveText('= 12960 min');
  await page.getByTestId('orbit-eccentricity').fill('0');
  await page.getByTestId('orbit-inclination').fill('28.5 deg');
  // The period reads best in days: 12,960 min is 9.00 d.
  await expect(page.getByTestId('figure-period')).toHaveText('9.00 d');
  await page.getByTestId('orbit-period').fill('14 d');
  await expect(page.getByTestId('converted-period')).toHaveText('= 20160 min');
  await expect(page.getByTestId('error-period')).toHaveCount(0);
  await screenshot(page, 'everyday-period-in-days');
  await page.getByTestId('orbit-save').click();
  await expect(page.getByTestId('orbit-row-period')).toHaveText('14.00 d');
  await expect(page.getByTestId('orbit-row').first()).not.toContainText(/AM|PM/);

  await page.getByRole('tab', { name: 'Surfaces' }).click();
  await page.getByTestId('surface-add').click();
  await dialogReady(page);
  await page.getByTestId('surface-name').fill('Side panel');
  await page.getByTestId('surface-area').fill('1.2 m²');
  await expect(page.getByTestId('surface-area-preview')).toHaveText('= 1.2 m²');
  await page.getByTestId('surface-area').fill('3 sq m');
  await expect(page.getByTestId('surface-area-preview')).toHaveText('= 3 m²');
  await page.getByTestId('surface-area').fill('1.2 m²²');
  await expect(page.getByTestId('surface-area-preview')).toContainText('is not a unit this field reads');
  await expect(page.getByTestId('surface-area-preview')).not.toContainText(/Unexpected|index/);
  await page.getByTestId('surface-area').fill('1.2 m²');
  await page.getByTestId('surface-normal').click();
  await page.getByRole('option', { name: /custom/i }).click();
  const axes = page.locator('mat-dialog-container .vector input');
  await axes.nth(0).fill('1');
  await axes.nth(1).fill('0');
  await axes.nth(2).fill('1');
  // (1, 0, 1) has length √2; scaled to 1 it is (0.707, 0, 0.707).
  await expect(page.getByTestId('surface-normal-note')).toHaveText('Length 1.414 scaled to 1: saved as (0.707, 0, 0.707).');
  await screenshot(page, 'everyday-surface-units');
  await page.getByTestId('surface-material').click();
  await page.getByRole('option').first().click();
  await page.getByTestId('surface-save').click();
  await expect(page.getByTestId('surface-row').filter({ hasText: 'Side panel' })).toContainText('1.2');

  // The sweep plots over dates: every tick is an ISO date or a 24-hour clock, never AM/PM.
  await page.getByRole('tab', { name: 'Mission sweep' }).click();
  await page.getByTestId('sweep-run').click();
  await expect(page.getByTestId('sweep-done')).toBeVisible({ timeout: 60_000 });
  const ticks = await page.getByTestId('sweep-beta-plot').locator('.ecl-axis-tick text').allTextContents();
  expect(ticks.length).toBeGreaterThan(2);
  for (const tick of ticks) expect(tick).toMatch(/^(\d{4}(-\d{2}(-\d{2})?)?|\d{2}:\d{2}(:\d{2})?|[-−]?[\d.,]+)$/);
  expect(ticks.join(' ')).not.toMatch(/AM|PM|Mar|Sun|Mon/);
  await screenshot(page, 'everyday-sweep-24h');
});

test('forms: after a token is made the emptied name field shows no error', async ({ page }) => {
  await signIn(page, 'analyst@kestrel.test');
  await page.goto('/tokens');
  await page.getByTestId('token-name').fill(`everyday ${Date.now()}`);
  await page.getByTestId('token-create').click();
  await expect(page.getByTestId('token-secret')).toBeVisible();
  await expect(page.getByTestId('token-name')).toHaveValue('');
  await expect(page.locator('mat-error')).toHaveCount(0);
  await screenshot(page, 'everyday-token-made');
});

test('forms: after an invitation is sent the emptied e-mail field shows no error', async ({ page }) => {
  await signIn(page, 'owner@kestrel.test');
  await page.getByRole('link', { name: 'Members' }).click();
  await page.getByTestId('invite-email').fill(`everyday.${Date.now()}@partner-thermal-lab.test`);
  await page.getByTestId('invite-submit').click();
  await expect(page.getByTestId('invitation-table')).toBeVisible();
  await expect(page.getByTestId('invite-email')).toHaveValue('');
  await expect(page.locator('mat-error')).toHaveCount(0);
});

// At 390 px the members, invitations and tokens tables are cards (.ecl-stacked-rows-narrow): nothing
// scrolls sideways, in either theme, and a row's Remove is reached with the keyboard from its role.
test('members, invitations and API tokens fit a 390 px phone, light and dark', async ({ page }) => {
  await signIn(page, 'owner@kestrel.test');
  await page.goto('/tokens');
  await page.getByTestId('token-name').fill('phone width check');
  await page.getByTestId('token-create').click();
  await expect(page.getByTestId('token-secret')).toBeVisible();
  await page.getByRole('link', { name: 'Members' }).click();
  await page.getByTestId('invite-email').fill('margaret.hollingsworth-okonkwo@partner-thermal-lab.test');
  await page.getByTestId('invite-submit').click();
  await expect(page.getByTestId('invitation-table')).toBeVisible();
  const membersUrl = page.url();
  const fits = async (testId: string): Promise<void> => {
    const table = page.getByTestId(testId);
    await expect(table).toBeVisible();
    const [scroll, client] = await table.locator('xpath=..').evaluate((wrap) => [wrap.scrollWidth, wrap.clientWidth]);
    expect(scroll, `${testId} scrolls sideways`).toBeLessThanOrEqual(client);
  };
  await page.setViewportSize({ width: 390, height: 844 });
  for (const scheme of ['light', 'dark'] as const) {
    await page.emulateMedia({ colorScheme: scheme });
    await page.goto(membersUrl);
    await fits('member-table');
    await fits('invitation-table');
    await page.getByTestId('member-table').locator('mat-select').nth(1).focus();
    await page.keyboard.press('Tab');
    await expect(page.getByRole('button', { name: /^Remove / }).first()).toBeFocused();
    await screenshot(page, `everyday-390-${scheme}-members`);
    await page.goto('/tokens');
    await fits('token-table');
    await screenshot(page, `everyday-390-${scheme}-tokens`);
  }
});

// Our internals, as a user must never read them: camelCase identifiers, dotted field paths,
// file names and NaN. E-mail addresses and hosts ("owner@kestrel.test") are not identifiers.
const INTERNALS = [
  { what: 'an identifier', pattern: /(?<![\w@.\-/])[a-z]+[A-Z][a-zA-Z0-9]*\b/ },
  { what: 'a field path', pattern: /(?<![\w@.\-/])[a-z]+\.[a-z]+[A-Z]\w*/ },
  { what: 'a file name', pattern: /\b[\w-]+\.(md|ts|mjs|js|json)\b/ },
  { what: 'NaN', pattern: /\bNaN\b/ },
  { what: 'our notes', pattern: /from memory|DOMAIN/ },
  // snake_case ("thermal_model", "c_p", "T_node"); not a token's shown prefix ("ecl_Fyv…")
  { what: 'a code name', pattern: /\b(?!ecl_)(?:[a-z]+|[A-Z])_[a-z]+\b/ },
];

async function internalsOn(page: Page): Promise<string[]> {
  // what is folded away (sources, assumptions) is read too
  await page.locator('details:not([open])').evaluateAll((all) => all.forEach((d) => d.setAttribute('open', '')));
  // an icon's ligature ("account_circle") is drawn as a picture, not read; both read at one moment
  const seen = await page.locator('body').evaluate((body) => ({
    text: (body as unknown as { innerText: string }).innerText,
    icons: Array.from(body.querySelectorAll('mat-icon')).map((icon) => ((icon as { textContent: string | null }).textContent ?? '').trim()),
  }));
  const text = seen.text;
  const icons = new Set(seen.icons);
  return INTERNALS.flatMap(({ what, pattern }) => {
    const match = [...text.matchAll(new RegExp(pattern.source, 'g'))].find((m) => !icons.has(m[0]));
    return match ? [`${what}: "${match[0]}" in "…${text.slice(Math.max(0, (match.index ?? 0) - 40), (match.index ?? 0) + 40).replace(/\s+/g, ' ')}…"`] : [];
  });
}

for (const role of roles) {
  test(`the ${role} reads no identifiers, file names or NaN on any page`, async ({ page }) => {
    test.setTimeout(180_000);
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, `${role}@kestrel.test`);
    const found: string[] = [];
    const visit = async (label: string): Promise<void> => {
      await page.waitForLoadState('networkidle');
      for (const problem of await internalsOn(page)) found.push(`${label} (${page.url()}): ${problem}`);
    };
    const links = await page.locator('nav a[href]').evaluateAll((as) => as.map((a) => a.getAttribute('href') ?? ''));
    for (const href of [...new Set(links)].filter((h) => h.startsWith('/'))) {
      await page.goto(href);
      await visit(href);
      // One level deeper: the first mission, load case and thermal model of each list, every tab.
      const first = page.locator('main a[href*="/missions/"], main a[href*="/cases/"], main a[href*="/thermal/"]').first();
      if ((await first.count()) > 0) {
        await first.click();
        await visit(`first item under ${href}`);
        const tabs = page.getByRole('tab');
        for (let i = 0; i < (await tabs.count()); i++) {
          await tabs.nth(i).click();
          await visit(`tab ${i + 1} under ${href}`);
        }
      }
    }
    expect(found, found.join('\n')).toEqual([]);
  });
}

test('the main dialogs and a thermal run\'s results show no identifiers, file names or NaN either', async ({ page }) => {
  test.setTimeout(240_000);
  await page.setViewportSize({ width: 1440, height: 900 });
  await signIn(page, 'owner@kestrel.test');
  const found: string[] = [];
  const scan = async (label: string): Promise<void> => {
    for (const problem of await internalsOn(page)) found.push(`${label}: ${problem}`);
  };
  const closeDialog = async (): Promise<void> => {
    await page.keyboard.press('Escape');
    await expect(page.locator('mat-dialog-container')).toHaveCount(0);
  };

  // New mission: as it opens, and refused empty (its errors)
  await page.getByTestId('mission-new').click();
  await dialogReady(page);
  await scan('new mission');
  await page.getByTestId('mission-save').click();
  await scan('new mission, saved empty');
  await closeDialog();

  // Add orbit: the editor, and a period in a unit it does not read
  await page.getByTestId('mission-row').first().locator('a').first().click();
  await expect(page.getByTestId('mission-title')).toBeVisible();
  await page.getByTestId('orbit-add').click();
  await expect(page.getByTestId('orbit-name')).toBeFocused();
  await scan('add orbit');
  await page.getByTestId('definition-period').click();
  await page.getByTestId('orbit-period').fill('3 fortnights and a bit');
  await page.getByTestId('orbit-save').click();
  await scan('add orbit, refused');

  // Derive cases and a custom case
  await page.getByRole('link', { name: 'Load cases' }).first().click();
  await page.getByTestId('derive-cases').click();
  await dialogReady(page);
  await scan('derive cases');
  await page.getByTestId('derive-submit').click();
  await scan('derive cases, sent empty');
  await closeDialog();
  await page.getByTestId('new-custom-case').click();
  await dialogReady(page);
  await scan('new custom case');
  await closeDialog();

  // A released case: the new revision form, and the compare dialog
  const releasedRow = page.getByTestId('case-table').locator('tr').filter({ has: page.locator('ecl-case-status', { hasText: /^\s*Released\s*$/ }) });
  await releasedRow.first().getByTestId('case-link').click();
  await expect(page.getByTestId('case-name')).toBeVisible();
  await page.getByTestId('case-new-revision').click();
  await expect(page.getByTestId('case-revise')).toBeVisible();
  await page.getByTestId('case-revision-start').click();
  await expect(page.getByTestId('case-error')).toBeVisible();
  await scan('new revision');
  await page.getByTestId('case-compare').click();
  await dialogReady(page);
  await scan('compare with');
  await closeDialog();

  // A thermal run's results, everything folded open
  await page.getByRole('link', { name: 'Thermal models' }).click();
  await page.getByRole('link', { name: /Kestrel-1 bus, 4 nodes/ }).click();
  await page.getByTestId('run-case').click();
  await page.getByRole('option', { name: /hot/ }).first().click();
  await clickAndAwaitAnswer(page, page.getByTestId('run-model'), THERMAL_RUN_PATH, 90_000);
  await expect(page.getByTestId('run-progress')).toBeHidden();
  await expect(page.getByTestId('run-results')).toBeVisible();
  await scan('thermal run results');
  await screenshot(page, 'everyday-thermal-run-assumptions');
  expect(found, found.join('\n')).toEqual([]);
});

test('screenshots of the changed screens at 390 px and in the dark theme', async ({ page }) => {
  test.setTimeout(180_000);
  await page.emulateMedia({ colorScheme: 'dark' });
  await page.setViewportSize({ width: 390, height: 844 });
  await signIn(page, 'analyst@kestrel.test');
  await screenshot(page, 'everyday-390-dark-landing');
  await page.getByTestId('mission-row').first().locator('a').first().click();
  await expect(page.getByTestId('mission-title')).toBeVisible();
  await expect(page.getByTestId('orbit-row-period').first()).toHaveText(/ (s|min|h|d)$/);
  await page.getByTestId('orbit-add').click();
  await expect(page.getByTestId('orbit-name')).toBeFocused();
  await page.getByTestId('definition-period').click();
  await page.getByTestId('orbit-period').fill('14 d');
  await page.getByTestId('orbit-eccentricity').fill('0');
  await page.getByTestId('orbit-inclination').fill('12 q');
  await expect(page.getByTestId('error-inclination')).toContainText('is not a unit this field reads');
  // Nothing in the editor is wider than the phone (it would slide the page sideways).
  const editorBox = await page.getByTestId('orbit-editor').boundingBox();
  expect(editorBox && editorBox.x >= 0 && editorBox.x + editorBox.width <= 390).toBe(true);
  await screenshot(page, 'everyday-390-dark-orbit-editor');
  await page.setViewportSize({ width: 1440, height: 900 });
  await page.getByRole('tab', { name: 'Surfaces' }).click();
  await page.getByTestId('surface-add').click();
  await dialogReady(page);
  await page.getByTestId('surface-area').fill('2 furlongs');
  await expect(page.getByTestId('surface-area-preview')).toContainText('is not a unit this field reads');
  await page.screenshot({ path: 'tmp/screenshots/everyday-1440-dark-surface-area-error.png' });
});
