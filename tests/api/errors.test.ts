import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { assertInvalidFields, assertProblem, leaksInternals } from './assert-problem.js';
import { addUser, Client, PASSWORD, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';

/** Longer than the 254 characters an address may have (RFC 5321 §4.5.3.1.3: a 256-octet path, less its angle brackets). */
const LONG_EMAIL = `${'a'.repeat(250)}@test.example`;
const GOOD_PASSWORD = 'a-long-enough-passphrase';
/** The shape of a link token, but one no mail ever carried. */
const UNKNOWN_TOKEN = 'C'.repeat(43);
const x = (n: number) => 'x'.repeat(n);

type Caller = 'visitor' | 'member' | 'admin';

/** A body the route must refuse with 400, and the fields the problem must name. */
interface BadBody {
  what: string;
  body: object;
  fields: string[];
}

/** A route that takes a JSON body, who calls it, and the bad bodies it must refuse. */
interface BodyRoute {
  method: 'post' | 'patch';
  path: string;
  caller: Caller;
  url?: (targetId: number) => string;
  bad: BadBody[];
}

/*
 * POST /api/auth/password-reset allows 5 requests per address in 15 minutes, and its limiter
 * counts refusals too: its bad bodies below plus the JSON-array case are exactly 5.
 * Malformed and oversized bodies are refused before the limiter runs.
 */
const BODY_ROUTES: readonly BodyRoute[] = [
  {
    method: 'post', path: '/api/auth/login', caller: 'visitor',
    bad: [
      { what: 'missing fields', body: {}, fields: ['email', 'password'] },
      { what: 'wrong types', body: { email: 42, password: true }, fields: ['email', 'password'] },
      { what: 'an invalid e-mail', body: { email: 'not-an-email', password: PASSWORD }, fields: ['email'] },
      { what: 'an extra-long e-mail', body: { email: LONG_EMAIL, password: PASSWORD }, fields: ['email'] },
      { what: 'an extra-long password', body: { email: 'member@test.example', password: x(201) }, fields: ['password'] },
    ],
  },
  {
    method: 'post', path: '/api/auth/password', caller: 'member',
    bad: [
      { what: 'missing fields', body: {}, fields: ['currentPassword', 'newPassword'] },
      { what: 'wrong types', body: { currentPassword: 1, newPassword: ['a'] }, fields: ['currentPassword', 'newPassword'] },
      { what: 'a too-short new password', body: { currentPassword: PASSWORD, newPassword: 'short' }, fields: ['newPassword'] },
      { what: 'an extra-long new password', body: { currentPassword: PASSWORD, newPassword: x(201) }, fields: ['newPassword'] },
    ],
  },
  {
    method: 'post', path: '/api/auth/password-reset', caller: 'visitor',
    bad: [
      { what: 'a missing e-mail', body: {}, fields: ['email'] },
      { what: 'a wrong type', body: { email: ['member@test.example'] }, fields: ['email'] },
      { what: 'an invalid e-mail', body: { email: 'member@' }, fields: ['email'] },
      { what: 'an extra-long e-mail', body: { email: LONG_EMAIL }, fields: ['email'] },
    ],
  },
  {
    method: 'post', path: '/api/auth/password-reset/confirm', caller: 'visitor',
    bad: [
      { what: 'missing fields', body: {}, fields: ['token', 'password'] },
      { what: 'wrong types', body: { token: 123, password: 123 }, fields: ['token', 'password'] },
      { what: 'a malformed token', body: { token: 'short', password: GOOD_PASSWORD }, fields: ['token'] },
      { what: 'a too-short password', body: { token: UNKNOWN_TOKEN, password: 'short' }, fields: ['password'] },
      { what: 'an extra-long password', body: { token: UNKNOWN_TOKEN, password: x(201) }, fields: ['password'] },
    ],
  },
  {
    method: 'post', path: '/api/invitations', caller: 'admin',
    bad: [
      { what: 'missing fields', body: {}, fields: ['email', 'name', 'role'] },
      { what: 'wrong types', body: { email: 1, name: 2, role: 3 }, fields: ['email', 'name', 'role'] },
      { what: 'an invalid e-mail', body: { email: 'two@@test.example', name: 'Ivo', role: 'recorder' }, fields: ['email'] },
      { what: 'an extra-long e-mail', body: { email: LONG_EMAIL, name: 'Ivo', role: 'recorder' }, fields: ['email'] },
      { what: 'an extra-long name', body: { email: 'ivo@test.example', name: x(121), role: 'recorder' }, fields: ['name'] },
      { what: 'a blank name', body: { email: 'ivo@test.example', name: '   ', role: 'recorder' }, fields: ['name'] },
      { what: 'an unknown role', body: { email: 'ivo@test.example', name: 'Ivo', role: 'owner' }, fields: ['role'] },
    ],
  },
  {
    method: 'post', path: '/api/invitations/accept', caller: 'visitor',
    bad: [
      { what: 'missing fields', body: {}, fields: ['token', 'password'] },
      { what: 'wrong types', body: { token: false, password: {} }, fields: ['token', 'password'] },
      { what: 'an extra-long token', body: { token: 'D'.repeat(101), password: GOOD_PASSWORD }, fields: ['token'] },
      { what: 'a too-short password', body: { token: UNKNOWN_TOKEN, password: 'nine-char' }, fields: ['password'] },
    ],
  },
  {
    method: 'post', path: '/api/users', caller: 'admin',
    bad: [
      { what: 'missing fields', body: {}, fields: ['email', 'name', 'role', 'password'] },
      { what: 'wrong types', body: { email: true, name: [], role: null, password: 1234567890 }, fields: ['email', 'name', 'role', 'password'] },
      { what: 'an invalid e-mail', body: { email: 'ivo.test.example', name: 'Ivo', role: 'recorder', password: GOOD_PASSWORD }, fields: ['email'] },
      { what: 'an extra-long e-mail', body: { email: LONG_EMAIL, name: 'Ivo', role: 'recorder', password: GOOD_PASSWORD }, fields: ['email'] },
      { what: 'an extra-long name', body: { email: 'ivo@test.example', name: x(121), role: 'recorder', password: GOOD_PASSWORD }, fields: ['name'] },
      { what: 'a too-short password', body: { email: 'ivo@test.example', name: 'Ivo', role: 'recorder', password: 'short' }, fields: ['password'] },
      { what: 'an unknown role', body: { email: 'ivo@test.example', name: 'Ivo', role: 'superuser', password: GOOD_PASSWORD }, fields: ['role'] },
    ],
  },
  {
    method: 'patch', path: '/api/users/:id', caller: 'admin', url: (id) => `/api/users/${id}`,
    bad: [
      { what: 'no field to change', body: {}, fields: ['body'] },
      { what: 'a wrong type', body: { active: 'no' }, fields: ['active'] },
      { what: 'an unknown role', body: { role: 'owner' }, fields: ['role'] },
      { what: 'an extra-long name', body: { name: x(121) }, fields: ['name'] },
      { what: 'an empty name', body: { name: '' }, fields: ['name'] },
    ],
  },
  {
    method: 'post', path: '/api/accessions', caller: 'admin',
    bad: [
      { what: 'missing fields', body: {}, fields: ['accessionNumber', 'name', 'siteId'] },
      { what: 'wrong types', body: { accessionNumber: 7, name: false, siteId: '1' }, fields: ['accessionNumber', 'name', 'siteId'] },
      { what: 'an extra-long accession number', body: { accessionNumber: x(41), name: 'Long', siteId: 1 }, fields: ['accessionNumber'] },
      { what: 'extra-long remarks', body: { accessionNumber: 'E-1', name: 'Long', siteId: 1, remarks: x(2001) }, fields: ['remarks'] },
      { what: 'a country that is not ISO 3166-1 alpha-3', body: { accessionNumber: 'E-1', name: 'Where', siteId: 1, originCountry: 'fj' }, fields: ['originCountry'] },
      { what: 'an acquisition date not in MCPD form', body: { accessionNumber: 'E-1', name: 'When', siteId: 1, acquisitionDate: '2024-03-12' }, fields: ['acquisitionDate'] },
      { what: 'a plant with an impossible planting date', body: { accessionNumber: 'E-1', name: 'When', siteId: 1, plants: [{ label: 'P1', plantedOn: '2025-02-30' }] }, fields: ['plants.0.plantedOn'] },
      { what: 'a negative site id', body: { accessionNumber: 'E-1', name: 'Where', siteId: -1 }, fields: ['siteId'] },
    ],
  },
];

describe('bad input and unknown routes', () => {
  let h: Harness;
  const callers = new Map<Caller, Client>();
  let targetId: number;

  before(async () => {
    h = await startHarness();
    await addUser(h.ds, 'recorder', 'member@test.example');
    const [visitor, member, admin] = await Promise.all([new Client(h.app).prime(), new Client(h.app).signIn('member@test.example', PASSWORD), signedInAs(h, 'admin')]);
    callers.set('visitor', visitor).set('member', member).set('admin', admin);
    targetId = (await addUser(h.ds, 'reviewer', 'target@test.example')).id;
  });
  after(() => h.close());

  /** Row counts and the user table: a refused request must change neither. */
  async function snapshot(): Promise<string> {
    return JSON.stringify([await rowCounts(h.ds), await h.ds.query('SELECT id, email, name, role, active, passwordHash FROM "user" ORDER BY id')]);
  }

  /** Runs a request and asserts it changed nothing in the database. */
  async function unchanged<T>(send: () => Promise<T>): Promise<T> {
    const before = await snapshot();
    const res = await send();
    assert.equal(await snapshot(), before, 'the database changed');
    return res;
  }

  for (const route of BODY_ROUTES) {
    describe(`${route.method.toUpperCase()} ${route.path}`, () => {
      const url = () => route.url?.(targetId) ?? route.path;
      const caller = () => callers.get(route.caller)!;

      for (const bad of route.bad) {
        test(`should answer 400 naming ${bad.fields.join(', ')} for ${bad.what}, changing nothing`, async () => {
          const res = await unchanged(() => caller().raw(route.method, url()).send(bad.body));
          assertInvalidFields(res, ...bad.fields);
        });
      }

      test('should answer 400 problem+json to a body that is not JSON, changing nothing', async () => {
        const res = await unchanged(() => caller().raw(route.method, url()).set('Content-Type', 'application/json').send('{bad'));
        const problem = assertProblem(res, 400);
        assert.match(problem.detail ?? '', /not valid JSON/);
      });

      test('should answer 400 naming body to a JSON array', async () => {
        const res = await unchanged(() => caller().raw(route.method, url()).send([]));
        assertInvalidFields(res, 'body');
      });

      test('should answer 413 problem+json to a JSON body over 1 MB, changing nothing', async () => {
        const res = await unchanged(() => caller().raw(route.method, url()).send({ ...route.bad[0]!.body, padding: x(1_100_000) }));
        assertProblem(res, 413);
      });
    });
  }

  test('should read a body sent as text/plain as no body at all: 400 naming the fields', async () => {
    const res = await callers.get('visitor')!.raw('post', '/api/auth/login').set('Content-Type', 'text/plain').send(JSON.stringify({ email: 'member@test.example', password: PASSWORD }));
    assertInvalidFields(res, 'email', 'password');
  });

  test('should answer 415 problem+json to a JSON body in a charset the server does not read', async () => {
    const res = await callers.get('visitor')!.raw('post', '/api/auth/login').set('Content-Type', 'application/json; charset=iso-8859-1').send('{}');
    assertProblem(res, 415);
  });

  test('should answer 400 naming the parameter to a bad query', async () => {
    const admin = callers.get('admin')!;
    assertInvalidFields(await admin.get('/api/audit?pageSize=1000'), 'pageSize');
    assertInvalidFields(await admin.get('/api/audit?page=first'), 'page');
  });

  test('should answer 404 problem+json to unknown API routes and to known paths with another method', async () => {
    const admin = callers.get('admin')!;
    for (const res of [
      await admin.get('/api/nothing-here'),
      await admin.post('/api/nothing-here', {}),
      await admin.get('/api/auth/login'),
      await admin.delete('/api/users/1'),
      await admin.get('/api/users/1'),
    ]) {
      assertProblem(res, 404);
    }
  });

  test('should answer 404 problem+json to an id that is not a positive whole number', async () => {
    const admin = callers.get('admin')!;
    for (const id of ['abc', '0', '-1', '1.5', '1e3', '0x1f', '9'.repeat(13)]) {
      assertProblem(await unchanged(() => admin.patch(`/api/users/${id}`, { name: 'Renamed' })), 404);
      assertProblem(await admin.get(`/api/outbox/${id}`), 404);
    }
  });

  test('should answer a badly percent-encoded path with a 4xx problem, not a crash', async () => {
    const res = await callers.get('admin')!.patch('/api/users/%E0%A4%A', { name: 'Renamed' });
    assert.ok(res.status >= 400 && res.status < 500, `status ${res.status}`);
    assertProblem(res, res.status);
  });

  test('should recognise a real stack trace, so the leak checks above can fail', () => {
    assert.equal(leaksInternals(new Error('boom').stack ?? ''), true);
    assert.equal(leaksInternals(JSON.stringify({ title: 'Not found', detail: 'No API route GET /api/nothing-here.' })), false);
  });
});

describe('a failure inside the server', () => {
  let h: Harness;
  const logged: unknown[] = [];

  before(async () => {
    h = await startHarness({ logError: (err) => logged.push(err) });
  });
  after(() => h.close());

  test('should answer 500 problem+json that says nothing of the cause, and log the error', async () => {
    const client = await signedInAs(h, 'recorder');
    await h.ds.query('DROP TABLE "character"');
    const res = await client.get('/api/characters');
    const problem = assertProblem(res, 500);
    assert.doesNotMatch(res.text, /sqlite|SELECT|no such table|QueryFailed/i);
    assert.equal(problem.type.endsWith('/internal'), true);
    assert.equal(logged.length, 1, 'the error is logged for the operator');
    assert.match(String((logged[0] as Error).message), /no such table/);
  });
});
