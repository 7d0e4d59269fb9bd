// The read-only BrAPI v2.1 interface: every answer validated against the specification's JSON
// schemas (tests/brapi-schemas/, source named in its README), paging at the edges, the standard's
// error answer for bad parameters, sign-in by session or token, nothing writable, superseded
// readings never served, ids stable across a restart, and a round trip against the XLSX export.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { Ajv } from 'ajv';
import addFormatsModule from 'ajv-formats';
import ExcelJS from 'exceljs';
import type { Response } from 'supertest';
import request from 'supertest';
import { hashToken } from '../../server/brapi/api-tokens.js';
import { listApiRoutes } from './api-routes.js';
import { assertBrapiError } from './assert-problem.js';
import { Client, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';
import { fromRaw, paintScene, uploadPhoto } from './photo-fixtures.js';
import { bytes } from './reference-set-file.js';

const SCHEMA_DIR = path.join(import.meta.dirname, '..', 'brapi-schemas');
const addFormats = addFormatsModule as unknown as (ajv: Ajv) => Ajv;

/** Ajv with the three schema files of the specification loaded; `nullable` is OpenAPI 3.0's keyword, which Ajv knows. */
function specValidator(): Ajv {
  const ajv = new Ajv({ allErrors: true, strict: false });
  addFormats(ajv);
  for (const file of ['brapi-core.json', 'brapi-germplasm.json', 'brapi-phenotyping.json']) ajv.addSchema(JSON.parse(readFileSync(path.join(SCHEMA_DIR, file), 'utf8')));
  return ajv;
}

const ajv = specValidator();

/** Asserts the answer validates against a definition of the specification's schemas, e.g. "brapi-core.json#/definitions/ServerInfoResponse". */
function assertValid(body: unknown, ref: string): void {
  const validate = ajv.getSchema(ref);
  assert.ok(validate, `no schema ${ref}`);
  const ok = validate(body);
  assert.ok(ok, `${ref}: ${ajv.errorsText(validate.errors, { separator: '\n' })}\n${JSON.stringify(body).slice(0, 600)}`);
}

/** What each call answers, by the specification's response names. */
const RESPONSE_OF: Record<string, string> = {
  serverinfo: 'brapi-core.json#/definitions/ServerInfoResponse',
  commoncropnames: 'brapi-core.json#/definitions/CommonCropNamesResponse',
  germplasm: 'brapi-germplasm.json#/definitions/GermplasmListResponse',
  'germplasm/{germplasmDbId}': 'brapi-germplasm.json#/definitions/GermplasmSingleResponse',
  locations: 'brapi-core.json#/definitions/LocationListResponse',
  seasons: 'brapi-core.json#/definitions/SeasonListResponse',
  observationunits: 'brapi-phenotyping.json#/definitions/ObservationUnitListResponse',
  variables: 'brapi-phenotyping.json#/definitions/ObservationVariableListResponse',
  observations: 'brapi-phenotyping.json#/definitions/ObservationListResponse',
  images: 'brapi-phenotyping.json#/definitions/ImageListResponse',
  'images/{imageDbId}': 'brapi-phenotyping.json#/definitions/ImageSingleResponse',
};

type Page<T> = { metadata: { pagination: { currentPage: number; pageSize: number; totalCount: number; totalPages: number } }; result: { data: T[] } };
type Obs = { observationDbId: string; observationVariableDbId: string; observationVariableName: string; germplasmDbId: string; observationUnitDbId?: string; observationTimeStamp: string; value: string; season?: { seasonDbId: string }; additionalInfo: Record<string, string> };

/** A small BrAPI client of the kind a curator's script would be: a base URL, a token, page by page. */
class TinyBrapiClient {
  constructor(
    private readonly h: Harness,
    private readonly token: string,
  ) {}

  /** One call; every JSON answer it gets is validated against the specification's schema for that call (or its error answer). */
  async get(call: string, query: Record<string, string | number> = {}): Promise<Response> {
    const res = await request(this.h.app).get(`/brapi/v2/${call}`).query(query).set('Authorization', `Bearer ${this.token}`);
    const service = call.replace(/^germplasm\/[^/]+$/, 'germplasm/{germplasmDbId}').replace(/^images\/[^/]+$/, 'images/{imageDbId}');
    if (res.status === 200 && RESPONSE_OF[service]) assertValid(res.body, RESPONSE_OF[service]);
    if (res.status >= 400) assertValid(res.body, 'brapi-core.json#/definitions/ErrorAnswer');
    return res;
  }

  /** Every item of a list call, following `totalPages`. */
  async all<T>(call: string, query: Record<string, string | number> = {}, pageSize = 50): Promise<T[]> {
    const items: T[] = [];
    for (let page = 0; ; page++) {
      const res = await this.get(call, { ...query, page, pageSize });
      assert.equal(res.status, 200, res.text);
      const body = res.body as Page<T>;
      items.push(...body.result.data);
      if (page + 1 >= body.metadata.pagination.totalPages) return items;
    }
  }
}

describe('BrAPI v2.1 interface', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let reviewer: Client;
  let token: string;
  let brapi: TinyBrapiClient;

  before(async () => {
    h = await startHarness({ demo: true });
    [admin, recorder, reviewer] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder'), signedInAs(h, 'reviewer')]);
    const me = (await reviewer.get('/api/auth/me').expect(200)).body as { user: { id: number } };
    const issued = await admin.post('/api/api-tokens', { userId: me.user.id, label: 'Curator script' });
    assert.equal(issued.status, 201, issued.text);
    token = issued.body.token as string;
    brapi = new TinyBrapiClient(h, token);
  });
  after(() => h.close());

  describe('answers and the specification', () => {
    test('should validate every call of serverinfo against the v2.1 schemas, and list exactly the calls mounted', async () => {
      const res = await brapi.get('serverinfo');
      assert.equal(res.status, 200, res.text);
      assertValid(res.body, RESPONSE_OF['serverinfo']!);
      const listed = (res.body.result.calls as { service: string; methods: string[]; versions: string[] }[]).map((c) => c.service).sort();
      const mounted = listApiRoutes(h.app)
        .filter((r) => r.path.startsWith('/brapi/v2/'))
        .map((r) => r.path.slice('/brapi/v2/'.length).replace(/:(\w+)/g, '{$1}'))
        .sort();
      assert.deepEqual(listed, mounted);
      for (const c of res.body.result.calls) assert.deepEqual([c.methods, c.versions], [['GET'], ['2.1']]);
      assert.ok(listed.includes('observations') && listed.includes('germplasm/{germplasmDbId}'));
    });

    test('should answer every JSON call with a body valid against its v2.1 response schema', async () => {
      const germplasm = (await brapi.get('germplasm')).body.result.data as { germplasmDbId: string }[];
      assert.ok(germplasm.length > 0, 'the demo has accessions');
      await photoReading(h, recorder);
      const image = (await brapi.get('images')).body.result.data[0] as { imageDbId: string };
      const urls: Record<string, string> = { 'germplasm/{germplasmDbId}': `germplasm/${germplasm[0]!.germplasmDbId}`, 'images/{imageDbId}': `images/${image.imageDbId}` };
      for (const [call, ref] of Object.entries(RESPONSE_OF)) {
        const res = await brapi.get(urls[call] ?? call, { pageSize: 200 });
        assert.equal(res.status, 200, `${call}: ${res.text}`);
        assert.match(String(res.headers['content-type']), /^application\/json/);
        assertValid(res.body, ref);
        if ('data' in res.body.result) assert.ok(res.body.result.data.length > 0, `${call} lists something in the demo`);
      }
    });

    test('should have schemas that refuse what the specification refuses (the validator has teeth)', async () => {
      const good = (await brapi.get('observations', { pageSize: 1 })).body;
      assertValid(good, RESPONSE_OF['observations']!);
      const spoil = (change: (b: any) => void) => {
        const copy = structuredClone(good);
        change(copy);
        return ajv.getSchema(RESPONSE_OF['observations']!)!(copy);
      };
      assert.equal(spoil((b) => (b.result.data[0].value = 51.2)), false, 'value must be a string');
      assert.equal(spoil((b) => delete b.result.data[0].observationDbId), false, 'observationDbId is required');
      assert.equal(spoil((b) => delete b.metadata.pagination.currentPage), false, 'currentPage is required');
      assert.equal(spoil((b) => (b.metadata.status = [{ message: 'x', messageType: 'NOTICE' }])), false, 'messageType is an enum');
      assert.equal(spoil((b) => (b.result.data[0].additionalInfo = { n: 1 })), false, 'additionalInfo values are strings');
      assert.equal(spoil((b) => (b.result.data[0].externalReferences = [])), false, 'fields we never send are refused');
      assert.equal(spoil((b) => (b.result.data[0].observationTimeStamp = '2025-01-01 10:00')), false, 'date-time format');
      const germplasm = structuredClone((await brapi.get('germplasm', { pageSize: 1 })).body);
      delete germplasm.result.data[0].germplasmPUI;
      assert.equal(ajv.getSchema(RESPONSE_OF['germplasm']!)!(germplasm), false, 'germplasmPUI is required');
      assert.equal(ajv.getSchema('brapi-core.json#/definitions/ErrorAnswer')!({ error: 'x' }), false);
    });

    test('should give germplasm the MCPD passport fields under BrAPI names', async () => {
      const [hl1] = (await brapi.get('germplasm', { accessionNumber: 'HL-0001' })).body.result.data;
      const [row] = (await h.ds.query(`SELECT * FROM "accession" WHERE "accessionNumber" = 'HL-0001'`)) as Record<string, unknown>[];
      assert.equal(hl1.germplasmDbId, String(row!['id']));
      assert.equal(hl1.accessionNumber, 'HL-0001');
      assert.equal(hl1.germplasmName, row!['name']);
      assert.equal(hl1.germplasmGenus, 'Colocasia');
      assert.equal(hl1.germplasmSpecies, 'esculenta');
      assert.equal(hl1.commonCropName, row!['cropName']);
      assert.deepEqual(hl1.synonyms, JSON.parse(String(row!['otherNames'])));
      const one = await brapi.get(`germplasm/${hl1.germplasmDbId}`);
      assert.deepEqual(one.body.result, hl1);
    });

    test('should describe each colour character as L*, a*, b* in CIELAB D65/2° and a categorical chip code, and each descriptor with its unit', async () => {
      const vars = await brapi.all<{ observationVariableDbId: string; observationVariableName: string; scale: { dataType: string; units?: string; scaleName: string }; method: { methodName: string } }>('variables');
      const [{ id: stripes }] = (await h.ds.query(`SELECT "id" FROM "character" WHERE "code" = 'petiole.stripes'`)) as [{ id: number }];
      const of = (id: string) => vars.find((v) => v.observationVariableDbId === id)!;
      for (const part of ['L', 'a', 'b']) {
        assert.equal(of(`c${stripes}-${part}`).scale.dataType, 'Numerical');
        assert.match(of(`c${stripes}-${part}`).scale.scaleName, new RegExp(`CIELAB ${part}\\* \\(D65, 2°\\)`));
        assert.match(of(`c${stripes}-${part}`).method.methodName, /D65 white, 2° observer/);
      }
      assert.equal(of(`c${stripes}-chip`).scale.dataType, 'Nominal');
      const [{ id: length }] = (await h.ds.query(`SELECT "id" FROM "descriptor" WHERE "code" = 'petiole.length'`)) as [{ id: number }];
      assert.equal(of(`d${length}`).scale.units, 'm');
      const colourCharacters = (await h.ds.query(`SELECT COUNT(*) AS n FROM "character" WHERE "colour" = 1`)) as [{ n: number }];
      const measured = (await h.ds.query(`SELECT COUNT(*) AS n FROM "descriptor" WHERE "kind" != 'ratio'`)) as [{ n: number }];
      assert.equal(vars.length, colourCharacters[0].n * 4 + measured[0].n);
    });
  });

  describe('paging (0-based page, pageSize, totalCount, totalPages)', () => {
    test('should page the observations without gaps or repeats, the last page short, and a page past the end empty', async () => {
      const [{ id: hl1 }] = (await h.ds.query(`SELECT "id" FROM "accession" WHERE "accessionNumber" = 'HL-0001'`)) as [{ id: number }];
      const [{ n }] = (await h.ds.query(`SELECT COUNT(*) AS n FROM "reading" WHERE "accessionId" = ? AND "supersededById" IS NULL`, [hl1])) as [{ n: number }];
      const total = n * 4 + ((await h.ds.query(`SELECT COUNT(*) AS n FROM "observation" o JOIN "descriptor" d ON d."id" = o."descriptorId" WHERE o."accessionId" = ? AND o."supersededById" IS NULL AND d."kind" != 'ratio'`, [hl1])) as [{ n: number }])[0].n;
      assert.ok(total > n * 4, 'the accession has descriptor values too, so a page crosses from readings to them');
      // 7 is no multiple of 4: pages also begin and end inside a reading's four observations.
      const size = 7;
      const pages = Math.ceil(total / size);
      assert.ok(pages >= 3, `enough observations to page (${total})`);
      const seen: string[] = [];
      for (let page = 0; page < pages; page++) {
        const res = await brapi.get('observations', { germplasmDbId: hl1, page, pageSize: size });
        assertValid(res.body, RESPONSE_OF['observations']!);
        const { pagination } = res.body.metadata;
        const expected = page < pages - 1 ? size : total - size * (pages - 1);
        assert.deepEqual(pagination, { currentPage: page, pageSize: expected, totalCount: total, totalPages: pages });
        seen.push(...(res.body.result.data as Obs[]).map((o) => o.observationDbId));
      }
      assert.equal(seen.length, total);
      assert.equal(new Set(seen).size, total, 'no observation on two pages');
      const past = await brapi.get('observations', { germplasmDbId: hl1, page: pages, pageSize: size });
      assert.equal(past.status, 200);
      assert.deepEqual(past.body.result.data, []);
      assert.deepEqual(past.body.metadata.pagination, { currentPage: pages, pageSize: 0, totalCount: total, totalPages: pages });
    });

    test('should default to page 0 of 1000 and page an in-memory list (variables) the same way', async () => {
      const all = await brapi.get('variables');
      const { totalCount } = all.body.metadata.pagination;
      assert.deepEqual(all.body.metadata.pagination, { currentPage: 0, pageSize: Math.min(1000, totalCount), totalCount, totalPages: Math.ceil(totalCount / 1000) });
      const one = await brapi.get('variables', { page: 3, pageSize: 1 });
      assert.deepEqual(one.body.metadata.pagination, { currentPage: 3, pageSize: 1, totalCount, totalPages: totalCount });
      assert.deepEqual(one.body.result.data[0], all.body.result.data[3]);
    });

    test('should answer an empty, valid page when a filter matches nothing', async () => {
      for (const query of [{ germplasmDbId: '999999' }, { germplasmDbId: 'not-ours' }, { observationVariableDbId: 'c1-Q' }, { seasonDbId: '1999-Never' }] as Record<string, string>[]) {
        const res = await brapi.get('observations', query);
        assert.equal(res.status, 200, res.text);
        assertValid(res.body, RESPONSE_OF['observations']!);
        assert.deepEqual(res.body.metadata.pagination, { currentPage: 0, pageSize: 0, totalCount: 0, totalPages: 0 });
      }
    });
  });

  describe('bad parameters → the standard error answer', () => {
    const cases: [string, Record<string, string>, RegExp][] = [
      ['pageSize 0', { pageSize: '0' }, /pageSize: must be a whole number from 1 to 1000/],
      ['pageSize above 1000', { pageSize: '1001' }, /pageSize/],
      ['a negative page', { page: '-1' }, /page: must be a whole number/],
      ['a fractional page', { page: '1.5' }, /page:/],
      ['a word for a page', { page: 'first' }, /page:/],
      ['a start that is no date-time', { observationTimeStampRangeStart: 'yesterday' }, /observationTimeStampRangeStart: must be an ISO 8601 date-time/],
      ['an end without a time zone', { observationTimeStampRangeEnd: '2025-01-01T10:00' }, /observationTimeStampRangeEnd/],
    ];
    for (const [what, query, message] of cases) {
      test(`should refuse ${what} with 400 and BrAPI's error string naming the parameter`, async () => {
        const res = await brapi.get('observations', query);
        assert.match(assertBrapiError(res, 400), message);
        assertValid(res.body, 'brapi-core.json#/definitions/ErrorAnswer');
      });
    }

    test('should refuse a parameter given twice, and a season year that is no year', async () => {
      const twice = await request(h.app).get('/brapi/v2/germplasm?germplasmDbId=1&germplasmDbId=2').set('Authorization', `Bearer ${token}`);
      assert.match(assertBrapiError(twice, 400), /germplasmDbId: give it once/);
      assert.match(assertBrapiError(await brapi.get('seasons', { year: '25' }), 400), /year: must be a 4-digit year/);
    });

    test('should answer 404 in BrAPI form for an unknown germplasm, image and call', async () => {
      assert.match(assertBrapiError(await brapi.get('germplasm/999999'), 404), /germplasmDbId 999999 is not found/);
      assert.match(assertBrapiError(await brapi.get('images/999999'), 404), /imageDbId 999999 is not found/);
      assertBrapiError(await brapi.get('studies'), 404);
      assertBrapiError(await request(h.app).get('/brapi/v1/germplasm').set('Authorization', `Bearer ${token}`), 404);
    });
  });

  describe('filters of GET /observations', () => {
    test('should filter by germplasm, observation unit, variable, season and time range, each exactly as the rows say', async () => {
      const all = await brapi.all<Obs>('observations', {}, 1000);
      const sample = all.find((o) => o.observationUnitDbId && o.season)!;
      const checks: [Record<string, string>, (o: Obs) => boolean][] = [
        [{ germplasmDbId: sample.germplasmDbId }, (o) => o.germplasmDbId === sample.germplasmDbId],
        [{ observationUnitDbId: sample.observationUnitDbId! }, (o) => o.observationUnitDbId === sample.observationUnitDbId],
        [{ observationVariableDbId: sample.observationVariableDbId }, (o) => o.observationVariableDbId === sample.observationVariableDbId],
        [{ seasonDbId: sample.season!.seasonDbId }, (o) => o.season?.seasonDbId === sample.season!.seasonDbId],
        [
          { observationTimeStampRangeStart: '2025-03-01T00:00:00Z', observationTimeStampRangeEnd: '2025-06-30T23:59:59+00:00' },
          (o) => o.observationTimeStamp >= '2025-03-01T00:00:00.000Z' && o.observationTimeStamp <= '2025-06-30T23:59:59.000Z',
        ],
      ];
      for (const [query, keep] of checks) {
        const got = await brapi.all<Obs>('observations', query, 1000);
        const expected = all.filter(keep).map((o) => o.observationDbId);
        assert.ok(expected.length > 0 && expected.length < all.length, `${JSON.stringify(query)} narrows the list`);
        assert.deepEqual(got.map((o) => o.observationDbId), expected, JSON.stringify(query));
      }
    });
  });

  describe('sign-in and roles', () => {
    test('should refuse a signed-out caller with 401 in BrAPI form, and admit every role by session', async () => {
      const res = await request(h.app).get('/brapi/v2/germplasm');
      assert.match(assertBrapiError(res, 401), /Sign in/);
      assert.match(String(res.headers['www-authenticate']), /^Bearer/);
      for (const client of [admin, recorder, reviewer, await signedInAs(h, 'trainer')]) {
        const ok = await client.get('/brapi/v2/observations?pageSize=1');
        assert.equal(ok.status, 200, ok.text);
      }
    });

    test('should refuse a malformed, unknown or revoked token, even beside a valid session cookie', async () => {
      const bearer = (value: string) => recorder.get('/brapi/v2/germplasm').set('Authorization', value);
      assert.match(assertBrapiError(await bearer('Basic dXNlcjpwYXNz'), 401), /Malformed Authorization header/);
      assert.match(assertBrapiError(await bearer(`Bearer ${token}x`), 401), /unknown or has been revoked/);
      const me = (await recorder.get('/api/auth/me').expect(200)).body as { user: { id: number } };
      const issued = (await admin.post('/api/api-tokens', { userId: me.user.id, label: 'To revoke' }).expect(201)).body as { id: number; token: string };
      assert.equal((await bearer(`Bearer ${issued.token}`)).status, 200);
      const revoked = await admin.post(`/api/api-tokens/${issued.id}/revoke`).expect(200);
      assert.ok(revoked.body.revokedAt);
      assert.match(assertBrapiError(await bearer(`Bearer ${issued.token}`), 401), /revoked/);
    });

    test('should stop a token when its user is deactivated, and never accept a token on /api', async () => {
      const trainer = await signedInAs(h, 'trainer');
      const me = (await trainer.get('/api/auth/me').expect(200)).body as { user: { id: number } };
      const { token: t } = (await admin.post('/api/api-tokens', { userId: me.user.id, label: 'Trainer laptop' }).expect(201)).body as { token: string };
      assert.equal((await request(h.app).get('/brapi/v2/seasons').set('Authorization', `Bearer ${t}`)).status, 200);
      assert.equal((await request(h.app).get('/api/auth/me').set('Authorization', `Bearer ${t}`)).status, 401);
      await admin.patch(`/api/users/${me.user.id}`, { active: false }).expect(200);
      assertBrapiError(await request(h.app).get('/brapi/v2/seasons').set('Authorization', `Bearer ${t}`), 401);
    });

    test('should store only the SHA-256 of a token, show the token once, and list tokens without it', async () => {
      const rows = (await h.ds.query(`SELECT * FROM "api_token"`)) as Record<string, unknown>[];
      const dump = JSON.stringify(rows);
      assert.ok(!dump.includes(token), 'the token itself is nowhere in the table');
      assert.ok(rows.some((r) => r['tokenHash'] === hashToken(token)));
      assert.match(hashToken(token), /^[0-9a-f]{64}$/);
      const listed = (await admin.get('/api/api-tokens').expect(200)).body as Record<string, unknown>[];
      assert.ok(listed.length >= 1);
      assert.ok(!JSON.stringify(listed).includes(token));
      assert.ok(listed.every((r) => !('token' in r) && !('tokenHash' in r)));
      assert.ok(listed.some((r) => typeof r['prefix'] === 'string' && token.startsWith(r['prefix'] as string)));
    });

    test('should refuse issuing a token to an unknown user or with no label, naming the field', async () => {
      const before = JSON.stringify(await rowCounts(h.ds));
      for (const [body, field] of [[{ userId: 999999, label: 'Ghost' }, 'userId'], [{ userId: 1, label: '  ' }, 'label'], [{ label: 'No user' }, 'userId']] as const) {
        const res = await admin.post('/api/api-tokens', body);
        assert.equal(res.status, 400, res.text);
        assert.ok((res.body.errors as { field: string }[]).some((e) => e.field === field), res.text);
      }
      assert.equal(JSON.stringify(await rowCounts(h.ds)), before);
    });
  });

  describe('read-only', () => {
    test('should refuse every write method with 405 in BrAPI form, by token or by session with the CSRF header, changing nothing', async () => {
      const before = JSON.stringify(await rowCounts(h.ds));
      for (const method of ['post', 'put', 'patch', 'delete'] as const) {
        for (const url of ['/brapi/v2/germplasm', '/brapi/v2/observations', '/brapi/v2/images/1/imagecontent', '/brapi/v2/search/germplasm', '/brapi/v1/germplasm']) {
          const byToken = await request(h.app)[method](url).set('Authorization', `Bearer ${token}`).send([{ germplasmName: 'Injected' }]);
          assert.match(assertBrapiError(byToken, 405), /read-only/);
          assert.equal(byToken.headers['allow'], 'GET, HEAD, OPTIONS');
          const bySession = await admin.agent[method](url).set('X-XSRF-TOKEN', admin.csrfToken).send([{ germplasmName: 'Injected' }]);
          assertBrapiError(bySession, 405);
        }
      }
      assert.equal(JSON.stringify(await rowCounts(h.ds)), before);
    });
  });

  describe('other origins', () => {
    test('should let a web tool on another origin read with a token (CORS, no credentials), preflight included', async () => {
      const preflight = await request(h.app).options('/brapi/v2/observations').set('Origin', 'https://tools.example').set('Access-Control-Request-Method', 'GET').set('Access-Control-Request-Headers', 'authorization');
      assert.equal(preflight.status, 204);
      assert.equal(preflight.headers['access-control-allow-origin'], '*');
      assert.match(String(preflight.headers['access-control-allow-headers']), /Authorization/);
      assert.equal(preflight.headers['access-control-allow-methods'], 'GET, HEAD');
      const res = await request(h.app).get('/brapi/v2/seasons').set('Authorization', `Bearer ${token}`).set('Origin', 'https://tools.example');
      assert.equal(res.status, 200);
      assert.equal(res.headers['access-control-allow-origin'], '*');
      assert.equal(res.headers['access-control-allow-credentials'], undefined, 'a session cookie is never honoured across origins');
    });
  });

  describe('current readings only, stable ids', () => {
    test('should serve a correction and never the reading it superseded', async () => {
      const [old] = (await h.ds.query(`SELECT r."id" FROM "reading" r JOIN "user" u ON u."id" = r."observerId" WHERE u."email" = 'recorder@demo.test' AND r."supersededById" IS NULL ORDER BY r."id" LIMIT 1`)) as [{ id: number }];
      const [row] = (await h.ds.query(`SELECT "accessionId", "plantId", "characterId", "observedAt" FROM "reading" WHERE "id" = ?`, [old.id])) as [{ accessionId: number; plantId: number | null; characterId: number; observedAt: string }];
      const demoRecorder = await new Client(h.app).signIn('recorder@demo.test', 'demo-pass-2026');
      const detail = { ...row, observedAt: `${row.observedAt.replace(' ', 'T')}Z` };
      const fixed = await demoRecorder.post(`/api/readings/${old.id}/supersede`, {
        accessionId: detail.accessionId,
        ...(detail.plantId ? { plantId: detail.plantId } : {}),
        characterId: detail.characterId,
        observedAt: detail.observedAt,
        method: 'instrument',
        lab: [51.23, 11.11, 22.22],
        light: 'open-shade',
        reason: 'typed a* and b* the wrong way round',
      });
      assert.equal(fixed.status, 201, fixed.text);
      const oldIds = await brapi.get('observations', { observationDbId: `r${old.id}-L` });
      assert.equal(oldIds.body.metadata.pagination.totalCount, 0, 'the superseded reading is gone');
      const now = await brapi.all<Obs>('observations', { germplasmDbId: String(detail.accessionId) }, 1000);
      assert.ok(!now.some((o) => o.additionalInfo['readingId'] === String(old.id)));
      const mine = now.filter((o) => o.additionalInfo['readingId'] === String(fixed.body.id));
      assert.deepEqual(mine.map((o) => o.value).slice(0, 3), ['51.23', '11.11', '22.22']);
    });

    test('should serve a corrected descriptor value and never the value it superseded', async () => {
      const [{ id: descriptorId }] = (await h.ds.query(`SELECT "id" FROM "descriptor" WHERE "code" = 'petiole.length'`)) as [{ id: number }];
      const accession = (await recorder.get('/api/accessions').expect(200)).body[0] as { id: number; plants: { id: number }[] };
      const first = await recorder.post('/api/observations', { accessionId: accession.id, plantId: accession.plants[0]!.id, descriptorId, value: 40, unit: 'in' });
      assert.equal(first.status, 201, first.text);
      const seen = async (id: number) => (await brapi.get('observations', { observationDbId: `o${id}` })).body.result.data as Obs[];
      assert.equal((await seen(first.body.id))[0]!.value, '1.016', '40 in is 1.016 m (NIST SP 811: 1 in = 0.0254 m exactly)');
      const fixed = await recorder.post(`/api/observations/${first.body.id}/supersede`, { value: 101.6, unit: 'cm' });
      assert.equal(fixed.status, 201, fixed.text);
      assert.deepEqual(await seen(first.body.id), []);
      assert.equal((await seen(fixed.body.id))[0]!.value, '1.016');
      assert.equal((await seen(fixed.body.id))[0]!.observationVariableDbId, `d${descriptorId}`);
    });

    test('should answer the same ids and values after a restart', async () => {
      const snapshot = async (c: TinyBrapiClient) => JSON.stringify([await c.all('germplasm'), await c.all('observationunits'), await c.all('variables'), await c.all('seasons'), await c.all('observations', {}, 1000)]);
      const before = await snapshot(brapi);
      h = await h.restart();
      brapi = new TinyBrapiClient(h, token);
      assert.equal(await snapshot(brapi), before);
      admin = Client.resume(h.app, admin);
      recorder = Client.resume(h.app, recorder);
    });
  });

  describe('images', () => {
    test('should list a photo with the observations read from it, and serve its display copy to a token holder', async () => {
      const reading = await photoReading(h, recorder);
      const [image] = (await brapi.get('images', { imageDbId: String(reading.photoId) })).body.result.data;
      assert.ok(image.observationDbIds.includes(`r${reading.id}-L`) && image.observationDbIds.includes(`r${reading.id}-chip`));
      assert.equal(image.mimeType, 'image/jpeg');
      const url = new URL(image.imageURL as string);
      const jpeg = await request(h.app).get(url.pathname).set('Authorization', `Bearer ${token}`).buffer(true);
      assert.equal(jpeg.status, 200);
      assert.equal(jpeg.headers['content-type'], 'image/jpeg');
      assert.deepEqual([...(jpeg.body as Buffer).subarray(0, 3)], [0xff, 0xd8, 0xff], 'a JPEG (SOI marker, ITU-T T.81 Annex B)');
      assertBrapiError(await request(h.app).get(url.pathname), 401);
    });
  });

  describe('round trip: a BrAPI client reads the same numbers as the readings export and the characterisation record', () => {
    test('should find, for every current reading of HL-0001, the L*, a*, b* and chip of the XLSX export', async () => {
      const germplasm = (await brapi.get('germplasm', { accessionNumber: 'HL-0001' })).body.result.data[0] as { germplasmDbId: string };
      const observations = await brapi.all<Obs>('observations', { germplasmDbId: germplasm.germplasmDbId }, 25);
      const byReading = new Map<string, Record<string, string>>();
      for (const o of observations) {
        const id = o.additionalInfo['readingId'];
        if (!id) continue;
        const part = o.observationDbId.split('-').pop()!;
        byReading.set(id, { ...byReading.get(id), [part]: o.value });
      }
      const xlsx = await admin.get(`/api/readings/export.xlsx?accessionId=${germplasm.germplasmDbId}`).buffer(true).parse(bytes);
      assert.equal(xlsx.status, 200);
      const book = new ExcelJS.Workbook();
      await book.xlsx.load(xlsx.body as ArrayBuffer);
      const sheet = book.getWorksheet('Readings')!;
      const header = (sheet.getRow(1).values as unknown[]).slice(1) as string[];
      const col = (name: string) => header.indexOf(name) + 1;
      const rows = sheet.getRows(2, sheet.rowCount - 1) ?? [];
      assert.ok(rows.length >= 20, `the demo accession has readings (${rows.length})`);
      assert.equal(byReading.size, rows.length, 'one BrAPI reading per exported row');
      for (const row of rows) {
        const got = byReading.get(String(row.getCell(col('id')).value));
        assert.ok(got, `reading ${row.getCell(col('id')).value} is served`);
        assert.deepEqual(
          [Number(got.L), Number(got.a), Number(got.b), got.chip],
          [row.getCell(col('L*')).value, row.getCell(col('a*')).value, row.getCell(col('b*')).value, row.getCell(col('best chip')).value],
        );
      }
    });

    test('should find, from the same observations, the centres the characterisation record shows (per-channel medians, overall and per season)', async () => {
      const germplasm = (await brapi.get('germplasm', { accessionNumber: 'HL-0001' })).body.result.data[0] as { germplasmDbId: string };
      const observations = await brapi.all<Obs>('observations', { germplasmDbId: germplasm.germplasmDbId }, 100);
      // One reading per readingId: its L*, a*, b*, review status, season and character (from the variable DbId "c<id>-L").
      const readings = new Map<string, { character: string; status: string; season?: string; lab: number[] }>();
      for (const o of observations) {
        const m = /^c(\d+)-(L|a|b)$/.exec(o.observationVariableDbId);
        if (!m) continue;
        const r = readings.get(o.additionalInfo['readingId']!) ?? { character: m[1]!, status: o.additionalInfo['reviewStatus']!, season: o.season?.seasonDbId, lab: [NaN, NaN, NaN] };
        r.lab['Lab'.indexOf(m[2]!)] = Number(o.value);
        readings.set(o.additionalInfo['readingId']!, r);
      }
      const median = (xs: number[]) => {
        const s = [...xs].sort((x, y) => x - y);
        return s.length % 2 ? s[(s.length - 1) / 2]! : (s[s.length / 2 - 1]! + s[s.length / 2]!) / 2;
      };
      const centre = (rs: { lab: number[] }[]) => [0, 1, 2].map((i) => median(rs.map((r) => r.lab[i]!)));
      const profile = (await admin.get(`/api/accessions/${germplasm.germplasmDbId}/profile`).expect(200)).body as {
        characters: { characterId: number; basis: string; nReadings: number; centre: { lab: number[] }; seasons: { season: string; seasonYear: number; n: number; centre: { lab: number[] } }[] }[];
      };
      assert.ok(profile.characters.length >= 2, 'the demo accession is characterised');
      // BrAPI values carry 2 decimals, as the exports do; a median of rounded values is within 0.01 of the rounded median (0.005 each side).
      const near = (got: number[], want: number[], what: string) => want.forEach((w, i) => assert.ok(Math.abs(got[i]! - w) <= 0.01 + 1e-9, `${what}: ${got} vs ${want}`));
      for (const c of profile.characters) {
        const mine = [...readings.values()].filter((r) => r.character === String(c.characterId));
        const basis = c.basis === 'approved' ? mine.filter((r) => r.status === 'approved') : mine;
        assert.equal(basis.length, c.nReadings, `character ${c.characterId}: readings in the basis`);
        near(centre(basis), c.centre.lab, `character ${c.characterId} centre`);
        for (const s of c.seasons) {
          const group = mine.filter((r) => r.season === `${s.seasonYear}-${s.season}`);
          assert.equal(group.length, s.n, `character ${c.characterId}, ${s.seasonYear} ${s.season}: readings`);
          near(centre(group), s.centre.lab, `character ${c.characterId}, ${s.seasonYear} ${s.season} centre`);
        }
      }
    });
  });
});

