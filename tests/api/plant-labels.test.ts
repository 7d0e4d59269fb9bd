// Plant labels (issue 13): the PDF sheet for an accession or a site, and a label's QR code read
// back from a photo of it by jsQR, the decoder the app uses where the browser has no BarcodeDetector.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { inflateSync } from 'node:zlib';
import jsqrModule from 'jsqr';
import QRCode from 'qrcode';
import sharp from 'sharp';
import { plantSheetUrl } from '../../server/collection/plant-labels.js';
import { plantIdFromScan } from '../../shared/collection/plant-link.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { PUBLIC_URL, signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { readingWorld, type ReadingWorld } from './reading-fixtures.js';

/** jsqr is CommonJS with an ES-style default in its types: under NodeNext the import is the module, whose default is the decoder. */
const jsQR = ((jsqrModule as unknown as { default?: unknown }).default ?? jsqrModule) as typeof jsqrModule.default;

/** The text a PDF shows: every hex string of every content stream, inflated and decoded (pdfkit writes the standard fonts' text so). */
function pdfText(pdf: Buffer): string {
  const raw = pdf.toString('latin1');
  let text = '';
  for (const m of raw.matchAll(/stream\r?\n/g)) {
    const start = m.index! + m[0].length;
    const end = raw.indexOf('endstream', start);
    try {
      const content = inflateSync(pdf.subarray(start, end)).toString('latin1');
      for (const hex of content.matchAll(/<([0-9a-fA-F]+)>/g)) text += Buffer.from(hex[1]!, 'hex').toString('latin1');
      text += '\n';
    } catch {
      // Not a deflated stream (fonts, images): no text of ours in it.
    }
  }
  return text;
}

async function getPdf(client: Client, url: string): Promise<Buffer> {
  const res = await client.agent.get(url).buffer(true).parse((r, cb) => {
    const chunks: Buffer[] = [];
    r.on('data', (c: Buffer) => chunks.push(c));
    r.on('end', () => cb(null, Buffer.concat(chunks)));
  });
  assert.equal(res.status, 200, `GET ${url}`);
  assert.equal(res.headers['content-type'], 'application/pdf');
  return res.body as Buffer;
}

describe('plant labels', () => {
  let h: Harness;
  let reviewer: Client;
  let w: ReadingWorld;

  before(async () => {
    h = await startHarness();
    const admin = await signedInAs(h, 'admin');
    reviewer = await signedInAs(h, 'reviewer');
    w = await readingWorld(admin);
  });
  after(() => h.close());

  test('should print one label per plant of an accession, with number, plant label and site', async () => {
    const pdf = await getPdf(reviewer, `/api/plants/labels.pdf?accessionId=${w.violet.id}`);
    assert.equal(pdf.subarray(0, 5).toString(), '%PDF-');
    const text = pdfText(pdf);
    assert.match(text, /RT-V/);
    assert.match(text, /Plant P1/);
    assert.match(text, /Plant P2/);
    assert.match(text, new RegExp(`Site ${w.wetDry.code}`));
    assert.match(text, new RegExp(`Site ${w.coast.code}`));
    assert.doesNotMatch(text, /RT-A/);
  });

  test('should print every plant at a site, of any accession', async () => {
    const text = pdfText(await getPdf(reviewer, `/api/plants/labels.pdf?siteId=${w.coast.id}`));
    assert.match(text, /RT-A/);
    assert.match(text, /RT-V/);
    assert.equal((text.match(/Plant P\d/g) ?? []).length, 2);
  });

  test('should refuse a query naming neither or both, and 404 with no plants', async () => {
    assertInvalidFields(await reviewer.get('/api/plants/labels.pdf'), 'accessionId');
    assertInvalidFields(await reviewer.get(`/api/plants/labels.pdf?accessionId=${w.violet.id}&siteId=${w.coast.id}`), 'accessionId');
    assertProblem(await reviewer.get('/api/plants/labels.pdf?accessionId=987654'), 404);
  });

  test('should read a label’s QR back from a photo of it, leading to the plant’s sheet', async () => {
    const plantId = w.violet.plants[0]!.id;
    const url = plantSheetUrl(PUBLIC_URL, plantId);
    // The label's QR as the PDF draws it (level M), printed about 3 cm wide and photographed:
    // put on a grainy olive-and-soil background, turned 7°, scaled down (which softens it) and saved as JPEG.
    const qr = await QRCode.toBuffer(url, { errorCorrectionLevel: 'M', margin: 4, width: 260 });
    const turned = await sharp(qr).rotate(7, { background: '#ffffff' }).flatten({ background: '#ffffff' }).png().toBuffer();
    const width = 900;
    const height = 700;
    const px = Buffer.alloc(width * height * 3);
    for (let i = 0; i < width * height; i++) {
      const grain = (i * 2654435761) % 41;
      px[i * 3] = 80 + grain;
      px[i * 3 + 1] = 90 + (grain >> 1);
      px[i * 3 + 2] = 40 + (grain >> 2);
    }
    const scene = await sharp(px, { raw: { width, height, channels: 3 } }).composite([{ input: turned, left: 310, top: 190 }]).png().toBuffer();
    const photo = await sharp(scene).resize(720).jpeg({ quality: 75 }).toBuffer();
    const { data, info } = await sharp(photo).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
    const found = jsQR(new Uint8ClampedArray(data.buffer, data.byteOffset, data.length), info.width, info.height);
    assert.ok(found, 'jsQR finds the code in the photo');
    assert.equal(found.data, url);
    assert.equal(plantIdFromScan(found.data), plantId);
    // What the app opens: the plant's sheet.
    const sheet = await reviewer.get(new URL(found.data).pathname.replace('/record/plant/', '/api/plants/') + '/sheet').expect(200);
    assert.equal(sheet.body.plant.id, plantId);
  });

  test('should take only a plant sheet address from a scan', () => {
    assert.equal(plantIdFromScan('https://garden.example/record/plant/42'), 42);
    assert.equal(plantIdFromScan('/record/plant/7?x=1'), 7);
    assert.equal(plantIdFromScan('https://garden.example/record/plant/0'), null);
    assert.equal(plantIdFromScan('HL-0001 P3'), null);
    assert.equal(plantIdFromScan('https://garden.example/admin/users'), null);
  });
});
