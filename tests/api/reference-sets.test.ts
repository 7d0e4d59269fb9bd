import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { ROLES } from '../../shared/api/roles.js';
import type { ChipDto, ReferenceSetSummary } from '../../shared/api/reference-set-answers.js';
import type { ReferenceSetFile } from '../../shared/colour/reference-set.js';
import { chipNames } from '../../shared/colour/chip-name.js';
import { AuditEvent } from '../../server/audit/audit-event.entity.js';
import { PRINT_CAUTION } from '../../server/reference-sets/field-card.js';
import { Chip, ReferenceSetChoice } from '../../server/reference-sets/reference-set.entity.js';
import { assertProblem } from './assert-problem.js';
import { Client, signedInAs, startHarness, type Harness } from './harness.js';
import { bytes, readSetV1, readSetV2 } from './reference-set-file.js';

describe('reference sets: list, chips and the printable card', () => {
  let h: Harness;
  let recorder: Client;
  let file: ReferenceSetFile;
  let fileV2: ReferenceSetFile;

  before(async () => {
    h = await startHarness();
    recorder = await signedInAs(h, 'recorder');
    file = readSetV1();
    fileV2 = readSetV2();
  });
  after(() => h.close());

  test('should list both sets, newest first, with v1 current while no admin has chosen, and counts from the files', async () => {
    const sets = (await recorder.get('/api/reference-sets').expect(200)).body as ReferenceSetSummary[];
    const fieldChips = file.chips.filter((c) => c.parent === null).length;
    const fieldChipsV2 = fileV2.chips.filter((c) => c.parent === null).length;
    assert.deepEqual(sets, [
      { id: 'v2', name: fileV2.name, version: 2, white: 'D65', observer: '2°', fieldChips: fieldChipsV2, fineChips: fileV2.chips.length - fieldChipsV2, current: false },
      { id: 'v1', name: file.name, version: 1, white: 'D65', observer: '2°', fieldChips, fineChips: file.chips.length - fieldChips, current: true },
    ]);
  });

  test('should store every chip of the file in the database, CIELAB as real numbers', async () => {
    assert.equal(await h.ds.getRepository(Chip).countBy({ setId: 'v1' }), file.chips.length);
    const stored = await h.ds.getRepository(Chip).findOneByOrFail({ setId: 'v1', code: file.chips[1]!.code });
    assert.deepEqual([stored.l, stored.a, stored.b], file.chips[1]!.lab);
    assert.equal(stored.kind, 'fine');
  });

  test('should send all chips of the set in one answer as the file has them, named by today\'s scheme', async () => {
    const res = await recorder.get('/api/reference-sets/v1/chips').expect(200);
    const chips = res.body as ChipDto[];
    assert.equal(chips.length, file.chips.length);
    const names = chipNames(file.chips);
    assert.deepEqual(chips, file.chips.map((c, i) => ({ ...c, name: names[i] })));
    // The v1 file keeps the words it was published with; none of them reaches a client.
    assert.ok(file.chips.some((c) => /greyish|moderate/.test(c.name)), 'the v1 file still holds its stored names');
    assert.ok(chips.every((c) => !/very pale|greyish|moderate|strong|vivid|deep|-/.test(c.name)), 'an old word reached the answer');
    const v2 = (await recorder.get('/api/reference-sets/v2/chips').expect(200)).body as ChipDto[];
    assert.deepEqual(v2, fileV2.chips, 'v2 is served exactly as its file has it');
  });

  test('should let an admin choose the current set, audited, and match against it; others are refused', async () => {
    const admin = await signedInAs(h, 'admin');
    assertProblem(await recorder.put('/api/reference-sets/current', { setId: 'v2' }), 403);
    const bad = await admin.put('/api/reference-sets/current', { setId: 'v 2' });
    assertProblem(bad, 400);
    assert.match(JSON.stringify(bad.body), /setId/);
    assertProblem(await admin.put('/api/reference-sets/current', { setId: 'v9' }), 404);
    assert.equal(await h.ds.getRepository(ReferenceSetChoice).count(), 0, 'a refused choice wrote nothing');
    const sets = (await admin.put('/api/reference-sets/current', { setId: 'v2' }).expect(200)).body as ReferenceSetSummary[];
    assert.deepEqual(sets.map((s) => [s.id, s.current]), [['v2', true], ['v1', false]]);
    const match = await recorder.post('/api/match', { lab: [50, -20, 30] }).expect(200);
    assert.equal(match.body.setId, 'v2');
    assert.ok(Number(match.body.matches[0].code.slice(2, 5)) > 189, 'a v2 code');
    const v1Match = await recorder.post('/api/match', { lab: [50, -20, 30], setId: 'v1' }).expect(200);
    assert.equal(v1Match.body.setId, 'v1');
    const events = await h.ds.getRepository(AuditEvent).findBy({ action: 'reference-set.current' });
    assert.deepEqual(events.map((e) => [e.subject, e.detail]), [['v2', { before: null }]]);
    await admin.put('/api/reference-sets/current', { setId: 'v1' }).expect(200);
    assert.equal((await recorder.post('/api/match', { lab: [50, -20, 30] }).expect(200)).body.setId, 'v1');
  });

  test('should make the chips cacheable: a strong ETag, private for a day, 304 when the tag matches', async () => {
    const first = await recorder.get('/api/reference-sets/v1/chips').expect(200);
    const etag = String(first.headers['etag']);
    assert.match(etag, /^"[^"]+"$/, 'a strong ETag (no W/ prefix)');
    assert.equal(first.headers['cache-control'], 'private, max-age=86400');
    const again = await recorder.get('/api/reference-sets/v1/chips').set('If-None-Match', etag);
    assert.equal(again.status, 304);
    assert.equal(again.text ?? '', '');
    const stale = await recorder.get('/api/reference-sets/v1/chips').set('If-None-Match', '"v1-something-else"');
    assert.equal(stale.status, 200);
  });

  test('should gzip the chips for a client that accepts it, and send them plain otherwise, each with its own tag', async () => {
    const zipped = await recorder.get('/api/reference-sets/v1/chips').set('Accept-Encoding', 'gzip').expect(200);
    assert.equal(zipped.headers['content-encoding'], 'gzip');
    assert.ok(Number(zipped.headers['content-length']) < 400_000, `gzip is small (${zipped.headers['content-length']} bytes)`);
    const plain = await recorder.get('/api/reference-sets/v1/chips').set('Accept-Encoding', 'identity').expect(200);
    assert.equal(plain.headers['content-encoding'], undefined);
    assert.match(String(plain.headers['vary']), /Accept-Encoding/i);
    assert.notEqual(zipped.headers['etag'], plain.headers['etag']);
    assert.deepEqual(zipped.body, plain.body);
  });

  test('should answer 404 problem+json for a set that does not exist, or an id that cannot be one', async () => {
    assertProblem(await recorder.get('/api/reference-sets/v9/chips'), 404);
    assertProblem(await recorder.get('/api/reference-sets/v9/card.pdf'), 404);
    assertProblem(await recorder.get(`/api/reference-sets/${'x'.repeat(40)}/chips`), 404);
    assertProblem(await recorder.get('/api/reference-sets/v1%20v2/chips'), 404);
  });

  test('should send the printable card as a one-page A4 PDF of a sane size, as a download', async () => {
    const res = await recorder.get('/api/reference-sets/v1/card.pdf').buffer(true).parse(bytes).expect(200);
    const pdf = res.body as Buffer;
    assert.equal(res.headers['content-type'], 'application/pdf');
    assert.match(String(res.headers['content-disposition']), /^attachment; filename="hueledger-field-card-v1\.pdf"$/);
    assert.equal(pdf.subarray(0, 5).toString('latin1'), '%PDF-');
    assert.match(pdf.subarray(-8).toString('latin1'), /%%EOF\s*$/);
    assert.ok(pdf.length > 3_000 && pdf.length < 500_000, `a card of 189 swatches is a few kB, got ${pdf.length} bytes`);
    const text = pdf.toString('latin1');
    assert.equal(text.match(/\/Type \/Page\b(?!s)/g)?.length, 1, 'the field card fits one page');
    assert.match(text, /\/MediaBox \[0 0 595\.28 841\.89\]/, 'A4');
    assert.ok(text.includes('(Hueledger field card, reference set v1)'), 'the document title names the set');
  });

  test('should print the caution the design asks for on the card', () => {
    assert.match(PRINT_CAUTION, /printers vary; colours are approximate; re-measure a printed card with an instrument before trusting it/);
  });
});

describe('who may read reference sets', () => {
  let h: Harness;
  const routes = ['/api/reference-sets', '/api/reference-sets/v1/chips', '/api/reference-sets/v1/card.pdf'];

  before(async () => {
    h = await startHarness();
  });
  after(() => h.close());

  for (const url of routes) {
    test(`should answer 401 problem+json to GET ${url} when signed out`, async () => {
      assertProblem(await (await new Client(h.app).prime()).get(url), 401);
    });
  }

  test('should answer 401 problem+json to POST /api/match when signed out', async () => {
    assertProblem(await (await new Client(h.app).prime()).post('/api/match', { hex: '#7b3f6e' }), 401);
  });

  // Browsing, matching and the card are for everyone signed in (issue 3): recorders print the card too.
  for (const role of ROLES) {
    test(`should let ${role === 'admin' ? 'an' : 'a'} ${role} list, load chips, download the card and match`, async () => {
      const client = await signedInAs(h, role);
      for (const url of routes) assert.equal((await client.get(url).buffer(true).parse(bytes)).status, 200, url);
      assert.equal((await client.post('/api/match', { hex: '#7b3f6e' })).status, 200);
    });
  }
});
