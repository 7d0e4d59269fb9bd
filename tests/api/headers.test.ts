import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import request from 'supertest';
import { createApp } from '../../server/app.js';
import { SESSION_COOKIE } from '../../server/auth/session-store.js';
import { CSRF_COOKIE } from '../../server/core/csrf.js';
import { addUser, Client, PASSWORD, PUBLIC_URL, signedInAs, startHarness, TEST_SECRET, type Harness } from './harness.js';

/** The directives of a Content-Security-Policy header, by name. */
function cspDirectives(header: unknown): Map<string, string[]> {
  assert.equal(typeof header, 'string', 'a Content-Security-Policy header is sent');
  return new Map(
    (header as string)
      .split(';')
      .map((d) => d.trim().split(/\s+/))
      .filter((parts) => parts[0])
      .map(([name, ...values]) => [name!.toLowerCase(), values]),
  );
}

function setCookies(res: request.Response): string[] {
  return ([] as string[]).concat(res.headers['set-cookie'] ?? []);
}

describe('security headers', () => {
  let h: Harness;
  let admin: Client;

  before(async () => {
    h = await startHarness();
    admin = await signedInAs(h, 'admin');
  });
  after(() => h.close());

  /** A success, a refusal, an unknown route and a state-changing request, by name: each must carry the headers. */
  async function answers(): Promise<[string, request.Response][]> {
    return [
      ['GET /api/health', await request(h.app).get('/api/health')],
      ['GET /api/auth/me signed out', await request(h.app).get('/api/auth/me')],
      ['GET /api/nothing-here', await request(h.app).get('/api/nothing-here')],
      ['POST /api/users', await admin.post('/api/users', { email: 'headers@test.example', name: 'Headers', role: 'recorder', password: 'a-long-enough-passphrase' })],
    ];
  }

  test('should send a Content-Security-Policy with default-src \'self\' and no inline scripts or framing', async () => {
    for (const [name, res] of await answers()) {
      const csp = cspDirectives(res.headers['content-security-policy']);
      assert.deepEqual(csp.get('default-src'), ["'self'"], `${name}: ${res.headers['content-security-policy']}`);
      assert.deepEqual(csp.get('script-src'), ["'self'"], name);
      assert.deepEqual(csp.get('object-src'), ["'none'"], name);
      assert.deepEqual(csp.get('frame-ancestors'), ["'none'"], name);
    }
  });

  test('should send X-Content-Type-Options: nosniff and a no-referrer policy', async () => {
    for (const [name, res] of await answers()) {
      assert.equal(res.headers['x-content-type-options'], 'nosniff', name);
      assert.equal(res.headers['referrer-policy'], 'no-referrer', name);
    }
  });

  test('should not say what the server runs on (no X-Powered-By)', async () => {
    for (const [name, res] of await answers()) assert.equal(res.headers['x-powered-by'], undefined, name);
  });

  test('should not send Strict-Transport-Security when the app is served over plain HTTP', async () => {
    const res = await request(h.app).get('/api/health');
    assert.equal(res.headers['strict-transport-security'], undefined);
  });
});

describe('security headers behind an HTTPS proxy', () => {
  let h: Harness;

  before(async () => {
    h = await startHarness();
    await addUser(h.ds, 'recorder', 'secure@test.example');
  });
  after(() => h.close());

  test('should send Strict-Transport-Security and mark both cookies Secure', async () => {
    const app = createApp({ dataSource: h.ds, mailer: h.mailer, sessionSecret: TEST_SECRET, publicUrl: PUBLIC_URL, secureCookies: true, trustProxy: 1, logError: () => {} });
    const health = await request(app).get('/api/health').set('X-Forwarded-Proto', 'https').expect(200);
    assert.match(String(health.headers['strict-transport-security']), /max-age=\d+/);
    const csrfCookie = setCookies(health).find((c) => c.startsWith(`${CSRF_COOKIE}=`));
    assert.ok(csrfCookie, 'the CSRF cookie is set');
    assert.match(csrfCookie, /;\s*Secure/i);
    const token = decodeURIComponent(csrfCookie.split(';')[0]!.slice(CSRF_COOKIE.length + 1));
    // The test agent talks plain HTTP to the app, so it is handed the Secure cookie explicitly.
    const login = await request(app)
      .post('/api/auth/login')
      .set('X-Forwarded-Proto', 'https')
      .set('Cookie', `${CSRF_COOKIE}=${encodeURIComponent(token)}`)
      .set('X-XSRF-TOKEN', token)
      .send({ email: 'secure@test.example', password: PASSWORD });
    assert.equal(login.status, 200, login.text);
    const sessionCookie = setCookies(login).find((c) => c.startsWith(`${SESSION_COOKIE}=`));
    assert.ok(sessionCookie, 'sign-in sets the session cookie');
    assert.match(sessionCookie, /;\s*Secure/i);
    assert.match(sessionCookie, /;\s*HttpOnly/i);
  });
});
