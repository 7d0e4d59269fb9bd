// An admin on a 390×844 phone issues a BrAPI token under Admin → BrAPI tokens, reads it off the
// screen once, a client outside the browser reads the collection with it, and after the admin
// revokes it the same client is refused. Screenshots go to tests/e2e/screenshots/.
import assert from 'node:assert/strict';
import { before, describe, test } from 'node:test';
import type { Page } from 'playwright-core';
import { choose, navigateTo, screenshot, signIn, useApp } from './browser.js';

const app = useApp();

describe('BrAPI tokens on a phone', () => {
  let page: Page;
  let token = '';

  before(async () => {
    page = await app.newPage({ phone: true });
    await signIn(page, app.url, 'admin@demo.test');
  });

  const brapi = (path: string, bearer: string) => fetch(`${app.url}/brapi/v2/${path}`, { headers: { Authorization: `Bearer ${bearer}` } });

  test('should issue a token for the demo reviewer and show it once, ready to copy', async () => {
    await navigateTo(page, 'BrAPI tokens');
    await page.getByRole('heading', { name: 'BrAPI tokens' }).waitFor();
    assert.match(await page.locator('.base-url code').innerText(), new RegExp(`^${app.url}/brapi/v2$`));
    await page.getByRole('button', { name: 'Issue token' }).click();
    await choose(page, 'Person', /reviewer@demo\.test/);
    await page.getByRole('textbox', { name: 'Label' }).fill('Genebank sync script');
    await page.getByRole('dialog').getByRole('button', { name: 'Issue token' }).click();
    const shown = page.getByTestId('issued-token');
    await shown.waitFor();
    token = (await shown.innerText()).trim();
    assert.match(token, /^hlb_[A-Za-z0-9_-]{43}$/);
    await page.locator('li.token', { hasText: 'Genebank sync script' }).waitFor();
    assert.match(await page.locator('li.token', { hasText: 'Genebank sync script' }).innerText(), /never used/);
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    assert.ok(overflow <= 0, `the page fits the phone's width (${overflow}px too wide)`);
    for (const name of ['Copy token', 'Done']) {
      const box = await page.getByRole('button', { name }).boundingBox();
      assert.ok(box && box.height >= 48, `${name} is a 48px target (${box?.height})`);
    }
    await screenshot(page, 'brapi-token-issued-phone');
  });

  test('should let a client read the collection with the token, and refuse it once revoked', async () => {
    const germplasm = await brapi('germplasm?pageSize=5', token);
    assert.equal(germplasm.status, 200);
    const body = (await germplasm.json()) as { result: { data: { accessionNumber: string }[] } };
    assert.ok(body.result.data.some((g) => g.accessionNumber === 'HL-0001'), 'the demo accession is there');

    await page.getByRole('button', { name: 'Done' }).click();
    // The panel closes in the app's own time after the click: wait for it to go, then check.
    await page.getByTestId('issued-token').waitFor({ state: 'detached' });
    assert.equal(await page.getByTestId('issued-token').count(), 0, 'the token is gone from the screen once done');
    await page.reload();
    await page.locator('li.token', { hasText: 'Genebank sync script' }).getByText(/last used/).waitFor();
    await page.getByRole('button', { name: 'Revoke Genebank sync script' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Revoke' }).click();
    await page.locator('li.token', { hasText: 'Genebank sync script' }).getByText(/Revoked/).waitFor();
    await screenshot(page, 'brapi-token-revoked-phone');

    const refused = await brapi('germplasm', token);
    assert.equal(refused.status, 401);
    assert.match((await refused.json()) as string, /^ERROR - .* - .*revoked/);
  });
});
