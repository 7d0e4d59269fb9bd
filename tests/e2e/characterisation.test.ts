// What colour a variety is, as a curator sees it on a phone (issue 14): the accession page's
// characterisation (accepted colours on the grey surround with their chip codes), the printable
// record, the look-alike page finding the demo's planted duplicate, and the Drift landing page
// listing the demo's drifting pair first. Screenshots go to tests/e2e/screenshots/.
import assert from 'node:assert/strict';
import { before, describe, test } from 'node:test';
import type { Page } from 'playwright-core';
import { DEMO_DRIFT } from '../../server/demo/demo-readings.js';
import { DEMO_DUPLICATE } from '../../server/demo/demo-scenario.js';
import { screenshot, signIn, useApp } from './browser.js';

const app = useApp();

describe('the characterisation of an accession, on a phone', () => {
  let page: Page;
  const ids = new Map<string, number>();

  before(async () => {
    page = await app.newPage({ phone: true });
    await signIn(page, app.url, 'reviewer@demo.test');
    const accessions = (await (await page.request.get(`${app.url}/api/accessions`)).json()) as { id: number; accessionNumber: string }[];
    for (const a of accessions) ids.set(a.accessionNumber, a.id);
  });

  test('should show each colour character\'s accepted colour on the grey surround with its chip code, and flag the drifting one', async () => {
    await page.goto(`${app.url}/collection/accessions/${ids.get(DEMO_DRIFT.accessionNumber)}`);
    const section = page.locator('hl-characterisation');
    await section.getByRole('heading', { name: 'Colour characterisation' }).waitFor();
    const stripes = section.locator('li.character', { hasText: 'stripes' });
    await stripes.waitFor();
    const code = (await stripes.locator('.colour .code').innerText()).trim();
    assert.match(code, /^F-\d{3}(\.\d{3})?$/);
    assert.equal(await stripes.locator('.colour').evaluate((el) => getComputedStyle(el).backgroundColor), 'rgb(119, 119, 119)', 'the neutral grey surround (L* 50)');
    assert.match(await stripes.innerText(), /flagged: \d+ season change/);
    // The accepted colour's nearest chip in v1 and in v2, each on the grey surround with its code.
    const sets = stripes.getByTestId('set-chips');
    assert.match(await sets.locator('[data-set="v1"]').innerText(), new RegExp(`^F-\\d{3}[\\s\\S]*In set v1 \\(current, shown above\\): ${code.replace('.', '\\.')} `));
    assert.match(await sets.locator('[data-set="v2"]').innerText(), /In set v2: F-(19\d|2\d\d|3\d\d|4[0-2]\d)(\.\d{3})? .*ΔE00 \d/);
    assert.match(await section.innerText(), /approximate/);
    await stripes.scrollIntoViewIfNeeded();
    await screenshot(page, 'characterisation-accession');
    const pdf = await page.request.get(`${app.url}/api/accessions/${ids.get(DEMO_DRIFT.accessionNumber)}/profile.pdf`);
    assert.equal(pdf.status(), 200);
    assert.equal((await pdf.body()).subarray(0, 5).toString('latin1'), '%PDF-');
  });

  test('should find the planted duplicate among the look-alike accessions', async () => {
    await page.goto(`${app.url}/collection/accessions/${ids.get(DEMO_DUPLICATE.sameAs)}`);
    await page.getByRole('link', { name: 'Look-alike accessions' }).click();
    const first = page.locator('ol.items > li').first();
    await first.waitFor();
    assert.match(await first.innerText(), new RegExp(`${DEMO_DUPLICATE.accessionNumber}[\\s\\S]*Possible duplicate`));
    assert.match(await page.locator('ul.pairs').innerText(), new RegExp(`${DEMO_DUPLICATE.sameAs}.*and.*${DEMO_DUPLICATE.accessionNumber}`));
    await screenshot(page, 'characterisation-similar');
  });

  test('should list the demo\'s drifting pair first on the Drift landing page, opening its detail', async () => {
    await page.goto(`${app.url}/drift`);
    const first = page.locator('hl-drift-overview-list ol.items > li').first();
    await first.waitFor();
    assert.match(await first.innerText(), new RegExp(DEMO_DRIFT.accessionNumber));
    await screenshot(page, 'characterisation-drift-overview');
    await first.getByRole('link').first().click();
    await page.waitForURL(/accessionId=\d+&characterId=\d+/);
    await page.locator('hl-comparison-list').waitFor();
  });
});
