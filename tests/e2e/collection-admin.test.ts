// Managing the collection in Chromium against the real server with the demo data: an admin at a
// desk edits a site's season scheme across the year end and adds a plant; a recorder on a phone
// enters descriptor values from the plant sheet in inches, sees the derived ratio, switches units
// without converting what was typed and finds the unit kept on the server; a reviewer opens a
// plant from the progress table and stays on its sheet, read-only.
import assert from 'node:assert/strict';
import { before, describe, test } from 'node:test';
import type { Page } from 'playwright-core';
import { navigateTo, openDialog, screenshot, signIn, useApp, waitForValue } from './browser.js';

const app = useApp();

/** GET an API route with the page's session. */
async function api<T>(page: Page, path: string): Promise<T> {
  return page.evaluate(async (p) => (await fetch(p)).json(), path) as Promise<T>;
}

interface SiteAnswer {
  id: number;
  code: string;
  seasons: { name: string; start: string; end: string }[];
}
interface DescriptorAnswer {
  id: number;
  code: string;
  label: string;
  kind: string;
  numeratorCode: string | null;
  denominatorCode: string | null;
}
interface AccessionAnswer {
  id: number;
  accessionNumber: string;
  name: string;
  plants: { id: number; label: string; plantedOn: string }[];
}

/**
 * A screenshot of the whole page: the shell scrolls inside its content pane, so the window is made
 * as tall as the content for the picture, then put back.
 */
async function wholePage(page: Page, name: string): Promise<void> {
  const size = page.viewportSize()!;
  const height = await page.evaluate(() => {
    const pane = document.querySelector('mat-sidenav-content');
    return (pane?.scrollHeight ?? 0) + (pane?.getBoundingClientRect().top ?? 0);
  });
  await page.setViewportSize({ width: size.width, height: Math.max(size.height, Math.ceil(height)) });
  await screenshot(page, name);
  await page.setViewportSize(size);
}

/** The position of the season row with this name, once the editor shows it. */
async function rowNamed(page: Page, name: string): Promise<number> {
  const names = () =>
    page.locator('hl-season-editor fieldset').evaluateAll((rows) => rows.map((row) => (row.querySelector('input[formcontrolname=name]') as HTMLInputElement | null)?.value));
  await page.waitForFunction(
    (wanted) => [...document.querySelectorAll('hl-season-editor fieldset input[formcontrolname=name]')].some((i) => (i as HTMLInputElement).value === wanted),
    name,
  ).catch(() => undefined);
  const shown = await names();
  const index = shown.indexOf(name);
  assert.ok(index >= 0, `a season called ${name} among ${shown.join(', ')}`);
  return index;
}

/** The season editor's row fields, by their position (0-based) and field label. */
function seasonField(page: Page, row: number, label: 'Name' | 'Starts (MM-DD)' | 'Ends (MM-DD)') {
  return page.locator('hl-season-editor fieldset').nth(row).getByLabel(label);
}

