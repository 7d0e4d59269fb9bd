// A calibration session run in Chromium against the real server with the demo data: the demo
// trainer creates a session with three specimens (two by chip code, one by instrument L*a*b*),
// three observers (the demo recorder on a phone, the reviewer and the admin on laptops) pick their
// chips on the trainee screen, the trainer watches the results fill in and closes the session, and
// the numbers on the screen are checked against a hand computation written here: Fleiss' κ and
// Cohen's κ from the picks, and each observer's mean ΔE00 computed with colorjs.io (an independent
// CIEDE2000 implementation; the app uses culori).
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { after, before, describe, test } from 'node:test';
import Color from 'colorjs.io';
import type { BrowserContext, Page } from 'playwright-core';
import { screenshot, signIn, useApp } from './browser.js';

const app = useApp();

type LabTuple = [number, number, number];
interface Chip {
  code: string;
  parent: string | null;
  lab: LabTuple;
}

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');
const CHIPS: Chip[] = JSON.parse(readFileSync(path.join(root, 'reference-colors/reference-set-v1.json'), 'utf8')).chips;
const chip = (code: string): Chip => CHIPS.find((c) => c.code === code) ?? assert.fail(`no chip ${code}`);
const fieldOf = (code: string): string => chip(code).parent ?? code;

/**
 * CIEDE2000 (kL = kC = kH = 1) by colorjs.io on the same L*a*b* numbers. Its deltaE2000 works in its
 * own `lab` space (D50 white), so the numbers are handed over in that space: handing them over as
 * `lab-d65` would convert them to D50 first and compare other colours (tests/reference/cross-check.test.ts).
 */
function deltaE2000(a: LabTuple, b: LabTuple): number {
  return new Color('lab', a).deltaE(new Color('lab', b), '2000');
}

const TITLE = 'Practice plot, week 9';
/** Lower than the default so certification turns on each observer's ΔE00 (κ is moderate here). */
const KAPPA_THRESHOLD = 0.4;
const DELTA_E_THRESHOLD = 1.8;
const SPECIMENS = [
  { label: 'Petiole, middle third', chipCode: 'F-010.003' },
  { label: 'Corm skin', chipCode: 'F-050' },
  { label: 'Leaf blade, upper surface', lab: [64.5, -5.5, 9] as LabTuple },
] as const;
const referenceOf = (i: number): LabTuple => {
  const s = SPECIMENS[i];
  return 'lab' in s ? s.lab : chip(s.chipCode).lab;
};

/** Each observer's picks, specimen by specimen (invented). */
const OBSERVERS = [
  { email: 'recorder@demo.test', phone: true, picks: ['F-010.003', 'F-050', 'F-090.002'] },
  { email: 'reviewer@demo.test', phone: false, picks: ['F-010.002', 'F-048', 'F-090.002'] },
  { email: 'admin@demo.test', phone: false, picks: ['F-010', 'F-050.003', 'F-092'] },
] as const;

/** Fleiss (1971) κ of a subjects × categories count table with the same number of raters per subject. */
function fleissKappa(table: number[][]): number {
  const n = table[0].reduce((a, b) => a + b, 0);
  const N = table.length;
  const pBar = table.reduce((sum, row) => sum + (row.reduce((s, x) => s + x * x, 0) - n) / (n * (n - 1)), 0) / N;
  const k = table[0].length;
  let pe = 0;
  for (let j = 0; j < k; j++) pe += (table.reduce((s, row) => s + row[j], 0) / (N * n)) ** 2;
  return (pBar - pe) / (1 - pe);
}

/** Cohen (1960) κ of two raters' category lists. */
function cohenKappa(a: readonly string[], b: readonly string[]): number {
  const n = a.length;
  const po = a.filter((x, i) => x === b[i]).length / n;
  const cats = [...new Set([...a, ...b])];
  const pe = cats.reduce((s, c) => s + (a.filter((x) => x === c).length / n) * (b.filter((x) => x === c).length / n), 0);
  return (po - pe) / (1 - pe);
}

// The hand computation.
const fields = OBSERVERS.map((o) => o.picks.map(fieldOf));
const categories = [...new Set(fields.flat())];
const table = SPECIMENS.map((_, i) => categories.map((c) => fields.filter((f) => f[i] === c).length));
const EXPECTED_KAPPA = fleissKappa(table);
const EXPECTED_MEAN_DE = OBSERVERS.map((o) => o.picks.reduce((s, code, i) => s + deltaE2000(chip(code).lab, referenceOf(i)), 0) / SPECIMENS.length);
const EXPECTED_CERTIFIED = EXPECTED_MEAN_DE.map((de) => EXPECTED_KAPPA >= KAPPA_THRESHOLD && de <= DELTA_E_THRESHOLD);
const EXPECTED_PAIR_01 = cohenKappa(fields[0], fields[1]);

