// The accessions' passport export after FAO/Bioversity Multi-Crop Passport Descriptors V.2.1
// (Alercia, Diulgheroff & Mackay 2015): the field names in the standard's order,
// several values joined by ";", dates YYYYMMDD with hyphens for unknown parts. The CSV is read
// back with csv-parse, a general-purpose RFC 4180 parser, not with our own code.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { parse } from 'csv-parse/sync';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { Client, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';

/** MCPD V.2.1 field names in the order the standard lists them, typed out again here rather than imported. */
const MCPD_V21 = 'PUID,INSTCODE,ACCENUMB,COLLNUMB,COLLCODE,COLLNAME,COLLINSTADDRESS,COLLMISSID,GENUS,SPECIES,SPAUTHOR,SUBTAXA,SUBTAUTHOR,CROPNAME,ACCENAME,ACQDATE,ORIGCTY,COLLSITE,DECLATITUDE,LATITUDE,DECLONGITUDE,LONGITUDE,COORDUNCERT,COORDDATUM,GEOREFMETH,ELEVATION,COLLDATE,BREDCODE,BREDNAME,SAMPSTAT,ANCEST,COLLSRC,DONORCODE,DONORNAME,DONORNUMB,OTHERNUMB,DUPLSITE,DUPLINSTNAME,STORAGE,MLSSTAT,ACCEURL,REMARKS';

