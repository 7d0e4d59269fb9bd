// Records in plain words (issue 17): wrap-year seasons named across both years, the reading
// history and the audit trail as sentences, the audit trail's filters (who, what, when) and paging,
// and From after To refused naming the field.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { AuditEventRow, Page } from '../../shared/api/auth.js';
import type { DriftAnswer } from '../../shared/api/analysis-answers.js';
import type { PlantProgress } from '../../shared/api/plant-sheet-answers.js';
import type { AccessionProfile } from '../../shared/api/profile-answers.js';
import type { ReadingDetail, ReadingList } from '../../shared/api/reading-answers.js';
import { seasonLabel } from '../../shared/collection/season-of.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { addUser, Client, PASSWORD, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';
import { instrumentBody, readingWorld, type ReadingWorld } from './reading-fixtures.js';

describe('records in plain words', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let world: ReadingWorld;
  let readingId: number;
  let correctionId: number;

  before(async () => {
    h = await startHarness();
    admin = await signedInAs(h, 'admin');
    const juno = await addUser(h.ds, 'recorder', 'juno@test.example');
    await h.ds.query('UPDATE "user" SET name = ? WHERE id = ?', ['Juno Testbright', juno.id]);
    recorder = await new Client(h.app).signIn('juno@test.example', PASSWORD);
    world = await readingWorld(admin);
    // 15 April 2025 in Fiji falls in the Wet season that began on 1 November 2024.
    readingId = (await recorder.post('/api/readings', instrumentBody(world, { observedAt: '2025-04-15T10:00:00+12:00', lab: [32.64865165315684, 18.2, -7.4] })).expect(201)).body.id;
    correctionId = (await recorder.post(`/api/readings/${readingId}/supersede`, { ...instrumentBody(world, { observedAt: '2025-04-15T10:00:00+12:00', lab: [33.1, 17.9, -7.0] }), reason: 'read the wrong third' }).expect(201)).body.id;
  });
  after(() => h.close());

  test('should name a season that wraps the year end by both years: a reading of 15 April 2025 in a November–April season is "Wet 2024–25"', async () => {
    const detail = (await recorder.get(`/api/readings/${readingId}`).expect(200)).body as ReadingDetail;
    assert.deepEqual([detail.season, detail.seasonYear, detail.seasonLabel], ['Wet', 2024, 'Wet 2024–25']);
    const list = (await recorder.get('/api/readings?includeSuperseded=true').expect(200)).body as ReadingList;
    assert.equal(list.items.find((r) => r.id === readingId)?.seasonLabel, 'Wet 2024–25');
    // A season inside one calendar year keeps one year; a wrap across a century writes both years whole.
    assert.equal(seasonLabel('Dry', 2025, false), 'Dry 2025');
    assert.equal(seasonLabel('Wet', 1999, true), 'Wet 1999–2000');
    assert.equal(seasonLabel(null, null, true), null);
  });

  test('should name wrap-year seasons by both years in drift groups, the characterisation record and plant progress', async () => {
    const detail = (await recorder.get(`/api/readings/${readingId}`).expect(200)).body as ReadingDetail;
    const drift = (await recorder.get(`/api/analysis/drift?accessionId=${world.violet.id}&characterId=${detail.characterId}`).expect(200)).body as DriftAnswer;
    assert.deepEqual(drift.groups.map((g) => [g.season, g.seasonYear, g.seasonLabel]), [['Wet', 2024, 'Wet 2024–25']]);
    const profile = (await recorder.get(`/api/accessions/${world.violet.id}/profile`).expect(200)).body as AccessionProfile;
    const character = profile.characters.find((c) => c.characterId === detail.characterId)!;
    assert.deepEqual(character.seasons.map((s) => s.seasonLabel), ['Wet 2024–25']);
    // Progress is for today's season at each plant's own site: P1 at the Fiji plot (Wet wraps), P2 at the coast garden (its Wet does not).
    const progress = (await recorder.get(`/api/accessions/${world.violet.id}/progress`).expect(200)).body as PlantProgress[];
    const [p1, p2] = [progress.find((p) => p.plantLabel === 'P1')!, progress.find((p) => p.plantLabel === 'P2')!];
    assert.equal(p1.seasonLabel, seasonLabel(p1.season, p1.seasonYear, p1.season === 'Wet'));
    assert.equal(p2.seasonLabel, seasonLabel(p2.season, p2.seasonYear, false));
    assert.ok(p1.seasonLabel && p2.seasonLabel, 'both sites have a season every day of the year');
  });

  test("should tell a reading's history in sentences, the correction with its colours and reason", async () => {
    const detail = (await recorder.get(`/api/readings/${readingId}`).expect(200)).body as ReadingDetail;
    const sentences = detail.history.map((e) => e.sentence);
    assert.match(sentences[0]!, /^Juno Testbright recorded reading \d+ by instrument: L\* 32\.65, a\* 18\.20, b\* −7\.40, nearest chip F-\d{3}\.\d{3} at ΔE00 \d\.\d{2}\.$/);
    assert.match(sentences[1]!, new RegExp(`^Juno Testbright corrected reading ${readingId} from L\\* 32\\.65, a\\* 18\\.20, b\\* −7\\.40 \\(F-[0-9.]+\\) to L\\* 33\\.10, a\\* 17\\.90, b\\* −7\\.00 \\(F-[0-9.]+\\) as reading ${correctionId}, because "read the wrong third"\\.$`));
    assert.ok(sentences.every((s) => !s.includes('{') && !s.includes('accessionId')), 'no raw JSON');
  });

  test('should filter the audit trail by who, what and when, page it, and write each event as a sentence', async () => {
    const all = (await admin.get('/api/audit?pageSize=200').expect(200)).body as Page<AuditEventRow>;
    assert.ok(all.items.every((e) => typeof e.sentence === 'string' && e.sentence.endsWith('.')));
    const byJuno = (await admin.get('/api/audit?who=testbright&pageSize=200').expect(200)).body as Page<AuditEventRow>;
    assert.ok(byJuno.total >= 3, 'sign-in, reading, correction');
    assert.ok(byJuno.items.every((e) => e.actorName === 'Juno Testbright'));
    const readings = (await admin.get('/api/audit?who=juno&action=reading').expect(200)).body as Page<AuditEventRow>;
    assert.deepEqual(readings.items.map((e) => e.action).sort(), ['reading.created', 'reading.created', 'reading.superseded']);
    const today = new Date().toISOString().slice(0, 10);
    const todays = (await admin.get(`/api/audit?from=${today}&to=${today}&pageSize=200`).expect(200)).body as Page<AuditEventRow>;
    assert.equal(todays.total, all.total, 'everything happened today');
    const none = (await admin.get('/api/audit?from=2001-01-01&to=2001-12-31').expect(200)).body as Page<AuditEventRow>;
    assert.equal(none.total, 0);
    const page2 = (await admin.get('/api/audit?pageSize=2&page=2').expect(200)).body as Page<AuditEventRow>;
    assert.deepEqual(page2.items.map((e) => e.id), all.items.slice(2, 4).map((e) => e.id));
    const signIn = all.items.find((e) => e.action === 'auth.sign-in' && e.actorName === 'Juno Testbright');
    assert.equal(signIn?.sentence, 'Juno Testbright signed in.');
  });

  test('should answer a conflict in words at the field that conflicts: "An accession RT-V already exists"', async () => {
    const taken = (field: string, res: import('supertest').Response) => {
      const problem = assertProblem(res, 409) as unknown as { detail: string; errors: { field: string; message: string }[] };
      assert.deepEqual(problem.errors.map((e) => e.field), [field]);
      return problem;
    };
    const accession = taken('accessionNumber', await admin.post('/api/accessions', { accessionNumber: 'rt-v', name: 'Twin', siteId: world.wetDry.id }));
    assert.match(accession.detail, /^An accession RT-V already exists; accession numbers are compared regardless of case\.$/);
    assert.equal(accession.errors[0]!.message, 'is taken: an accession RT-V already exists (letter case does not count)');
    const site = taken('code', await admin.post('/api/sites', { code: 'rwd', name: 'Twin plot', timezone: 'Pacific/Fiji', seasons: [{ name: 'All year', start: '01-01', end: '12-31' }] }));
    assert.match(site.detail, /^A site RWD already exists/);
    const plant = taken('label', await admin.post(`/api/accessions/${world.violet.id}/plants`, { label: 'P1', plantedOn: '2025-04-10' }));
    assert.equal(plant.detail, 'A plant P1 already exists in this accession.');
    const user = taken('email', await admin.post('/api/users', { email: 'juno@test.example', name: 'Twin', role: 'recorder', password: 'a-long-passphrase' }));
    assert.equal(user.detail, 'An account for juno@test.example already exists.');
    taken('email', await admin.post('/api/invitations', { email: 'juno@test.example', name: 'Twin', role: 'recorder' }));
  });

  test("should give the reading's latest review with its comment, for the recorder to read at the top", async () => {
    const before = (await recorder.get(`/api/readings/${correctionId}`).expect(200)).body as ReadingDetail;
    assert.equal(before.latestReview, null);
    const reviewer = await signedInAs(h, 'reviewer');
    await reviewer.post(`/api/readings/${correctionId}/review`, { decision: 'reread', comment: 'Read the middle third in open shade.' }).expect(201);
    const after = (await recorder.get(`/api/readings/${correctionId}`).expect(200)).body as ReadingDetail;
    assert.deepEqual([after.latestReview?.decision, after.latestReview?.comment, after.latestReview?.reviewerName], ['reread', 'Read the middle third in open shade.', 'Test reviewer']);
  });

  test("should list the plant's earlier readings of the same character for the review, newest first, without superseded versions", async () => {
    const older = (await recorder.post('/api/readings', instrumentBody(world, { observedAt: '2025-04-01T10:00:00+12:00', lab: [34, 19, -8] })).expect(201)).body.id as number;
    const detail = (await recorder.get(`/api/readings/${correctionId}`).expect(200)).body as ReadingDetail;
    assert.deepEqual(detail.earlier.map((e) => e.id), [older], 'not the superseded original');
    assert.equal(detail.earlier[0]!.observerName, 'Juno Testbright');
    assert.match(detail.earlier[0]!.hex, /^#[0-9a-f]{6}$/);
  });

  test('should approve a filtered set in one request, all or nothing', async () => {
    const reviewer = await signedInAs(h, 'reviewer');
    const a = (await recorder.post('/api/readings', instrumentBody(world, { observedAt: '2025-03-01T10:00:00+12:00' })).expect(201)).body.id as number;
    const b = (await recorder.post('/api/readings', instrumentBody(world, { observedAt: '2025-03-02T10:00:00+12:00' })).expect(201)).body.id as number;
    const before = await rowCounts(h.ds);
    assertProblem(await reviewer.post('/api/reviews/approve', { ids: [a, readingId] }), 409);
    assert.deepEqual(await rowCounts(h.ds), before, 'a superseded reading refuses the whole set');
    assertInvalidFields(await reviewer.post('/api/reviews/approve', { ids: [] }), 'ids');
    assert.deepEqual((await reviewer.post('/api/reviews/approve', { ids: [a, b] }).expect(200)).body, { approved: 2 });
    for (const id of [a, b]) assert.equal(((await recorder.get(`/api/readings/${id}`).expect(200)).body as ReadingDetail).status, 'approved');
  });

  test("should write the days the audit sentences name in the reader's language (Accept-Language), never as ISO", async () => {
    await admin.post('/api/calibration/sessions', { title: 'Days in words', heldOn: '2026-04-02' }).expect(201);
    const sentenceIn = async (language: string) => {
      const page = (await admin.get('/api/audit?action=calibration.session.created&pageSize=50').set('Accept-Language', language).expect(200)).body as Page<AuditEventRow>;
      return page.items.find((e) => e.sentence.includes('"Days in words"'))!.sentence;
    };
    // The same style as the screens' dates (formatDateTime's 'date' style), for each language.
    assert.match(await sentenceIn('en-GB,en;q=0.8'), /, held on 2 Apr 2026\.$/);
    assert.match(await sentenceIn('en-US'), /, held on Apr 2, 2026\.$/);
    assert.doesNotMatch(await sentenceIn('xx-unknown'), /2026-04-02/, 'an unknown language still gets a written day');
  });

  test('should refuse From after To with a 400 naming "to", and keep the audit trail from non-admins', async () => {
    assertInvalidFields(await admin.get('/api/audit?from=2026-05-02&to=2026-05-01'), 'to');
    assertInvalidFields(await recorder.get('/api/readings?from=2026-05-02&to=2026-05-01'), 'to');
    assertProblem(await recorder.get('/api/audit'), 403);
  });
});
