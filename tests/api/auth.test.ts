import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { AuditEventRow, Page, UserSummary } from '../../shared/api/auth.js';
import { User } from '../../server/auth/user.entity.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { addUser, Client, PASSWORD, signedInAs, startHarness, type Harness } from './harness.js';

describe('sign-in and sign-out (POST /api/auth/login, /logout, GET /me)', () => {
  let h: Harness;
  let admin: Client;
  let member: User;
  let inactive: User;

  before(async () => {
    h = await startHarness();
    admin = await signedInAs(h, 'admin');
    member = await addUser(h.ds, 'recorder', 'member@test.example');
    inactive = await addUser(h.ds, 'reviewer', 'inactive@test.example');
    await h.ds.getRepository(User).update({ id: inactive.id }, { active: false });
  });
  after(() => h.close());

  /** The audit events of one action, newest first, as an admin sees them. */
  async function auditOf(action: string): Promise<AuditEventRow[]> {
    const res = await admin.get(`/api/audit?action=${action}&pageSize=200`).expect(200);
    return (res.body as Page<AuditEventRow>).items;
  }

  async function signIn(email: string, password: string) {
    const client = await new Client(h.app).prime();
    return { client, res: await client.post('/api/auth/login', { email, password }) };
  }

  test('should answer 200 with exactly the id, e-mail, name and role of the user', async () => {
    const { res } = await signIn('member@test.example', PASSWORD);
    assert.equal(res.status, 200);
    assert.deepEqual(res.body, { user: { id: member.id, email: 'member@test.example', name: 'Test recorder', role: 'recorder' } });
  });

  test('should never send the password hash, at sign-in or from /api/auth/me', async () => {
    const { client, res } = await signIn('member@test.example', PASSWORD);
    const me = await client.get('/api/auth/me').expect(200);
    for (const text of [res.text, me.text]) {
      assert.doesNotMatch(text, /passwordHash|scrypt\$/);
    }
    assert.deepEqual(Object.keys((me.body as { user: UserSummary }).user).sort(), ['email', 'id', 'name', 'role']);
  });

  test('should sign in whatever the case and surrounding spaces of the e-mail', async () => {
    const { res } = await signIn('  Member@Test.EXAMPLE ', PASSWORD);
    assert.equal(res.status, 200);
    assert.equal((res.body as { user: UserSummary }).user.id, member.id);
  });

  test('should refuse a wrong password with 401 problem+json', async () => {
    const { res } = await signIn('member@test.example', 'not-the-password');
    assertProblem(res, 401);
  });

  test('should refuse an unknown e-mail with 401 and the same words as a wrong password', async () => {
    const unknown = assertProblem((await signIn('nobody@test.example', PASSWORD)).res, 401);
    const wrong = assertProblem((await signIn('member@test.example', 'not-the-password')).res, 401);
    assert.equal(unknown.detail, wrong.detail, 'the answer must not tell which addresses have accounts');
  });

  test('should refuse a deactivated user with 401 even with the right password', async () => {
    const { client, res } = await signIn('inactive@test.example', PASSWORD);
    assertProblem(res, 401);
    assertProblem(await client.get('/api/auth/me'), 401);
  });

  test('should start no session when sign-in is refused', async () => {
    const { client, res } = await signIn('member@test.example', 'not-the-password');
    assert.equal(res.status, 401);
    assert.equal(client.cookie('hueledger.sid'), undefined, 'no session cookie after a refused sign-in');
    assertProblem(await client.get('/api/auth/me'), 401);
  });

  test('should refuse a sign-in with no password with 400 naming the field', async () => {
    const { res } = await signIn('member@test.example', '');
    assertInvalidFields(res, 'password');
  });

  test('should answer /api/auth/me with the signed-in user', async () => {
    const { client } = await signIn('member@test.example', PASSWORD);
    const me = await client.get('/api/auth/me').expect(200);
    assert.deepEqual(me.body, { user: { id: member.id, email: 'member@test.example', name: 'Test recorder', role: 'recorder' } });
  });

  test('should answer 204 at sign-out and 401 at /api/auth/me afterwards', async () => {
    const { client } = await signIn('member@test.example', PASSWORD);
    await client.get('/api/auth/me').expect(200);
    const out = await client.post('/api/auth/logout');
    assert.equal(out.status, 204);
    assertProblem(await client.get('/api/auth/me'), 401);
  });

  test('should end the session on the server at sign-out, so a copied cookie stops working', async () => {
    const { client } = await signIn('member@test.example', PASSWORD);
    const copy = Client.resume(h.app, client);
    await copy.get('/api/auth/me').expect(200);
    await client.post('/api/auth/logout').expect(204);
    assertProblem(await copy.get('/api/auth/me'), 401);
  });

  test('should answer 204 at sign-out when nobody is signed in', async () => {
    const client = await new Client(h.app).prime();
    assert.equal((await client.post('/api/auth/logout')).status, 204);
  });

  test('should note the time of the last sign-in', async () => {
    const user = await addUser(h.ds, 'trainer', 'stamp@test.example');
    assert.equal(user.lastLoginAt, null);
    const before = Date.now() - 2000;
    await signIn('stamp@test.example', PASSWORD);
    const reloaded = await h.ds.getRepository(User).findOneByOrFail({ id: user.id });
    assert.ok(reloaded.lastLoginAt && reloaded.lastLoginAt.getTime() >= before, `lastLoginAt is ${reloaded.lastLoginAt}`);
  });

  test('should record an audit event for a sign-in', async () => {
    const user = await addUser(h.ds, 'reviewer', 'audited@test.example');
    await signIn('audited@test.example', PASSWORD);
    const events = (await auditOf('auth.sign-in')).filter((e) => e.actorId === user.id);
    assert.equal(events.length, 1);
    assert.equal(events[0]!.actorEmail, 'audited@test.example');
    assert.equal(events[0]!.subject, `user:${user.id}`);
    assert.ok(events[0]!.ip, 'the event keeps the address it came from');
  });

  test('should record an audit event for a failed sign-in, without the password tried', async () => {
    await signIn('target@test.example', 'a-guessed-password-1234');
    const events = (await auditOf('auth.sign-in-failed')).filter((e) => e.actorEmail === 'target@test.example');
    assert.equal(events.length, 1);
    assert.equal(events[0]!.actorId, null);
    assert.doesNotMatch(JSON.stringify(events[0]), /a-guessed-password-1234/);
  });

  test('should record an audit event for a sign-out', async () => {
    const user = await addUser(h.ds, 'recorder', 'leaver@test.example');
    const { client } = await signIn('leaver@test.example', PASSWORD);
    await client.post('/api/auth/logout').expect(204);
    const events = (await auditOf('auth.sign-out')).filter((e) => e.actorId === user.id);
    assert.equal(events.length, 1);
  });
});