/** The number printed with two decimals and a true minus sign, as the app prints it. */
const shown = (x: number, decimals = 2) => (x < 0 ? `−${Math.abs(x).toFixed(decimals)}` : x.toFixed(decimals));

async function whoAmI(page: Page): Promise<string> {
  return page.evaluate(async () => ((await (await fetch('/api/auth/me')).json()) as { user: { name: string } }).user.name);
}

/** Picks one specimen's chip on the trainee screen: the field chip, then (if fine) the fine chip, then confirm. */
async function pick(page: Page, code: string, position: number): Promise<void> {
  try {
    await pickSteps(page, code, position);
  } catch (err) {
    await screenshot(page, `calibration-failed-pick-${code}`);
    throw err;
  }
}

async function pickSteps(page: Page, code: string, position: number): Promise<void> {
  const chooser = page.locator('hl-chip-chooser');
  await chooser.getByText('Step 1 of 2').waitFor();
  await chooser.locator(`hl-swatch-grid [data-code="${fieldOf(code)}"]`).click();
  await chooser.getByText(`Step 2 of 2: fine chips of ${fieldOf(code)}`).waitFor();
  if (code !== fieldOf(code)) await chooser.locator(`hl-swatch-grid [data-code="${code}"]`).click();
  const confirm = chooser.getByRole('button', { name: 'Confirm this chip' });
  const box = await confirm.boundingBox();
  assert.ok(box && box.height >= 48, 'the confirm button is a big target');
  await confirm.click();
  await page.getByText(`Saved: ${code} for specimen ${position}`).waitFor();
}

