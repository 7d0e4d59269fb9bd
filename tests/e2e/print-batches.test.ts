// An admin re-measures a printed field card in Chromium on a phone: records the print batch,
// pastes the measured CIELAB of three patches and reads each patch's ΔE00 from its chip and the
// batch's median. Expected ΔE00 from colorjs.io's CIEDE2000 on the same numbers
// (tests/reference/cross-check.test.ts shows it agrees with Sharma, Wu & Dalal 2005).
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import Color from 'colorjs.io';
import type { BrowserContext } from 'playwright-core';
import type { ChipDto } from '../../shared/api/reference-set-answers.js';
import { choose, screenshot, signIn, useApp } from './browser.js';

const app = useApp();

/** Invented instrument readings: each chip's CIELAB as a printer might move it. */
const OFFSETS = [[0.5, -0.4, 0.3], [2.5, -2.0, 3.5], [-1.0, 0.6, -0.8]] as const;

describe('a printed card re-measured', () => {
  let phone: BrowserContext;

  before(async () => {
    phone = await app.newContext({ phone: true });
  });
  after(async () => {
    await phone?.close();
  });

  test('should record a print batch, take pasted measurements and show each patch and the median, refusing a bad line without saving', async () => {
    const page = await phone.newPage();
    await signIn(page, app.url, 'admin@demo.test');
    await page.goto(`${app.url}/reference-set/prints`);
    await page.getByText('No print batch recorded yet.').waitFor();
    assert.match(await page.getByRole('note').first().innerText(), /approximate/);

    await choose(page, 'Reference set', /^v2/);
    await page.getByRole('radio', { name: 'Field card' }).click();
    await page.getByLabel('Printed on').fill('2026-11-20');
    await page.getByLabel('Printer and paper').fill('Office laser, 160 g matt paper');
    await page.getByRole('button', { name: 'Record the batch' }).click();
    await page.getByRole('heading', { name: /Field card of set v2, printed/ }).waitFor();
    await page.getByText('No patches measured yet').waitFor();

    // A code no set has: refused on its line, nothing saved.
    const box = page.getByLabel('Measured patches', { exact: true });
    await box.fill('F-999 50 0 0');
    await page.getByRole('button', { name: 'Save the patches' }).click();
    await page.getByText('Line 1 (chip code): F-999 is not a chip of set v2').waitFor();
    await page.getByText('No patch of this batch measured yet.').waitFor();

    const body = await (await page.request.get(`${app.url}/api/reference-sets/v2/chips`)).json();
    const chips = ((Array.isArray(body) ? body : body.chips) as ChipDto[]).filter((c) => c.parent === null).slice(0, 3);
    const round = (v: number) => Math.round(v * 100) / 100;
    const measured = chips.map((c, i): [number, number, number] => [round(c.lab[0] + OFFSETS[i]![0]), round(c.lab[1] + OFFSETS[i]![1]), round(c.lab[2] + OFFSETS[i]![2])]);
    await box.fill(chips.map((c, i) => `${c.code}\t${measured[i]!.join('\t')}`).join('\n'));
    await page.getByRole('button', { name: 'Save the patches' }).click();
    await page.getByText('3 patches saved.').waitFor();

    const expected = chips.map((c, i) => new Color('lab', [...c.lab]).deltaE(new Color('lab', measured[i]!), '2000')).sort((p, q) => p - q);
    const summary = await page.getByTestId('print-summary').innerText();
    assert.match(summary, new RegExp(`median ΔE00 ${expected[1]!.toFixed(2)}, largest ${expected[2]!.toFixed(2)}`), summary);
    assert.equal((await page.locator('.patch').count()), 3);
    await screenshot(page, 'print-batch-phone');
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    assert.ok(overflow <= 0, `nothing sticks out sideways (${overflow} px)`);

    await page.getByRole('link', { name: 'All print batches' }).click();
    await page.getByRole('link', { name: /Field card of set v2/ }).waitFor();
    assert.match(await page.getByRole('link', { name: /Field card of set v2/ }).innerText(), /3 patches: median ΔE00/);
    await page.close();
  });
});