describe('changing one\'s own password (POST /api/auth/password)', () => {
  let h: Harness;

  before(async () => {
    h = await startHarness();
  });
  after(() => h.close());

  test('should refuse a wrong current password with 400 naming currentPassword, and keep the old password', async () => {
    await addUser(h.ds, 'recorder', 'keeper@test.example');
    const client = await new Client(h.app).signIn('keeper@test.example', PASSWORD);
    const res = await client.post('/api/auth/password', { currentPassword: 'not-the-password', newPassword: 'a-brand-new-passphrase' });
    assertInvalidFields(res, 'currentPassword');
    await new Client(h.app).signIn('keeper@test.example', PASSWORD);
  });

  test('should answer 204, then refuse the old password and accept the new one', async () => {
    await addUser(h.ds, 'trainer', 'changer@test.example');
    const client = await new Client(h.app).signIn('changer@test.example', PASSWORD);
    const res = await client.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'a-brand-new-passphrase' });
    assert.equal(res.status, 204);
    await client.get('/api/auth/me').expect(200);
    const old = await new Client(h.app).prime();
    assertProblem(await old.post('/api/auth/login', { email: 'changer@test.example', password: PASSWORD }), 401);
    await new Client(h.app).signIn('changer@test.example', 'a-brand-new-passphrase');
  });

  test('should refuse a new password shorter than 10 characters with 400 naming newPassword', async () => {
    await addUser(h.ds, 'reviewer', 'short@test.example');
    const client = await new Client(h.app).signIn('short@test.example', PASSWORD);
    assertInvalidFields(await client.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'short' }), 'newPassword');
  });
});
