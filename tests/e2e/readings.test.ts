// A recorder on a phone records one reading by each of the four methods (instrument L*a*b*, chip
// by eye, on-screen swatch, photo region), finds all four in the Readings table, opens one, and
// downloads the CSV export of them. Screenshots of each step go to tests/e2e/screenshots/.
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { after, before, describe, test } from 'node:test';
import type { BrowserContext, Page } from 'playwright-core';
import sharp from 'sharp';
import { choose, navigateTo, screenshot, signIn, useApp, waitForValue } from './browser.js';

const app = useApp();

const WIDTH = 1200;
const HEIGHT = 900;
/** A phone's height in the browser helper. */
const PHONE_HEIGHT = 844;

/** An invented scene made here: olive ground with a purple petiole band across the middle. */
async function petiolePhoto(): Promise<Buffer> {
  const px = Buffer.alloc(WIDTH * HEIGHT * 3);
  for (let y = 0; y < HEIGHT; y++) {
    for (let x = 0; x < WIDTH; x++) {
      const i = (y * WIDTH + x) * 3;
      const grain = ((x * 7 + y * 13) % 9) - 4;
      const rgb: [number, number, number] = y > 380 && y < 560 ? [122, 52, 98] : [96, 104, 52];
      px[i] = rgb[0] + grain;
      px[i + 1] = rgb[1] + grain;
      px[i + 2] = rgb[2] + grain;
    }
  }
  return sharp(px, { raw: { width: WIDTH, height: HEIGHT, channels: 3 } }).jpeg({ quality: 90 }).toBuffer();
}

/** Saves the form and returns the new reading's id from the saved panel. */
async function saveReading(page: Page): Promise<number> {
  const save = page.getByRole('button', { name: 'Save reading' });
  const box = await save.boundingBox();
  assert.ok(box && box.height >= 48, 'the save button is a big target');
  assert.ok(box.y + box.height > PHONE_HEIGHT - 100, `the save button sits at the bottom of the phone screen (y ${box.y})`);
  await save.click();
  const saved = page.getByText(/Saved as reading \d+/);
  await saved.waitFor();
  const id = Number(/Saved as reading (\d+)/.exec(await saved.innerText())![1]);
  const panel = await page.locator('.saved').innerText();
  assert.match(panel, /F-\d{3}(\.\d{3})?/, 'the best chip is shown');
  assert.match(panel, /ΔE00\s+\d+\.\d{2}/, 'ΔE00 is shown');
  assert.match(panel, /indistinguishable|close|clearly different/, 'the verdict is in words');
  return id;
}

/** Drags across the photo between two points given as fractions of its size. */
async function drag(page: Page, from: [number, number], to: [number, number]): Promise<void> {
  const box = await page.locator('hl-photo-canvas .viewport').boundingBox();
  assert.ok(box, 'the photo is on screen');
  const at = ([fx, fy]: [number, number]) => [box.x + fx * box.width, box.y + fy * box.height] as const;
  await page.mouse.move(...at(from));
  await page.mouse.down();
  for (let k = 1; k <= 6; k++) await page.mouse.move(at(from)[0] + ((at(to)[0] - at(from)[0]) * k) / 6, at(from)[1] + ((at(to)[1] - at(from)[1]) * k) / 6);
  await page.mouse.up();
}

/** The page scrolls inside the frame: scroll it to the end for a second screenshot. */
async function scrollToEnd(page: Page): Promise<void> {
  await page.locator('mat-sidenav-content').evaluate((el) => el.scrollTo(0, el.scrollHeight));
}

