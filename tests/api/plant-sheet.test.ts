// The plant sheet, progress and the walk order (issue 13), against the real app on a fresh SQLite file.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { PlantProgress, PlantSheet, WalkEntry, CollectionProgress } from '../../shared/api/plant-sheet.js';
import type { Descriptor } from '../../shared/api/descriptors.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { rowCounts, signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { instrumentBody, readingWorld, type ReadingWorld } from './reading-fixtures.js';

describe('plant sheet', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let reviewer: Client;
  let w: ReadingWorld;
  let descriptors: Descriptor[];

  before(async () => {
    h = await startHarness();
    admin = await signedInAs(h, 'admin');
    recorder = await signedInAs(h, 'recorder');
    reviewer = await signedInAs(h, 'reviewer');
    w = await readingWorld(admin);
    descriptors = (await admin.get('/api/descriptors').expect(200)).body as Descriptor[];
  });
  after(() => h.close());

  const sheetOf = async (plantId: number, client: Client = recorder) => (await client.get(`/api/plants/${plantId}/sheet`).expect(200)).body as PlantSheet;
  const code = (row: PlantSheet['rows'][number]) => row.colour?.code ?? row.descriptor!.code;

  test('should list colour characters and descriptors in walk order: leaf, petiole, basal ring and sheath, corm, roots', async () => {
    const sheet = await sheetOf(w.violet.plants[0]!.id);
    const codes = sheet.rows.map(code);
    const at = (c: string) => codes.indexOf(c);
    for (const c of ['leaf.blade.upper', 'petiole.third.upper', 'petiole.ring.basal', 'sheath.inside', 'corm.flesh.centre', 'root']) assert.ok(at(c) >= 0, `${c} is on the sheet`);
    assert.ok(at('leaf.blade.upper') < at('petiole.third.upper'));
    assert.ok(at('petiole.third.upper') < at('petiole.ring.basal'));
    assert.ok(at('sheath.edge') < at('corm.flesh.centre'));
    assert.ok(at('corm.skin') < at('root'));
    // A leaf's lengths sit with the leaf's colours, before the petiole.
    assert.ok(at('leaf.blade.length') > at('leaf.blade.upper') && at('leaf.blade.length') < at('petiole.third.upper'));
    // Ratios are computed, never typed, so they are not rows to do.
    assert.equal(codes.includes('sheath.petiole.ratio'), false);
    const sorted = [...sheet.rows].sort((a, b) => a.sortOrder - b.sortOrder);
    assert.deepEqual(sheet.rows.map((r) => r.key), sorted.map((r) => r.key));
  });

  test('should show a length read on the same part as a colour as one row', async () => {
    const sheet = await sheetOf(w.violet.plants[0]!.id);
    const ring = sheet.rows.find((r) => r.colour?.code === 'petiole.ring.basal')!;
    assert.equal(ring.descriptor?.code, 'petiole.ring.basal.reach');
    assert.equal(sheet.rows.filter((r) => r.descriptor?.code === 'petiole.ring.basal.reach').length, 1);
  });

  test('should count progress from this season only, and mark a reading done with its chip and ΔE00', async () => {
    const plant = w.violet.plants[0]!;
    const before = await sheetOf(plant.id);
    assert.equal(before.progress.colour.done, 0);
    assert.equal(before.progress.state, 'not-started');
    const characters = (await admin.get('/api/characters').expect(200)).body as { id: number; colour: boolean; active: boolean }[];
    assert.equal(before.progress.colour.total, characters.filter((c) => c.colour && c.active).length);
    assert.equal(before.progress.descriptors.total, descriptors.filter((d) => d.active && d.kind !== 'ratio').length);

    // A reading from a year ago belongs to another season: still to do.
    const yearAgo = new Date(Date.now() - 366 * 86_400_000).toISOString();
    await recorder.post('/api/readings', instrumentBody(w, { observedAt: yearAgo })).expect(201);
    assert.equal((await sheetOf(plant.id)).progress.colour.done, 0);

    const { observedAt: _drop, ...now } = instrumentBody(w);
    const reading = (await recorder.post('/api/readings', now).expect(201)).body as { id: number; bestChip: string; deltaE00: number };
    const length = descriptors.find((d) => d.code === 'petiole.length')!;
    await recorder.post('/api/observations', { accessionId: w.violet.id, plantId: plant.id, descriptorId: length.id, value: 40, unit: 'in' }).expect(201);
    const sheet = await sheetOf(plant.id);
    const row = sheet.rows.find((r) => r.colour?.code === 'petiole.third.upper')!;
    assert.equal(row.colour!.status, 'done');
    assert.equal(row.colour!.reading!.id, reading.id);
    assert.equal(row.colour!.reading!.bestChipCode, reading.bestChip);
    assert.equal(row.colour!.reading!.deltaE00, reading.deltaE00);
    const lengthRow = sheet.rows.find((r) => r.descriptor?.code === 'petiole.length')!;
    assert.equal(lengthRow.descriptor!.status, 'done');
    assert.equal(lengthRow.descriptor!.value!.formatted.metric, '101.6 cm');
    assert.deepEqual([sheet.progress.colour.done, sheet.progress.descriptors.done], [1, 1]);
    assert.equal(sheet.progress.state, 'partial');
    // The other plant of the accession is untouched.
    assert.equal((await sheetOf(w.violet.plants[1]!.id)).progress.colour.done, 0);
  });

  test('should record a skip with its reason, and refuse one without a reason naming the field', async () => {
    const plant = w.violet.plants[1]!;
    const spathe = w.characters.get('flower.spathe')!;
    const before = await rowCounts(h.ds);
    assertInvalidFields(await recorder.post(`/api/plants/${plant.id}/skips`, { characterId: spathe.id, reason: '  ' }), 'reason');
    assertInvalidFields(await recorder.post(`/api/plants/${plant.id}/skips`, { characterId: spathe.id, descriptorId: 1, reason: 'Both' }), 'characterId');
    assertInvalidFields(await recorder.post(`/api/plants/${plant.id}/skips`, { characterId: 987654, reason: 'Ghost' }), 'characterId');
    assertProblem(await recorder.post('/api/plants/987654/skips', { characterId: spathe.id, reason: 'No plant' }), 404);
    assertProblem(await reviewer.post(`/api/plants/${plant.id}/skips`, { characterId: spathe.id, reason: 'Not mine to skip' }), 403);
    assert.deepEqual(await rowCounts(h.ds), before);
    await recorder.post(`/api/plants/${plant.id}/skips`, { characterId: spathe.id, reason: 'Not flowering this season' }).expect(201);
    const sheet = await sheetOf(plant.id);
    const row = sheet.rows.find((r) => r.colour?.code === 'flower.spathe')!;
    assert.equal(row.colour!.status, 'skipped');
    assert.equal(row.colour!.skip!.reason, 'Not flowering this season');
    assert.equal(sheet.progress.colour.skipped, 1);
    assert.equal(sheet.progress.state, 'not-started');
  });

  test('should give per-plant progress for an accession and the collection, with counts by state', async () => {
    const list = (await reviewer.get(`/api/accessions/${w.violet.id}/progress`).expect(200)).body as PlantProgress[];
    assert.deepEqual(list.map((p) => [p.plantLabel, p.colour.done, p.state]), [['P1', 1, 'partial'], ['P2', 0, 'not-started']]);
    assertProblem(await reviewer.get('/api/accessions/987654/progress'), 404);
    const all = (await reviewer.get('/api/progress').expect(200)).body as CollectionProgress;
    assert.equal(all.plants.length, 3);
    assert.deepEqual(all.counts, { complete: 0, partial: 1, 'not-started': 2 });
    const coast = (await reviewer.get(`/api/progress?siteId=${w.coast.id}`).expect(200)).body as CollectionProgress;
    assert.deepEqual(coast.plants.map((p) => `${p.accessionNumber} ${p.plantLabel}`), ['RT-A P1', 'RT-V P2']);
    // A year ago the reading taken then was this season's.
    const yearAgo = new Date(Date.now() - 366 * 86_400_000).toISOString();
    const then = (await reviewer.get(`/api/progress?siteId=${w.wetDry.id}&at=${encodeURIComponent(yearAgo)}`).expect(200)).body as CollectionProgress;
    assert.equal(then.plants.find((p) => p.plantLabel === 'P1')!.colour.done, 1);
    assertInvalidFields(await reviewer.get('/api/progress?at=yesterday'), 'at');
  });

  test('should mark a plant complete once every row is done or skipped', async () => {
    const plant = w.amber.plants[0]!;
    const sheet = await sheetOf(plant.id);
    for (const row of sheet.rows) {
      if (row.colour) await recorder.post(`/api/plants/${plant.id}/skips`, { characterId: row.colour.characterId, reason: 'Test: set aside' }).expect(201);
      if (row.descriptor) await recorder.post(`/api/plants/${plant.id}/skips`, { descriptorId: row.descriptor.descriptorId, reason: 'Test: set aside' }).expect(201);
    }
    const after = await sheetOf(plant.id);
    assert.equal(after.progress.state, 'complete');
    assert.equal(after.progress.colour.skipped, after.progress.colour.total);
  });

  test('should let an admin change the walk order, all entries at once, and refuse a partial list naming the field', async () => {
    const order = (await recorder.get('/api/catalogue/order').expect(200)).body as WalkEntry[];
    assert.ok(order.length > 30);
    const root = order.find((e) => e.code === 'root')!;
    const moved = [root, ...order.filter((e) => e !== root)].map((e) => ({ kind: e.kind, id: e.id }));
    assertProblem(await recorder.put('/api/catalogue/order', { items: moved }), 403);
    const before = await rowCounts(h.ds);
    assertInvalidFields(await admin.put('/api/catalogue/order', { items: moved.slice(1) }), 'items');
    assertInvalidFields(await admin.put('/api/catalogue/order', { items: [...moved, moved[0]] }), 'items');
    assert.deepEqual(await rowCounts(h.ds), before);
    const after = (await admin.put('/api/catalogue/order', { items: moved }).expect(200)).body as WalkEntry[];
    assert.equal(after[0]!.code, 'root');
    const sheet = await sheetOf(w.violet.plants[0]!.id);
    assert.equal(code(sheet.rows[0]!), 'root');
    // A character added later joins the end of the walk.
    const added = (await admin.post('/api/characters', { code: 'test.walk.last', organ: 'root', label: 'Added last', howToRead: 'Read after everything else.' }).expect(201)).body as { sortOrder: number };
    assert.ok(added.sortOrder > Math.max(...after.map((e) => e.sortOrder)));
  });
});
