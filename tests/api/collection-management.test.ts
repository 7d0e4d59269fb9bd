// Collection management (issue 5, item 3): sites and their season schemes, accessions and plants,
// and the character catalogue. Admins write, everyone signed in reads; refusals write nothing.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { Accession, Character, Plant, SavedSite, Site } from '../../shared/api/collection.js';
import { seedCharacterCatalogue } from '../../server/collection/seed-catalogue.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { Client, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';

const WET_DRY = [
  { name: 'Wet', start: '11-01', end: '04-30' },
  { name: 'Dry', start: '05-01', end: '10-31' },
];

/** Audit events of one action about one subject. */
async function auditOf(admin: Client, action: string, subject: string): Promise<{ detail: Record<string, unknown> }[]> {
  const items = (await admin.get(`/api/audit?action=${action}&pageSize=200`).expect(200)).body.items as { subject: string; detail: Record<string, unknown> }[];
  return items.filter((e) => e.subject === subject);
}

describe('collection management', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let reviewer: Client;

  before(async () => {
    h = await startHarness({ demo: true });
    [admin, recorder, reviewer] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder'), signedInAs(h, 'reviewer')]);
  });
  after(() => h.close());

  describe('sites and season schemes', () => {
    test('should create a site with its seasons (201), audited, and list it', async () => {
      const res = await admin.post('/api/sites', { code: 'NEW-1', name: 'New Terrace Plot', timezone: 'Pacific/Apia', latitude: -13.8, longitude: -171.7, elevationM: 40, seasons: WET_DRY });
      assert.equal(res.status, 201, res.text);
      const site = res.body as SavedSite;
      assert.deepEqual(site.seasons.map((s) => [s.name, s.start, s.end]), [['Dry', '05-01', '10-31'], ['Wet', '11-01', '04-30']]);
      assert.deepEqual(site.warnings, []);
      const listed = ((await recorder.get('/api/sites').expect(200)).body as Site[]).find((s) => s.id === site.id);
      assert.equal(listed?.timezone, 'Pacific/Apia');
      assert.equal((await auditOf(admin, 'site.created', `site:${site.id}`)).length, 1);
    });

    test('should allow a scheme with a gap and report the uncovered days as a warning', async () => {
      const res = await admin.post('/api/sites', { code: 'GAP-1', name: 'Gappy Plot', timezone: 'Asia/Manila', seasons: [{ name: 'Cool', start: '11-01', end: '02-28' }, { name: 'Warm', start: '03-01', end: '10-31' }] });
      assert.equal(res.status, 201, res.text);
      const [gap] = (res.body as SavedSite).warnings;
      assert.equal(gap?.kind, 'gap');
      assert.match(gap!.message, /29 Feb/);
    });

    test('should refuse an unknown time zone with 400 naming timezone, writing nothing', async () => {
      const before = await rowCounts(h.ds);
      assertInvalidFields(await admin.post('/api/sites', { code: 'TZ-1', name: 'Nowhere', timezone: 'Mars/Olympus_Mons', seasons: WET_DRY }), 'timezone');
      assertInvalidFields(await admin.post('/api/sites', { code: 'TZ-2', name: 'Offset', timezone: '+05:00', seasons: WET_DRY }), 'timezone');
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should refuse overlapping seasons with 400 naming the later season and both names, writing nothing', async () => {
      const before = await rowCounts(h.ds);
      const res = await admin.post('/api/sites', { code: 'OVL-1', name: 'Overlap', timezone: 'Africa/Lagos', seasons: [{ name: 'Dry', start: '11-01', end: '03-31' }, { name: 'Rains', start: '03-15', end: '10-31' }] });
      assertInvalidFields(res, 'seasons.1');
      assert.match(JSON.stringify(res.body.errors), /“Dry” and “Rains” both cover 15 Mar–31 Mar/);
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should refuse impossible dates, repeated names and bad coordinates, naming each field', async () => {
      const res = await admin.post('/api/sites', {
        code: 'BAD 1',
        name: '',
        timezone: 'Pacific/Fiji',
        latitude: 91,
        seasons: [{ name: 'Wet', start: '02-30', end: '04-30' }, { name: 'wet', start: '05-01', end: '10-31' }],
      });
      assertInvalidFields(res, 'code', 'name', 'latitude', 'seasons.0.start', 'seasons.1.name');
    });

    test('should refuse a site code already in use with 409, writing nothing', async () => {
      const before = await rowCounts(h.ds);
      assertProblem(await admin.post('/api/sites', { code: 'RDP', name: 'Second Riverside', timezone: 'Pacific/Fiji', seasons: WET_DRY }), 409);
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should change a site by PATCH, audit the change, and refuse seasons there', async () => {
      const site = (await admin.post('/api/sites', { code: 'PAT-1', name: 'Patch Plot', timezone: 'Asia/Bangkok', seasons: WET_DRY }).expect(201)).body as SavedSite;
      const res = await admin.patch(`/api/sites/${site.id}`, { name: 'Patched Plot', elevationM: 210, latitude: null });
      assert.equal(res.status, 200, res.text);
      assert.equal(res.body.name, 'Patched Plot');
      assert.equal(res.body.elevationM, 210);
      assert.equal(res.body.seasons.length, 2);
      const [event] = await auditOf(admin, 'site.updated', `site:${site.id}`);
      assert.deepEqual(event?.detail['name'], { from: 'Patch Plot', to: 'Patched Plot' });
      assertInvalidFields(await admin.patch(`/api/sites/${site.id}`, { seasons: WET_DRY }), 'seasons');
      assertProblem(await admin.patch(`/api/sites/${site.id}`, { code: 'RDP' }), 409);
      assertProblem(await admin.patch('/api/sites/987654', { name: 'Ghost' }), 404);
    });

    test('should replace a scheme by PUT, keeping the row of a season whose name stays', async () => {
      const site = (await admin.post('/api/sites', { code: 'PUT-1', name: 'Put Plot', timezone: 'Asia/Bangkok', seasons: WET_DRY }).expect(201)).body as SavedSite;
      const wetId = site.seasons.find((s) => s.name === 'Wet')!.id;
      const scheme = [
        { name: 'Wet', start: '10-16', end: '02-15' },
        { name: 'Hot', start: '02-16', end: '05-15' },
        { name: 'Rainy', start: '05-16', end: '10-15' },
      ];
      const res = await admin.put(`/api/sites/${site.id}/seasons`, { seasons: scheme });
      assert.equal(res.status, 200, res.text);
      const saved = res.body as SavedSite;
      assert.deepEqual(saved.seasons.map((s) => s.name), ['Hot', 'Rainy', 'Wet']);
      assert.equal(saved.seasons.find((s) => s.name === 'Wet')!.id, wetId);
      assert.deepEqual(saved.warnings, []);
      const stored = ((await recorder.get('/api/sites').expect(200)).body as Site[]).find((s) => s.id === site.id)!;
      assert.deepEqual(stored.seasons.map((s) => s.name), ['Hot', 'Rainy', 'Wet']);
      const [event] = await auditOf(admin, 'site.seasons.replaced', `site:${site.id}`);
      assert.equal((event?.detail['from'] as unknown[]).length, 2);
    });

    test('should refuse a bad scheme by PUT with 400 and keep the old scheme', async () => {
      const site = (await admin.post('/api/sites', { code: 'PUT-2', name: 'Kept Plot', timezone: 'Asia/Bangkok', seasons: WET_DRY }).expect(201)).body as SavedSite;
      const before = await rowCounts(h.ds);
      assertInvalidFields(await admin.put(`/api/sites/${site.id}/seasons`, { seasons: [{ name: 'A', start: '01-01', end: '12-31' }, { name: 'B', start: '06-01', end: '06-30' }] }), 'seasons.1');
      assertInvalidFields(await admin.put(`/api/sites/${site.id}/seasons`, { seasons: [] }), 'seasons');
      assert.deepEqual(await rowCounts(h.ds), before);
      assertProblem(await admin.put('/api/sites/987654/seasons', { seasons: WET_DRY }), 404);
    });
  });

  describe('accessions and plants', () => {
    let accession: Accession;
    let siteIds: number[];
    before(async () => {
      siteIds = ((await admin.get('/api/sites').expect(200)).body as Site[]).map((s) => s.id);
      accession = (await admin.post('/api/accessions', { accessionNumber: 'CM-0001', name: 'Management Test', siteId: siteIds[0]!, plants: [{ label: 'P1', plantedOn: '2025-02-01' }] }).expect(201)).body as Accession;
    });

    test('should answer one accession by id with its plants, and 404 for an unknown one', async () => {
      const res = await reviewer.get(`/api/accessions/${accession.id}`).expect(200);
      assert.equal(res.body.accessionNumber, 'CM-0001');
      assert.equal(res.body.plants.length, 1);
      assertProblem(await reviewer.get('/api/accessions/987654'), 404);
      assertProblem(await reviewer.get('/api/accessions/abc'), 404);
    });

    test('should change passport fields by PATCH, clear one with null, and audit it', async () => {
      const res = await admin.patch(`/api/accessions/${accession.id}`, { name: 'Managed Test', otherNames: ['Second Name'], originCountry: 'WSM', acquisitionDate: '202503--', donorName: null, siteId: siteIds[1]! });
      assert.equal(res.status, 200, res.text);
      const changed = res.body as Accession;
      assert.equal(changed.name, 'Managed Test');
      assert.deepEqual(changed.otherNames, ['Second Name']);
      assert.equal(changed.siteId, siteIds[1]);
      assert.equal(changed.donorName, null);
      assert.equal(changed.plants.length, 1, 'plants stay');
      const [event] = await auditOf(admin, 'accession.updated', `accession:${accession.id}`);
      assert.deepEqual(event?.detail['name'], { from: 'Management Test', to: 'Managed Test' });
    });

    test('should refuse a taken accession number with 409 and bad passport fields with 400, writing nothing', async () => {
      const before = await rowCounts(h.ds);
      assertProblem(await admin.patch(`/api/accessions/${accession.id}`, { accessionNumber: 'HL-0001' }), 409);
      assertInvalidFields(await admin.patch(`/api/accessions/${accession.id}`, { originCountry: 'Fiji', acquisitionDate: '2025-03-01', sampleStatus: 5 }), 'originCountry', 'acquisitionDate', 'sampleStatus');
      assertInvalidFields(await admin.patch(`/api/accessions/${accession.id}`, { siteId: 987654 }), 'siteId');
      assertProblem(await admin.patch('/api/accessions/987654', { name: 'Ghost' }), 404);
      assert.deepEqual(await rowCounts(h.ds), before);
      assert.equal((await admin.get(`/api/accessions/${accession.id}`).expect(200)).body.accessionNumber, 'CM-0001');
    });

    test('should add a plant at the accession’s site by default (201), audited', async () => {
      const res = await admin.post(`/api/accessions/${accession.id}/plants`, { label: 'P2', plantedOn: '2025-04-10' });
      assert.equal(res.status, 201, res.text);
      const plant = res.body as Plant;
      assert.equal(plant.accessionId, accession.id);
      assert.equal(plant.siteId, siteIds[1], 'the accession moved to the second site above');
      assert.equal((await auditOf(admin, 'plant.created', `plant:${plant.id}`)).length, 1);
    });

    test('should refuse a taken plant label with 409 and a bad date or site with 400, writing nothing', async () => {
      const before = await rowCounts(h.ds);
      assertProblem(await admin.post(`/api/accessions/${accession.id}/plants`, { label: 'P1', plantedOn: '2025-04-10' }), 409);
      assertInvalidFields(await admin.post(`/api/accessions/${accession.id}/plants`, { label: 'P9', plantedOn: '2025-02-30' }), 'plantedOn');
      assertInvalidFields(await admin.post(`/api/accessions/${accession.id}/plants`, { label: 'P9', plantedOn: '2025-02-03', siteId: 987654 }), 'siteId');
      assertProblem(await admin.post('/api/accessions/987654/plants', { label: 'P1', plantedOn: '2025-04-10' }), 404);
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should change a plant by PATCH and refuse a label its accession already uses', async () => {
      const plant = (await admin.post(`/api/accessions/${accession.id}/plants`, { label: 'P3', plantedOn: '2025-05-01' }).expect(201)).body as Plant;
      const res = await admin.patch(`/api/plants/${plant.id}`, { label: 'P3a', plantedOn: '2025-05-02', siteId: siteIds[2]! });
      assert.equal(res.status, 200, res.text);
      assert.deepEqual([res.body.label, res.body.plantedOn, res.body.siteId], ['P3a', '2025-05-02', siteIds[2]]);
      assertProblem(await admin.patch(`/api/plants/${plant.id}`, { label: 'P1' }), 409);
      assertProblem(await admin.patch('/api/plants/987654', { label: 'P1' }), 404);
      const [event] = await auditOf(admin, 'plant.updated', `plant:${plant.id}`);
      assert.deepEqual(event?.detail['label'], { from: 'P3', to: 'P3a' });
    });
  });

  describe('characters', () => {
    test('should give every character a drift threshold of ΔE00 1.8 by default (Paravina et al. 2015 acceptability)', async () => {
      const characters = (await recorder.get('/api/characters').expect(200)).body as Character[];
      assert.ok(characters.length >= 20);
      for (const c of characters) assert.equal(c.driftThreshold, 1.8, c.code);
    });

    test('should keep only colour characters in the seeded catalogue: non-colour ones are descriptors now', async () => {
      const characters = (await recorder.get('/api/characters').expect(200)).body as Character[];
      assert.deepEqual(characters.filter((c) => !c.colour).map((c) => c.code), []);
    });

    test('should add a character (201) after the catalogue and refuse its code a second time (409)', async () => {
      const body = { code: 'petiole.spot.base', organ: 'petiole', label: 'Spot at the petiole base', howToRead: 'Read the dark spot just above the basal ring, where there is one.' };
      const res = await admin.post('/api/characters', body);
      assert.equal(res.status, 201, res.text);
      assert.equal(res.body.colour, true);
      assert.equal(res.body.active, true);
      const list = (await recorder.get('/api/characters').expect(200)).body as Character[];
      assert.equal(list.at(-1)?.code, 'petiole.spot.base');
      const before = await rowCounts(h.ds);
      assertProblem(await admin.post('/api/characters', body), 409);
      assertInvalidFields(await admin.post('/api/characters', { ...body, code: 'Petiole Spot', organ: 'stem', howToRead: '' }), 'code', 'organ', 'howToRead');
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should change a character by PATCH but never its code or organ', async () => {
      const [first] = (await recorder.get('/api/characters').expect(200)).body as Character[];
      const res = await admin.patch(`/api/characters/${first!.id}`, { driftThreshold: 2.5, caution: 'Mind the sharp leaf edge.' });
      assert.equal(res.status, 200, res.text);
      assert.equal(res.body.driftThreshold, 2.5);
      assertInvalidFields(await admin.patch(`/api/characters/${first!.id}`, { code: 'leaf.renamed', organ: 'root' }), 'code', 'organ');
      assertInvalidFields(await admin.patch(`/api/characters/${first!.id}`, { driftThreshold: 0 }), 'driftThreshold');
      assertProblem(await admin.patch('/api/characters/987654', { label: 'Ghost' }), 404);
      const [event] = await auditOf(admin, 'character.updated', `character:${first!.id}`);
      assert.deepEqual(event?.detail['driftThreshold'], { from: 1.8, to: 2.5 });
    });

    test('should keep an admin’s edits to a seeded character when the catalogue is seeded again, even after a restart', async () => {
      const target = ((await recorder.get('/api/characters').expect(200)).body as Character[]).find((c) => c.code === 'corm.flesh.centre')!;
      await admin.patch(`/api/characters/${target.id}`, { label: 'Corm flesh, middle of the cut', howToRead: 'Our own edited instructions for the corm centre.', active: false, driftThreshold: 3 }).expect(200);
      assert.equal(await seedCharacterCatalogue(h.ds), 0, 'nothing is missing, so nothing is added');
      h = await h.restart();
      const again = await Client.resume(h.app, admin).get('/api/characters').expect(200);
      const kept = (again.body as Character[]).find((c) => c.code === 'corm.flesh.centre')!;
      assert.deepEqual([kept.label, kept.howToRead, kept.active, kept.driftThreshold], ['Corm flesh, middle of the cut', 'Our own edited instructions for the corm centre.', false, 3]);
      admin = Client.resume(h.app, admin);
      recorder = Client.resume(h.app, recorder);
      reviewer = Client.resume(h.app, reviewer);
    });
  });

  describe('who may write', () => {
    test('should refuse every write to a recorder and a reviewer with 403, writing nothing', async () => {
      const site = ((await recorder.get('/api/sites').expect(200)).body as Site[])[0]!;
      const before = await rowCounts(h.ds);
      for (const client of [recorder, reviewer]) {
        assertProblem(await client.post('/api/sites', { code: 'NO-1', name: 'No', timezone: 'UTC', seasons: WET_DRY }), 403);
        assertProblem(await client.patch(`/api/sites/${site.id}`, { name: 'No' }), 403);
        assertProblem(await client.put(`/api/sites/${site.id}/seasons`, { seasons: WET_DRY }), 403);
        assertProblem(await client.post('/api/characters', { code: 'no.no', organ: 'leaf', label: 'No', howToRead: 'Not allowed to add this one.' }), 403);
      }
      assert.deepEqual(await rowCounts(h.ds), before);
    });
  });
});
