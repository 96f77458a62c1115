// The thermal engineer's path (issue 7): a small model built in the editor (nodes, a coupling with
// a refused value and its message, a heater on a 24-32 V bus), run on the demo hot and cold cases,
// the heater's duty cycle read, and the radiator and heater sized.
import { expect, test, type Page } from '@playwright/test';
import { clickAndAwaitAnswer, screenshot, signIn, THERMAL_RUN_PATH } from './session';

async function choose(page: Page, selectTestId: string, option: RegExp | string): Promise<void> {
  await page.getByTestId(selectTestId).click();
  await page.getByRole('option', { name: option }).first().click();
  // the panel closes with an animation; a click on the select before it is gone does not reopen it
  await expect(page.getByRole('listbox')).toHaveCount(0);
}

async function runOn(page: Page, kind: RegExp): Promise<string> {
  await choose(page, 'run-case', kind);
  await clickAndAwaitAnswer(page, page.getByTestId('run-model'), THERMAL_RUN_PATH, 60_000);
  await expect(page.getByTestId('run-progress')).toBeHidden();
  const results = page.getByTestId('run-results');
  await expect(results).toContainText(kind);
  await expect(page.getByTestId('run-verdict')).toHaveText(/^(PASS|FAIL)$/);
  return (await page.getByTestId('heater-duty').first().innerText()).trim();
}

test('the thermal engineer builds a small model, runs it on the hot and the cold case and sizes it', async ({ page }) => {
  test.setTimeout(180_000);
  await page.setViewportSize({ width: 1400, height: 1000 });
  await signIn(page, 'thermal@kestrel.test');

  await page.getByRole('link', { name: 'Thermal models' }).click();
  // Without a mission in the address the page opens on the first mission that has a model (the
  // Lunar pathfinder, first in the list, has none), with the demo model listed.
  await expect(page.getByTestId('thermal-mission')).toContainText('Kestrel-1 imaging smallsat');
  await expect(page.getByTestId('thermal-models')).toContainText('Kestrel-1 bus, 4 nodes');
  await choose(page, 'thermal-mission', 'Kestrel Lunar pathfinder');
  await expect(page.getByText('No thermal models for this mission yet.')).toBeVisible();
  await choose(page, 'thermal-mission', 'Kestrel-1 imaging smallsat');
  await expect(page.getByTestId('thermal-models')).toContainText('Kestrel-1 bus, 4 nodes');
  await screenshot(page, 'thermal-models-list');

  // "New model" asks for a name first and writes nothing until Create (issue 17).
  await page.getByTestId('new-model').click();
  await expect(page.getByTestId('new-model-name')).toBeFocused();
  await page.getByTestId('new-model-create').click();
  await expect(page.getByText('Give the new model a name.')).toBeVisible();
  await page.getByTestId('new-model-name').fill('Browser battery model');
  await page.getByTestId('new-model-create').click();
  await expect(page.getByTestId('nodes-table')).toBeVisible();
  await page.getByTestId('model-name').fill('Browser battery model');

  // Node 1: the battery.
  await page.getByLabel('Name of node 1', { exact: true }).fill('battery');
  await page.getByLabel('Capacitance of battery (J/K)', { exact: true }).fill('2400');
  await page.getByLabel('Dissipation of battery (W)', { exact: true }).fill('2');
  await page.getByLabel('Minimum operating temperature of battery (°C)', { exact: true }).fill('0');
  await page.getByLabel('Maximum operating temperature of battery (°C)', { exact: true }).fill('30');

  // Node 2: a panel that owns the zenith radiator.
  await page.getByTestId('add-node').click();
  await page.getByLabel('Name of node 2', { exact: true }).fill('panel');
  await page.getByLabel('Capacitance of panel (J/K)', { exact: true }).fill('1000');
  await page.getByLabel('Maximum operating temperature of panel (°C)', { exact: true }).fill('30');
  await page.getByLabel('Surfaces of panel', { exact: true }).click();
  await page.getByRole('option', { name: /Zenith radiator/ }).click();
  await page.keyboard.press('Escape');

  // A coupling: a refused value says why under its cell, then a good one.
  await page.getByTestId('add-coupling').click();
  const conductance = page.getByLabel('Conductance of coupling 1 (W/K)', { exact: true });
  await conductance.fill('-1');
  await conductance.blur();
  await expect(page.getByTestId('couplings-table')).toContainText('conductance must be above 0 W/K (got -1)');
  await screenshot(page, 'thermal-editor-validation');
  await conductance.fill('0.5');
  await expect(page.getByTestId('couplings-table')).not.toContainText('must be above');

  // A thermostat heater on the battery with a 24-32 V bus.
  await page.getByTestId('add-heater').click();
  await page.getByLabel('Installed power of heater 1 (W)', { exact: true }).fill('10');
  await page.getByLabel('On temperature of heater 1 (°C)', { exact: true }).fill('5');
  await page.getByLabel('Off temperature of heater 1 (°C)', { exact: true }).fill('8');
  await page.getByLabel('Minimum bus voltage of heater 1 (V)', { exact: true }).fill('24');
  await page.getByLabel('Nominal bus voltage of heater 1 (V)', { exact: true }).fill('28');
  await page.getByLabel('Maximum bus voltage of heater 1 (V)', { exact: true }).fill('32');

  // Our own margin; without one the case's (17 K by default) applies.
  await page.getByLabel('Operating margin (K)').fill('3');
  await page.getByTestId('save-model').click();
  await expect(page.getByText('Model saved.')).toBeVisible();
  await expect(page.getByTestId('save-model')).toBeDisabled();
  await screenshot(page, 'thermal-editor');

  const hotDuty = await runOn(page, /hot/);
  await screenshot(page, 'thermal-run-hot');
  const coldDuty = await runOn(page, /cold/);
  expect(coldDuty).toMatch(/^\d+(\.\d)? ?%$/);
  // The cold case needs the heater at least as much as the hot one.
  expect(parseFloat(coldDuty)).toBeGreaterThanOrEqual(parseFloat(hotDuty));
  await expect(page.getByTestId('heater-results')).toContainText('24');
  await expect(page.getByTestId('plot-heaters')).toBeVisible();
  await screenshot(page, 'thermal-run-cold');

  await choose(page, 'size-radiator-node', 'panel');
  await choose(page, 'size-heater-node', 'battery');
  await page.getByTestId('size-model').click();
  await expect(page.getByTestId('radiator-area')).toHaveText(/^\d+\.\d{3} m²$/, { timeout: 60_000 });
  await expect(page.getByTestId('heater-power')).toHaveText(/^[\d,]+\.\d{2} W$/);
  await expect(page.getByTestId('sizing-results')).toContainText('limit 75 %');
  await screenshot(page, 'thermal-sizing');
  await expect(page.getByLabel('Design caution')).toContainText('Habitability and touch-temperature limits are not checked.');
});