describe('GET /api/accessions/mcpd.csv', () => {
  let h: Harness;
  let reviewer: Client;
  let text: string;
  let rows: Record<string, string>[];

  before(async () => {
    h = await startHarness({ demo: true });
    const admin = await signedInAs(h, 'admin');
    reviewer = await signedInAs(h, 'reviewer');
    const site = (await admin.post('/api/sites', { code: 'MCP', name: 'Export Plot', timezone: 'Pacific/Fiji', latitude: -17.51234, longitude: 177.98765, elevationM: 12.6, seasons: [{ name: 'All year', start: '01-01', end: '12-31' }] }).expect(201)).body;
    await admin.post('/api/accessions', {
      accessionNumber: 'MC-0001',
      name: 'Comma, the Elder',
      otherNames: ['Second "quoted" name', 'Third'],
      siteId: site.id,
      instituteCode: 'XHL009',
      originCountry: 'FJI',
      collectingSite: 'Garden by the old mill\nsecond line',
      collectingLatitude: -16.80012,
      collectingLongitude: 178.41236,
      collectingElevationM: 240.4,
      acquisitionDate: '202403--',
      sampleStatus: 300,
      donorName: 'Ottoline Brake',
      remarks: 'Café-grown; ñame-like corm',
    }).expect(201);
    await admin.post('/api/accessions', { accessionNumber: 'MC-0002', name: '=HYPERLINK("https://example.invalid","open")', siteId: site.id, remarks: '@SUM(1+1)' }).expect(201);
    const res = await reviewer.get('/api/accessions/mcpd.csv').expect(200);
    text = res.text;
    assert.match(String(res.headers['content-type']), /^text\/csv; charset=utf-8/);
    assert.match(String(res.headers['content-disposition']), /attachment; filename="accessions-mcpd-\d{4}-\d{2}-\d{2}\.csv"/);
    rows = parse(text, { columns: true, bom: false }) as Record<string, string>[];
  });
  after(() => h.close());

  test('should start with the MCPD V.2.1 field names in the standard’s order, CRLF line ends', () => {
    assert.equal(text.slice(0, text.indexOf('\r\n')), MCPD_V21);
    assert.ok(!text.startsWith('\uFEFF'), 'no byte-order mark before PUID');
  });

  test('should have one row per accession, in accession-number order, then the report row', () => {
    assert.ok(rows.length >= 9, `${rows.length} rows`);
    const numbers = rows.slice(0, -1).map((r) => r['ACCENUMB']!);
    assert.ok(numbers.every((n) => n !== ''));
    assert.deepEqual(numbers, [...numbers].sort());
    assert.equal(rows.at(-1)!['ACCENUMB'], '', 'the report row holds no accession');
  });

  test('should warn in a report row about every accession without INSTCODE (MCPD requires it)', () => {
    const report = rows.at(-1)!;
    const without = rows.slice(0, -1).filter((r) => r['INSTCODE'] === '').map((r) => r['ACCENUMB']);
    assert.ok(without.includes('MC-0002') && without.includes('HL-0006'), without.join(','));
    assert.equal(report['REMARKS'], `Export report, not an accession: INSTCODE (required by MCPD) is missing for ${without.length} accessions: ${without.join(', ')}.`);
    assert.ok(!report['REMARKS']!.includes('MC-0001'));
  });

  test('should quote a name with a comma and join several names with ";"', () => {
    const row = rows.find((r) => r['ACCENUMB'] === 'MC-0001')!;
    assert.equal(row['ACCENAME'], 'Comma, the Elder;Second "quoted" name;Third');
    assert.ok(text.includes('"Comma, the Elder;Second ""quoted"" name;Third"'), 'RFC 4180 quoting of commas and doubled quotes');
    assert.equal(row['COLLSITE'], 'Garden by the old mill\nsecond line');
  });

  test('should write dates YYYYMMDD with hyphens for unknown parts, and taro’s taxonomy', () => {
    const row = rows.find((r) => r['ACCENUMB'] === 'MC-0001')!;
    assert.equal(row['ACQDATE'], '202403--');
    for (const r of rows) assert.match(r['ACQDATE']!, /^(\d{4}(\d{2}|--)(\d{2}|--))?$/, r['ACCENUMB']);
    assert.deepEqual([row['GENUS'], row['SPECIES'], row['SPAUTHOR'], row['CROPNAME']], ['Colocasia', 'esculenta', '(L.) Schott', 'taro']);
    assert.equal(row['SAMPSTAT'], '300');
    assert.equal(row['ORIGCTY'], 'FJI');
    assert.equal(row['INSTCODE'], 'XHL009');
  });

  test('should give the accession’s own collecting coordinates in decimal degrees and elevation in whole metres, never the holding site’s', () => {
    const row = rows.find((r) => r['ACCENUMB'] === 'MC-0001')!;
    assert.equal(row['DECLATITUDE'], '-16.8001');
    assert.equal(row['DECLONGITUDE'], '178.4124');
    assert.equal(row['ELEVATION'], '240');
    assert.equal(row['LATITUDE'], '', 'the DMS forms stay blank');
    // MC-0002 has no collecting coordinates: blank, although its holding site has -17.5123, 177.9877, 13 m.
    const unknown = rows.find((r) => r['ACCENUMB'] === 'MC-0002')!;
    assert.deepEqual([unknown['DECLATITUDE'], unknown['DECLONGITUDE'], unknown['ELEVATION']], ['', '', '']);
  });

  test('should make text that would start a spreadsheet formula inert, but leave negative coordinates as numbers (OWASP CSV injection)', () => {
    const row = rows.find((r) => r['ACCENUMB'] === 'MC-0002')!;
    assert.equal(row['ACCENAME'], `'=HYPERLINK("https://example.invalid","open")`);
    assert.equal(row['REMARKS'], "'@SUM(1+1)");
    assert.equal(rows.find((r) => r['ACCENUMB'] === 'MC-0001')!['DECLATITUDE'], '-16.8001');
  });

  test('should keep UTF-8 text intact', () => {
    assert.equal(rows.find((r) => r['ACCENUMB'] === 'MC-0001')!['REMARKS'], 'Café-grown; ñame-like corm');
  });

  test('should leave unknown fields blank for the demo accession without passport details', () => {
    const row = rows.find((r) => r['ACCENUMB'] === 'HL-0008')!;
    assert.deepEqual([row['ACQDATE'], row['SAMPSTAT'], row['DONORNAME'], row['PUID']], ['', '', '', '']);
  });

  test('should not be taken for an accession id, and need a session', async () => {
    assertProblem(await (await new Client(h.app).prime()).get('/api/accessions/mcpd.csv'), 401);
  });

  test('should refuse parameters it does not take with problem+json', async () => {
    assertInvalidFields(await reviewer.get('/api/accessions/mcpd.csv?site=MCP'), 'query');
  });

  test('should refuse collecting coordinates out of range on create and update, naming the field and unit, writing nothing', async () => {
    const admin = await signedInAs(h, 'admin');
    const siteId = (await admin.get('/api/sites').expect(200)).body.find((s: { code: string }) => s.code === 'MCP').id;
    const before = await rowCounts(h.ds);
    const created = await admin.post('/api/accessions', { accessionNumber: 'MC-0099', name: 'Out of range', siteId, collectingLatitude: 91, collectingLongitude: -180.5, collectingElevationM: 9500 });
    assertInvalidFields(created, 'collectingLatitude', 'collectingLongitude', 'collectingElevationM');
    const messages = Object.fromEntries(assertProblem(created, 400).errors!.map((e) => [e.field, e.message]));
    assert.match(messages['collectingLatitude']!, /degrees/);
    assert.match(messages['collectingLongitude']!, /degrees/);
    assert.match(messages['collectingElevationM']!, /metres/);
    assert.deepEqual(await rowCounts(h.ds), before);
    const typed = await admin.post('/api/accessions', { accessionNumber: 'MC-0099', name: 'Wrong type', siteId, collectingLatitude: '16 S' });
    assert.ok(assertProblem(typed, 400).errors?.some((e) => e.field === 'collectingLatitude' && /degrees/.test(e.message)), typed.text);
    const id = (await admin.get('/api/accessions').expect(200)).body.find((a: { accessionNumber: string }) => a.accessionNumber === 'MC-0001').id;
    assertInvalidFields(await admin.patch(`/api/accessions/${id}`, { collectingElevationM: -600, name: 'Renamed' }), 'collectingElevationM');
    assert.deepEqual(await rowCounts(h.ds), before);
    const after = (await admin.get(`/api/accessions/${id}`).expect(200)).body;
    assert.deepEqual([after.name, after.collectingElevationM], ['Comma, the Elder', 240.4]);
  });
});
