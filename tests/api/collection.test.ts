import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { Accession, Character, Site } from '../../shared/api/collection.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { Client, rowCounts, startHarness, type Harness } from './harness.js';

/** The demo password README.md prints for the demo accounts. */
const DEMO_PASSWORD = 'demo-pass-2026';
const DEMO_ACCOUNTS = ['admin', 'trainer', 'reviewer', 'recorder'] as const;

/** "MM-DD" of every day of a leap year, so 02-29 is covered too. */
function daysOfLeapYear(): string[] {
  const days: string[] = [];
  for (let t = Date.UTC(2024, 0, 1); t < Date.UTC(2025, 0, 1); t += 86_400_000) days.push(new Date(t).toISOString().slice(5, 10));
  return days;
}

/** Whether an inclusive "MM-DD" range holds the day; a range whose end comes before its start wraps the year end. */
function inSeason(day: string, start: string, end: string): boolean {
  return start <= end ? day >= start && day <= end : day >= start || day <= end;
}

describe('the collection with the demo scenario (/api/sites, /api/characters, /api/accessions)', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;

  before(async () => {
    h = await startHarness({ demo: true });
    [admin, recorder] = await Promise.all([new Client(h.app).signIn('admin@demo.test', DEMO_PASSWORD), new Client(h.app).signIn('recorder@demo.test', DEMO_PASSWORD)]);
  });
  after(() => h.close());

  test('should let each documented demo account sign in with its own role (README.md)', async () => {
    for (const role of DEMO_ACCOUNTS) {
      const client = role === 'admin' ? admin : role === 'recorder' ? recorder : await new Client(h.app).signIn(`${role}@demo.test`, DEMO_PASSWORD);
      assert.equal((await client.get('/api/auth/me').expect(200)).body.user.role, role);
    }
  });

  describe('GET /api/sites', () => {
    let sites: Site[];
    before(async () => {
      sites = (await recorder.get('/api/sites').expect(200)).body as Site[];
    });

    test('should list at least 3 sites in at least 3 different, valid time zones', () => {
      assert.ok(sites.length >= 3, `${sites.length} sites`);
      const zones = new Set(sites.map((s) => s.timezone));
      assert.ok(zones.size >= 3, `time zones: ${[...zones].join(', ')}`);
      for (const zone of zones) assert.doesNotThrow(() => new Intl.DateTimeFormat('en', { timeZone: zone }), `${zone} is an IANA zone`);
    });

    test('should have a site whose season scheme wraps the year end and one with three seasons', () => {
      assert.ok(sites.some((s) => s.seasons.some((x) => x.end < x.start)), 'a season runs across 31 December');
      assert.ok(sites.some((s) => s.seasons.length === 3), 'a site has three seasons');
    });

    test('should give every site seasons that cover each day of the year exactly once', () => {
      const days = daysOfLeapYear();
      assert.equal(days.length, 366);
      for (const site of sites) {
        for (const s of site.seasons) {
          assert.match(s.start, /^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/);
          assert.match(s.end, /^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/);
        }
        for (const day of days) {
          const holding = site.seasons.filter((s) => inSeason(day, s.start, s.end));
          assert.equal(holding.length, 1, `${site.code} ${day} falls in ${holding.map((s) => s.name).join(', ') || 'no season'}`);
        }
      }
    });
  });

  describe('GET /api/characters', () => {
    let characters: Character[];
    before(async () => {
      characters = (await recorder.get('/api/characters').expect(200)).body as Character[];
    });

    test('should list at least 20 colour characters across leaf, petiole, sheath, sap, corm and root', () => {
      const colours = characters.filter((c) => c.colour);
      assert.ok(colours.length >= 20, `${colours.length} colour characters`);
      const organs = new Set(colours.map((c) => c.organ));
      for (const organ of ['leaf', 'petiole', 'sheath', 'sap', 'corm', 'root']) assert.ok(organs.has(organ as Character['organ']), `a colour character of the ${organ}`);
    });

    test('should give every corm and sap character a caution about raw tissue', () => {
      const raw = characters.filter((c) => c.organ === 'corm' || c.organ === 'sap');
      assert.ok(raw.length > 0);
      for (const c of raw) assert.match(c.caution ?? '', /glove/i, `${c.code} carries a caution`);
    });

    test('should say how to read every character, under a unique code', () => {
      assert.equal(new Set(characters.map((c) => c.code)).size, characters.length);
      for (const c of characters) assert.ok(c.howToRead.length > 20, `${c.code} says how to read it`);
    });
  });

  describe('GET and POST /api/accessions', () => {
    let siteIds: number[];
    before(async () => {
      siteIds = ((await admin.get('/api/sites').expect(200)).body as Site[]).map((s) => s.id);
    });

    test('should list at least 8 accessions that have plants at known sites', async () => {
      const accessions = (await recorder.get('/api/accessions').expect(200)).body as Accession[];
      const withPlants = accessions.filter((a) => a.plants.length > 0);
      assert.ok(withPlants.length >= 8, `${withPlants.length} accessions with plants`);
      for (const a of accessions) {
        assert.ok(siteIds.includes(a.siteId), `${a.accessionNumber} is held at a known site`);
        for (const p of a.plants) {
          assert.ok(siteIds.includes(p.siteId), `${a.accessionNumber} ${p.label} grows at a known site`);
          assert.match(p.plantedOn, /^\d{4}-\d{2}-\d{2}$/);
        }
      }
    });

    test('should create an accession with its plants (201), which is then listed', async () => {
      const body = {
        accessionNumber: 'HL-T-0001',
        name: 'Test Lantern',
        siteId: siteIds[0]!,
        otherNames: ['Little Lamp'],
        originCountry: 'FJI',
        acquisitionDate: '2025----',
        sampleStatus: 300,
        plants: [
          { label: 'P2', plantedOn: '2025-03-01' },
          { label: 'P1', plantedOn: '2025-02-01', siteId: siteIds[1]! },
        ],
      };
      const res = await admin.post('/api/accessions', body);
      assert.equal(res.status, 201, res.text);
      const created = res.body as Accession;
      assert.equal(created.accessionNumber, 'HL-T-0001');
      assert.deepEqual(created.plants.map((p) => [p.label, p.siteId]), [['P1', siteIds[1]], ['P2', siteIds[0]]]);
      const listed = ((await recorder.get('/api/accessions').expect(200)).body as Accession[]).find((a) => a.id === created.id);
      assert.ok(listed, 'the new accession is listed');
      assert.equal(listed.name, 'Test Lantern');
      assert.equal(listed.plants.length, 2);
      assert.deepEqual(listed.otherNames, ['Little Lamp']);
    });

    test('should refuse an accession number already in use with 409 and create nothing', async () => {
      await admin.post('/api/accessions', { accessionNumber: 'HL-T-0002', name: 'First', siteId: siteIds[0]! }).expect(201);
      const before = await rowCounts(h.ds);
      assertProblem(await admin.post('/api/accessions', { accessionNumber: 'HL-T-0002', name: 'Second', siteId: siteIds[0]!, plants: [{ label: 'P1', plantedOn: '2025-01-01' }] }), 409);
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should refuse an unknown site with 400 naming siteId, and create nothing', async () => {
      const before = await rowCounts(h.ds);
      assertInvalidFields(await admin.post('/api/accessions', { accessionNumber: 'HL-T-0003', name: 'Nowhere', siteId: 987654 }), 'siteId');
      assertInvalidFields(
        await admin.post('/api/accessions', { accessionNumber: 'HL-T-0004', name: 'Half There', siteId: siteIds[0]!, plants: [{ label: 'P1', plantedOn: '2025-01-01', siteId: 987654 }] }),
        'plants.siteId',
      );
      assert.deepEqual(await rowCounts(h.ds), before);
    });

    test('should refuse plant labels that repeat within an accession with 400 naming plants', async () => {
      const res = await admin.post('/api/accessions', {
        accessionNumber: 'HL-T-0005',
        name: 'Echo',
        siteId: siteIds[0]!,
        plants: [{ label: 'P1', plantedOn: '2025-01-01' }, { label: 'P1', plantedOn: '2025-01-02' }],
      });
      assertInvalidFields(res, 'plants');
    });

    test('should record an audit event for a new accession', async () => {
      const created = (await admin.post('/api/accessions', { accessionNumber: 'HL-T-0006', name: 'Audited', siteId: siteIds[0]! }).expect(201)).body as Accession;
      const events = (await admin.get('/api/audit?action=accession.created').expect(200)).body.items as { subject: string }[];
      assert.ok(events.some((e) => e.subject === `accession:${created.id}`));
    });
  });
});
