// A recorder takes a photo reading in Chromium: upload a photo made here with sharp, draw a
// region, mark a grey card, and read the result with its chip codes, on a phone and at a desk.
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { BrowserContext, Page } from 'playwright-core';
import sharp from 'sharp';
import { navigateTo, screenshot, signIn, useApp } from './browser.js';

const app = useApp();

const WIDTH = 1600;
const HEIGHT = 1200;

/** A warm-lit scene: olive ground, a purple petiole band across the middle, a grey card at the top left. */
async function fieldPhoto(): Promise<Buffer> {
  const px = Buffer.alloc(WIDTH * HEIGHT * 3);
  for (let y = 0; y < HEIGHT; y++) {
    for (let x = 0; x < WIDTH; x++) {
      const i = (y * WIDTH + x) * 3;
      const grain = ((x * 7 + y * 13) % 9) - 4;
      let rgb: [number, number, number] = [96, 104, 52];
      if (y > 500 && y < 760) rgb = [122, 52, 98];
      if (x > 80 && x < 400 && y > 80 && y < 340) rgb = [136, 128, 112];
      px[i] = rgb[0] + grain;
      px[i + 1] = rgb[1] + grain;
      px[i + 2] = rgb[2] + grain;
    }
  }
  return sharp(px, { raw: { width: WIDTH, height: HEIGHT, channels: 3 } }).jpeg({ quality: 90 }).toBuffer();
}

/** Drags across the photo between two points given as fractions of its width and height. */
async function drag(page: Page, from: [number, number], to: [number, number], beforeRelease?: () => Promise<void>): Promise<void> {
  const box = await page.locator('hl-photo-canvas .viewport').boundingBox();
  assert.ok(box, 'the photo is on screen');
  const at = ([fx, fy]: [number, number]) => [box.x + fx * box.width, box.y + fy * box.height] as const;
  await page.mouse.move(...at(from));
  await page.mouse.down();
  for (let k = 1; k <= 6; k++) await page.mouse.move(at(from)[0] + ((at(to)[0] - at(from)[0]) * k) / 6, at(from)[1] + ((at(to)[1] - at(from)[1]) * k) / 6);
  await beforeRelease?.();
  await page.mouse.up();
}

/** The whole flow; returns the page for screenshots. */
async function takeReading(browser: BrowserContext, url: string, phone: boolean, shot: string): Promise<void> {
  const page = await browser.newPage();
  await signIn(page, url, 'recorder@demo.test');
  await navigateTo(page, 'Record');
  // Record opens the reading form; its photo method leads to the photo page.
  await page.getByRole('radio', { name: /Photo region/ }).click();
  await page.getByRole('heading', { name: 'Photo reading' }).waitFor();
  assert.match(await page.locator('hl-record-cautions').innerText(), /gloves/);
  assert.match(await page.locator('hl-record-cautions').innerText(), /approximate/);

  const primary = page.getByRole('button', { name: 'Take photo' });
  const box = await primary.boundingBox();
  assert.ok(box && box.height >= 48, 'the primary action is a big target');
  if (phone) assert.ok(box.y + box.height > 844 - 120, `the primary action sits at the bottom of the phone screen (y ${box.y})`);
  await screenshot(page, `${shot}-start`);

  await page.locator('input[type=file]:not([capture])').setInputFiles({ name: 'petiole.jpg', mimeType: 'image/jpeg', buffer: await fieldPhoto() });
  await page.locator('hl-photo-canvas img').waitFor();
  await page.waitForFunction(() => (document.querySelector('hl-photo-canvas img') as HTMLImageElement | null)?.complete);

  // A box across the purple band.
  await drag(page, [0.35, 0.47], [0.65, 0.58], async () => {
    // While the finger is still down, the browser's own approximate reading is shown.
    await page.getByText('Preview, approximate').waitFor();
  });
  const result = page.locator('hl-sample-result');
  await result.waitFor();
  const first = await result.innerText();
  assert.match(first, /F-\d{3}(\.\d{3})?/, 'chip codes are shown');
  assert.match(first, /ΔE00/);
  assert.match(first, /Between F-\d{3}/);
  assert.match(first, /Even colour|Not even/);
  assert.match(first, /No correction/);

  // Mark the grey card: the reading is balanced on it.
  await screenshot(page, `${shot}-tissue`);
  await page.locator('.marking').getByText('Grey card').click();
  await drag(page, [0.08, 0.09], [0.22, 0.26]);
  await page.getByText(/Balanced on the grey card/).waitFor();
  const tools = await page.locator('.tools .tool').first().boundingBox();
  assert.ok(tools && tools.height >= 48, 'tool buttons are big targets');
  await screenshot(page, shot);
  // The page scrolls inside the frame: look at the rest of it too.
  await page.locator('mat-sidenav-content').evaluate((el) => el.scrollTo(0, el.scrollHeight));
  await screenshot(page, `${shot}-end`);
  const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
  assert.ok(overflow <= 0, `nothing sticks out sideways (${overflow} px)`);
  await page.close();
}

describe('a photo reading in Chromium', () => {
  let phone: BrowserContext;
  let desk: BrowserContext;

  before(async () => {
    phone = await app.newContext({ phone: true });
    desk = await app.newContext();
  });
  after(async () => {
    await phone?.close();
    await desk?.close();
  });

  test('should let a recorder on a 390 × 844 phone upload a photo, draw a box and read the chips', async () => {
    await takeReading(phone, app.url, true, 'photo-reading-phone');
  });

  test('should lay the photo and the reading side by side at a desk', async () => {
    await takeReading(desk, app.url, false, 'photo-reading-desktop');
  });

  test('should not offer Record to a reviewer', async () => {
    const page = await desk.newPage();
    await signIn(page, app.url, 'reviewer@demo.test');
    assert.doesNotMatch((await page.locator('mat-sidenav a').allInnerTexts()).join(' | '), /Record/);
    await page.goto(`${app.url}/record/photo`);
    await page.waitForURL((u) => !u.pathname.startsWith('/record'));
    await page.close();
  });

  test('should load nothing from another origin', () => {
    assert.deepEqual([...app.foreignRequests, ...app.foreignRequests], []);
  });
});
