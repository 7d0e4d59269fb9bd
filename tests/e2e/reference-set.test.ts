import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { BrowserContext, Page } from 'playwright-core';
import { navigateTo, screenshot, signIn, useApp } from './browser.js';

const app = useApp();

/** The codes of the match strip, nearest first. */
async function stripCodes(page: Page): Promise<string[]> {
  return (await page.locator('hl-match-strip .code').allInnerTexts()).map((t) => t.trim());
}

describe('a recorder on a phone matches and browses the reference set', () => {
  let browser: BrowserContext;
  let page: Page;

  before(async () => {
    browser = await app.newContext({ phone: true });
    page = await browser.newPage();
    await signIn(page, app.url, 'recorder@demo.test');
  });
  after(async () => {
    await browser?.close();
  });

  test('should reach the reference set from the navigation', async () => {
    await navigateTo(page, 'Reference set');
    await page.waitForURL((u) => u.pathname === '/reference-set/match');
    await page.getByRole('heading', { name: 'Your colour' }).waitFor();
  });

  test('should match a typed hex and show codes, ΔE00 and verdicts in words, checked by the server', async () => {
    await page.getByLabel('Hex colour').fill('#7b3f6e');
    await page.getByText('Checked by the server against set v1').waitFor();
    const codes = await stripCodes(page);
    assert.equal(codes.length, 5);
    for (const code of codes) assert.match(code, /^F-\d{3}(\.\d{3})?$/);
    const strip = await page.locator('hl-match-strip').innerText();
    assert.match(strip, /ΔE00\s+\d+\.\d{2}/);
    assert.match(strip, /indistinguishable|close|clearly different/);
    // The page's answer is the server's: compare with the API itself.
    const server = await page.evaluate(async () => {
      const xsrf = document.cookie.split('; ').find((c) => c.startsWith('XSRF-TOKEN='))?.split('=')[1] ?? '';
      const res = await fetch('/api/match', { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-XSRF-TOKEN': decodeURIComponent(xsrf) }, body: JSON.stringify({ hex: '#7b3f6e' }) });
      return (await res.json()) as { matches: { code: string }[]; between: { a: string; b: string } };
    });
    assert.deepEqual(codes, server.matches.map((m) => m.code));
    const words = await page.locator('hl-between-bar .words').innerText();
    assert.match(words, new RegExp(`${server.between.a}.*${server.between.b}`));
    assert.match(words, /nearer|half-way/);
    assert.match(await page.locator('hl-screen-caution').innerText(), /Screen colours are approximate; judge against the physical chip in good light/);
    await screenshot(page, 'reference-set-match-phone');
    // The shell scrolls inside its content pane: scroll the strip into view for a second picture.
    await page.locator('hl-match-strip').scrollIntoViewIfNeeded();
    await screenshot(page, 'reference-set-match-strip-phone');
    await page.locator('hl-between-bar').scrollIntoViewIfNeeded();
    await screenshot(page, 'reference-set-match-between-phone');
  });

  test('should match an instrument reading given as L*a*b*', async () => {
    await page.getByRole('radio', { name: /L\*a\*b\*/ }).or(page.getByRole('button', { name: /L\*a\*b\*/ })).first().click();
    await page.getByLabel('L*').fill('62.5');
    await page.getByLabel('a*').fill('-18');
    await page.getByLabel('b*').fill('41');
    await page.getByRole('button', { name: 'Match' }).click();
    await page.getByText('Checked by the server').waitFor();
    assert.match(await page.locator('.input-facts').innerText(), /L\* 62\.50, a\* −18\.00, b\* 41\.00/);
    assert.equal((await stripCodes(page)).length, 5);
  });

  test('should refuse an L* above 100 with a message by the field', async () => {
    await page.getByLabel('L*').fill('120');
    await page.getByRole('button', { name: 'Match' }).click();
    await page.getByText('L* from 0 to 100').waitFor();
  });

  test('should open a field chip into its fine chips and show a fine chip’s numbers', async () => {
    await page.getByRole('tab', { name: 'Browse chips' }).or(page.getByRole('link', { name: 'Browse chips' })).first().click();
    await page.waitForURL((u) => u.pathname === '/reference-set/browse');
    // Field chips by hue sector, each heading with its h° range (names of our own).
    await page.getByRole('group', { name: 'wine h° 350–30 field chips' }).waitFor();
    await screenshot(page, 'reference-set-browse-phone');
    await page.getByRole('button', { name: /^F-087,/ }).click();
    await page.waitForURL((u) => u.searchParams.get('chip') === 'F-087');
    const fines = page.getByRole('group', { name: 'fine chips of F-087' });
    await fines.waitFor();
    const fineCodes = (await fines.locator('.code').allInnerTexts()).map((t) => t.trim());
    assert.ok(fineCodes.length >= 8, `F-087 has fine chips (${fineCodes.length})`);
    for (const code of fineCodes) assert.match(code, /^F-087\.\d{3}$/);
    // Keyboard: focus a fine chip and open it with Enter.
    await fines.getByRole('button').nth(1).focus();
    await page.keyboard.press('Enter');
    await page.waitForURL((u) => u.searchParams.get('chip') === fineCodes[1]);
    const detail = page.locator('hl-chip-detail');
    await detail.getByText(fineCodes[1]!, { exact: true }).first().waitFor();
    const text = await detail.innerText();
    assert.match(text, /CIELAB\s+L\* \d+\.\d{2}, a\* −?\d+\.\d{2}, b\* −?\d+\.\d{2}/);
    assert.match(text, /LCh\s+L\* \d+\.\d{2}, C\* \d+\.\d{2}, h° \d+\.\d/);
    assert.match(text, /#[0-9a-f]{6}/);
    assert.match(text, /inside sRGB|outside sRGB/);
    assert.match(text, /Field chip\s+F-087/);
    assert.match(text, /ΔE00 \d+\.\d{2}/);
    await screenshot(page, 'reference-set-fine-chip-phone');
    await fines.scrollIntoViewIfNeeded();
    await screenshot(page, 'reference-set-fine-chips-phone');
  });

  test('should jump to a chip typed as a code', async () => {
    await page.getByLabel('Find a code').fill('F-120.003');
    await page.waitForURL((u) => u.searchParams.get('chip') === 'F-120.003');
    await page.locator('hl-chip-detail .code', { hasText: 'F-120.003' }).waitFor();
    await page.getByLabel('Find a code').fill('F-999');
    await page.getByText('There is no chip F-999 in set v1.').first().waitFor();
  });

  test('should offer the printable card as a PDF download', async () => {
    const link = page.getByRole('link', { name: 'Download printable card (PDF)' });
    assert.equal(await link.getAttribute('href'), '/api/reference-sets/v1/card.pdf');
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    assert.equal(download.suggestedFilename(), 'hueledger-field-card-v1.pdf');
  });

  test('should offer the fine-chip booklet as a PDF download', async () => {
    const link = page.getByRole('link', { name: 'Download fine-chip booklet (PDF)' });
    assert.equal(await link.getAttribute('href'), '/api/reference-sets/v1/booklet.pdf');
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    assert.equal(download.suggestedFilename(), 'hueledger-fine-chip-booklet-v1.pdf');
  });

  test('should load nothing from another origin', () => {
    assert.deepEqual(app.foreignRequests, []);
  });
});

describe('a reviewer at a desk browses the reference set', () => {
  let browser: BrowserContext;

  before(async () => {
    browser = await app.newContext();
  });
  after(async () => {
    await browser?.close();
  });

  test('should see the field chips beside the chosen chip’s detail, and a match strip', async () => {
    const page = await browser.newPage();
    await signIn(page, app.url, 'reviewer@demo.test');
    await page.goto(`${app.url}/reference-set/browse?chip=F-087.014`);
    await page.locator('hl-chip-detail .code', { hasText: 'F-087.014' }).waitFor();
    const families = await page.locator('.families').boundingBox();
    const chosen = await page.locator('aside.chosen').boundingBox();
    assert.ok(families && chosen && chosen.x > families.x + families.width - 1, 'the chosen chip sits beside the families on a desk');
    await screenshot(page, 'reference-set-browse-desktop');
    await page.goto(`${app.url}/reference-set/match`);
    await page.getByLabel('Hex colour').fill('#c8b27a');
    await page.getByText('Checked by the server against set v1').waitFor();
    await screenshot(page, 'reference-set-match-desktop');
    await page.close();
  });
});
