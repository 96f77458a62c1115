// Issue 15 in the browser: a case walked as its author, its reviewer and an importing viewer do it —
// derive, edit the margin, submit, a reviewer's comment and return, the author's fix, release, a new
// revision, compare and the exports — with the "why" quoting the case's own figures throughout.
import { readFile } from 'node:fs/promises';
import { parse as parseCsv } from 'csv-parse/sync';
import { expect, test } from '@playwright/test';
import { api, as, dialogReady, screenshot } from './session';

const mission = 'Kestrel-1 imaging smallsat';

test('derive, edit the margin, review with a comment, return, fix, release, revise, compare and export', async ({ browser }) => {
  test.setTimeout(120_000);
  const thermal = await as(browser, 'thermal@kestrel.test');
  // Derive through the API the page uses (the derive dialog has its own test), then walk the pages.
  const missions = (await api(thermal).get('/missions')).items as { id: string; name: string }[];
  const m = missions.find((x) => x.name === mission)!;
  const orbits = (await api(thermal).get(`/missions/${m.id}/orbits`)).items as { id: string }[];
  const derived = (await api(thermal).send('post', `/missions/${m.id}/cases/derive`, { orbitId: orbits[0]!.id, name: 'Promise walk' })).items as { id: string; workspaceId: string }[];
  const hotId = derived[0]!.id;
  const workspaceId = derived[0]!.workspaceId;
  const page = `/w/${workspaceId}/cases/${hotId}`;

  // Author: edit the margin 25 % -> 30 %; the "why" and the tile follow.
  await thermal.goto(page);
  await expect(thermal.getByTestId('case-factors')).toContainText('heat loads +25 %');
  await thermal.getByTestId('case-edit').click();
  await dialogReady(thermal);
  await thermal.getByTestId('edit-heat-margin').fill('30');
  await thermal.getByTestId('edit-save').click();
  await expect(thermal.locator('mat-dialog-container')).toHaveCount(0);
  const factors = thermal.getByTestId('case-factors');
  await expect(factors).toContainText('heat loads +30 %');
  await expect(factors).not.toContainText('heat loads +25 %');
  const withMargin = (await thermal.getByTestId('case-with-margin').textContent())!.replace(/[^\d.]/g, '');
  await expect(factors).toContainText(`${Number(withMargin).toFixed(1)} W orbit-average with margin`);
  await thermal.getByTestId('case-submit').click();
  await dialogReady(thermal);
  await thermal.getByTestId('review-confirm').click();
  await expect(thermal.getByTestId('case-status')).toContainText(/review/i);
  // The author of a case in review is offered no release and no return.
  await expect(thermal.getByTestId('case-release')).toHaveCount(0);
  await expect(thermal.getByTestId('case-return')).toHaveCount(0);
  await screenshot(thermal, 'case-promise-author-in-review');

  // Reviewer: a comment, then return to the author with what to change.
  const owner = await as(browser, 'owner@kestrel.test');
  await owner.goto(page);
  await owner.getByTestId('case-comment-text').fill('Which albedo table is this from?');
  await owner.getByTestId('case-comment').click();
  await expect(owner.getByTestId('case-comments')).toContainText('Which albedo table is this from?');
  await owner.getByTestId('case-comment-text').fill('Please use the agreed 35 % heat-load margin.');
  await owner.getByTestId('case-return').click();
  await expect(owner.getByTestId('case-status')).toContainText(/draft/i);
  await expect(owner.getByTestId('case-comments')).toContainText('returned revision 1 to its author');
  await screenshot(owner, 'case-promise-reviewer-returned');

  // Author: sees the returned comment, fixes the margin, resubmits.
  await thermal.reload();
  await expect(thermal.getByTestId('case-comments')).toContainText('Please use the agreed 35 % heat-load margin.');
  await thermal.getByTestId('case-edit').click();
  await dialogReady(thermal);
  await thermal.getByTestId('edit-heat-margin').fill('35');
  await thermal.getByTestId('edit-save').click();
  await expect(thermal.locator('mat-dialog-container')).toHaveCount(0);
  await expect(thermal.getByTestId('case-factors')).toContainText('heat loads +35 %');
  await thermal.getByTestId('case-submit').click();
  await dialogReady(thermal);
  await thermal.getByTestId('review-confirm').click();
  await expect(thermal.getByTestId('case-status')).toContainText(/review/i);

  // Reviewer releases.
  await owner.reload();
  await owner.getByTestId('case-release').click();
  await dialogReady(owner);
  await owner.getByTestId('review-confirm').click();
  await expect(owner.getByTestId('release-done')).toBeVisible();
  await owner.getByTestId('release-close').click();
  await expect(owner.getByTestId('case-status')).toContainText(/released/i);
  await screenshot(owner, 'case-promise-reviewer-released');

  // The author starts a new revision with its reason, on the page; it is released, then compared with the first.
  await thermal.reload();
  await thermal.getByTestId('case-new-revision').click();
  await thermal.getByTestId('case-revision-start').click();
  await expect(thermal.getByTestId('case-error')).toContainText('Say why this revision is made');
  await thermal.getByTestId('case-revision-reason').fill('Systems asked for a 40 % heat-load margin');
  await thermal.getByTestId('case-revision-start').click();
  await expect(thermal.getByTestId('case-revision')).toContainText('Revision 2');
  await expect(thermal.getByTestId('case-revision-reason-shown')).toContainText('Systems asked for a 40 % heat-load margin');
  await screenshot(thermal, 'case-promise-author-new-revision');
  const rev2 = await api(thermal).get(`/cases/${thermal.url().split('/').pop()!}`);
  await api(thermal).send('patch', `/cases/${String(rev2.id)}`, { version: rev2.version, margins: { heatLoadPercent: 40 } });
  await api(thermal).send('post', `/cases/${String(rev2.id)}/submit`);
  await api(owner).send('post', `/cases/${String(rev2.id)}/release`);

  // Viewer (importing team): the released case, its "why" at a glance, compare and the exports.
  const viewer = await as(browser, 'viewer@kestrel.test');
  await viewer.goto(`/w/${workspaceId}/cases/${String(rev2.id)}`);
  await expect(viewer.getByTestId('case-factors')).toContainText('heat loads +40 %');
  await expect(viewer.getByTestId('case-comment-text')).toHaveCount(0);
  await expect(viewer.getByTestId('case-edit')).toHaveCount(0);
  await screenshot(viewer, 'case-promise-viewer');
  await viewer.getByTestId('case-compare').click();
  await dialogReady(viewer);
  await viewer.getByTestId('compare-pick').click();
  await viewer.getByRole('option').filter({ hasText: /Promise walk hot .*revision 1\b/ }).first().click();
  await viewer.getByTestId('compare-go').click();
  await expect(viewer).toHaveURL(/compare/);
  // Revision 1 (35 %) is A, revision 2 (40 %) is B: new − old, in percentage points, labelled in words.
  const marginRow = viewer.getByRole('row').filter({ hasText: 'Heat-load margin' }).first();
  await expect(marginRow).toContainText('+5.0 percentage points');
  await expect(viewer.getByText('margins.heatLoadPercent')).toHaveCount(0);
  await screenshot(viewer, 'case-promise-compare');

  await viewer.goto(`/w/${workspaceId}/cases/${String(rev2.id)}`);
  const download = viewer.waitForEvent('download');
  await viewer.getByTestId('export-csv').click();
  const csv = await readFile((await (await download).path())!, 'utf8');
  const rows = parseCsv(csv, { columns: true }) as Record<string, string>[];
  const json = (await api(viewer).get(`/cases/${String(rev2.id)}/export?format=json`)) as { results: { total: { orbitAverageWithMarginW: number } }; checksum: string };
  const total = rows.find((r) => r['row'] === 'orbit average' && r['surface'] === 'spacecraft total')!;
  expect(Number(total['absorbed total with margin (W)'])).toBeCloseTo(json.results.total.orbitAverageWithMarginW, 2);
  expect(total['checksum (sha256)']).toBe(json.checksum);
  expect(total['caution']).toMatch(/Preliminary-design estimate/);
  await Promise.all([thermal.close(), owner.close(), viewer.close()]);
});
