// Records in plain words, in Chromium with the demo data (issue 17): the admin's audit page reads
// as sentences with filters and a subtitle, a reading's caption gives its number, wrap-year seasons
// are named by both years, From after To is refused with a message, one date style follows the
// browser's locale on every page that shows one, and a reviewer sees no "New reading" button.
import assert from 'node:assert/strict';
import { before, describe, test } from 'node:test';
import type { Page } from 'playwright-core';
import { DEMO_DRIFT } from '../../server/demo/demo-readings.js';
import { choose, openDialog, screenshot, signIn, useApp } from './browser.js';

/** A calendar date as ISO 8601 writes it: never what a person should read on a page. */
const ISO_DAY = /\b\d{4}-\d{2}-\d{2}\b/;
/** A day as en-GB writes it in the app's style ("9 Mar 2026"). */
const GB_DAY = /\b\d{1,2} [A-Z][a-z]{2,3} 20\d\d\b/;
/** A day as en-US writes it in the app's style ("Mar 9, 2026"). */
const US_DAY = /\b[A-Z][a-z]{2} \d{1,2}, 20\d\d\b/;

const app = useApp();

describe('records in plain words', () => {
  let admin: Page;

  before(async () => {
    admin = await app.newPage({ locale: 'en-GB' });
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
    assert.match(await admin.getByRole('alert').innerText(), /From 2 May 2026 is after To 1 May 2026: choose a From on or before To\.$/);
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
    assert.match(await admin.locator('p.range-error').innerText(), /From 1 Jun 2025 is after To 1 May 2025/);
    assert.ok(!admin.url().includes('to=2025-05-01'), 'the refused date is not applied');
    assert.equal(await to.inputValue(), '');
  });

  test('should refuse From after To in the review queue filters with a message, leaving the queue as it was', async () => {
    const reviewer = await app.newPage({ locale: 'en-GB' });
    await signIn(reviewer, app.url, 'reviewer@demo.test');
    await reviewer.goto(`${app.url}/review`);
    const from = reviewer.getByLabel('Observed from');
    await from.waitFor();
    await from.fill('2025-06-01');
    await reviewer.waitForURL(/from=2025-06-01/);
    const to = reviewer.getByLabel('Observed to');
    await to.fill('2025-05-01');
    await reviewer.locator('p.range-error').waitFor();
    assert.match(await reviewer.locator('p.range-error').innerText(), /From 1 Jun 2025 is after To 1 May 2025: choose a From on or before To\./);
    assert.ok(!reviewer.url().includes('to=2025-05-01'), 'the refused date is not applied');
    assert.equal(await to.inputValue(), '');
    await to.fill('2025-07-01');
    await reviewer.waitForURL(/to=2025-07-01/);
    await reviewer.locator('p.range-error').waitFor({ state: 'detached' });
  });

  test('should write the dates of calibration, the accession and its characterisation, and drift in the locale’s style, never as ISO', async () => {
    const accessions = (await admin.evaluate(() => fetch('/api/accessions').then((r) => r.json()))) as { id: number; accessionNumber: string }[];
    const characters = (await admin.evaluate(() => fetch('/api/characters').then((r) => r.json()))) as { id: number; code: string }[];
    const accessionId = accessions.find((a) => a.accessionNumber === DEMO_DRIFT.accessionNumber)!.id;
    const characterId = characters.find((c) => c.code === DEMO_DRIFT.characterCode)!.id;
    const sessions = (await admin.evaluate(() => fetch('/api/calibration/sessions').then((r) => r.json()))) as { id: number; status: string }[];
    const closed = sessions.find((s) => s.status === 'closed')!;
    // Each page is read once what it loads is on screen: its section headings, its plant list, its table rows.
    const pages: { path: string; ready: string[] }[] = [
      { path: '/calibration', ready: ['main h2'] },
      { path: '/calibration/records', ready: ['main h2'] },
      { path: `/calibration/sessions/${closed.id}`, ready: ['[data-testid="kappa-interval"]', 'main p.status'] },
      { path: `/collection/accessions/${accessionId}`, ready: ['hl-characterisation li.character', 'main p:has-text("Planted")'] },
      { path: `/drift?accessionId=${accessionId}&characterId=${characterId}`, ready: ['hl-groups-table tbody tr'] },
    ];
    for (const { path, ready } of pages) {
      await admin.goto(`${app.url}${path}`);
      for (const selector of ready) await admin.locator(selector).first().waitFor();
      const text = await admin.locator('main').innerText();
      assert.doesNotMatch(text, ISO_DAY, `${path} shows no ISO date`);
      assert.match(text, GB_DAY, `${path} writes its dates as en-GB does`);
    }
    const us = await app.newPage({ locale: 'en-US' });
    await signIn(us, app.url, 'admin@demo.test');
    await us.goto(`${app.url}/drift?accessionId=${accessionId}&characterId=${characterId}`);
    const groups = us.locator('hl-groups-table tbody tr').first();
    await groups.waitFor();
    assert.match(await groups.innerText(), US_DAY, 'the same table follows an en-US browser');
  });

  test('should name wrap-year seasons by both years on the characterisation record, the drift table, the plant sheet and collection progress', async () => {
    const accessions = (await admin.evaluate(() => fetch('/api/accessions').then((r) => r.json()))) as { id: number; accessionNumber: string; plants: { id: number; label: string }[] }[];
    const characters = (await admin.evaluate(() => fetch('/api/characters').then((r) => r.json()))) as { id: number; code: string }[];
    const accession = accessions.find((a) => a.accessionNumber === DEMO_DRIFT.accessionNumber)!;
    const characterId = characters.find((c) => c.code === DEMO_DRIFT.characterCode)!.id;
    // The demo's drifting pair was read at RDP, whose Wet season runs November to April.
    await admin.goto(`${app.url}/collection/accessions/${accession.id}`);
    const stripes = admin.locator('hl-characterisation li.character', { hasText: 'stripes' });
    await stripes.locator('.strip').waitFor();
    assert.match(await stripes.innerText(), /Wet 2025–26/);
    assert.doesNotMatch(await stripes.innerText(), /Wet 2025(?!–)/, 'no wet season named by one year only');
    await admin.goto(`${app.url}/drift?accessionId=${accession.id}&characterId=${characterId}`);
    const wetRow = admin.locator('hl-groups-table tbody tr', { hasText: 'Wet' }).first();
    await wetRow.waitFor();
    assert.match(await wetRow.locator('th').innerText(), /^Wet 20\d\d–\d\d$/);
    // Progress is for today's season at the plant's site: the API's season, named as people say it.
    const plant = accession.plants[0]!;
    const sheet = (await admin.evaluate((id) => fetch(`/api/plants/${id}/sheet`).then((r) => r.json()), plant.id)) as { progress: { season: string | null; seasonYear: number } };
    const { season, seasonYear } = sheet.progress;
    const expected = season === null ? `no season ${seasonYear}` : season === 'Wet' ? `Wet ${seasonYear}–${String((seasonYear + 1) % 100).padStart(2, '0')}` : `${season} ${seasonYear}`;
    await admin.goto(`${app.url}/record/plant/${plant.id}`);
    const where = admin.locator('p.where');
    await where.waitFor();
    assert.ok((await where.innerText()).endsWith(`· ${expected}`), `the plant sheet names "${expected}": ${await where.innerText()}`);
    await admin.goto(`${app.url}/collection/progress`);
    const row = admin.locator('tr', { has: admin.locator(`a[href="/record/plant/${plant.id}"]`) });
    await row.waitFor();
    assert.ok((await row.innerText()).includes(expected), `collection progress names "${expected}"`);
  });

  test("should show the plant's earlier readings of the character on the reading page and in the review dialog, swatches on grey with code, day and observer", async () => {
    type Earlier = { id: number; bestChip: string; observerName: string; observedAt: string };
    const withEarlier = (await admin.evaluate(async () => {
      const list = await fetch('/api/readings?pageSize=50').then((r) => r.json());
      for (const r of list.items as { id: number; plantId: number | null }[]) {
        if (r.plantId === null) continue;
        const detail = await fetch(`/api/readings/${r.id}`).then((x) => x.json());
        if (detail.earlier.length >= 2) return { id: r.id as number, earlier: detail.earlier as Earlier[] };
      }
      return null;
    })) as { id: number; earlier: Earlier[] } | null;
    assert.ok(withEarlier, 'the demo has a plant read more than twice for one character');
    await admin.goto(`${app.url}/readings/${withEarlier.id}`);
    const section = admin.locator('[data-testid="earlier-readings"]');
    await section.locator('li').first().waitFor();
    assert.equal(await section.locator('li').count(), withEarlier.earlier.length);
    const first = await section.locator('li').first().innerText();
    const e = withEarlier.earlier[0]!;
    assert.ok(first.includes(e.bestChip) && first.includes(e.observerName), first);
    assert.match(first, GB_DAY, 'the day in the reader’s style');
    assert.equal(await section.locator('.hl-swatch-surround').evaluate((el) => getComputedStyle(el).backgroundColor), 'rgb(119, 119, 119)', 'the neutral grey surround (L* 50)');
    await section.locator('li a').first().click();
    await admin.waitForURL(new RegExp(`/readings/${e.id}$`));

    const reviewer = await app.newPage({ locale: 'en-GB' });
    await signIn(reviewer, app.url, 'reviewer@demo.test');
    await reviewer.goto(`${app.url}/review`);
    await reviewer.getByRole('button', { name: /^Review reading \d+/ }).first().click();
    const dialog = reviewer.getByRole('dialog');
    await dialog.locator('hl-reading-match').waitFor();
    await dialog.locator('[data-testid="earlier-readings"] h3').waitFor();
    assert.match(await dialog.locator('[data-testid="earlier-readings"]').innerText(), /earlier readings of|No earlier reading of this character/);
  });

  test('should show a conflict in words at the field that conflicts, not at the top of the dialog', async () => {
    await admin.goto(`${app.url}/collection`);
    await admin.getByRole('button', { name: 'New accession' }).click();
    const dialog = await openDialog(admin);
    // The demo's first accession, typed in lower case: numbers are compared regardless of case.
    await dialog.getByLabel('Accession number').fill(DEMO_DRIFT.accessionNumber.toLowerCase());
    await dialog.getByRole('textbox', { name: /^Name/ }).fill('A second try');
    await choose(admin, 'Held at site', /RDP/);
    await dialog.getByRole('button', { name: 'Create accession' }).click();
    const field = dialog.locator('mat-form-field', { has: admin.getByLabel('Accession number') });
    const error = field.locator('mat-error');
    await error.waitFor();
    assert.match(await error.innerText(), new RegExp(`an accession ${DEMO_DRIFT.accessionNumber.toLowerCase()} already exists`, 'i'));
    assert.doesNotMatch(await dialog.innerText(), /Conflict|already in use/);
    await dialog.getByRole('button', { name: 'Cancel' }).click();
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
    // An accession and character nobody has read: the Drift page offers "Record one" to the recorder only.
    const empty = (await reviewer.evaluate(async () => {
      const [accessions, characters] = await Promise.all(['/api/accessions', '/api/characters'].map((u) => fetch(u).then((r) => r.json())));
      for (const c of characters as { id: number; colour: boolean }[]) {
        if (!c.colour) continue;
        const list = await fetch(`/api/readings?accessionId=${accessions[0].id}&characterId=${c.id}&includeSuperseded=true`).then((r) => r.json());
        if (list.total === 0) return `accessionId=${accessions[0].id}&characterId=${c.id}`;
      }
      return null;
    })) as string | null;
    assert.ok(empty, 'the demo leaves some character of its first accession unread');
    for (const [page, offered] of [[reviewer, false], [recorder, true]] as const) {
      await page.goto(`${app.url}/drift?${empty}`);
      await page.getByText('No readings of this accession and character yet.').waitFor();
      assert.equal(await page.getByRole('link', { name: 'Record one' }).count(), offered ? 1 : 0, offered ? 'the recorder is offered it' : 'the reviewer is not');
    }
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