describe('an admin at a desk manages sites and accessions', () => {
  let page: Page;

  before(async () => {
    page = await app.newPage();
    await signIn(page, app.url, 'admin@demo.test');
  });

  test('should edit a site’s seasons to wrap the year end, see an overlap in words, and save', async () => {
    await page.goto(`${app.url}/collection?tab=sites`);
    // The demo's coastal garden has Dry 01-01 → 05-31 and Wet 06-01 → 12-31: nothing wraps yet.
    await page.getByRole('link', { name: 'Cindlecove Collection Garden' }).click();
    await page.waitForURL(/\/collection\/sites\/\d+$/);
    await page.getByRole('heading', { name: 'Seasons' }).waitFor();
    const dry = await rowNamed(page, 'Dry');
    const wet = await rowNamed(page, 'Wet');
    await waitForValue(seasonField(page, dry, 'Starts (MM-DD)'), '01-01');

    // Dry now starts on 1 December: it overlaps Wet until Wet is shortened.
    await seasonField(page, dry, 'Starts (MM-DD)').fill('1201');
    await seasonField(page, dry, 'Name').click(); // leaving the field writes 1201 as 12-01
    await waitForValue(seasonField(page, dry, 'Starts (MM-DD)'), '12-01');
    const overlap = page.locator('.problem', { hasText: 'Overlap:' });
    await overlap.waitFor();
    assert.match(await overlap.innerText(), /“Dry” and “Wet” both cover 1 Dec–31 Dec/);
    assert.equal(await overlap.locator('mat-icon').innerText(), 'layers');
    await page.getByRole('button', { name: 'Save site' }).click();
    await page.getByText('Seasons overlap or share a name').waitFor();

    await seasonField(page, wet, 'Ends (MM-DD)').fill('11-30');
    await page.getByText('Every day of the year falls in exactly one season.').waitFor();
    assert.match(await page.locator('hl-season-editor .legend').innerText(), /Dry\s+1 Dec → 31 May · 182 days \(183 in leap years\), across the year end/);
    // The ring draws the wrapping season as one arc: a single "A" command.
    const arc = await page.locator('hl-year-ring path.arc').first().getAttribute('d');
    assert.equal(arc?.match(/A /g)?.length, 1);
    await wholePage(page, 'collection-season-editor-desk');

    await page.getByRole('button', { name: 'Save site' }).click();
    await page.locator('.save-bar [role=status]', { hasText: 'Saved' }).waitFor();
    const sites = await api<SiteAnswer[]>(page, '/api/sites');
    const saved = sites.find((s) => s.code === 'CCG');
    const stored = saved?.seasons.map(({ name, start, end }) => ({ name, start, end })).sort((a, b) => a.name.localeCompare(b.name));
    assert.deepEqual(stored, [
      { name: 'Dry', start: '12-01', end: '05-31' },
      { name: 'Wet', start: '06-01', end: '11-30' },
    ]);
    await page.reload();
    await page.getByRole('heading', { name: 'Seasons' }).waitFor();
    await page.locator('hl-season-editor fieldset').first().waitFor();
    await waitForValue(seasonField(page, await rowNamed(page, 'Dry'), 'Starts (MM-DD)'), '12-01');
  });

  test('should add a plant to an accession and see it listed with its age', async () => {
    await page.goto(`${app.url}/collection`);
    await page.getByRole('link', { name: 'HL-0001' }).click();
    await page.waitForURL(/\/collection\/accessions\/\d+$/);
    await page.getByRole('heading', { name: /HL-0001/ }).waitFor();
    assert.match(await page.locator('.passport').innerText(), /Accession number\s+ACCENUMB\s+HL-0001/);
    assert.match(await page.locator('.passport').innerText(), /Country of origin\s+ORIGCTY\s+FJI/);

    await page.getByRole('button', { name: 'Add plant' }).click();
    const dialog = await openDialog(page);
    await dialog.getByLabel('Plant label').fill('E2E-07');
    await dialog.getByLabel('Planted on').fill('2025-01-15');
    await dialog.getByRole('button', { name: 'Add plant' }).click();
    await page.locator('li.plant', { hasText: 'E2E-07' }).waitFor();
    assert.match(await page.locator('li.plant', { hasText: 'E2E-07' }).innerText(), /Planted Jan 15, 2025 · \d+ months/);
    const id = Number(new URL(page.url()).pathname.split('/').pop());
    const accession = await api<AccessionAnswer>(page, `/api/accessions/${id}`);
    assert.ok(accession.plants.some((p) => p.label === 'E2E-07' && p.plantedOn === '2025-01-15'));
    await wholePage(page, 'collection-accession-desk');
  });

  test('should offer the MCPD passport CSV from the accessions list', async () => {
    await page.goto(`${app.url}/collection`);
    const link = page.getByRole('link', { name: 'MCPD passport CSV' });
    assert.equal(await link.getAttribute('href'), '/api/accessions/mcpd.csv');
    const [download] = await Promise.all([page.waitForEvent('download'), link.click()]);
    assert.match(download.suggestedFilename(), /\.csv$/);
  });

  test('should change a character’s drift threshold and see the descriptor catalogue', async () => {
    await page.goto(`${app.url}/collection?tab=characters`);
    const row = page.locator('tr', { hasText: 'upper third' }).first();
    const label = (await row.locator('td').nth(1).innerText()).split('\n')[0]!.trim();
    await row.getByRole('button', { name: `Edit ${label}` }).click();
    const dialog = await openDialog(page);
    await dialog.getByLabel('Drift threshold (ΔE00)').fill('2.5');
    await dialog.getByRole('button', { name: 'Save' }).click();
    await dialog.waitFor({ state: 'detached' });
    await page.locator('tr', { hasText: label }).locator('td.number', { hasText: '2.5' }).waitFor();
    const characters = await api<{ label: string; driftThreshold: number }[]>(page, '/api/characters');
    assert.equal(characters.find((c) => c.label === label)?.driftThreshold, 2.5);
    await wholePage(page, 'collection-characters-desk');

    await page.getByRole('tab', { name: 'Descriptors' }).click();
    await page.waitForURL((u) => u.searchParams.get('tab') === 'descriptors');
    const ratioRow = page.locator('tr', { hasText: /ratio/i }).first();
    assert.match(await ratioRow.innerText(), /Ratio[\s\S]*computed, never typed[\s\S]*÷/);
    await wholePage(page, 'collection-descriptors-desk');
  });

  test('should load nothing from another origin', () => {
    assert.deepEqual(app.foreignRequests, []);
  });
});

