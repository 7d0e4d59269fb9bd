// Free text never stores invisible control characters: NUL truncates text in other tools, and the
// Unicode bidirectional overrides (U+202E and its kin; Unicode Technical Report #36) can make a
// name or a note read differently from what it holds. Such text is refused with a 400 naming the
// field, and nothing is written; newlines and tabs are ordinary text and are kept.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { assertProblem } from './assert-problem.js';
import { rowCounts, signedInAs, startHarness, type Client, type Harness } from './harness.js';

describe('control characters in free-text fields', () => {
  let h: Harness;
  let admin: Client;
  let siteId: number;

  before(async () => {
    h = await startHarness();
    admin = await signedInAs(h, 'admin');
    const site = await admin.post('/api/sites', { code: 'CTL-1', name: 'Control Plot', timezone: 'Pacific/Apia', seasons: [{ name: 'All year', start: '01-01', end: '12-31' }] });
    assert.equal(site.status, 201, site.text);
    siteId = (site.body as { id: number }).id;
  });
  after(() => h.close());

  test('should refuse a right-to-left override in a name with 400 naming the field, writing nothing', async () => {
    const before = await rowCounts(h.ds);
    const res = await admin.post('/api/accessions', { accessionNumber: 'CTL-0001', name: 'Taro \u202Egnp.exe', siteId });
    const problem = assertProblem(res, 400);
    const error = problem.errors?.find((e) => e.field === 'name');
    assert.ok(error, JSON.stringify(problem.errors));
    assert.match(error.message, /control characters \(U\+202E at character 6\)/);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should refuse a NUL inside a list item, naming its place in the list', async () => {
    const before = await rowCounts(h.ds);
    const res = await admin.post('/api/accessions', { accessionNumber: 'CTL-0002', name: 'Plain', otherNames: ['fine', 'bad\u0000name'], siteId });
    const problem = assertProblem(res, 400);
    assert.ok(problem.errors?.some((e) => e.field === 'otherNames.1' && /U\+0000/.test(e.message)), JSON.stringify(problem.errors));
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should refuse a control character in a site name on an update, leaving the site as it was', async () => {
    assertProblem(await admin.patch(`/api/sites/${siteId}`, { name: 'Control\u0007Plot' }), 400);
    const sites = (await admin.get('/api/sites').expect(200)).body as { id: number; name: string }[];
    assert.equal(sites.find((s) => s.id === siteId)?.name, 'Control Plot');
  });

  test('should keep newlines and tabs in free text', async () => {
    const remarks = 'First line\n\tindented second line\r\nthird line';
    const res = await admin.post('/api/accessions', { accessionNumber: 'CTL-0003', name: 'Multi-line', remarks, siteId });
    assert.equal(res.status, 201, res.text);
    const stored = (await admin.get(`/api/accessions/${(res.body as { id: number }).id}`).expect(200)).body as { remarks: string };
    assert.equal(stored.remarks, remarks);
  });
});
