// Non-colour descriptors (issue 5, item 4): the catalogue, observations typed in inches or
// centimetres, pounds or kilograms and stored in SI (NIST SP 811, 2008, Appendix B.8), ratios
// derived from the same plant's latest values, and corrections that keep the history.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { Accession } from '../../shared/api/collection.js';
import type { AccessionDescriptors, Descriptor, Observation, ObservationPage } from '../../shared/api/descriptors.js';
import { seedDescriptorCatalogue } from '../../server/collection/seed-catalogue.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { Client, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';

describe('descriptors and observations', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let otherRecorder: Client;
  let reviewer: Client;
  let byCode: Map<string, Descriptor>;
  let accession: Accession;
  let siteId: number;

  const observe = (client: Client, code: string, rest: object, plantIndex = 0) =>
    client.post('/api/observations', { accessionId: accession.id, plantId: accession.plants[plantIndex]!.id, descriptorId: byCode.get(code)!.id, ...rest });

  before(async () => {
    h = await startHarness();
    [admin, recorder, otherRecorder, reviewer] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder'), signedInAs(h, 'recorder'), signedInAs(h, 'reviewer')]);
    const site = (await admin.post('/api/sites', { code: 'DSC', name: 'Descriptor Plot', timezone: 'Pacific/Fiji', seasons: [{ name: 'All year', start: '01-01', end: '12-31' }] }).expect(201)).body;
    siteId = site.id;
    accession = (await admin.post('/api/accessions', { accessionNumber: 'DS-0001', name: 'Measured One', siteId, plants: [{ label: 'P1', plantedOn: '2025-01-10' }, { label: 'P2', plantedOn: '2025-01-10' }] }).expect(201)).body;
    byCode = new Map(((await reviewer.get('/api/descriptors').expect(200)).body as Descriptor[]).map((d) => [d.code, d]));
  });
  after(() => h.close());

  describe('the catalogue', () => {
    test('should seed at least a dozen descriptors of every kind, each saying how to measure it', () => {
      assert.ok(byCode.size >= 12, `${byCode.size} descriptors`);
      for (const kind of ['length', 'mass', 'count', 'category', 'ratio']) assert.ok([...byCode.values()].some((d) => d.kind === kind), kind);
      for (const d of byCode.values()) assert.ok(d.howToMeasure.length > 20, d.code);
    });

    test('should name for each seeded ratio two seeded parts of one measured kind', () => {
      const ratio = byCode.get('sheath.petiole.ratio')!;
      assert.deepEqual([ratio.numeratorCode, ratio.denominatorCode], ['sheath.length', 'petiole.length']);
      for (const r of [...byCode.values()].filter((d) => d.kind === 'ratio')) {
        const [top, bottom] = [byCode.get(r.numeratorCode!), byCode.get(r.denominatorCode!)];
        assert.ok(top && bottom, r.code);
        assert.equal(top.kind, bottom.kind, r.code);
      }
    });

    test('should carry the raw-tissue caution on corm measurements', () => {
      assert.match(byCode.get('corm.mass')!.caution ?? '', /glove/i);
    });

    test('should add a category descriptor (201), refuse its code again (409) and bad shapes (400), writing nothing on refusal', async () => {
      const body = { code: 'sucker.vigour', label: 'Sucker vigour', object: 'largest sucker', kind: 'category', categories: [{ id: 'weak', label: 'Weak' }, { id: 'strong', label: 'Strong' }], howToMeasure: 'Compare the largest sucker with the mother plant at full growth.' };
      const res = await admin.post('/api/descriptors', body);
      assert.equal(res.status, 201, res.text);
      const before = await rowCounts(h.ds);
      assertProblem(await admin.post('/api/descriptors', body), 409);
      assertInvalidFields(await admin.post('/api/descriptors', { ...body, code: 'x.one', categories: [{ id: 'a', label: 'A' }] }), 'categories');
      assertInvalidFields(await admin.post('/api/descriptors', { ...body, code: 'x.two', kind: 'ratio', categories: undefined }), 'numeratorCode', 'denominatorCode');
      assertInvalidFields(await admin.post('/api/descriptors', { ...body, code: 'x.three', kind: 'ratio', categories: undefined, numeratorCode: 'petiole.length', denominatorCode: 'corm.mass' }), 'denominatorCode');
      assertInvalidFields(await admin.post('/api/descriptors', { ...body, code: 'x.four', kind: 'ratio', categories: undefined, numeratorCode: 'no.such', denominatorCode: 'sheath.length' }), 'numeratorCode');
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should let an admin relabel or add categories by PATCH but never remove one', async () => {
      const shape = byCode.get('corm.shape')!;
      const more = [...shape.categories, { id: 'heart', label: 'Heart-shaped' }];
      const res = await admin.patch(`/api/descriptors/${shape.id}`, { categories: more });
      assert.equal(res.status, 200, res.text);
      assert.equal(res.body.categories.length, shape.categories.length + 1);
      assertInvalidFields(await admin.patch(`/api/descriptors/${shape.id}`, { categories: more.slice(1) }), 'categories');
      assertInvalidFields(await admin.patch(`/api/descriptors/${shape.id}`, { kind: 'length', code: 'corm.outline' }), 'kind', 'code');
      assertProblem(await admin.patch('/api/descriptors/987654', { label: 'Ghost' }), 404);
    });

    test('should keep an admin’s edits to a seeded descriptor when the catalogue is seeded again', async () => {
      const height = byCode.get('plant.height')!;
      await admin.patch(`/api/descriptors/${height.id}`, { label: 'Height to the top leaf', active: false }).expect(200);
      assert.equal(await seedDescriptorCatalogue(h.ds), 0);
      const kept = ((await reviewer.get('/api/descriptors').expect(200)).body as Descriptor[]).find((d) => d.code === 'plant.height')!;
      assert.deepEqual([kept.label, kept.active], ['Height to the top leaf', false]);
      await admin.patch(`/api/descriptors/${height.id}`, { active: true }).expect(200);
    });

    test('should refuse descriptor writes to a recorder with 403', async () => {
      assertProblem(await recorder.post('/api/descriptors', { code: 'no.way', label: 'No', object: 'no', kind: 'count', howToMeasure: 'Not allowed to add this one.' }), 403);
      assertProblem(await recorder.patch(`/api/descriptors/${byCode.get('plant.height')!.id}`, { label: 'No' }), 403);
    });
  });

  describe('observations in SI', () => {
    test('should store a petiole of 40 in as 1.016 m, keeping what was typed (NIST SP 811: 1 in = 0.0254 m; figure: common practice, no source)', async () => {
      const res = await observe(recorder, 'petiole.length', { value: 40, unit: 'in', observedAt: '2025-06-10T09:00:00+12:00' });
      assert.equal(res.status, 201, res.text);
      const o = res.body as Observation;
      assert.equal(o.valueSi, 1.016);
      assert.deepEqual([o.enteredValue, o.enteredUnit], [40, 'in']);
      assert.equal(o.observedAt, '2025-06-09T21:00:00.000Z');
      assert.equal(o.supersedesId, null);
    });

    test('should store a sheath of 28 in as 0.7112 m', async () => {
      const o = (await observe(recorder, 'sheath.length', { value: 28, unit: 'in', observedAt: '2025-06-10T09:05:00+12:00' }).expect(201)).body as Observation;
      assert.equal(o.valueSi, 0.7112);
    });

    test('should store 1 lb as 0.45359237 kg (NIST SP 811, Appendix B.8, exact)', async () => {
      const o = (await observe(recorder, 'corm.mass', { value: 1, unit: 'lb' }).expect(201)).body as Observation;
      assert.equal(o.valueSi, 0.45359237);
    });

    test('should store centimetres and grams in SI as well', async () => {
      assert.equal(((await observe(recorder, 'leaf.blade.length', { value: 61, unit: 'cm' }, 1).expect(201)).body as Observation).valueSi, 0.61);
      assert.equal(((await observe(recorder, 'cormels.mass', { value: 850, unit: 'g' }).expect(201)).body as Observation).valueSi, 0.85);
    });

    test('should store counts and categories', async () => {
      assert.equal(((await observe(recorder, 'suckers.count', { value: 4 }).expect(201)).body as Observation).valueSi, 4);
      const shape = (await observe(recorder, 'corm.shape', { category: 'cone' }).expect(201)).body as Observation;
      assert.deepEqual([shape.category, shape.valueSi, shape.enteredUnit], ['cone', null, null]);
    });

    test('should refuse a typed ratio with 400 naming descriptorId, writing nothing', async () => {
      const before = await rowCounts(h.ds);
      const res = await observe(recorder, 'sheath.petiole.ratio', { value: 0.7, unit: 'count' });
      assertInvalidFields(res, 'descriptorId');
      assert.match(res.body.errors[0].message, /computed/);
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should refuse a unit that does not fit the kind, naming unit, writing nothing', async () => {
      const before = await rowCounts(h.ds);
      assertInvalidFields(await observe(recorder, 'petiole.length', { value: 2, unit: 'kg' }), 'unit');
      assertInvalidFields(await observe(recorder, 'corm.mass', { value: 2, unit: 'in' }), 'unit');
      assertInvalidFields(await observe(recorder, 'suckers.count', { value: 2, unit: 'cm' }), 'unit');
      assertInvalidFields(await observe(recorder, 'petiole.length', { value: 40 }), 'unit');
      assertInvalidFields(await observe(recorder, 'petiole.length', { value: 40, unit: 'ft' }), 'unit');
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should refuse other bad observations, naming the field, writing nothing', async () => {
      const before = await rowCounts(h.ds);
      assertInvalidFields(await observe(recorder, 'suckers.count', { value: 2.5 }), 'value');
      assertInvalidFields(await observe(recorder, 'petiole.length', { value: -1, unit: 'cm' }), 'value');
      assertInvalidFields(await observe(recorder, 'corm.shape', { category: 'triangle' }), 'category');
      assertInvalidFields(await observe(recorder, 'corm.shape', { value: 3, unit: 'cm' }), 'value');
      assertInvalidFields(await observe(recorder, 'petiole.length', { category: 'cone', value: 3, unit: 'cm' }), 'category');
      assertInvalidFields(await observe(recorder, 'petiole.length', { value: 3, unit: 'cm', observedAt: '2999-01-01T00:00:00Z' }), 'observedAt');
      assertInvalidFields(await observe(recorder, 'petiole.length', { value: 3, unit: 'cm', observedAt: '2025-06-10' }), 'observedAt');
      assertInvalidFields(await recorder.post('/api/observations', { accessionId: 987654, descriptorId: byCode.get('petiole.length')!.id, value: 3, unit: 'cm' }), 'accessionId');
      assertInvalidFields(await recorder.post('/api/observations', { accessionId: accession.id, descriptorId: 987654, value: 3, unit: 'cm' }), 'descriptorId');
      const stranger = (await admin.post('/api/accessions', { accessionNumber: 'DS-0002', name: 'Other', siteId, plants: [{ label: 'P1', plantedOn: '2025-01-10' }] }).expect(201)).body as Accession;
      const counted = await rowCounts(h.ds);
      assertInvalidFields(await recorder.post('/api/observations', { accessionId: accession.id, plantId: stranger.plants[0]!.id, descriptorId: byCode.get('petiole.length')!.id, value: 3, unit: 'cm' }), 'plantId');
      assert.deepEqual(await rowCounts(h.ds), counted);
      assert.equal(counted['observation'], before['observation']);
    });

    test('should refuse observations to a reviewer (403), writing nothing', async () => {
      const before = await rowCounts(h.ds);
      assertProblem(await observe(reviewer, 'petiole.length', { value: 40, unit: 'in' }), 403);
      assert.deepEqual(await rowCounts(h.ds), before);
    });
  });

  describe('latest values and derived ratios', () => {
    test('should derive the sheath-to-petiole ratio 0.70 from a 28 in sheath on a 40 in petiole of the same plant (common practice, no source)', async () => {
      const res = await reviewer.get(`/api/accessions/${accession.id}/descriptors`).expect(200);
      const body = res.body as AccessionDescriptors;
      const p1 = body.plants.find((p) => p.plantLabel === 'P1')!;
      const ratio = p1.values.find((v) => v.code === 'sheath.petiole.ratio')!;
      assert.equal(ratio.derived, true);
      assert.equal(ratio.valueSi, 0.7);
      assert.deepEqual(ratio.formatted, { metric: '0.70', imperial: '0.70' });
      assert.equal(ratio.observationId, null);
      const petiole = p1.values.find((v) => v.code === 'petiole.length')!;
      assert.deepEqual(petiole.formatted, { metric: '101.6 cm', imperial: '40.0 in' });
      assert.equal(p1.values.find((v) => v.code === 'corm.shape')!.categoryLabel, 'Cone, narrowing to the top');
    });

    test('should never combine values of two plants into one ratio', async () => {
      // P2 has a blade length but no width; P1 gets a width only: no blade ratio for either.
      await observe(recorder, 'leaf.blade.width', { value: 40, unit: 'cm' }, 0).expect(201);
      const body = (await reviewer.get(`/api/accessions/${accession.id}/descriptors`).expect(200)).body as AccessionDescriptors;
      for (const p of body.plants) assert.ok(!p.values.some((v) => v.code === 'leaf.blade.length.width.ratio'), `${p.plantLabel} has no blade ratio`);
      const p2 = body.plants.find((p) => p.plantLabel === 'P2')!;
      assert.deepEqual(p2.values.map((v) => v.code), ['leaf.blade.length']);
    });

    test('should use the latest observation of each part', async () => {
      // A later sheath of 32 in on P1: 32 / 40 = 0.8.
      await observe(recorder, 'sheath.length', { value: 32, unit: 'in', observedAt: '2025-07-10T09:00:00+12:00' }).expect(201);
      // An earlier petiole must not replace the later one.
      await observe(recorder, 'petiole.length', { value: 10, unit: 'in', observedAt: '2025-05-01T09:00:00+12:00' }).expect(201);
      const p1 = ((await reviewer.get(`/api/accessions/${accession.id}/descriptors`).expect(200)).body as AccessionDescriptors).plants.find((p) => p.plantLabel === 'P1')!;
      assert.equal(p1.values.find((v) => v.code === 'sheath.petiole.ratio')!.valueSi, 0.8);
    });

    test('should answer 404 for an unknown accession', async () => {
      assertProblem(await reviewer.get('/api/accessions/987654/descriptors'), 404);
    });
  });

  describe('corrections keep the history', () => {
    test('should supersede an observation with a new one, linking both ways and keeping the old', async () => {
      const wrong = (await observe(recorder, 'plant.height', { value: 12, unit: 'in' }).expect(201)).body as Observation;
      const res = await recorder.post(`/api/observations/${wrong.id}/supersede`, { value: 120, unit: 'cm' });
      assert.equal(res.status, 201, res.text);
      const fixed = res.body as Observation;
      assert.equal(fixed.supersedesId, wrong.id);
      assert.equal(fixed.valueSi, 1.2);
      assert.equal(fixed.plantId, wrong.plantId);
      assert.equal(fixed.observedAt, wrong.observedAt);
      const all = (await reviewer.get(`/api/observations?accessionId=${accession.id}&descriptorId=${byCode.get('plant.height')!.id}&includeSuperseded=true`).expect(200)).body as ObservationPage;
      const old = all.items.find((o) => o.id === wrong.id)!;
      assert.equal(old.supersededById, fixed.id);
      assert.equal(old.valueSi, 0.3048, 'the old value is kept as it was');
      const current = (await reviewer.get(`/api/observations?accessionId=${accession.id}&descriptorId=${byCode.get('plant.height')!.id}`).expect(200)).body as ObservationPage;
      assert.deepEqual(current.items.map((o) => o.id), [fixed.id]);
      const events = (await admin.get('/api/audit?action=observation.superseded').expect(200)).body.items as { subject: string }[];
      assert.ok(events.some((e) => e.subject === `observation:${wrong.id}`));
    });

    test('should refuse to correct an observation twice (409), someone else’s (403) or an unknown one (404), writing nothing', async () => {
      const first = (await observe(recorder, 'suckers.count', { value: 1 }).expect(201)).body as Observation;
      await recorder.post(`/api/observations/${first.id}/supersede`, { value: 2 }).expect(201);
      const mine = (await observe(recorder, 'suckers.count', { value: 5 }).expect(201)).body as Observation;
      const before = await rowCounts(h.ds);
      assertProblem(await recorder.post(`/api/observations/${first.id}/supersede`, { value: 3 }), 409);
      assertProblem(await otherRecorder.post(`/api/observations/${mine.id}/supersede`, { value: 6 }), 403);
      assertProblem(await recorder.post('/api/observations/987654/supersede', { value: 6 }), 404);
      assertInvalidFields(await recorder.post(`/api/observations/${mine.id}/supersede`, { value: 6, unit: 'kg' }), 'unit');
      assertProblem(await reviewer.post(`/api/observations/${mine.id}/supersede`, { value: 6 }), 403);
      assert.deepEqual(await rowCounts(h.ds), before);
      // An admin may correct anyone's.
      await admin.post(`/api/observations/${mine.id}/supersede`, { value: 6 }).expect(201);
    });
  });

  describe('GET /api/observations', () => {
    test('should page the current observations newest first, with a total', async () => {
      const page1 = (await reviewer.get(`/api/observations?accessionId=${accession.id}&pageSize=3&page=1`).expect(200)).body as ObservationPage;
      const page2 = (await reviewer.get(`/api/observations?accessionId=${accession.id}&pageSize=3&page=2`).expect(200)).body as ObservationPage;
      assert.equal(page1.items.length, 3);
      assert.equal(page1.total, page2.total);
      assert.ok(page1.total > 6);
      const times = [...page1.items, ...page2.items].map((o) => o.observedAt);
      assert.deepEqual(times, [...times].sort().reverse());
      assert.ok(page1.items.every((o) => o.supersededById === null));
    });

    test('should filter by plant and descriptor', async () => {
      const p2 = accession.plants[1]!.id;
      const res = (await reviewer.get(`/api/observations?plantId=${p2}`).expect(200)).body as ObservationPage;
      assert.ok(res.total >= 1);
      assert.ok(res.items.every((o) => o.plantId === p2));
    });

    test('should refuse bad query values with 400 naming them', async () => {
      assertInvalidFields(await reviewer.get('/api/observations?pageSize=5000&accessionId=abc&includeSuperseded=maybe'), 'pageSize', 'accessionId', 'includeSuperseded');
    });
  });
});
