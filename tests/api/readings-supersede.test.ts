// Readings are never edited in place (issue 5, item 2): a correction is a new reading that
// supersedes the old one, linked both ways; nothing is lost; recorders correct only their own.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { ReadingDetail, ReadingList } from '../../shared/api/reading-answers.js';
import { AuditEvent } from '../../server/audit/audit-event.entity.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { rowCounts, signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { instrumentBody, readingWorld, type ReadingWorld } from './reading-fixtures.js';

describe('superseding readings', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let otherRecorder: Client;
  let reviewer: Client;
  let w: ReadingWorld;

  before(async () => {
    h = await startHarness();
    [admin, recorder, otherRecorder, reviewer] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder'), signedInAs(h, 'recorder'), signedInAs(h, 'reviewer')]);
    w = await readingWorld(admin);
  });
  after(() => h.close());

  const take = async (client: Client, lab: [number, number, number]) => (await client.post('/api/readings', instrumentBody(w, { lab })).expect(201)).body as ReadingDetail;
  const correct = (client: Client, id: number, lab: [number, number, number], reason: string) => client.post(`/api/readings/${id}/supersede`, { ...instrumentBody(w, { lab }), reason });

  test('should keep a chain of four versions, each linked both ways, the old ones unchanged', async () => {
    const first = await take(recorder, [40, 20, -10]);
    const rowsBefore = await h.ds.query('SELECT * FROM reading WHERE id = ?', [first.id]);
    const chain: ReadingDetail[] = [first];
    for (const [i, lab] of ([[41, 20, -10], [42, 21, -10], [43, 21, -11]] as [number, number, number][]).entries()) {
      const res = await correct(recorder, chain.at(-1)!.id, lab, `L* mistyped (${i + 1})`);
      assert.equal(res.status, 201, res.text);
      assert.equal(res.headers['location'], `/api/readings/${res.body.id}`);
      chain.push(res.body);
    }
    const last = chain.at(-1)!;
    assert.deepEqual(last.lab, [43, 21, -11]);
    assert.equal(last.supersedesId, chain[2]!.id);
    assert.equal(last.supersededById, null);
    assert.deepEqual(last.versions.map((v) => v.id), chain.map((r) => r.id), 'versions: the whole chain, oldest first');
    assert.deepEqual(last.versions.map((v) => v.current), [false, false, false, true]);
    assert.deepEqual(last.versions.map((v) => v.reason), [null, 'L* mistyped (1)', 'L* mistyped (2)', 'L* mistyped (3)']);

    for (const [i, r] of chain.entries()) {
      const now = (await reviewer.get(`/api/readings/${r.id}`).expect(200)).body as ReadingDetail;
      assert.deepEqual(now.lab, r.lab, 'each version keeps its own colour');
      assert.equal(now.supersedesId, i === 0 ? null : chain[i - 1]!.id);
      assert.equal(now.supersededById, i === chain.length - 1 ? null : chain[i + 1]!.id);
      assert.deepEqual(now.versions.map((v) => v.id), chain.map((x) => x.id), 'every version shows the same chain');
    }
    // The first row is as it was, but for the forward link.
    const rowsAfter = await h.ds.query('SELECT * FROM reading WHERE id = ?', [first.id]);
    assert.deepEqual({ ...rowsAfter[0], supersededById: null }, rowsBefore[0]);
    assert.equal(rowsAfter[0].supersededById, chain[1]!.id);
  });

  test('should list only current readings unless superseded ones are asked for', async () => {
    const a = await take(recorder, [50, 10, 10]);
    const b = (await correct(recorder, a.id, [51, 10, 10], 'light changed').expect(201)).body as ReadingDetail;
    const observerId = a.observerId;
    const current = (await admin.get(`/api/readings?observerId=${observerId}&pageSize=100`).expect(200)).body as ReadingList;
    const all = (await admin.get(`/api/readings?observerId=${observerId}&pageSize=100&includeSuperseded=true`).expect(200)).body as ReadingList;
    assert.ok(current.items.some((r) => r.id === b.id) && !current.items.some((r) => r.id === a.id));
    assert.ok(all.items.some((r) => r.id === a.id) && all.items.some((r) => r.id === b.id));
    assert.equal(all.total - current.total, all.items.filter((r) => r.supersededById !== null).length);
  });

  test('should record reading.superseded on the old and reading.created on the new, in both histories', async () => {
    const a = await take(recorder, [60, 0, 30]);
    const b = (await correct(recorder, a.id, [60, 0, 31], 'b* misread').expect(201)).body as ReadingDetail;
    const events = await h.ds.getRepository(AuditEvent).find({ where: [{ subject: `reading:${a.id}` }, { subject: `reading:${b.id}` }], order: { id: 'ASC' } });
    assert.deepEqual(events.map((e) => [e.action, e.subject]), [['reading.created', `reading:${a.id}`], ['reading.created', `reading:${b.id}`], ['reading.superseded', `reading:${a.id}`]]);
    assert.equal(events[1]!.detail!['supersedes'], a.id);
    assert.equal(events[2]!.detail!['by'], b.id);
    assert.equal(events[2]!.detail!['reason'], 'b* misread');
    const old = (await reviewer.get(`/api/readings/${a.id}`).expect(200)).body as ReadingDetail;
    assert.deepEqual(old.history.map((e) => e.action), ['reading.created', 'reading.superseded']);
    assert.deepEqual(b.history.map((e) => e.action), ['reading.created']);
  });

  test('should refuse to supersede a superseded reading with 409, writing nothing', async () => {
    const a = await take(recorder, [30, 30, 0]);
    await correct(recorder, a.id, [31, 30, 0], 'first fix').expect(201);
    const before = await rowCounts(h.ds);
    assertProblem(await correct(recorder, a.id, [32, 30, 0], 'second fix of the old one'), 409);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should let only the observer or an admin correct; 403 for another recorder, writing nothing', async () => {
    const a = await take(recorder, [45, -20, 25]);
    const before = await rowCounts(h.ds);
    assertProblem(await correct(otherRecorder, a.id, [45, -20, 26], 'not mine'), 403);
    assertProblem(await correct(reviewer, a.id, [45, -20, 26], 'reviewers only read'), 403);
    assert.deepEqual(await rowCounts(h.ds), before);
    const byAdmin = await correct(admin, a.id, [45, -20, 26], 'typo spotted by the admin');
    assert.equal(byAdmin.status, 201, byAdmin.text);
    // The observation stays the recorder's; the audit names the admin as the one who corrected it.
    assert.equal(byAdmin.body.observerId, a.observerId);
    assert.equal(byAdmin.body.history[0].actorName, 'Test admin');
    assert.equal((await correct(recorder, byAdmin.body.id, [45, -20, 27], 'recorder re-read it')).status, 201);
  });

  test('should need a reason and a valid body, and 404 for no such reading, writing nothing', async () => {
    const a = await take(recorder, [55, 5, 5]);
    const before = await rowCounts(h.ds);
    assertInvalidFields(await recorder.post(`/api/readings/${a.id}/supersede`, instrumentBody(w)), 'reason');
    assertInvalidFields(await correct(recorder, a.id, [55, 5, 5], '   '), 'reason');
    assertInvalidFields(await recorder.post(`/api/readings/${a.id}/supersede`, { ...instrumentBody(w, { lab: [120, 0, 0] }), reason: 'x' }), 'lab.0');
    assertInvalidFields(await recorder.post(`/api/readings/${a.id}/supersede`, { ...instrumentBody(w, { characterId: 99999 }), reason: 'x' }), 'characterId');
    assertProblem(await correct(recorder, 999999, [55, 5, 5], 'nothing there'), 404);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should never delete: every reading ever taken is still there', async () => {
    const [{ n }] = await h.ds.query('SELECT COUNT(*) AS n FROM reading');
    const [{ created }] = await h.ds.query(`SELECT COUNT(*) AS created FROM audit_event WHERE action = 'reading.created'`);
    assert.equal(n, created);
  });
});
