// A recorder saves the ground and the stripe colour of one photo region as two readings of their
// characters in one step, in Chromium on a phone. The photo is made here with sharp: leaf-green
// ground with purple stripes, 3 : 1, so both colours are known; truths computed with culori
// (IEC 61966-2-1 sRGB to CIELAB D65), ΔE00 by culori's CIEDE2000.
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import { converter, differenceCiede2000 } from 'culori';
import type { BrowserContext, Page } from 'playwright-core';
import sharp from 'sharp';
import type { ReadingDetail } from '../../shared/api/reading-answers.js';
import { choose, screenshot, signIn, useApp } from './browser.js';

const app = useApp();

const WIDTH = 800;
const HEIGHT = 600;
const GROUND: [number, number, number] = [79, 122, 40];
const STRIPE: [number, number, number] = [107, 45, 92];
const toLab = converter('lab65');
const de00 = differenceCiede2000();
const labOf = (rgb: readonly number[]) => toLab({ mode: 'rgb', r: rgb[0]! / 255, g: rgb[1]! / 255, b: rgb[2]! / 255 });

/** Vertical stripes: 30 px of ground, 10 px of stripe, across the whole photo. */
function stripedPhoto(): Promise<Buffer> {
  const px = Buffer.alloc(WIDTH * HEIGHT * 3);
  for (let y = 0; y < HEIGHT; y++) for (let x = 0; x < WIDTH; x++) px.set(x % 40 < 30 ? GROUND : STRIPE, (y * WIDTH + x) * 3);
  return sharp(px, { raw: { width: WIDTH, height: HEIGHT, channels: 3 } }).png().toBuffer();
}

async function drag(page: Page, from: [number, number], to: [number, number]): Promise<void> {
  const box = await page.locator('hl-photo-canvas .viewport').boundingBox();
  assert.ok(box, 'the photo is on screen');
  const at = ([fx, fy]: [number, number]) => [box.x + fx * box.width, box.y + fy * box.height] as const;
  await page.mouse.move(...at(from));
  await page.mouse.down();
  for (let k = 1; k <= 6; k++) await page.mouse.move(at(from)[0] + ((at(to)[0] - at(from)[0]) * k) / 6, at(from)[1] + ((at(to)[1] - at(from)[1]) * k) / 6);
  await page.mouse.up();
}

describe('the colours of a striped region saved as readings of their characters', () => {
  let phone: BrowserContext;

  before(async () => {
    phone = await app.newContext({ phone: true });
  });
  after(async () => {
    await phone?.close();
  });

  test('should save the ground and the stripe as two readings in one step, each with its own colour', async () => {
    const page = await phone.newPage();
    await signIn(page, app.url, 'recorder@demo.test');
    await page.goto(`${app.url}/record/photo`);
    await page.getByRole('heading', { name: 'Photo reading' }).waitFor();
    await page.locator('input[type=file]:not([capture])').setInputFiles({ name: 'striped-petiole.png', mimeType: 'image/png', buffer: await stripedPhoto() });
    await page.locator('hl-photo-canvas img').waitFor();
    await page.waitForFunction(() => (document.querySelector('hl-photo-canvas img') as HTMLImageElement | null)?.complete);
    await drag(page, [0.2, 0.3], [0.8, 0.7]);

    const section = page.getByTestId('cluster-readings');
    await section.waitFor();
    await section.scrollIntoViewIfNeeded();
    await section.getByLabel('Accession').fill('HL-0001');
    await page.getByRole('option', { name: /HL-0001/ }).click();
    await choose(page, 'Plant (optional)', /^P1/);
    await section.getByRole('radio', { name: 'Open shade' }).click();
    await choose(page, 'Character of colour 1', 'Petiole, middle third');
    // The same character for both colours is pointed out at the second, before anything is sent.
    await choose(page, 'Character of colour 2', 'Petiole, middle third');
    await section.getByText('Character: already given to an earlier colour').waitFor();
    await choose(page, 'Character of colour 2', 'Petiole stripes');
    await section.getByText('Character: already given to an earlier colour').waitFor({ state: 'detached' });
    const save = section.getByRole('button', { name: 'Save 2 readings' });
    const target = await save.boundingBox();
    assert.ok(target && target.height >= 48, 'the save button is a big target');
    await screenshot(page, 'photo-colours-chosen');
    await save.click();

    await section.getByText('2 readings saved').waitFor();
    const links = section.getByRole('link', { name: /^Reading \d+$/ });
    const ids = (await links.allInnerTexts()).map((t) => Number(t.replace('Reading ', '')));
    assert.equal(ids.length, 2);
    await screenshot(page, 'photo-colours-saved');

    const [ground, stripe] = await Promise.all(ids.map(async (id) => (await (await page.request.get(`${app.url}/api/readings/${id}`)).json()) as ReadingDetail));
    assert.deepEqual([ground!.characterCode, stripe!.characterCode], ['petiole.third.middle', 'petiole.stripes']);
    assert.equal(ground!.plantLabel, 'P1');
    const lab = (r: ReadingDetail) => ({ mode: 'lab65' as const, l: r.lab[0], a: r.lab[1], b: r.lab[2] });
    assert.ok(de00(lab(ground!), labOf(GROUND)) < 0.5, `ground ${ground!.lab}`);
    assert.ok(de00(lab(stripe!), labOf(STRIPE)) < 0.5, `stripe ${stripe!.lab}`);
    assert.deepEqual([ground!.provenance.cluster?.index, stripe!.provenance.cluster?.index], [0, 1]);

    // The reading's own page says it is one colour of the region.
    await links.nth(1).click();
    await page.getByText(/Colour 2 of 2 in the region/).waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    assert.ok(overflow <= 0, `nothing sticks out sideways (${overflow} px)`);
    await page.close();
  });
});