describe('readings on a phone: each method, the table, the detail and the export', () => {
  let browser: BrowserContext;
  let page: Page;
  const ids: Record<string, number> = {};

  before(async () => {
    browser = await app.newContext({ phone: true });
    page = await browser.newPage();
    await signIn(page, app.url, 'recorder@demo.test');
  });
  after(async () => {
    await browser?.close();
  });

  test('should record an instrument reading, choosing accession, character and the illuminant/observer it reports (no light)', async () => {
    await navigateTo(page, 'Record');
    await page.getByRole('heading', { name: 'New reading' }).waitFor();
    await page.getByLabel('Accession').fill('HL-0001');
    await page.getByRole('option', { name: /HL-0001/ }).click();
    await choose(page, 'Plant', /^P1/);
    // A character the demo scenario never reads, so the table can be filtered down to these four.
    await choose(page, 'Character', 'Petiole, middle third');
    assert.match(await page.locator('hl-character-picker').innerText(), /How to read it/);
    await screenshot(page, 'readings-form-what');
    await page.getByRole('radio', { name: /Instrument L\*a\*b\*/ }).click();
    await page.getByLabel('L*', { exact: true }).fill('38.5');
    await page.getByLabel('a*', { exact: true }).fill('24.2');
    await page.getByLabel('b*', { exact: true }).fill('-9.6');
    // The instrument lights the sample: no light is asked, its illuminant/observer is.
    assert.equal(await page.getByRole('radio', { name: 'Open shade' }).count(), 0);
    await page.getByRole('radio', { name: 'D65 / 10°' }).click();
    await page.getByRole('radio', { name: 'D65 / 10°', checked: true }).waitFor();
    await page.getByText('cannot be converted exactly without the spectrum', { exact: false }).waitFor();
    const preview = await page.locator('hl-lab-fields .preview').innerText();
    assert.match(preview, /#[0-9a-f]{6}/, 'the colour is previewed as it is typed');
    await screenshot(page, 'readings-form-instrument');
    ids['instrument'] = await saveReading(page);
    await screenshot(page, 'readings-form-saved');
  });

  test('should keep accession and character for the next plant and record a chip picked by eye, asking the light', async () => {
    await page.getByRole('button', { name: 'Next plant' }).click();
    // The form is redrawn for the next plant in the app's own time: wait for the kept values.
    await waitForValue(page.getByLabel('Accession'), /HL-0001/);
    await page.getByRole('radio', { name: /Chip by eye/ }).click();
    await page.getByRole('radio', { name: 'Open shade' }).click();
    await page.getByRole('radio', { name: 'Open shade', checked: true }).waitFor();
    // A plum field chip (anthocyanin petioles), then one of its fine chips.
    const field = page.locator('hl-chip-picker .families hl-swatch-grid button.chip[aria-label*="plum"]').first();
    await field.click();
    await page.locator('hl-chip-picker .fines-heading').waitFor();
    const fine = page.locator('hl-chip-picker .fines-heading + hl-swatch-grid button.chip').nth(2);
    await fine.click();
    await page.locator('hl-chip-picker .fines-heading + hl-swatch-grid button.chip[aria-pressed=true]').waitFor();
    const chosen = await page.locator('hl-chip-picker .chosen-row').innerText();
    assert.match(chosen, /F-\d{3}\.\d{3}/, 'a fine chip is chosen');
    await screenshot(page, 'readings-form-chip');
    ids['chip'] = await saveReading(page);
  });

  test('should record an on-screen swatch with the caution that screens are approximate', async () => {
    await page.getByRole('button', { name: 'Next plant' }).click();
    await page.getByRole('radio', { name: /On-screen swatch/ }).click();
    await page.locator('form').getByText(/Screens are approximate/).waitFor();
    await page.getByLabel('Device colour picker').fill('#6a3a5e');
    await page.locator('hl-swatch-picker .hex').filter({ hasText: /#6[0-9a-f]3[0-9a-f]5[0-9a-f]/ }).waitFor();
    await screenshot(page, 'readings-form-swatch');
    ids['swatch'] = await saveReading(page);
  });

  test('should record a photo region: upload, draw, save as reading, back in the form', async () => {
    await page.getByRole('button', { name: 'Next plant' }).click();
    await page.getByLabel('Notes').fill('photo of the band');
    await page.getByRole('radio', { name: /Photo region/ }).click();
    await page.getByRole('heading', { name: 'Photo reading' }).waitFor();
    await page.locator('input[type=file]:not([capture])').setInputFiles({ name: 'petiole.jpg', mimeType: 'image/jpeg', buffer: await petiolePhoto() });
    await page.locator('hl-photo-canvas img').waitFor();
    await page.waitForFunction(() => (document.querySelector('hl-photo-canvas img') as HTMLImageElement | null)?.complete);
    await drag(page, [0.35, 0.47], [0.65, 0.58]);
    await page.locator('hl-sample-result').waitFor();
    await page.getByRole('button', { name: 'Save as reading' }).click();
    await page.getByRole('heading', { name: 'New reading' }).waitFor();
    await page.locator('hl-photo-summary hl-photo-crop svg').waitFor();
    await page.locator('hl-photo-summary .sample').waitFor();
    assert.equal(await page.getByLabel('Notes').inputValue(), 'photo of the band', 'the half-filled form came back');
    assert.match(await page.getByLabel('Accession').inputValue(), /HL-0001/);
    await page.locator('hl-photo-summary').scrollIntoViewIfNeeded();
    await screenshot(page, 'readings-form-photo');
    ids['photo'] = await saveReading(page);
  });

  test('should find all four in the Readings table, filtered by character to the recorder’s own', async () => {
    await navigateTo(page, 'Readings');
    await page.getByRole('heading', { name: 'Readings' }).waitFor();
    await page.getByRole('button', { name: /Filters/ }).click();
    await choose(page, 'Character', 'Petiole, middle third');
    await page.waitForURL((u) => u.searchParams.has('characterId'));
    await page.getByRole('checkbox', { name: 'Only mine' }).check();
    await page.waitForURL((u) => u.searchParams.has('observerId'));
    await page.getByText('4 readings').waitFor();
    const cards = page.locator('.cards .card');
    assert.equal(await cards.count(), 4);
    const labels = await cards.evaluateAll((els) => els.map((el) => el.getAttribute('aria-label') ?? ''));
    for (const id of Object.values(ids)) assert.ok(labels.some((l) => l.startsWith(`Reading ${id}:`)), `reading ${id} is listed`);
    const text = await page.locator('.cards').innerText();
    for (const method of ['Photo region', 'Instrument L*a*b*', 'Chip by eye', 'On-screen swatch']) assert.ok(text.includes(method), `${method} is shown`);
    await page.getByRole('button', { name: /Filters/ }).click();
    await screenshot(page, 'readings-table-phone');
  });

  test('should open the photo reading’s detail with its crop, chips and history', async () => {
    await page.locator(`.cards .card[aria-label^="Reading ${ids['photo']}:"]`).click();
    await page.getByRole('heading', { name: new RegExp(`Reading ${ids['photo']}`) }).waitFor();
    await page.locator('hl-photo-crop svg path.mark').first().waitFor();
    const body = await page.locator('section.hl-page').innerText();
    assert.match(body, /Nearest chips/);
    assert.match(body, /pixels|used/);
    assert.match(body, /Open shade/);
    assert.match(body, /photo of the band/);
    assert.match(body, /History/);
    assert.ok(await page.getByRole('link', { name: 'Correct this reading' }).isVisible(), 'the owner may correct it');
    await screenshot(page, 'readings-detail-phone');
    await scrollToEnd(page);
    await screenshot(page, 'readings-detail-phone-end');
  });

  test('should download the CSV export of the filtered readings with all four in it', async () => {
    await page.goBack();
    await page.getByText('4 readings').waitFor();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'CSV' }).click()]);
    const file = await download.path();
    assert.ok(file, 'the file was saved');
    const csv = readFileSync(file, 'utf8');
    const lines = csv.trim().split(/\r?\n/);
    assert.equal(lines.length, 5, 'a header and four readings');
    for (const id of Object.values(ids)) assert.ok(lines.some((line) => line.split(',')[0]?.replace(/"/g, '') === String(id)), `reading ${id} is in the export`);
    for (const method of ['photo', 'instrument', 'chip', 'swatch']) assert.ok(lines.slice(1).some((l) => l.includes(method)), `the ${method} reading is in the export`);
  });

  test('should load nothing from another origin', () => {
    assert.deepEqual(app.foreignRequests, []);
  });
});
