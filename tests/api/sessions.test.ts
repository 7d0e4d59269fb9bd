import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { SessionRecord } from '../../server/auth/session.entity.js';
import { SESSION_COOKIE } from '../../server/auth/session-store.js';
import { assertProblem } from './assert-problem.js';
import { addUser, Client, PASSWORD, startHarness, type Harness } from './harness.js';

/** The session id inside express-session's signed cookie value (`s:<id>.<signature>`, URL-encoded). */
function sessionId(client: Client): string {
  const value = client.cookie(SESSION_COOKIE);
  assert.ok(value, 'the client holds a session cookie');
  const decoded = decodeURIComponent(value);
  assert.match(decoded, /^s:[^.]+\./);
  return decoded.slice(2, decoded.indexOf('.'));
}

describe('sessions', () => {
  let h: Harness;

  before(async () => {
    h = await startHarness();
    await addUser(h.ds, 'recorder', 'first@test.example');
    await addUser(h.ds, 'reviewer', 'second@test.example');
  });
  after(() => h.close());

  test('should set the session cookie HttpOnly and SameSite=Lax at sign-in', async () => {
    const client = await new Client(h.app).prime();
    const res = await client.post('/api/auth/login', { email: 'first@test.example', password: PASSWORD }).expect(200);
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith(`${SESSION_COOKIE}=`));
    assert.ok(cookie, 'sign-in sets the session cookie');
    const attributes = cookie.split(';').map((a) => a.trim().toLowerCase());
    assert.ok(attributes.includes('httponly'), cookie);
    assert.ok(attributes.includes('samesite=lax'), cookie);
    assert.ok(attributes.includes('path=/'), cookie);
  });

  test('should give a new session id at sign-in and forget the old one', async () => {
    const client = await new Client(h.app).signIn('first@test.example', PASSWORD);
    const before = sessionId(client);
    const holderOfOldId = Client.resume(h.app, client);
    await client.post('/api/auth/login', { email: 'second@test.example', password: PASSWORD }).expect(200);
    const afterwards = sessionId(client);
    assert.notEqual(afterwards, before);
    const me = await client.get('/api/auth/me').expect(200);
    assert.equal(me.body.user.email, 'second@test.example');
    assertProblem(await holderOfOldId.get('/api/auth/me'), 401);
    assert.equal(await h.ds.getRepository(SessionRecord).countBy({ sid: before }), 0, 'the old session row is gone');
  });

  test('should keep the session in the database with its user', async () => {
    const client = await new Client(h.app).signIn('first@test.example', PASSWORD);
    const row = await h.ds.getRepository(SessionRecord).findOneByOrFail({ sid: sessionId(client) });
    const user = (await client.get('/api/auth/me').expect(200)).body.user;
    assert.equal(row.userId, user.id);
    assert.ok(row.expiresAt > Date.now());
  });

  test('should end a session whose expiry has passed and delete its row', async () => {
    const client = await new Client(h.app).signIn('first@test.example', PASSWORD);
    const sid = sessionId(client);
    await h.ds.getRepository(SessionRecord).update({ sid }, { expiresAt: Date.now() - 1000 });
    assertProblem(await client.get('/api/auth/me'), 401);
    assert.equal(await h.ds.getRepository(SessionRecord).countBy({ sid }), 0);
  });

  test('should end the other sessions of a user who changes their password, and keep the current one', async () => {
    await addUser(h.ds, 'trainer', 'changer@test.example');
    const phone = await new Client(h.app).signIn('changer@test.example', PASSWORD);
    const laptop = await new Client(h.app).signIn('changer@test.example', PASSWORD);
    const bystander = await new Client(h.app).signIn('first@test.example', PASSWORD);
    await laptop.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'another-long-passphrase' }).expect(204);
    await laptop.get('/api/auth/me').expect(200);
    assertProblem(await phone.get('/api/auth/me'), 401);
    await bystander.get('/api/auth/me').expect(200);
  });
});

describe('sessions across a restart', () => {
  let h: Harness;

  before(async () => {
    h = await startHarness();
    await addUser(h.ds, 'admin', 'steady@test.example');
  });
  after(() => h.close());

  test('should still know a signed-in user after the app restarts on the same database file', async () => {
    const client = await new Client(h.app).signIn('steady@test.example', PASSWORD);
    await client.get('/api/auth/me').expect(200);
    h = await h.restart();
    const resumed = Client.resume(h.app, client);
    const me = await resumed.get('/api/auth/me');
    assert.equal(me.status, 200, me.text);
    assert.equal(me.body.user.email, 'steady@test.example');
    // The CSRF cookie, signed with the same secret, still passes after the restart.
    await resumed.post('/api/auth/logout').expect(204);
    assertProblem(await resumed.get('/api/auth/me'), 401);
  });

  test('should refuse a session cookie the app never issued', async () => {
    const stranger = new Client(h.app);
    const me = await stranger.get('/api/auth/me').set('Cookie', `${SESSION_COOKIE}=s%3Aforged-session-id.not-a-signature`);
    assertProblem(me, 401);
  });
});