describe('a recorder on a phone enters descriptors', () => {
  let page: Page;

  before(async () => {
    page = await app.newPage({ phone: true });
    await signIn(page, app.url, 'recorder@demo.test');
  });

  test('should reach the descriptor entry from an accession page', async () => {
    const accessions = await api<AccessionAnswer[]>(page, '/api/accessions');
    const first = accessions.find((a) => a.accessionNumber === 'HL-0001')!;
    await page.goto(`${app.url}/collection/accessions/${first.id}`);
    await page.getByRole('heading', { name: /HL-0001/ }).waitFor();
    await wholePage(page, 'collection-accession-phone');
    await page.getByRole('link', { name: `Record descriptors of plant ${first.plants[0]!.label}` }).click();
    await page.waitForURL((u) => u.pathname === '/record/descriptors' && u.searchParams.get('plant') === String(first.plants[0]!.id));
    await page.getByRole('heading', { name: 'Descriptors' }).waitFor();
  });

  /** The descriptor entry row of a descriptor by its code (the ratio's words also name its parts, so not by text). */
  async function rowOf(code: string) {
    const descriptor = (await api<DescriptorAnswer[]>(page, '/api/descriptors')).find((d) => d.code === code);
    assert.ok(descriptor, `the catalogue has ${code}`);
    return { descriptor, row: page.locator(`#descriptor-${descriptor.id}`), field: page.locator(`#descriptor-${descriptor.id} input`) };
  }

  let sheetUrl = '';

  test('should type petiole 40 in and sheath 28 in from the plant sheet, see the ratio 0.70 computed live, and keep 40 and 28 as typed when switching to metric', async () => {
    const accessions = await api<AccessionAnswer[]>(page, '/api/accessions');
    const plant = accessions.find((a) => a.accessionNumber === 'HL-0001')!.plants[0]!;
    sheetUrl = `${app.url}/record/plant/${plant.id}`;
    await page.goto(sheetUrl);
    await page.getByRole('link', { name: /^Petiole length: / }).click();
    await page.waitForURL((u) => u.pathname === '/record/descriptors' && u.searchParams.get('sheet') === String(plant.id));
    const units = page.getByRole('group', { name: 'Units' });
    await units.getByText('Imperial', { exact: true }).click();
    const petiole = await rowOf('petiole.length');
    const sheath = await rowOf('sheath.length');
    // Each row takes the page's units once it is redrawn: wait for its toggle before typing.
    await petiole.row.locator('.mat-button-toggle-checked', { hasText: 'in' }).waitFor();
    await petiole.field.fill('40');
    await sheath.field.fill('28');
    const ratio = (await api<DescriptorAnswer[]>(page, '/api/descriptors')).find(
      (d) => d.kind === 'ratio' && [d.numeratorCode, d.denominatorCode].sort().join() === 'petiole.length,sheath.length',
    );
    assert.ok(ratio, 'the catalogue has a ratio of petiole and sheath length');
    // The figures: petiole about 40 in, sheath about 28 in, ratio 0.70 (common practice, no source).
    const ratioRow = page.locator('hl-descriptor-row', { hasText: ratio.label });
    await ratioRow.locator('.ratio-value', { hasText: '0.70' }).waitFor();
    assert.match(await ratioRow.innerText(), /computed from (petiole length and sheath length|sheath length and petiole length)/);
    assert.equal(await ratioRow.locator('input').count(), 0, 'a ratio has no field to type in');
    await petiole.row.getByText('stored as 1.016 m · typed 40 in').waitFor();
    await wholePage(page, 'descriptor-entry-phone');

    // Switching the unit reads the same numbers in the new unit: nothing typed is converted.
    await units.getByText('Metric', { exact: true }).click();
    await petiole.row.getByText('stored as 0.4 m · typed 40 cm').waitFor();
    await sheath.row.getByText('stored as 0.28 m · typed 28 cm').waitFor();
    await waitForValue(petiole.field, '40');
    await waitForValue(sheath.field, '28');
    await ratioRow.locator('.ratio-value', { hasText: '0.70' }).waitFor();
    // The choice is the recorder's, kept on the server (not only in this browser).
    await page.waitForFunction(async () => (await (await fetch('/api/account/preferences')).json()).unitSystem === 'metric', undefined, { polling: 250 });
  });

  test('should save both values at once, come back to the sheet, and find the unit kept for the recorder on another phone', async () => {
    const units = page.getByRole('group', { name: 'Units' });
    await units.getByText('Imperial', { exact: true }).click();
    const petiole = await rowOf('petiole.length');
    await petiole.row.getByText('stored as 1.016 m · typed 40 in').waitFor();
    const accessionId = Number(new URL(page.url()).searchParams.get('accession'));
    const plantId = Number(new URL(page.url()).searchParams.get('plant'));
    await page.getByRole('button', { name: 'Save 2 values' }).click();
    await page.getByText('2 values saved.').waitFor();
    await page.waitForURL((u) => u.pathname === `/record/plant/${plantId}`);
    // The sheet shows the saved value in the recorder's units.
    await page.locator('.half.descriptor', { hasText: 'Petiole length' }).getByText('Done · 40.0 in').waitFor();
    const answer = await api<{ plants: { plantId: number | null; values: { code: string; formatted: { metric: string; imperial: string } }[] }[] }>(
      page,
      `/api/accessions/${accessionId}/descriptors`,
    );
    const values = answer.plants.find((p) => p.plantId === plantId)?.values ?? [];
    assert.equal(values.find((v) => v.code === 'petiole.length')?.formatted.imperial, '40.0 in');
    assert.equal(values.find((v) => v.code === 'sheath.length')?.formatted.imperial, '28.0 in');
    await wholePage(page, 'descriptor-entry-saved-phone');
    await page.waitForFunction(async () => (await (await fetch('/api/account/preferences')).json()).unitSystem === 'imperial', undefined, { polling: 250 });

    // Another phone (no storage of this one): the recorder's unit comes from the server.
    const other = await app.newPage({ phone: true });
    await signIn(other, app.url, 'recorder@demo.test');
    await other.goto(sheetUrl);
    await other.getByRole('link', { name: /^Petiole length: / }).click();
    await other.waitForURL((u) => u.pathname === '/record/descriptors');
    await other.getByRole('group', { name: 'Units' }).locator('.mat-button-toggle-checked', { hasText: 'Imperial' }).waitFor();
    await other.locator(`#descriptor-${petiole.descriptor.id}`).locator('.mat-button-toggle-checked', { hasText: 'in' }).waitFor();
  });

  test('should show the recorder the season ring without edit fields', async () => {
    await page.goto(`${app.url}/collection?tab=sites`);
    await page.getByRole('link', { name: /Rellowmere Demonstration Plot/ }).first().click();
    await page.locator('hl-year-ring').waitFor();
    assert.equal(await page.locator('hl-season-editor').count(), 0);
    assert.match(await page.locator('.season-list').innerText(), /Wet 1 Nov → 30 Apr · 181 days \(182 in leap years\), across the year end/);
    await wholePage(page, 'collection-site-phone');
  });
});