describe('a trainer runs a calibration session with three observers', () => {
  let trainerBrowser: BrowserContext;
  let trainer: Page;
  const observers: { browser: BrowserContext; page: Page; name: string }[] = [];
  let sessionUrl = '';

  before(async () => {
    trainerBrowser = await app.newContext();
    trainer = await trainerBrowser.newPage();
    await signIn(trainer, app.url, 'trainer@demo.test');
  });
  after(async () => {
    for (const o of observers) await o.browser.close();
    await trainerBrowser?.close();
  });

  test('hand computation is what we think it is', () => {
    // Three observers agree on specimen 1's field chip and two of three on 2 and 3: P̄ = 5/9,
    // P̄e = 19/81, κ = 26/62 (worked by hand; Fleiss 1971, eq. for κ).
    assert.ok(Math.abs(EXPECTED_KAPPA - 26 / 62) < 1e-12);
    assert.ok(Math.abs(EXPECTED_PAIR_01 - 4 / 7) < 1e-12);
  });

  test('should create a session with three specimens from the sessions page', async () => {
    await trainer.goto(`${app.url}/calibration`);
    await trainer.getByRole('button', { name: /New session/ }).click();
    await trainer.getByLabel('Title').fill(TITLE);
    await trainer.getByLabel('Group agreement κ at least').fill(String(KAPPA_THRESHOLD));
    // The words under the field follow the typed value: wait for them rather than read at once.
    await trainer.locator('hl-session-form').filter({ hasText: /Landis & Koch \(1977\) call agreement "substantial"[\s\S]*Paravina et al\. \(2015\)/ }).waitFor();
    await trainer.getByRole('button', { name: 'Create session' }).click();
    await trainer.waitForURL(/\/calibration\/sessions\/\d+$/);
    sessionUrl = trainer.url();
    for (const s of SPECIMENS) {
      const form = trainer.locator('hl-specimen-form');
      await form.getByLabel('Specimen label').fill(s.label);
      if ('chipCode' in s) {
        await form.getByRole('radio', { name: 'Chip code' }).or(form.getByRole('button', { name: 'Chip code' })).first().click();
        await form.getByLabel('Chip code').fill(s.chipCode);
      } else {
        await form.getByRole('radio', { name: 'Instrument L*a*b*' }).or(form.getByRole('button', { name: 'Instrument L*a*b*' })).first().click();
        await form.getByLabel('L*', { exact: true }).fill(String(s.lab[0]));
        await form.getByLabel('a*', { exact: true }).fill(String(s.lab[1]));
        await form.getByLabel('b*', { exact: true }).fill(String(s.lab[2]));
      }
      await form.getByRole('button', { name: 'Add specimen' }).click();
      await trainer.locator('ol.specimens li', { hasText: s.label }).waitFor();
    }
    assert.equal(await trainer.locator('ol.specimens li').count(), 3);
  });

  test('should let three observers pick their chips on the trainee screen, one on a phone', async () => {
    for (const o of OBSERVERS) {
      const browser = await app.newContext({ phone: o.phone });
      const page = await browser.newPage();
      page.on('console', (m) => m.type() === 'error' && console.error(`[${o.email}] ${m.text()}`));
      await signIn(page, app.url, o.email);
      observers.push({ browser, page, name: await whoAmI(page) });
    }
    for (const [i, o] of OBSERVERS.entries()) {
      const { page } = observers[i];
      await page.goto(`${app.url}/calibration`);
      await page.locator('li.card', { hasText: TITLE }).getByRole('link', { name: 'Take part' }).click();
      await page.getByText(`Specimen 1 of 3: ${SPECIMENS[0].label}`).waitFor();
      for (const [s, code] of o.picks.entries()) {
        await page.getByText(`Specimen ${s + 1} of 3`).waitFor();
        if (i === 0 && s === 0) {
          // The phone picker at its second step, for a person to look at.
          await page.locator('hl-chip-chooser hl-swatch-grid [data-code="F-010"]').click();
          await page.getByText('Step 2 of 2: fine chips of F-010').waitFor();
          await screenshot(page, 'calibration-trainee-picker-phone');
          await page.getByRole('button', { name: 'Other field chips' }).click();
        }
        await pick(page, code, s + 1);
      }
      await page.getByText('3 of 3 answered').waitFor();
      // The trainer's live results fill in without a reload.
      await trainer.getByText(`${(i + 1) * 3} of ${(i + 1) * 3} answers in`).waitFor();
    }
  });

  test('should let an observer change a pick while the session is open', async () => {
    const { page } = observers[2];
    await page.getByRole('button', { name: 'Specimen 3, answered' }).click();
    await page.locator('hl-chip-chooser').getByText('your current pick').waitFor();
    await page.locator('hl-chip-chooser hl-swatch-grid [data-code="F-092.001"]').click();
    await page.getByRole('button', { name: 'Change my pick' }).click();
    await page.getByText('Changed: F-092.001 for specimen 3').waitFor();
    // Back to the planned pick, so the hand computation holds.
    await page.locator('hl-chip-chooser .keep-chip').click();
    await page.getByRole('button', { name: 'Change my pick' }).click();
    await page.getByText('Changed: F-092 for specimen 3').waitFor();
  });

  test('should show live results that match the hand computation, then close with a confirmation', async () => {
    const kappaLine = trainer.locator('[data-testid="fleiss-kappa"]');
    await trainer.waitForFunction((want) => document.querySelector('[data-testid="fleiss-kappa"]')?.textContent?.includes(want), `κ ${shown(EXPECTED_KAPPA)}, moderate agreement`);
    assert.match(await kappaLine.innerText(), new RegExp(`κ ${shown(EXPECTED_KAPPA)}, moderate agreement \\(Landis & Koch 1977\\) over 3 specimens`));
    await trainer.locator('hl-bias-chart').scrollIntoViewIfNeeded();
    assert.equal(await trainer.locator('hl-bias-chart g.arrow').count(), 3, 'one arrow per observer');
    await trainer.getByRole('button', { name: 'Close session' }).click();
    await trainer.getByRole('dialog').getByText('Close this session?').waitFor();
    await trainer.getByRole('dialog').getByRole('button', { name: 'Close session' }).click();
    await trainer.getByText(/Session closed: \d+ observers? certified/).waitFor();
    await trainer.getByText(/Closed on [A-Z][a-z]{2} \d{1,2}, \d{4}: results are frozen/).waitFor();
    await trainer.locator('th', { hasText: 'Certified' }).waitFor();

    for (const [i, o] of observers.entries()) {
      const row = trainer.locator('table.observers tbody tr', { hasText: o.name });
      const text = await row.innerText();
      assert.match(text, new RegExp(`\\b${shown(EXPECTED_MEAN_DE[i])}\\b`), `${o.name}: mean ΔE00 ${shown(EXPECTED_MEAN_DE[i])} (colorjs.io) in “${text}”`);
      assert.match(await row.locator('td.cert').innerText(), EXPECTED_CERTIFIED[i] ? /yes/ : /no/);
      assert.match(text, /reads .* than the reference|no clear bias/);
    }
    // Cohen's κ of the first two observers, in the pair matrix.
    const headers = await trainer.locator('table.pairs thead th').allInnerTexts();
    const col = headers.findIndex((h) => h.includes(observers[1].name));
    const cell = trainer.locator('table.pairs tbody tr', { hasText: observers[0].name }).locator('td').nth(col - 1);
    assert.match(await cell.innerText(), new RegExp(`^${shown(EXPECTED_PAIR_01)}`));

    await trainer.locator('hl-results-view').scrollIntoViewIfNeeded();
    await screenshot(trainer, 'calibration-trainer-results-desktop');
    await trainer.locator('hl-bias-chart svg[role="img"]').scrollIntoViewIfNeeded();
    await screenshot(trainer, 'calibration-trainer-bias-chart-desktop');
    await trainer.locator('table.pairs').scrollIntoViewIfNeeded();
    await screenshot(trainer, 'calibration-trainer-pairs-desktop');
    await trainer.locator('hl-bias-chart mat-button-toggle', { hasText: 'Table' }).click();
    await trainer.locator('table.bias-table').waitFor();
    assert.equal(await trainer.locator('table.bias-table tbody tr').count(), 3);
  });

  test('should show each observer their own result once closed, and refuse a late pick', async () => {
    const { page } = observers[0];
    await page.reload();
    await page.getByText('My mean ΔE00').waitFor();
    assert.match(await page.locator('hl-my-result-view').innerText(), new RegExp(`My mean ΔE00: ${shown(EXPECTED_MEAN_DE[0])} over 3 specimens`));
    assert.match(await page.locator('hl-my-result-view').innerText(), EXPECTED_CERTIFIED[0] ? /Certified\s+for set v1/ : /Not certified/);
    assert.equal(await page.locator('hl-my-result-view li.specimen').count(), 3);
    await screenshot(page, 'calibration-my-result-phone');
    const late = await page.evaluate(async (url) => {
      const id = Number(url.split('/').pop());
      const xsrf = decodeURIComponent(document.cookie.split('; ').find((c) => c.startsWith('XSRF-TOKEN='))?.split('=')[1] ?? '');
      const detail = await (await fetch(`/api/calibration/sessions/${id}`)).json();
      const res = await fetch(`/api/calibration/sessions/${id}/responses`, { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-XSRF-TOKEN': xsrf }, body: JSON.stringify({ specimenId: detail.specimens[0].id, chipCode: 'F-001' }) });
      return res.status;
    }, sessionUrl);
    assert.equal(late, 409);
  });

  test('should offer practice with ΔE00 and a verdict in words, and say it is no certification', async () => {
    const { page } = observers[0];
    await page.goto(`${app.url}/calibration/practice?seed=2026`);
    await page.locator('.hl-page').filter({ hasText: /Practice on screen is not a certification/ }).waitFor();
    await page.locator('hl-chip-chooser hl-swatch-grid [data-code]').first().click();
    await page.getByText('Step 2 of 2').waitFor();
    await page.getByRole('button', { name: 'Check my pick' }).click();
    const result = await page.locator('section.result').innerText();
    assert.match(result, /ΔE00\s+\d+\.\d{2}\s+from the target/);
    assert.match(result, /indistinguishable|close|clearly different/);
    await screenshot(page, 'calibration-practice-phone');
  });

  test('should preview a specimen and its neighbours under three simulated deficiencies', async () => {
    await trainer.goto(sessionUrl);
    await trainer.locator('ol.specimens li', { hasText: 'Petiole, middle third' }).getByRole('link', { name: 'Vision preview' }).click();
    await trainer.waitForURL(/\/calibration\/vision\?lab=/);
    for (const name of ['Normal colour vision', 'Protanopia', 'Deuteranopia', 'Tritanopia']) await trainer.getByRole('region', { name }).waitFor();
    assert.equal(await trainer.locator('section.row').count(), 4);
    const codes = await trainer.locator('section.row').first().locator('button.neighbour .code').allInnerTexts();
    assert.equal(codes.length, 6);
    assert.ok(!codes.includes('F-010.003'), 'the specimen’s own chip is not listed as its neighbour');
    assert.match(await trainer.locator('section.row').nth(2).locator('.sentence').innerText(), /^With deuteranopia/);
    await screenshot(trainer, 'calibration-vision-preview-desktop');
  });
});
