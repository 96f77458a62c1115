// Attitude modes and phases (issue 19) as the thermal engineer: the demo mission flown in three
// phases and two modes, a phase added from the keyboard with typed UTC dates (refused beside its field
// outside the mission's dates, and the mission's dates refused when they would leave a phase out), the
// sweep's days by phase, and the cases that name the phase that drove them; light, dark and 390 px.
import { expect, test, type Page } from '@playwright/test';
import { dialogReady, screenshot, signIn } from './session';

const mission = 'Kestrel-2 ocean-colour smallsat';

/** The "Extended mission" phase from the keyboard: its dates typed, avionics at 15 W, saved by Enter. */
async function extendedPhase(page: Page, startDate: string, endDate: string): Promise<void> {
  await page.getByTestId('phase-add').focus();
  await page.keyboard.press('Enter');
  await dialogReady(page);
  await page.keyboard.type('Extended mission');
  await page.getByTestId('phase-start').fill(startDate);
  await page.getByTestId('phase-end').fill(endDate);
  await page.getByTestId('phase-node-add').click();
  await page.getByTestId('phase-node-name-0').fill('avionics');
  await page.getByTestId('phase-node-w-0').fill('15');
  await page.getByTestId('phase-end').press('Enter');
}

test('the thermal engineer reads and adds phases, sweeps the mission by phase and opens a case driven by a phase', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1400, height: 1000 });
  await signIn(page, 'thermal@kestrel.test');
  await page.getByRole('link', { name: 'Missions' }).first().click();
  await page.getByRole('link', { name: mission }).click();
  await page.getByRole('tab', { name: 'Modes and phases' }).click();
  await expect(page.getByTestId('mode-row')).toHaveCount(2);
  await expect(page.getByTestId('mode-table')).toContainText('Body-mounted array → on a body spinning about the Sun, 0° from the spin axis');
  await expect(page.getByTestId('phase-row')).toHaveCount(3);
  await expect(page.getByTestId('phase-table')).toContainText('Launch and early orbit');
  await expect(page.getByTestId('phase-table')).toContainText('camera: 22 W for 1500 s every 5800 s, else 3 W');
  await screenshot(page, 'phases-mission-tab');

  // A phase from the keyboard: typed ISO dates; a reversed range is refused beside its field.
  await extendedPhase(page, '2031-03-31', '2031-01-01');
  await expect(page.getByTestId('phase-end-error')).toContainText('ends before it starts');
  await screenshot(page, 'phases-phase-dialog');
  // A phase after the mission's end is refused beside its field, naming the mission's dates.
  await expect(page.getByTestId('phase-mission-dates')).toContainText('The mission runs 2028-01-10 to 2030-12-31');
  await page.getByTestId('phase-start').fill('2031-01-01');
  await page.getByTestId('phase-end').fill('2031-03-31');
  await page.getByTestId('phase-end').press('Enter');
  await expect(page.getByTestId('phase-end-error')).toContainText('2031-03-31 is after the mission ends (2030-12-31)');
  await screenshot(page, 'phases-phase-dialog-outside-mission');
  await page.keyboard.press('Escape');
  await expect(page.locator('mat-dialog-container')).toHaveCount(0);

  // The mission is extended; cutting it short of a phase is refused beside the end date.
  await page.getByTestId('mission-edit').click();
  await dialogReady(page);
  await page.getByTestId('mission-end').fill('2030-06-30');
  await page.getByTestId('mission-end').press('Enter');
  await expect(page.getByTestId('mission-end-error')).toContainText('2030-06-30 is before the end of phase "Nominal operations" (2028-04-01 to 2030-12-31)');
  await screenshot(page, 'phases-mission-dates-refused');
  await page.getByTestId('mission-end').fill('2031-06-30');
  await page.getByTestId('mission-end').press('Enter');
  await expect(page.locator('mat-dialog-container')).toHaveCount(0);
  await page.getByRole('tab', { name: 'Modes and phases' }).click();
  await extendedPhase(page, '2031-01-01', '2031-03-31');
  await expect(page.getByTestId('phase-row')).toHaveCount(4);
  await expect(page.getByTestId('phase-table')).toContainText('avionics: 15 W');

  // The sweep names each day's phase.
  await page.getByRole('tab', { name: 'Mission sweep' }).click();
  await page.getByTestId('sweep-run').click();
  await expect(page.getByTestId('sweep-done')).toBeVisible({ timeout: 120_000 });
  const phaseRows = page.getByTestId('sweep-phase-row');
  await expect(phaseRows).toHaveCount(4);
  await expect(phaseRows.nth(0)).toContainText('Launch and early orbit');
  await expect(phaseRows.nth(0)).toContainText('Sun safe');
  await expect(phaseRows.nth(0).locator('td').nth(3)).toHaveText('15');
  await expect(phaseRows.nth(3)).toContainText('Extended mission');
  await expect(phaseRows.nth(3).locator('td').nth(3)).toHaveText('90');
  await expect(page.getByTestId('sweep-phases')).not.toContainText('NaN');
  await page.getByTestId('sweep-phases').scrollIntoViewIfNeeded();
  await screenshot(page, 'phases-sweep');

  // The cases name their phase; the survival cold case says so.
  await page.getByRole('link', { name: 'Load cases' }).first().click();
  await expect(page.getByTestId('case-table')).toContainText('Kestrel-2 SSO 600 survival cold');
  await expect(page.getByTestId('case-table').getByTestId('case-variant')).toHaveCount(1);
  await page.getByRole('link', { name: 'Kestrel-2 SSO 600 hot' }).click();
  await expect(page.getByTestId('case-name')).toHaveText('Kestrel-2 SSO 600 hot');
  await expect(page.getByTestId('case-phase')).toContainText('Phase');
  await expect(page.getByTestId('case-phase')).toContainText('attitude mode');
  // the phase that puts the most heat into the spacecraft: its absorbed load and its dissipation, beside every phase's
  await expect(page.getByTestId('case-factors')).toContainText(/puts the most heat into the spacecraft of the mission's phases, orbit-average absorbed load and the dissipation the phase names: \d+\.\d W absorbed \+ \d+\.\d W dissipated = \d+\.\d W; /);
  await expect(page.getByTestId('case-factor-figure').first()).toContainText(/W absorbed \+ dissipated$/);
  await screenshot(page, 'phases-case');

  await page.emulateMedia({ colorScheme: 'dark' });
  await screenshot(page, 'phases-case-dark');
  await page.goBack();
  await page.getByRole('link', { name: 'Missions' }).first().click();
  await page.getByRole('link', { name: mission }).click();
  await page.getByRole('tab', { name: 'Modes and phases' }).click();
  await expect(page.getByTestId('phase-row')).toHaveCount(4);
  await screenshot(page, 'phases-mission-tab-dark');
  await page.setViewportSize({ width: 390, height: 900 });
  await page.emulateMedia({ colorScheme: 'light' });
  await expect(page.getByTestId('phase-row')).toHaveCount(4);
  expect(Number(await page.evaluate('document.documentElement.scrollWidth - document.documentElement.clientWidth'))).toBeLessThanOrEqual(0);
  await screenshot(page, 'phases-mission-tab-390');
  // The Sun-safe mode's dialog at 390 px: the array's pointing chosen, the others as defined.
  await page.getByRole('button', { name: 'Edit mode Sun safe' }).click();
  await dialogReady(page);
  await expect(page.getByTestId('mode-name')).toHaveValue('Sun safe');
  await screenshot(page, 'phases-mode-dialog-390');
  await page.keyboard.press('Escape');

  // The +Y radiator on a spinner in nadir imaging, through the mode's pointing editor (the surface
  // dialog's own); the choice from the keyboard, the save by Enter, the table says it in words.
  await page.getByRole('button', { name: 'Edit mode nadir imaging' }).click();
  await dialogReady(page);
  await page.getByTestId('mode-pointing-2').focus();
  await page.keyboard.press('Enter');
  await page.keyboard.press('ArrowDown');
  await page.keyboard.press('Enter');
  await expect(page.getByTestId('mode-2-pointing-preview')).toHaveText('Faces: facing the orbit normal.');
  await page.getByTestId('mode-2-pointing-kind').click();
  await page.getByRole('option', { name: /spinning body/ }).click();
  await page.getByTestId('mode-2-spin-axis').click();
  await page.getByRole('option', { name: /^Orbit normal/ }).click();
  await page.getByTestId('mode-2-spin-angle').fill('190');
  await expect(page.getByTestId('mode-2-pointing-preview')).toHaveText('The angle from the spin axis is 0 to 180°.');
  await page.getByTestId('mode-2-spin-angle').fill('45');
  await expect(page.getByTestId('mode-2-pointing-preview')).toHaveText('Faces: on a body spinning about the orbit normal, 45° from the spin axis (loads averaged over a turn).');
  const dialog = page.locator('mat-dialog-container');
  expect(await dialog.evaluate((e) => e.scrollWidth - e.clientWidth)).toBeLessThanOrEqual(0);
  await screenshot(page, 'phases-mode-editor-390');
  await page.emulateMedia({ colorScheme: 'dark' });
  await screenshot(page, 'phases-mode-editor-390-dark');
  await page.setViewportSize({ width: 1400, height: 1000 });
  await screenshot(page, 'phases-mode-editor-dark');
  await page.emulateMedia({ colorScheme: 'light' });
  await screenshot(page, 'phases-mode-editor');
  await page.getByTestId('mode-2-spin-angle').press('Enter');
  await expect(dialog).toHaveCount(0);
  await expect(page.getByTestId('mode-table')).toContainText('+Y radiator → on a body spinning about the orbit normal, 45° from the spin axis');
});