describe('an admin on a phone edits seasons', () => {
  test('should show the season editor in one column with the ring on top', async () => {
    const page = await app.newPage({ phone: true });
    await signIn(page, app.url, 'admin@demo.test');
    await page.goto(`${app.url}/collection?tab=sites`);
    await page.getByRole('link', { name: /Hobbenvale Trial Garden/ }).first().click();
    await page.locator('hl-season-editor').waitFor();
    await seasonField(page, await rowNamed(page, 'Rainy'), 'Ends (MM-DD)').fill('09-30');
    await page.locator('.problem', { hasText: 'Gap:' }).waitFor();
    assert.match(await page.locator('.problem', { hasText: 'Gap:' }).innerText(), /No season covers 1 Oct–15 Oct/);
    const ring = await page.locator('hl-year-ring').boundingBox();
    const firstRow = await page.locator('hl-season-editor fieldset').first().boundingBox();
    assert.ok(ring && firstRow && ring.y < firstRow.y, 'the ring comes before the rows on a phone');
    await wholePage(page, 'collection-season-editor-phone');
  });
});

describe('a reviewer follows the progress table', () => {
  test('should open a plant from the table on its sheet to look at, not be sent away', async () => {
    const page = await app.newPage();
    await signIn(page, app.url, 'reviewer@demo.test');
    await page.goto(`${app.url}/collection/progress`);
    const link = page.locator('td.mat-column-plant a').first();
    await link.waitFor();
    const label = (await link.innerText()).trim();
    await link.click();
    await page.waitForURL((u) => /^\/collection\/plants\/\d+$/.test(u.pathname));
    await page.getByRole('heading', { name: new RegExp(`plant ${label}`) }).waitFor();
    await page.getByText('To look at: readings and descriptors are taken from Record by those who record.').waitFor();
    assert.match(new URL(page.url()).pathname, /^\/collection\/plants\/\d+$/, 'still on the sheet, not sent to Review');
    assert.equal(await page.getByRole('button', { name: /^Skip / }).count(), 0, 'nothing to skip on a sheet to look at');
    assert.equal(await page.locator('.rows a[href]').count(), 0, 'no row opens an entry form');
    await wholePage(page, 'plant-sheet-reviewer-desk');
  });
});

