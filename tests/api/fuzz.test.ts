// Property-based fuzzing (fast-check) of every JSON API route the app mounts, found by walking the
// router, so routes added later are fuzzed without editing this file. For each route, random and
// malformed bodies, odd path parameters and odd query strings are sent as a signed-in admin (the
// role with the most write access) and as nobody. The properties: never a 5xx; every refusal is
// RFC 9457 problem+json; and a refused request leaves every table's row count as it was.
// Runs are seeded, so a failure names a seed and a path that reproduce it: set FUZZ_SEED to replay,
// FUZZ_RUNS to look harder (the default keeps `npm test` quick).
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import fc from 'fast-check';
import { listApiRoutes, type MountedRoute } from './api-routes.js';
import { Client, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';

const RUNS = Number(process.env['FUZZ_RUNS'] ?? 12);
const SEED = Number(process.env['FUZZ_SEED'] ?? 20261202);

/**
 * Routes not fuzzed, and why: signing out would end the fuzzing client's own session, and a
 * random body can never be a valid multipart photo (uploads have their own tests in photos.test.ts).
 */
const SKIP = new Set(['POST /api/auth/logout']);

/** Values that have broken parsers elsewhere: huge, negative, fractional, non-finite in disguise, prototype keys, long text. */
const oddScalar = fc.oneof(
  fc.constantFrom(0, -1, 1.5, 2 ** 31, 2 ** 53 + 1, -(2 ** 63), 1e308, '1e309', 'NaN', 'Infinity', '', ' ', 'null', 'true', '0x10', '%00', '../../etc/passwd', '__proto__', 'constructor'),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 20 }),
  fc.integer(),
  fc.double(),
  fc.boolean(),
  fc.constant(null),
  fc.constant('x'.repeat(100_000)),
);

/** The same without the 100 kB string: a URL that long is refused by Node's HTTP parser (431) before the app sees it. */
const oddQueryValue = fc.oneof(oddScalar.filter((v) => typeof v !== 'string' || v.length < 1000), fc.constant('9'.repeat(400)));

/** Field names our bodies use, so random objects often hit real validators rather than only missing-field checks. */
const KNOWN_KEYS = ['id', 'email', 'password', 'name', 'role', 'token', 'hex', 'lab', 'k', 'region', 'shape', 'x', 'y', 'width', 'height', 'neutral', 'accessionId', 'characterId', 'siteId', 'plantId', 'method', 'chipCode', 'photoId', 'light', 'observedAt', 'seasons', 'start', 'end', 'code', 'label', 'value', 'unit', 'title', 'specimenId', 'decision', 'comment', 'reason', 'page', 'pageSize', '__proto__', 'constructor'];

const body = fc.oneof(
  fc.jsonValue({ maxDepth: 3 }),
  fc.dictionary(fc.constantFrom(...KNOWN_KEYS), fc.oneof(oddScalar, fc.array(oddScalar, { maxLength: 4 }), fc.dictionary(fc.constantFrom(...KNOWN_KEYS), oddScalar, { maxKeys: 4 })), { maxKeys: 8 }),
  fc.record({ lab: fc.array(oddScalar, { maxLength: 5 }), hex: oddScalar, region: fc.dictionary(fc.constantFrom('shape', 'x', 'y', 'width', 'height', 'radius', 'points'), oddScalar) }, { requiredKeys: [] }),
);

/** Text that is not the JSON it claims to be. */
const malformed = fc.oneof(fc.constantFrom('{', '[1,', '{"a":}', 'undefined', '\u0000', '{"__proto__":{"x":1}}', '"'.repeat(5000)), fc.string({ maxLength: 200 }));

const pathParam = fc.oneof(
  fc.constantFrom('0', '-1', '1.5', '1e3', '99999999999999999999', 'v1', 'v999', '..', '%2e%2e%2f', 'null', 'undefined', 'a%00b', ' '),
  fc.nat({ max: 1_000_000 }).map(String),
  fc.string({ minLength: 1, maxLength: 30 }).map(encodeURIComponent),
);

const query = fc.dictionary(
  fc.oneof(fc.constantFrom('page', 'pageSize', 'sort', 'dir', 'accessionId', 'characterId', 'siteId', 'observerId', 'method', 'status', 'from', 'to', 'season', 'seasonYear', 'q', 'k', 'kind', 'includeSuperseded', 'germplasmDbId', 'observationUnitDbId', 'observationVariableDbId', 'seasonDbId', 'observationTimeStampRangeStart', 'observationTimeStampRangeEnd', 'year'), fc.string({ minLength: 1, maxLength: 8 })),
  fc.oneof(oddQueryValue.map(String), fc.array(fc.string({ maxLength: 6 }), { minLength: 2, maxLength: 3 })),
  { maxKeys: 5 },
);

