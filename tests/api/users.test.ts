import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { AuditEventRow, Page, UserRow } from '../../shared/api/auth.js';
import { SessionRecord } from '../../server/auth/session.entity.js';
import { User } from '../../server/auth/user.entity.js';
import { assertProblem } from './assert-problem.js';
import { addUser, Client, PASSWORD, rowCounts, startHarness, type Harness } from './harness.js';

const ROW_KEYS = ['active', 'createdAt', 'email', 'id', 'lastLoginAt', 'name', 'role'];

describe('user administration (/api/users)', () => {
  let h: Harness;
  let admin: Client;
  let adminId: number;

  before(async () => {
    h = await startHarness();
    adminId = (await addUser(h.ds, 'admin', 'chief@test.example')).id;
    admin = await new Client(h.app).signIn('chief@test.example', PASSWORD);
  });
  after(() => h.close());

  async function auditOf(action: string): Promise<AuditEventRow[]> {
    return ((await admin.get(`/api/audit?action=${action}&pageSize=200`).expect(200)).body as Page<AuditEventRow>).items;
  }

  test('should create a user (201) who can then sign in with the given role', async () => {
    const res = await admin.post('/api/users', { email: 'Hazel.Prine@Test.Example', name: 'Hazel Prine', role: 'reviewer', password: 'hazel-long-passphrase' });
    assert.equal(res.status, 201, res.text);
    const row = res.body as UserRow;
    assert.deepEqual(Object.keys(row).sort(), ROW_KEYS);
    assert.equal(row.email, 'hazel.prine@test.example');
    assert.equal(row.role, 'reviewer');
    assert.equal(row.active, true);
    const hazel = await new Client(h.app).signIn('hazel.prine@test.example', 'hazel-long-passphrase');
    const me = await hazel.get('/api/auth/me').expect(200);
    assert.deepEqual(me.body.user, { id: row.id, email: 'hazel.prine@test.example', name: 'Hazel Prine', role: 'reviewer' });
  });

  test('should refuse a second account for an e-mail, whatever its case, with 409 and create nothing', async () => {
    await addUser(h.ds, 'recorder', 'twin@test.example');
    const before = await rowCounts(h.ds);
    for (const email of ['twin@test.example', 'TWIN@test.example']) {
      assertProblem(await admin.post('/api/users', { email, name: 'Twin', role: 'trainer', password: 'a-long-passphrase' }), 409);
    }
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should list users with their rows and without password hashes', async () => {
    const res = await admin.get('/api/users').expect(200);
    const rows = res.body as UserRow[];
    assert.ok(rows.some((r) => r.email === 'chief@test.example'));
    for (const row of rows) assert.deepEqual(Object.keys(row).sort(), ROW_KEYS);
    assert.doesNotMatch(res.text, /passwordHash|scrypt\$/);
  });

  test('should change a user\'s role (200), which their very next request sees', async () => {
    const user = await addUser(h.ds, 'recorder', 'promoted@test.example');
    const them = await new Client(h.app).signIn('promoted@test.example', PASSWORD);
    const res = await admin.patch(`/api/users/${user.id}`, { role: 'reviewer' });
    assert.equal(res.status, 200, res.text);
    assert.equal((res.body as UserRow).role, 'reviewer');
    assert.equal((await them.get('/api/auth/me').expect(200)).body.user.role, 'reviewer');
  });

  test('should end a deactivated user\'s sessions at once and refuse their sign-in', async () => {
    const user = await addUser(h.ds, 'trainer', 'leaving@test.example');
    const phone = await new Client(h.app).signIn('leaving@test.example', PASSWORD);
    const laptop = await new Client(h.app).signIn('leaving@test.example', PASSWORD);
    assert.equal(await h.ds.getRepository(SessionRecord).countBy({ userId: user.id }), 2);
    const res = await admin.patch(`/api/users/${user.id}`, { active: false });
    assert.equal(res.status, 200, res.text);
    assert.equal((res.body as UserRow).active, false);
    assertProblem(await phone.get('/api/auth/me'), 401);
    assertProblem(await laptop.get('/api/auth/me'), 401);
    assert.equal(await h.ds.getRepository(SessionRecord).countBy({ userId: user.id }), 0);
    const retry = await new Client(h.app).prime();
    assertProblem(await retry.post('/api/auth/login', { email: 'leaving@test.example', password: PASSWORD }), 401);
  });

  test('should let a reactivated user sign in again', async () => {
    const user = await addUser(h.ds, 'recorder', 'returning@test.example');
    await admin.patch(`/api/users/${user.id}`, { active: false }).expect(200);
    await admin.patch(`/api/users/${user.id}`, { active: true }).expect(200);
    await new Client(h.app).signIn('returning@test.example', PASSWORD);
  });

  test('should refuse an admin deactivating their own account with 409, keeping them active and signed in', async () => {
    assertProblem(await admin.patch(`/api/users/${adminId}`, { active: false }), 409);
    assert.equal((await h.ds.getRepository(User).findOneByOrFail({ id: adminId })).active, true);
    await admin.get('/api/auth/me').expect(200);
  });

  test('should refuse an admin changing their own role with 409', async () => {
    assertProblem(await admin.patch(`/api/users/${adminId}`, { role: 'recorder' }), 409);
    assert.equal((await h.ds.getRepository(User).findOneByOrFail({ id: adminId })).role, 'admin');
  });

  test('should let an admin change their own name', async () => {
    const res = await admin.patch(`/api/users/${adminId}`, { name: 'Chief Renamed' });
    assert.equal(res.status, 200, res.text);
    assert.equal((res.body as UserRow).name, 'Chief Renamed');
  });

  test('should answer 404 to a change of a user who does not exist', async () => {
    assertProblem(await admin.patch('/api/users/999999', { name: 'Nobody' }), 404);
  });

  test('should ignore fields a change may not set, such as the e-mail or the password hash', async () => {
    const user = await addUser(h.ds, 'reviewer', 'sturdy@test.example');
    const res = await admin.patch(`/api/users/${user.id}`, { name: 'Sturdy', email: 'hijack@test.example', passwordHash: 'scrypt$1$1$1$AAAA$AAAA', id: 1 });
    assert.equal(res.status, 200, res.text);
    const reloaded = await h.ds.getRepository(User).findOneByOrFail({ id: user.id });
    assert.equal(reloaded.email, 'sturdy@test.example');
    assert.equal(reloaded.passwordHash, user.passwordHash);
    assert.equal(reloaded.name, 'Sturdy');
    await new Client(h.app).signIn('sturdy@test.example', PASSWORD);
  });

  test('should record audit events for a created and a changed user, with what changed', async () => {
    const created = (await admin.post('/api/users', { email: 'logged@test.example', name: 'Logged', role: 'recorder', password: 'a-long-passphrase' }).expect(201)).body as UserRow;
    await admin.patch(`/api/users/${created.id}`, { role: 'trainer' }).expect(200);
    const creation = (await auditOf('user.created')).find((e) => e.subject === `user:${created.id}`);
    assert.ok(creation, 'user.created is recorded');
    assert.equal(creation.actorId, adminId);
    assert.equal(creation.detail?.['role'], 'recorder');
    const change = (await auditOf('user.updated')).find((e) => e.subject === `user:${created.id}`);
    assert.ok(change, 'user.updated is recorded');
    assert.equal(change.actorId, adminId);
    assert.deepEqual(change.detail, {
      before: { name: 'Logged', role: 'recorder', active: true },
      after: { name: 'Logged', role: 'trainer', active: true },
    });
    assert.doesNotMatch(JSON.stringify(creation), /a-long-passphrase/);
  });
});