let paintedPhotos = 0;

/** A photo reading of the first demo accession's first plant, by the recorder, on a photo of its own. */
async function photoReading(h: Harness, recorder: Client): Promise<{ id: number; photoId: number }> {
  // A new colour each time: the same bytes would be the same stored photo.
  const bytes = await fromRaw(paintScene(64, 64, [120, 60 + 10 * paintedPhotos++, 110], []), 64, 64).png().toBuffer();
  const photo = (await uploadPhoto(recorder, bytes, 'leaf.png', 'image/png').expect(201)).body as { id: number };
  const accession = (await recorder.get('/api/accessions').expect(200)).body[0] as { id: number; plants: { id: number }[] };
  const [character] = (await h.ds.query(`SELECT "id" FROM "character" WHERE "code" = 'petiole.third.upper'`)) as [{ id: number }];
  const res = await recorder.post('/api/readings', {
    accessionId: accession.id,
    plantId: accession.plants[0]!.id,
    characterId: character.id,
    observedAt: '2026-02-10T09:30:00+12:00',
    method: 'photo',
    photo: { photoId: photo.id, region: { shape: 'rect', x: 8, y: 8, width: 40, height: 40 } },
    light: 'open-shade',
  });
  assert.equal(res.status, 201, res.text);
  return { id: res.body.id as number, photoId: photo.id };
}
