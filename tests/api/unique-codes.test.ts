// Accession numbers and site codes are unique regardless of letter case (issue 14): "hl-0001" beside
// "HL-0001" is refused with a 409 problem naming the field, and nothing is written.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { Accession } from '../../server/collection/accession.entity.js';
import { Site } from '../../server/collection/site.entity.js';
import { assertProblem } from './assert-problem.js';
import { rowCounts, signedInAs, startHarness, type Client, type Harness } from './harness.js';

describe('codes unique regardless of case', () => {
  let h: Harness;
  let admin: Client;
  let siteId = 0;
  const seasons = [{ name: 'All year', start: '01-01', end: '12-31' }];

  before(async () => {
    h = await startHarness();
    admin = await signedInAs(h, 'admin');
    siteId = (await admin.post('/api/sites', { code: 'CASE', name: 'Case plot', timezone: 'UTC', seasons }).expect(201)).body.id;
    await admin.post('/api/accessions', { accessionNumber: 'HL-0001', name: 'Upper', siteId }).expect(201);
  });
  after(() => h.close());

  const conflictOn = (res: Parameters<typeof assertProblem>[0], field: string) => {
    const problem = assertProblem(res, 409);
    assert.deepEqual(problem.errors?.map((e) => e.field), [field]);
    assert.match(problem.detail ?? '', /regardless of case/);
  };

  test('should refuse a new accession whose number differs only in case, writing nothing', async () => {
    const before = await rowCounts(h.ds);
    conflictOn(await admin.post('/api/accessions', { accessionNumber: 'hl-0001', name: 'Lower', siteId }), 'accessionNumber');
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should refuse renaming an accession to another one\'s number in other case, but allow changing its own case', async () => {
    const other = (await admin.post('/api/accessions', { accessionNumber: 'HL-0002', name: 'Other', siteId }).expect(201)).body;
    conflictOn(await admin.patch(`/api/accessions/${other.id}`, { accessionNumber: 'Hl-0001' }), 'accessionNumber');
    assert.equal((await admin.patch(`/api/accessions/${other.id}`, { accessionNumber: 'hl-0002' }).expect(200)).body.accessionNumber, 'hl-0002');
  });

  test('should refuse a site code that differs only in case, on create and on update', async () => {
    conflictOn(await admin.post('/api/sites', { code: 'case', name: 'Lower plot', timezone: 'UTC', seasons }), 'code');
    const other = (await admin.post('/api/sites', { code: 'OTHR', name: 'Other plot', timezone: 'UTC', seasons }).expect(201)).body;
    conflictOn(await admin.patch(`/api/sites/${other.id}`, { code: 'Case' }), 'code');
  });

  // The database holds the same rule (unique indexes on LOWER(...)), so a writer that goes around the API is refused too.
  const refusedByIndex = (err: unknown, index: string) => {
    const e = err as { code?: string; message?: string };
    assert.equal(e.code, 'SQLITE_CONSTRAINT_UNIQUE');
    assert.ok(e.message?.includes(`index '${index}'`), e.message);
    return true;
  };

  test('should refuse, in the database, an accession saved around the API whose number differs only in case', async () => {
    const before = await rowCounts(h.ds);
    const site = await h.ds.getRepository(Site).findOneByOrFail({ id: siteId });
    await assert.rejects(h.ds.getRepository(Accession).save({ accessionNumber: 'hL-0001', name: 'Around the API', otherNames: [], site }), (e) => refusedByIndex(e, 'IDX_accession_number_lower'));
    assert.deepEqual(await rowCounts(h.ds), before);
    // The index compares case only: a different number still saves.
    const saved = await h.ds.getRepository(Accession).save({ accessionNumber: 'HL-0009', name: 'Different number', otherNames: [], site });
    await h.ds.getRepository(Accession).delete(saved.id);
  });

  test('should refuse, in the database, a site saved around the API whose code differs only in case', async () => {
    const before = await rowCounts(h.ds);
    await assert.rejects(h.ds.getRepository(Site).save({ code: 'cAsE', name: 'Around the API', timezone: 'UTC', latitude: null, longitude: null, elevationM: null }), (e) => refusedByIndex(e, 'IDX_site_code_lower'));
    assert.deepEqual(await rowCounts(h.ds), before);
  });
});
