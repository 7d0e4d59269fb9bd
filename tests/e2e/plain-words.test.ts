// Records in plain words, in Chromium with the demo data (issue 17): the admin's audit page reads
// as sentences with filters and a subtitle, a reading's caption gives its number, wrap-year seasons
// are named by both years, From after To is refused with a message, one date style follows the
// browser's locale, and a reviewer sees no "New reading" button.
import assert from 'node:assert/strict';
import { before, describe, test } from 'node:test';
import type { Page } from 'playwright-core';
import { choose, screenshot, signIn, useApp } from './browser.js';

const app = useApp();

describe('records in plain words', () => {
  let admin: Page;

  before(async () => {
    admin = await app.newPage();
    await signIn(admin, app.url, 'admin@demo.test');
  });

  test('should show the audit trail as sentences, say what it holds, and filter it by what', async () => {
    await admin.goto(`${app.url}/admin/audit`);
    await admin.locator('ol.events li p.sentence').first().waitFor();
    assert.match(await admin.locator('p.subtitle').innerText(), /Everything that happened, kept for ever and newest first: .* \d+ events in all\./s);
    const first = await admin.locator('ol.events li p.sentence').first().innerText();
    assert.match(first, /^[A-Z][A-Za-z' -]+ signed in\.$/, 'the admin who just signed in');
    await choose(admin, 'What', 'Readings and reviews');
    await admin.locator('p.subtitle', { hasText: 'match the filters' }).waitFor();
    const actions = await admin.locator('ol.events li').evaluateAll((lis) => lis.map((li) => li.getAttribute('data-action')));
    assert.ok(actions.length > 0 && actions.every((a) => a?.startsWith('reading.')), actions.join(', '));
    const sentences = await admin.locator('ol.events li p.sentence').allInnerTexts();
    assert.ok(sentences.every((s) => !/[{}]|accessionId/.test(s)), 'no raw JSON');
    await admin.getByLabel('From').fill('2026-05-02');
    await admin.getByLabel('To').fill('2026-05-01');
    assert.match(await admin.getByRole('alert').innerText(), /From 2026-05-02 is after To 2026-05-01: choose a From on or before To\.$/);
    await screenshot(admin, 'plain-words-audit-desktop');
  });

  test('should caption a reading with its number, name its wrap-year season by both years, and write dates in the locale’s style', async () => {
    const list = (await admin.evaluate(() => fetch('/api/readings?pageSize=100').then((r) => r.json()))) as { items: { id: number; season: string | null; seasonYear: number | null; seasonLabel: string | null; observedAt: string }[] };
    const wet = list.items.find((r) => r.seasonLabel?.startsWith('Wet ') && r.seasonLabel.includes('–'));
    assert.ok(wet, 'the demo has a reading in a season that wraps the year end');
    assert.equal(wet.seasonLabel, `Wet ${wet.seasonYear}–${String((wet.seasonYear! + 1) % 100).padStart(2, '0')}`);
    await admin.goto(`${app.url}/readings/${wet.id}`);
    const match = admin.locator('hl-reading-match');
    await match.waitFor();
    assert.equal(await match.locator('.head .pair .code').first().innerText(), `reading ${wet.id}`);
    const page = await admin.locator('.hl-page').innerText();
    assert.ok(page.includes(wet.seasonLabel!), `the page names ${wet.seasonLabel}`);
    const shown = await admin.evaluate((iso) => new Intl.DateTimeFormat(navigator.languages?.[0] ?? navigator.language, { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' }).format(new Date(iso)), wet.observedAt);
    assert.ok(page.includes(shown), `the observed time is written "${shown}"`);
  });

  test('should refuse From after To in the readings filters with a message, leaving the list as it was', async () => {
    await admin.goto(`${app.url}/readings`);
    const from = admin.getByLabel('From', { exact: true });
    await from.waitFor();
    await from.fill('2025-06-01');
    await admin.waitForURL(/from=2025-06-01/);
    const to = admin.getByLabel('To', { exact: true });
    await to.fill('2025-05-01');
    assert.match(await admin.locator('p.range-error').innerText(), /From 2025-06-01 is after To 2025-05-01/);
    assert.ok(!admin.url().includes('to=2025-05-01'), 'the refused date is not applied');
    assert.equal(await to.inputValue(), '');
  });

  test('should show a reviewer no "New reading" button, and a recorder one', async () => {
    const reviewer = await app.newPage({ phone: true });
    await signIn(reviewer, app.url, 'reviewer@demo.test');
    await reviewer.goto(`${app.url}/readings`);
    await reviewer.getByRole('heading', { name: 'Readings' }).waitFor();
    await reviewer.locator('div.toolbar').waitFor();
    assert.equal(await reviewer.getByRole('link', { name: 'New reading' }).count(), 0);
    const recorder = await app.newPage({ phone: true });
    await signIn(recorder, app.url, 'recorder@demo.test');
    await recorder.goto(`${app.url}/readings`);
    await recorder.getByRole('link', { name: 'New reading' }).waitFor();
  });

  test('should approve the filtered queue page with one confirmation', async () => {
    const reviewer = await app.newPage();
    await signIn(reviewer, app.url, 'reviewer@demo.test');
    await reviewer.goto(`${app.url}/review`);
    const button = reviewer.getByRole('button', { name: /Approve all \d+ shown/ });
    await button.waitFor();
    const count = Number(/Approve all (\d+) shown/.exec(await button.innerText())![1]);
    await button.click();
    await reviewer.getByRole('dialog').getByText(`Approve ${count} readings?`).waitFor();
    await reviewer.getByRole('dialog').getByRole('button', { name: `Approve ${count}` }).click();
    await reviewer.getByText(`${count} readings approved.`).waitFor();
    await screenshot(reviewer, 'plain-words-bulk-approve-desktop');
  });
});
