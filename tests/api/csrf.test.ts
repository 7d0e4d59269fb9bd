import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import request from 'supertest';
import { User } from '../../server/auth/user.entity.js';
import { CSRF_COOKIE } from '../../server/core/csrf.js';
import { assertProblem } from './assert-problem.js';
import { addUser, Client, PASSWORD, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';

const NEW_USER = { email: 'newcomer@test.example', name: 'Newcomer', role: 'recorder', password: 'a-long-enough-passphrase' };
const LOGIN = { email: 'member@test.example', password: PASSWORD };

describe('CSRF protection of state-changing requests', () => {
  let h: Harness;
  let admin: Client;

  before(async () => {
    h = await startHarness();
    admin = await signedInAs(h, 'admin');
    await addUser(h.ds, 'recorder', LOGIN.email);
  });
  after(() => h.close());

  /** Asserts a 403 problem of the CSRF type. */
  function assertCsrfRefusal(res: request.Response): void {
    const problem = assertProblem(res, 403);
    assert.match(problem.type, /\/csrf$/);
  }

  test('should hand out an XSRF-TOKEN cookie that scripts can read, SameSite=Lax, at GET /api/health', async () => {
    const res = await request(h.app).get('/api/health').expect(200);
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${CSRF_COOKIE}=`));
    assert.ok(cookie, 'health sets the CSRF cookie');
    const attributes = cookie.split(';').map((a) => a.trim().toLowerCase());
    assert.ok(!attributes.includes('httponly'), 'Angular must be able to read the cookie');
    assert.ok(attributes.includes('samesite=lax'), cookie);
  });

  test('should refuse a sign-in without X-XSRF-TOKEN with 403, starting no session and recording nothing', async () => {
    const client = await new Client(h.app).prime();
    const before = await rowCounts(h.ds);
    assertCsrfRefusal(await client.agent.post('/api/auth/login').send(LOGIN));
    assert.deepEqual(await rowCounts(h.ds), before);
    assertProblem(await client.get('/api/auth/me'), 401);
  });

  test('should refuse a sign-in whose header does not match the cookie', async () => {
    const client = await new Client(h.app).prime();
    const before = await rowCounts(h.ds);
    assertCsrfRefusal(await client.agent.post('/api/auth/login').set('X-XSRF-TOKEN', 'forged.token').send(LOGIN));
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should refuse a cookie and header pair that the server did not sign, even when they match', async () => {
    const planted = 'attacker-chosen-nonce.attacker-chosen-mac';
    const before = await rowCounts(h.ds);
    const res = await request(h.app).post('/api/auth/login').set('Cookie', `${CSRF_COOKIE}=${planted}`).set('X-XSRF-TOKEN', planted).send(LOGIN);
    assertCsrfRefusal(res);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should refuse another browser\'s valid token echoed with this browser\'s cookie', async () => {
    const other = await new Client(h.app).prime();
    const client = await new Client(h.app).prime();
    assert.notEqual(other.csrfToken, client.csrfToken);
    assertCsrfRefusal(await client.agent.post('/api/auth/login').set('X-XSRF-TOKEN', other.csrfToken).send(LOGIN));
  });

  test('should refuse an admin creating a user without the header: no user, no audit event', async () => {
    const before = await rowCounts(h.ds);
    assertCsrfRefusal(await admin.agent.post('/api/users').send(NEW_USER));
    assert.deepEqual(await rowCounts(h.ds), before);
    assert.equal(await h.ds.getRepository(User).countBy({ email: NEW_USER.email }), 0);
  });

  test('should refuse an admin creating a user with a forged header: no user, no audit event', async () => {
    const before = await rowCounts(h.ds);
    assertCsrfRefusal(await admin.agent.post('/api/users').set('X-XSRF-TOKEN', `${admin.csrfToken}x`).send(NEW_USER));
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should refuse a PATCH without the header and leave the user as it was', async () => {
    const target = await addUser(h.ds, 'reviewer', 'patched@test.example');
    assertCsrfRefusal(await admin.agent.patch(`/api/users/${target.id}`).send({ active: false, name: 'Changed' }));
    const reloaded = await h.ds.getRepository(User).findOneByOrFail({ id: target.id });
    assert.equal(reloaded.active, true);
    assert.equal(reloaded.name, target.name);
  });

  test('should refuse a sign-out without the header and keep the session', async () => {
    const client = await new Client(h.app).signIn(LOGIN.email, LOGIN.password);
    assertCsrfRefusal(await client.agent.post('/api/auth/logout'));
    await client.get('/api/auth/me').expect(200);
  });

  test('should let the same requests through when the header echoes the cookie', async () => {
    const res = await admin.post('/api/users', NEW_USER);
    assert.equal(res.status, 201, res.text);
    assert.equal(await h.ds.getRepository(User).countBy({ email: NEW_USER.email }), 1);
  });

  test('should not ask for the header on a GET', async () => {
    const res = await admin.agent.get('/api/users');
    assert.equal(res.status, 200);
  });
});

describe('CSRF tokens are bound to the session', () => {
  let h: Harness;

  before(async () => {
    h = await startHarness();
    await addUser(h.ds, 'recorder', 'bound@test.example');
  });
  after(() => h.close());

  /** The XSRF-TOKEN a response sets, if any. */
  function tokenSetBy(res: request.Response): string | undefined {
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${CSRF_COOKIE}=`));
    return cookie ? decodeURIComponent(cookie.split(';')[0]!.slice(CSRF_COOKIE.length + 1)) : undefined;
  }

  /** Sends a sign-out with this client's session cookie but the given token as both the XSRF cookie and the header. */
  function signOutWith(client: Client, token: string) {
    const sessionCookie = client.cookieHeader().split('; ').filter((c) => !c.startsWith(`${CSRF_COOKIE}=`));
    return request(h.app)
      .post('/api/auth/logout')
      .set('Cookie', [...sessionCookie, `${CSRF_COOKIE}=${encodeURIComponent(token)}`].join('; '))
      .set('X-XSRF-TOKEN', token);
  }

  test('should hand out a new token at sign-in, different from the one fetched before', async () => {
    const client = await new Client(h.app).prime();
    const anonymous = client.csrfToken;
    const login = await client.post('/api/auth/login', { email: 'bound@test.example', password: PASSWORD });
    assert.equal(login.status, 200, login.text);
    const issued = tokenSetBy(login);
    assert.ok(issued, 'sign-in sets a new XSRF-TOKEN');
    assert.notEqual(issued, anonymous);
  });

  test('should refuse a token fetched anonymously with a signed-in session, and keep the session', async () => {
    const stranger = await new Client(h.app).prime();
    const client = await new Client(h.app).signIn('bound@test.example', PASSWORD);
    const res = await signOutWith(client, stranger.csrfToken);
    assert.match(assertProblem(res, 403).type, /\/csrf$/);
    await client.get('/api/auth/me').expect(200);
  });

  test('should refuse the token of one signed-in session with another session', async () => {
    const first = await new Client(h.app).signIn('bound@test.example', PASSWORD);
    const second = await new Client(h.app).signIn('bound@test.example', PASSWORD);
    const res = await signOutWith(second, first.csrfToken);
    assert.match(assertProblem(res, 403).type, /\/csrf$/);
    await second.get('/api/auth/me').expect(200);
  });

  test('should accept the token issued at sign-in with its own session', async () => {
    const client = await new Client(h.app).signIn('bound@test.example', PASSWORD);
    await signOutWith(client, client.csrfToken).expect(204);
    assertProblem(await client.get('/api/auth/me'), 401);
  });
});
