// One plant characterised completely from its sheet on a 390×844 phone window: every seeded
// colour character by instrument and every descriptor, counting the taps a recorder makes. After
// the first colour character each one costs at most five taps ("Next character on this plant",
// L*, a*, b*, save). The sheet then shows 100 %. Screenshots go to tests/e2e/screenshots/.
import assert from 'node:assert/strict';
import { before, describe, test } from 'node:test';
import type { Locator, Page } from 'playwright-core';
import QRCode from 'qrcode';
import sharp from 'sharp';
import { screenshot, signIn, useApp } from './browser.js';
import { signInOverHttp } from './http-session.js';

const app = useApp();

interface SheetAnswer {
  rows: { colour: { characterId: number; label: string; status: string } | null; descriptor: { descriptorId: number; code: string; kind: string; status: string } | null }[];
  progress: { colour: { done: number; total: number }; descriptors: { done: number; total: number } };
}

/** Invented L*a*b* values that walk round the hue circle, one per character (not measured from any plant). */
function labFor(i: number): [string, string, string] {
  const h = (i * 37 * Math.PI) / 180;
  return [String(35 + (i % 5) * 8), (Math.cos(h) * 24).toFixed(1), (Math.sin(h) * 24).toFixed(1)];
}

describe('the plant sheet on a phone', () => {
  let page: Page;
  let plantId: number;
  let taps = 0;

  /** A tap the recorder makes (a click, or a tap into a field before typing). */
  const tap = async (target: Locator) => {
    taps += 1;
    await target.click();
  };
  const typeInto = async (field: Locator, text: string) => {
    await tap(field);
    await field.fill(text);
  };

  before(async () => {
    await app.ready();
    const server = app.server;
    // A plant of its own, so nothing of the demo's readings counts on its sheet.
    const admin = await signInOverHttp(server.url, 'admin@demo.test', 'demo-pass-2026');
    const sites = (await (await fetch(`${server.url}/api/sites`, { headers: admin.headers() })).json()) as { id: number }[];
    const res = await fetch(`${server.url}/api/accessions`, {
      method: 'POST',
      headers: admin.json(),
      body: JSON.stringify({ accessionNumber: 'HL-E2E-SHEET', name: 'Sheet Walk', siteId: sites[0]!.id, plants: [{ label: 'W1', plantedOn: '2025-09-01' }] }),
    });
    assert.equal(res.status, 201);
    plantId = ((await res.json()) as { plants: { id: number }[] }).plants[0]!.id;
    page = await app.newPage({ phone: true });
    await signIn(page, app.url, 'recorder@demo.test');
  });

  const sheet = () => page.evaluate(async (id) => (await fetch(`/api/plants/${id}/sheet`)).json(), plantId) as Promise<SheetAnswer>;

  test('should characterise every colour character by instrument with at most five taps each after the first', async () => {
    await page.goto(`${app.url}/record/plant/${plantId}`);
    await page.getByText(/0 of \d+ colour characters, 0 of \d+ descriptors/).waitFor();
    await screenshot(page, 'plant-sheet-start');
    const colourRows = (await sheet()).rows.filter((r) => r.colour).map((r) => r.colour!);
    assert.ok(colourRows.length >= 20, `${colourRows.length} colour characters seeded`);

    // The first: open it from the sheet, choose the method and the instrument's illuminant/observer once (no light: it lights the sample).
    await tap(page.getByRole('link', { name: `${colourRows[0]!.label}: to do, read it` }));
    await page.waitForURL(/\/record\?/);
    await tap(page.getByRole('radio', { name: /Instrument/ }));
    await tap(page.getByRole('radio', { name: 'D65 / 10°' }));
    const perCharacter: number[] = [];
    for (const [i, row] of colourRows.entries()) {
      const before = taps;
      if (i > 0) {
        await tap(page.getByRole('button', { name: 'Next character on this plant' }));
        await page.getByRole('button', { name: 'Save reading' }).waitFor();
      }
      // The form says which character it is on before anything is typed.
      await page.getByRole('combobox', { name: /Character/ }).filter({ hasText: row.label }).waitFor();
      const [l, a, b] = labFor(i);
      await typeInto(page.getByLabel('L*', { exact: true }), l);
      await typeInto(page.getByLabel('a*', { exact: true }), a);
      await typeInto(page.getByLabel('b*', { exact: true }), b);
      await tap(page.getByRole('button', { name: 'Save reading' }));
      await page.getByText(/Saved as reading \d+/).waitFor();
      if (i > 0) perCharacter.push(taps - before);
      if (i === 1) await screenshot(page, 'plant-sheet-saved-next');
    }
    assert.ok(Math.max(...perCharacter) <= 5, `taps per colour character after the first: ${perCharacter.join(', ')}`);
    const after = await sheet();
    assert.equal(after.progress.colour.done, after.progress.colour.total);
  });

  test('should take every descriptor from the sheet and show the plant 100 % done', async () => {
    // With no colour character left, "next" goes back to the sheet.
    await tap(page.getByRole('button', { name: 'Next character on this plant' }));
    await page.waitForURL(new RegExp(`/record/plant/${plantId}$`));
    const rows = (await sheet()).rows.filter((r) => r.descriptor).map((r) => r.descriptor!);
    await tap(page.locator('.half.descriptor a.open').first());
    await page.waitForURL(/\/record\/descriptors\?/);
    for (const d of rows) {
      const row = page.locator(`#descriptor-${d.descriptorId}`);
      if (d.kind === 'category') await tap(row.getByRole('option').first());
      else await typeInto(row.getByRole('textbox'), d.kind === 'count' ? '3' : d.kind === 'mass' ? '1.2' : '40');
    }
    await tap(page.getByRole('button', { name: /^Save \d+ values/ }));
    await page.waitForURL(new RegExp(`/record/plant/${plantId}$`));
    await page.getByText('100 %').waitFor();
    const done = await sheet();
    assert.equal(done.progress.descriptors.done, done.progress.descriptors.total);
    await page.getByText(/Every row of this plant is done or skipped/).waitFor();
    await screenshot(page, 'plant-sheet-complete');
  });

  test('should open a plant’s sheet from a photo of its label on the Record page', async () => {
    // The label's QR as printed (the plant sheet's address), photographed on a grainy background.
    const qr = await QRCode.toBuffer(`${app.url}/record/plant/${plantId}`, { errorCorrectionLevel: 'M', margin: 4, width: 300 });
    const photo = await sharp({ create: { width: 1000, height: 750, channels: 3, background: { r: 96, g: 104, b: 60 } } })
      .composite([{ input: await sharp(qr).rotate(5, { background: '#ffffff' }).flatten({ background: '#ffffff' }).png().toBuffer(), left: 340, top: 200 }])
      .jpeg({ quality: 80 })
      .toBuffer();
    await page.goto(`${app.url}/record`);
    await page.getByRole('button', { name: 'Scan a label' }).waitFor();
    await screenshot(page, 'record-scan-a-label');
    await page.getByLabel('Photo of a plant label').setInputFiles({ name: 'label.jpg', mimeType: 'image/jpeg', buffer: photo });
    await page.waitForURL(new RegExp(`/record/plant/${plantId}$`));
    await page.getByText('HL-E2E-SHEET plant').waitFor();
  });
});