describe('an admin on a phone changes the walk order', () => {
  test('should move a row up with a 48 px button, save, and find the new order on the server', async () => {
    const page = await app.newPage({ phone: true });
    await signIn(page, app.url, 'admin@demo.test');
    await navigateTo(page, 'Walk order');
    const rows = page.locator('ol.walk li.entry');
    await rows.nth(1).waitFor();
    const second = (await rows.nth(1).locator('.label').innerText()).trim();
    const first = (await rows.nth(0).locator('.label').innerText()).trim();
    const up = page.getByRole('button', { name: `Move ${second} up` });
    const box = await up.boundingBox();
    assert.ok(box && box.width >= 48 && box.height >= 48, `the move button is a 48 px target (${JSON.stringify(box)})`);
    await up.click();
    // The list is redrawn in the app's own time: wait for the moved row at the top.
    await rows.nth(0).locator('.label', { hasText: second }).waitFor();
    // The keyboard stays on the row that moved (it is at the top now, so on its down arrow).
    await page.waitForFunction((name) => document.activeElement?.getAttribute('aria-label') === `Move ${name} down`, second);
    assert.equal(await page.evaluate(() => document.documentElement.scrollWidth), 390, 'nothing is pushed off the phone screen');
    await wholePage(page, 'walk-order-phone');
    await page.getByRole('button', { name: 'Save walk order' }).click();
    await page.getByText('Walk order saved').waitFor();
    const order = await api<{ label: string }[]>(page, '/api/catalogue/order');
    assert.deepEqual(order.slice(0, 2).map((e) => e.label), [second, first]);
  });
});
