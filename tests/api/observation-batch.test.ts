// Descriptor values: plausible ranges per descriptor and several values saved all or nothing (issue 13).
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { Descriptor, Observation } from '../../shared/api/descriptors.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import type { Response } from 'supertest';

/** The message of the error naming `field`, after checking the problem names it. */
function messageFor(res: Response, field: string): string {
  assertInvalidFields(res, field);
  return (res.body as { errors: { field: string; message: string }[] }).errors.find((e) => e.field === field)!.message;
}
import { addUser, Client, PASSWORD, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';
import { readingWorld, type ReadingWorld } from './reading-fixtures.js';

describe('descriptor values', () => {
  let h: Harness;
  let recorder: Client;
  let w: ReadingWorld;
  let byCode: Map<string, Descriptor>;

  before(async () => {
    h = await startHarness();
    const admin = await signedInAs(h, 'admin');
    recorder = await signedInAs(h, 'recorder');
    w = await readingWorld(admin);
    byCode = new Map(((await admin.get('/api/descriptors').expect(200)).body as Descriptor[]).map((d) => [d.code, d]));
  });
  after(() => h.close());

  const value = (code: string, v: number, unit?: string) => ({ accessionId: w.violet.id, plantId: w.violet.plants[0]!.id, descriptorId: byCode.get(code)!.id, value: v, ...(unit ? { unit } : {}) });

  test('should refuse a 127 m petiole, naming the field, the descriptor and the unit', async () => {
    const before = await rowCounts(h.ds);
    const message = messageFor(await recorder.post('/api/observations', value('petiole.length', 127, 'm')), 'value');
    assert.match(message, /127 m is not a plausible petiole length: expected 0\.02 m to 3 m/);
    // The same length in centimetres is fine; the range is said in the unit typed.
    await recorder.post('/api/observations', value('petiole.length', 127, 'cm')).expect(201);
    const inches = messageFor(await recorder.post('/api/observations', value('petiole.length', 400, 'in')), 'value');
    assert.match(inches, /400 in .* expected 0\.79 in to 118\.11 in/);
    assertInvalidFields(await recorder.post('/api/observations', value('suckers.count', 2.5)), 'value');
    assert.equal((await rowCounts(h.ds))['observation'], before['observation']! + 1);
  });

  test('should save several values at once', async () => {
    const res = await recorder.post('/api/observations/batch', { observations: [value('plant.height', 110, 'cm'), value('suckers.count', 4), { ...value('corm.shape', 0), value: undefined, category: 'round' }] }).expect(201);
    const saved = res.body as Observation[];
    assert.deepEqual(saved.map((o) => o.descriptorCode), ['plant.height', 'suckers.count', 'corm.shape']);
    assert.equal(saved[0]!.valueSi, 1.1);
  });

  test('should save nothing when one value of several is refused, naming that value', async () => {
    const reviewer = await signedInAs(h, 'reviewer');
    const before = await rowCounts(h.ds);
    const res = await recorder.post('/api/observations/batch', { observations: [value('plant.height', 120, 'cm'), value('sheath.length', 3000, 'cm'), value('suckers.count', 5)] });
    const message = messageFor(res, 'observations.1.value');
    assert.match(message, /3000 cm is not a plausible sheath length/);
    assertInvalidFields(await recorder.post('/api/observations/batch', { observations: [] }), 'observations');
    assertProblem(await reviewer.post('/api/observations/batch', { observations: [value('plant.height', 120, 'cm')] }), 403);
    assert.deepEqual(await rowCounts(h.ds), before);
  });
});

describe('unit preference on the server', () => {
  let h: Harness;

  before(async () => {
    h = await startHarness();
  });
  after(() => h.close());

  test('should keep each person’s units on the server, for every device they sign in on', async () => {
    await addUser(h.ds, 'recorder', 'two-phones@test.example');
    const recorder = await new Client(h.app).signIn('two-phones@test.example', PASSWORD);
    const reviewer = await signedInAs(h, 'reviewer');
    assert.deepEqual((await recorder.get('/api/account/preferences').expect(200)).body, { unitSystem: 'metric' });
    await recorder.put('/api/account/preferences', { unitSystem: 'imperial' }).expect(200);
    // Another sign-in (another phone) of the same person sees it; another person does not.
    const again = await new Client(h.app).signIn('two-phones@test.example', PASSWORD);
    assert.deepEqual((await again.get('/api/account/preferences').expect(200)).body, { unitSystem: 'imperial' });
    assert.deepEqual((await reviewer.get('/api/account/preferences').expect(200)).body, { unitSystem: 'metric' });
    assertInvalidFields(await recorder.put('/api/account/preferences', { unitSystem: 'furlongs' }), 'unitSystem');
  });
});
