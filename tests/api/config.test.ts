// Start-up configuration: TRUST_PROXY and secure cookies are read and checked with the rest, so a
// deployment behind a TLS-terminating proxy marks its cookies Secure, and a wrong value stops the
// server with a message naming the variable.
import { describe, test } from 'node:test';
import assert from 'node:assert/strict';
import request from 'supertest';
import { createApp } from '../../server/app.js';
import { SESSION_COOKIE } from '../../server/auth/session-store.js';
import { readConfig } from '../../server/config.js';
import { CSRF_COOKIE } from '../../server/core/csrf.js';
import { addUser, PASSWORD, PUBLIC_URL, startHarness, TEST_SECRET } from './harness.js';

describe('readConfig: TRUST_PROXY and secure cookies', () => {
  test('should trust no proxy and send plain cookies when TRUST_PROXY is unset', () => {
    const config = readConfig({});
    assert.equal(config.trustProxy, false);
    assert.equal(config.secureCookies, false);
  });

  test('should read a hop count and turn secure cookies on with it', () => {
    const config = readConfig({ TRUST_PROXY: '1', PUBLIC_URL: 'https://taro.example.org' });
    assert.equal(config.trustProxy, 1);
    assert.equal(config.secureCookies, true);
  });

  test('should read a list of addresses and ranges', () => {
    const config = readConfig({ TRUST_PROXY: 'loopback, 10.0.0.0/8, ::1', PUBLIC_URL: 'https://taro.example.org' });
    assert.equal(config.trustProxy, 'loopback,10.0.0.0/8,::1');
  });

  test('should let SECURE_COOKIES=0 turn secure cookies off behind a proxy', () => {
    const config = readConfig({ TRUST_PROXY: '1', SECURE_COOKIES: '0' });
    assert.equal(config.trustProxy, 1);
    assert.equal(config.secureCookies, false);
  });

  test('should refuse a TRUST_PROXY that is neither a hop count nor addresses, naming the variable', () => {
    assert.throws(() => readConfig({ TRUST_PROXY: 'yes please', PUBLIC_URL: 'https://taro.example.org' }), /TRUST_PROXY: must be the number of proxies/);
    assert.throws(() => readConfig({ TRUST_PROXY: '10.0.0.0/33', PUBLIC_URL: 'https://taro.example.org' }), /TRUST_PROXY/);
    assert.throws(() => readConfig({ TRUST_PROXY: '99', PUBLIC_URL: 'https://taro.example.org' }), /TRUST_PROXY: must be the number of proxies in front \(1 to 10\)/);
  });

  test('should refuse secure cookies with an http PUBLIC_URL, naming PUBLIC_URL', () => {
    assert.throws(() => readConfig({ TRUST_PROXY: '1' }), /PUBLIC_URL: must be an https:\/\/ URL when cookies are Secure/);
    assert.throws(() => readConfig({ SECURE_COOKIES: '1', PUBLIC_URL: 'http://taro.example.org' }), /PUBLIC_URL/);
  });

  test('should refuse an unknown SECURE_COOKIES value', () => {
    assert.throws(() => readConfig({ SECURE_COOKIES: 'maybe' }), /SECURE_COOKIES/);
  });

  test('should give the app a Secure session cookie behind a proxy that says https, as configured', async () => {
    const h = await startHarness();
    try {
      const config = readConfig({ TRUST_PROXY: '1', PUBLIC_URL: 'https://taro.example.org' });
      const app = createApp({ dataSource: h.ds, mailer: h.mailer, sessionSecret: TEST_SECRET, publicUrl: PUBLIC_URL, trustProxy: config.trustProxy, secureCookies: config.secureCookies, logError: () => {} });
      await addUser(h.ds, 'recorder', 'proxied@test.example');
      const health = await request(app).get('/api/health').set('X-Forwarded-Proto', 'https').expect(200);
      const csrf = ([] as string[]).concat(health.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${CSRF_COOKIE}=`))!;
      const token = decodeURIComponent(csrf.split(';')[0]!.slice(CSRF_COOKIE.length + 1));
      const login = await request(app)
        .post('/api/auth/login')
        .set('X-Forwarded-Proto', 'https')
        .set('Cookie', `${CSRF_COOKIE}=${encodeURIComponent(token)}`)
        .set('X-XSRF-TOKEN', token)
        .send({ email: 'proxied@test.example', password: PASSWORD });
      assert.equal(login.status, 200, login.text);
      const session = ([] as string[]).concat(login.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${SESSION_COOKIE}=`));
      assert.ok(session, 'sign-in sets the session cookie');
      assert.match(session, /;\s*Secure/i);
    } finally {
      await h.close();
    }
  });
});
