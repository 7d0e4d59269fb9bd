// In the field without signal: the demo recorder opens Hueledger once online on a phone, the
// service worker caches the app, the phone goes offline (Playwright's offline mode), the app is
// reloaded from the cache, two readings are recorded through the real form (instrument L*a*b* and
// chip by eye) and wait in the queue; back online the queue sends itself, and the server holds
// exactly two readings for the recorder, even after one request is replayed with its key.
import assert from 'node:assert/strict';
import { existsSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { after, before, describe, test } from 'node:test';
import type { BrowserContext, Page } from 'playwright-core';
import sharp from 'sharp';
import { screenshot, signIn, navigateTo, choose, useApp } from './browser.js';

const app = useApp();

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

/** An invented scene made here: olive ground with a purple petiole band across the middle. */
async function bandPhoto(): Promise<Buffer> {
  const [w, h] = [1200, 900];
  const px = Buffer.alloc(w * h * 3);
  for (let y = 0; y < h; y++) {
    for (let x = 0; x < w; x++) {
      const i = (y * w + x) * 3;
      const grain = ((x * 7 + y * 13) % 9) - 4;
      const rgb = y > 380 && y < 560 ? [122, 52, 98] : [96, 104, 52];
      px[i] = rgb[0]! + grain;
      px[i + 1] = rgb[1]! + grain;
      px[i + 2] = rgb[2]! + grain;
    }
  }
  return sharp(px, { raw: { width: w, height: h, channels: 3 } }).jpeg({ quality: 90 }).toBuffer();
}

/** Drags across the photo between two points given as fractions of its size. */
async function dragAcross(page: Page, from: [number, number], to: [number, number]): Promise<void> {
  const box = await page.locator('hl-photo-canvas .viewport').boundingBox();
  assert.ok(box, 'the photo is on screen');
  const at = ([fx, fy]: [number, number]) => [box.x + fx * box.width, box.y + fy * box.height] as const;
  await page.mouse.move(...at(from));
  await page.mouse.down();
  for (let k = 1; k <= 6; k++) await page.mouse.move(at(from)[0] + ((at(to)[0] - at(from)[0]) * k) / 6, at(from)[1] + ((at(to)[1] - at(from)[1]) * k) / 6);
  await page.mouse.up();
}

/** The signed-in person's newest readings on the server (the demo may hold older ones), asked from the page with its session. */
async function myReadings(page: Page): Promise<{ id: number; method: string }[] & { total?: number }> {
  const list = await page.evaluate(async () => {
    const me = (await (await fetch('/api/auth/me')).json()) as { user: { id: number } };
    return (await (await fetch(`/api/readings?observerId=${me.user.id}&sort=observedAt&dir=desc&pageSize=100`)).json()) as { items: { id: number; method: string }[]; total: number };
  });
  return Object.assign(list.items, { total: list.total });
}

describe('offline on a phone: cached app, queued readings, sent once back in range', () => {
  let browser: BrowserContext;
  let page: Page;
  /** The recorder's readings on the server before going offline (the demo may hold some). */
  let known: Set<number>;
  let knownTotal: number;

  before(async () => {
    assert.ok(existsSync(path.join(root, 'dist/client/browser/ngsw-worker.js')), 'the production build has the service worker (npm run build)');
    browser = await app.newContext({ phone: true, serviceWorker: true });
    page = await browser.newPage();
    await signIn(page, app.url, 'recorder@demo.test');
    const mine = await myReadings(page);
    known = new Set(mine.map((r) => r.id));
    knownTotal = mine.total ?? 0;
  });
  after(async () => {
    await browser?.close();
  });

  test('should install the service worker and cache what the Record form needs while online', async () => {
    const scope = await page.evaluate(async () => (await navigator.serviceWorker.ready).scope);
    assert.equal(scope, `${app.url}/`);
    // A reload puts the page under the worker's control; then the form's lists pass through its cache.
    await page.reload();
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
    await navigateTo(page, 'Record');
    await page.getByRole('heading', { name: 'New reading' }).waitFor();
    await page.getByLabel('Accession', { exact: true }).waitFor();
    // The chips of the reference set (for chip by eye) are fetched once and kept.
    await page.getByRole('radio', { name: /Chip by eye/ }).click();
    await page.locator('hl-chip-picker .families hl-swatch-grid button.chip').first().waitFor();
    await page.waitForFunction(async () => {
      const keys = await caches.keys();
      const names = await Promise.all(keys.map(async (k) => (await (await caches.open(k)).keys()).map((r) => r.url)));
      const urls = names.flat();
      return ['/api/accessions', '/api/characters', '/api/sites'].every((p) => urls.some((u) => u.endsWith(p))) && urls.some((u) => u.includes('/api/reference-sets/'));
    });
  });

  test('should open from the cache after a reload with no connection', async () => {
    await browser.setOffline(true);
    await page.goto(`${app.url}/record`);
    await page.getByRole('heading', { name: 'New reading' }).waitFor();
    assert.equal(await page.evaluate(() => navigator.onLine), false);
    await page.getByLabel('Accession', { exact: true }).waitFor();
  });

  test('should record an instrument reading through the form and keep it on the phone', async () => {
    await page.getByLabel('Accession', { exact: true }).fill('HL-0001');
    await page.getByRole('option', { name: /HL-0001/ }).click();
    await choose(page, 'Character', 'Petiole, upper third');
    await page.getByRole('radio', { name: /Instrument L\*a\*b\*/ }).click();
    await page.getByLabel('L*', { exact: true }).fill('38.5');
    await page.getByLabel('a*', { exact: true }).fill('24.2');
    await page.getByLabel('b*', { exact: true }).fill('-9.6');
    await page.getByRole('radio', { name: 'D65 / 10°' }).click();
    await screenshot(page, 'offline-record-form');
    await page.getByRole('button', { name: 'Save reading' }).click();
    await page.getByText('Saved — waiting to send.').waitFor();
    await page.getByRole('link', { name: '1 reading waiting to send' }).waitFor();
    await screenshot(page, 'offline-saved-waiting');
  });

  test('should record a chip picked by eye for the next plant, and show "2 waiting" in the toolbar', async () => {
    await page.getByRole('button', { name: 'Next plant' }).click();
    await page.getByRole('radio', { name: /Chip by eye/ }).click();
    await page.locator('hl-chip-picker .families hl-swatch-grid button.chip').nth(20).click();
    await page.locator('hl-chip-picker .fines-heading').waitFor();
    // A fine chip of that field chip, and wait until the picker shows it chosen.
    await page.locator('hl-chip-picker .fines-heading + hl-swatch-grid button.chip').nth(2).click();
    await page.locator('hl-chip-picker .fines-heading + hl-swatch-grid button.chip[aria-pressed=true]').waitFor();
    const picked = (await page.locator('hl-chip-picker .chosen-row').innerText()).match(/F-\d{3}\.\d{3}/)?.[0];
    assert.ok(picked, 'a fine chip is chosen');
    // The instrument before asked no light; a chip read by eye does.
    await page.getByRole('radio', { name: 'Open shade' }).click();
    await page.getByRole('button', { name: 'Save reading' }).click();
    await page.getByText('Saved — waiting to send.').waitFor();
    // The provisional chip, worked out on the phone, on grey with its code under it.
    await page.locator('.saved.queued .provisional .chip-code', { hasText: picked }).waitFor();
    assert.match(await page.locator('.saved.queued .provisional').innerText(), /Provisional: nearest chip F-\d{3}\.\d{3}/);
    await screenshot(page, 'offline-saved-provisional-chip');
    const indicator = page.getByRole('link', { name: '2 readings waiting to send' });
    await indicator.waitFor();
    const box = await indicator.boundingBox();
    assert.ok(box && box.x >= 0 && box.x + box.width <= 390 && box.y < 120 && box.height >= 48, `the strip sits under the toolbar, full width, a big target (${JSON.stringify(box)})`);
    assert.equal(await page.evaluate(() => document.documentElement.scrollWidth), 390, 'nothing is pushed off the phone screen');
  });

  test('should list both on the queue screen, clear to a recorder', async () => {
    await page.getByRole('link', { name: '2 readings waiting to send' }).click();
    await page.getByRole('heading', { name: 'Waiting to send' }).waitFor();
    assert.match(await page.locator('.summary').innerText(), /2 readings waiting to send/);
    const cards = page.locator('hl-queued-reading');
    assert.equal(await cards.count(), 2);
    const text = await page.locator('.list').innerText();
    assert.match(text, /HL-0001/);
    assert.match(text, /Instrument L\*a\*b\*/);
    assert.match(text, /Chip by eye/);
    assert.match(text, /F-\d{3}\.\d{3}/, 'the chip picked by eye shows its code under the swatch');
    assert.match(text, /Waiting to send/);
    await screenshot(page, 'offline-queue-phone');
  });

  test('should send both by itself once back online, and the queue empties', async () => {
    // The idempotency key of the first reading, read from IndexedDB, to replay it afterwards.
    const waiting = await page.evaluate(async () => {
      const db = await new Promise<IDBDatabase>((resolve, reject) => {
        const open = indexedDB.open('hueledger-offline');
        open.onsuccess = () => resolve(open.result);
        open.onerror = () => reject(open.error);
      });
      const all = await new Promise<{ key: string; body: unknown; createdAt: string }[]>((resolve) => {
        const req = db.transaction('readings').objectStore('readings').getAll();
        req.onsuccess = () => resolve(req.result);
      });
      return all.sort((a, b) => a.createdAt.localeCompare(b.createdAt));
    });
    assert.equal(waiting.length, 2);
    await browser.setOffline(false);
    await page.getByText('Nothing waiting').waitFor();
    assert.equal(await page.locator('hl-queue-indicator a').count(), 0, 'the toolbar indicator is gone');
    await screenshot(page, 'offline-queue-sent');

    const after_ = await myReadings(page);
    assert.equal(after_.total, knownTotal + 2, 'the server holds two more readings for the recorder');
    const added = after_.filter((r) => !known.has(r.id));
    assert.deepEqual(added.map((r) => r.method).sort(), ['chip', 'instrument'], 'exactly the two readings, once each');

    // A resend of the first with its key (as a phone whose answer was lost would do) creates nothing.
    const replay = await page.evaluate(async ({ key, body }) => {
      const xsrf = decodeURIComponent(document.cookie.split('; ').find((c) => c.startsWith('XSRF-TOKEN='))!.slice('XSRF-TOKEN='.length));
      const res = await fetch('/api/readings', { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-XSRF-TOKEN': xsrf, 'Idempotency-Key': key }, body: JSON.stringify(body) });
      return { status: res.status, replayed: res.headers.get('Idempotent-Replayed') };
    }, waiting[0]!);
    assert.equal(replay.status, 201);
    assert.equal(replay.replayed, 'true');
    assert.equal((await myReadings(page)).total, knownTotal + 2, 'still exactly two more readings');
  });

  test('should load nothing from another origin', () => {
    assert.deepEqual(app.foreignRequests, []);
  });
});

describe('offline on a phone: a photo reading kept on the phone, measured again by the server', () => {
  let browser: BrowserContext;
  let page: Page;
  let known: Set<number>;

  before(async () => {
    browser = await app.newContext({ phone: true, serviceWorker: true });
    page = await browser.newPage();
    await signIn(page, app.url, 'recorder@demo.test');
    await page.evaluate(async () => (await navigator.serviceWorker.ready).scope);
    await page.reload();
    await page.waitForFunction(() => navigator.serviceWorker.controller !== null);
    known = new Set((await myReadings(page)).map((r) => r.id));
    await navigateTo(page, 'Record');
    await page.getByLabel('Accession', { exact: true }).waitFor();
  });
  after(async () => {
    await browser?.close();
  });

  test('should keep the photo, show its colour as provisional, and send photo then reading once online', async () => {
    await browser.setOffline(true);
    await page.getByLabel('Accession', { exact: true }).fill('HL-0001');
    await page.getByRole('option', { name: /HL-0001/ }).click();
    await choose(page, 'Character', 'Petiole, upper third');
    await page.getByRole('radio', { name: 'Overcast' }).click();
    await page.getByRole('radio', { name: /Photo region/ }).click();
    await page.getByRole('heading', { name: 'Photo reading' }).waitFor();
    await page.locator('input[type=file]:not([capture])').setInputFiles({ name: 'petiole.jpg', mimeType: 'image/jpeg', buffer: await bandPhoto() });
    await page.getByText('No connection: the photo is kept on this phone.').waitFor();
    await page.locator('hl-photo-canvas img').waitFor();
    await page.waitForFunction(() => (document.querySelector('hl-photo-canvas img') as HTMLImageElement | null)?.complete);
    await dragAcross(page, [0.35, 0.47], [0.65, 0.58]);
    await page.getByText('Preview, approximate').waitFor();
    await screenshot(page, 'offline-photo-provisional');
    await page.getByRole('button', { name: 'Save as reading' }).click();
    await page.getByRole('heading', { name: 'New reading' }).waitFor();
    await page.getByText('Provisional colour.').waitFor();
    await page.getByRole('button', { name: 'Save reading' }).click();
    await page.getByText('Saved — waiting to send.').waitFor();
    await page.getByRole('link', { name: '1 reading waiting to send' }).click();
    await page.locator('hl-queued-reading').filter({ hasText: /Provisional colour/ }).filter({ hasText: /Photo region/ }).waitFor();
    await screenshot(page, 'offline-photo-queue');

    await browser.setOffline(false);
    await page.getByText('Nothing waiting').waitFor();
    const stored = (await myReadings(page)).filter((r) => !known.has(r.id));
    assert.equal(stored.length, 1);
    assert.equal(stored[0]!.method, 'photo');
    // The server sampled the region itself: the reading names the uploaded photo and its pixels.
    const detail = await page.evaluate(async (id) => (await (await fetch(`/api/readings/${id}`)).json()) as { provenance: { photoId: number | null; pixelCount: number | null } }, stored[0]!.id);
    assert.ok(detail.provenance.photoId, 'the reading names the uploaded photo');
    assert.ok((detail.provenance.pixelCount ?? 0) > 1000, 'the server measured the full-size region');
  });
});
