// Accession numbers and site codes are unique regardless of letter case (issue 14): "hl-0001" beside
// "HL-0001" is refused with a 409 problem naming the field, and nothing is written.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
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
});