function queryString(q: Record<string, string | string[]>): string {
  const parts = Object.entries(q).flatMap(([k, v]) => (Array.isArray(v) ? v.map((x) => `${encodeURIComponent(k)}=${encodeURIComponent(x)}`) : [`${encodeURIComponent(k)}=${encodeURIComponent(v)}`]));
  return parts.length ? `?${parts.join('&')}` : '';
}

function fillPath(pattern: string, params: string[]): string {
  let i = 0;
  return pattern.replace(/:[A-Za-z]+/g, () => params[i++ % params.length] ?? '1');
}

type Sent = { status: number; headers: Record<string, string>; text: string };

async function send(client: Client, route: MountedRoute, url: string, payload: { json?: unknown; raw?: string }): Promise<Sent> {
  const method = route.method.toLowerCase() as 'get' | 'post' | 'patch' | 'put' | 'delete';
  if (method === 'get' || method === 'delete') return client.agent[method](url).set('X-XSRF-TOKEN', client.csrfToken);
  const req = client.agent[method](url).set('X-XSRF-TOKEN', client.csrfToken);
  if (payload.raw !== undefined) return req.set('Content-Type', 'application/json').send(payload.raw);
  return req.set('Content-Type', 'application/json').send(JSON.stringify(payload.json ?? null));
}

describe('fuzzing every JSON API route (fast-check)', () => {
  let h: Harness;
  let admin: Client;
  let nobody: Client;
  let routes: MountedRoute[];

  before(async () => {
    h = await startHarness({ demo: true });
    admin = await signedInAs(h, 'admin');
    nobody = await new Client(h.app).prime();
    routes = listApiRoutes(h.app).filter((r) => !SKIP.has(`${r.method} ${r.path}`));
  });
  after(() => h.close());

  test('finds the routes to fuzz', () => {
    assert.ok(routes.length >= 20, `only ${routes.length} routes found`);
  });

  test('never answers 5xx, always problem+json (BrAPI\'s error string under /brapi) when refusing, and changes nothing when it refuses', async () => {
    const failures: string[] = [];
    const statuses = new Map<number, number>();
    for (const route of routes) {
      const property = fc.asyncProperty(
        fc.constantFrom('admin', 'nobody'),
        fc.array(pathParam, { minLength: 1, maxLength: 3 }),
        query,
        fc.oneof(body.map((json) => ({ json })), malformed.map((raw) => ({ raw }))),
        async (who, params, q, payload) => {
          const url = `${fillPath(route.path, params)}${queryString(q)}`;
          const before = JSON.stringify(await rowCounts(h.ds));
          const res = await send(who === 'admin' ? admin : nobody, route, url, payload);
          statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
          const what = `${route.method} ${url.slice(0, 200)} as ${who} with ${JSON.stringify(payload).slice(0, 300)}`;
          assert.ok(res.status < 500, `${what} → ${res.status} ${res.text.slice(0, 300)}`);
          if (res.status >= 400) {
            if (route.path.startsWith('/brapi/')) assert.match(res.text, /^"ERROR - /, `${what} → ${res.status} not BrAPI's error string`);
            else assert.match(res.headers['content-type'] ?? '', /^application\/problem\+json/, `${what} → ${res.status} not problem+json`);
            assert.equal(JSON.stringify(await rowCounts(h.ds)), before, `${what} → ${res.status} but rows changed`);
          }
        },
      );
      const result = await fc.check(property, { numRuns: RUNS, seed: SEED, endOnFailure: true });
      if (result.failed) failures.push(`${route.method} ${route.path}: ${String(result.errorInstance).split('\n')[0]!.slice(0, 400)} (seed ${result.seed}, path ${result.counterexamplePath})`);
    }
    assert.deepEqual(failures, []);
    // The fuzzing reached both the validators (4xx) and handlers that accepted what they got (2xx).
    const count = (lo: number) => [...statuses].filter(([s]) => s >= lo && s < lo + 100).reduce((n, [, c]) => n + c, 0);
    assert.ok(count(400) > 0 && count(200) > 0, `statuses seen: ${JSON.stringify([...statuses].sort())}`);
    console.log(`# fuzz: ${routes.length} routes, statuses ${JSON.stringify(Object.fromEntries([...statuses].sort((a, b) => a[0] - b[0])))}`);
  });
});
