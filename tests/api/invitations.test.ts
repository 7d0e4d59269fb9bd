import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { AuditEventRow, InvitationRow, OutboxMessage, Page, Role } from '../../shared/api/auth.js';
import { Invitation } from '../../server/auth/invitation.entity.js';
import { User } from '../../server/auth/user.entity.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { addUser, Client, mailsTo, PUBLIC_URL, rowCounts, signedInAs, startHarness, tokenFromLink, type Harness } from './harness.js';

const NEW_PASSWORD = 'a-long-invited-passphrase';

describe('invitations, end to end through the fake SMTP server', () => {
  let h: Harness;
  let admin: Client;
  let visitor: Client;

  before(async () => {
    h = await startHarness();
    admin = await signedInAs(h, 'admin');
    visitor = await new Client(h.app).prime();
  });
  after(() => h.close());

  /** Invites someone as the admin and returns the token from the mail the outbox caught. */
  async function invite(email: string, role: Role = 'recorder', name = 'Invited Person'): Promise<string> {
    await admin.post('/api/invitations', { email, name, role }).expect(201);
    const outbox = (await admin.get('/api/outbox').expect(200)).body as OutboxMessage[];
    const mail = outbox.find((m) => m.to === email);
    assert.ok(mail, `a mail to ${email} is in the outbox`);
    return tokenFromLink(mail.text, 'invitation');
  }

  test('should answer 201 with the pending invitation and mail a link to the invitee', async () => {
    const res = await admin.post('/api/invitations', { email: 'Fern.Ashby@Test.Example', name: 'Fern Ashby', role: 'reviewer' });
    assert.equal(res.status, 201, res.text);
    const row = res.body as InvitationRow;
    assert.equal(row.email, 'fern.ashby@test.example');
    assert.equal(row.role, 'reviewer');
    assert.equal(row.acceptedAt, null);
    assert.ok(Date.parse(row.expiresAt) > Date.now());

    const outbox = (await admin.get('/api/outbox').expect(200)).body as OutboxMessage[];
    const mail = outbox.find((m) => m.to === 'fern.ashby@test.example');
    assert.ok(mail, 'the invitation mail reached the fake SMTP server');
    assert.match(mail.subject, /invited/i);
    assert.match(mail.text, /Fern Ashby/);
    assert.ok(mail.text.includes(`${PUBLIC_URL}/invitation/`), mail.text);
    const single = await admin.get(`/api/outbox/${mail.id}`).expect(200);
    assert.equal((single.body as OutboxMessage).text, mail.text);
  });

  test('should show the e-mail, name and role behind a link', async () => {
    const token = await invite('willow@test.example', 'trainer', 'Willow Brack');
    const res = await visitor.get(`/api/invitations/${token}`);
    assert.equal(res.status, 200, res.text);
    assert.equal(res.body.email, 'willow@test.example');
    assert.equal(res.body.name, 'Willow Brack');
    assert.equal(res.body.role, 'trainer');
    assert.deepEqual(Object.keys(res.body).sort(), ['email', 'expiresAt', 'name', 'role']);
  });

  test('should create the account at accept (201), after which the invitee signs in with the invited role', async () => {
    const token = await invite('rowan@test.example', 'trainer', 'Rowan Keel');
    const res = await visitor.post('/api/invitations/accept', { token, password: NEW_PASSWORD });
    assert.equal(res.status, 201, res.text);
    assert.deepEqual(Object.keys(res.body.user).sort(), ['email', 'id', 'name', 'role']);
    assert.equal(res.body.user.role, 'trainer');

    const invitee = await new Client(h.app).signIn('rowan@test.example', NEW_PASSWORD);
    const me = await invitee.get('/api/auth/me').expect(200);
    assert.deepEqual(me.body.user, { id: res.body.user.id, email: 'rowan@test.example', name: 'Rowan Keel', role: 'trainer' });

    const listed = ((await admin.get('/api/invitations').expect(200)).body as InvitationRow[]).find((i) => i.email === 'rowan@test.example');
    assert.ok(listed?.acceptedAt, 'the admin sees the invitation as accepted');
  });

  test('should answer 410 to a second accept of the same link and create no second account', async () => {
    const token = await invite('once@test.example');
    await visitor.post('/api/invitations/accept', { token, password: NEW_PASSWORD }).expect(201);
    const before = await rowCounts(h.ds);
    assertProblem(await visitor.post('/api/invitations/accept', { token, password: 'another-long-passphrase' }), 410);
    assertProblem(await visitor.get(`/api/invitations/${token}`), 410);
    assert.deepEqual(await rowCounts(h.ds), before);
    assert.equal(await h.ds.getRepository(User).countBy({ email: 'once@test.example' }), 1);
  });

  test('should create one account when the same link is accepted twice at once', async () => {
    const token = await invite('hasty@test.example');
    const other = await new Client(h.app).prime();
    const answers = await Promise.all([
      visitor.post('/api/invitations/accept', { token, password: NEW_PASSWORD }),
      other.post('/api/invitations/accept', { token, password: 'a-competing-passphrase' }),
    ]);
    assert.deepEqual(answers.map((r) => r.status).sort(), [201, 410]);
    assert.equal(await h.ds.getRepository(User).countBy({ email: 'hasty@test.example' }), 1);
  });

  test('should answer 404 to an unknown or malformed token', async () => {
    const unknown = 'A'.repeat(43);
    const before = await rowCounts(h.ds);
    assertProblem(await visitor.get(`/api/invitations/${unknown}`), 404);
    assertProblem(await visitor.post('/api/invitations/accept', { token: unknown, password: NEW_PASSWORD }), 404);
    assertProblem(await visitor.get('/api/invitations/not*a*token'), 404);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should answer 410 to an expired invitation and create no account', async () => {
    const token = await invite('late@test.example');
    await h.ds.getRepository(Invitation).update({ email: 'late@test.example' }, { expiresAt: new Date(Date.now() - 1000) });
    assertProblem(await visitor.get(`/api/invitations/${token}`), 410);
    assertProblem(await visitor.post('/api/invitations/accept', { token, password: NEW_PASSWORD }), 410);
    assert.equal(await h.ds.getRepository(User).countBy({ email: 'late@test.example' }), 0);
  });

  test('should refuse a too-short password at accept with 400 and leave the link usable', async () => {
    const token = await invite('patient@test.example');
    assertInvalidFields(await visitor.post('/api/invitations/accept', { token, password: 'short' }), 'password');
    assert.equal((await visitor.get(`/api/invitations/${token}`)).status, 200);
  });

  test('should keep only a hash of the token: the raw token is in no table but the mail outbox', async () => {
    const token = await invite('hashed@test.example');
    const row = await h.ds.getRepository(Invitation).findOneByOrFail({ email: 'hashed@test.example' });
    assert.match(row.tokenHash, /^[0-9a-f]{64}$/);
    assert.notEqual(row.tokenHash, token);
    const tables = Object.keys(await rowCounts(h.ds)).filter((t) => t !== 'mail_message');
    assert.ok(tables.includes('invitation'));
    for (const table of tables) {
      const dump = JSON.stringify(await h.ds.query(`SELECT * FROM "${table}"`));
      assert.ok(!dump.includes(token), `the raw token appears in table ${table}`);
    }
    assert.equal((await mailsTo(h.ds, 'hashed@test.example')).length, 1, 'the mail, and only it, carries the token');
  });

  test('should refuse to invite an address that has an account with 409, whatever its case, and send no mail', async () => {
    await addUser(h.ds, 'recorder', 'taken@test.example');
    const before = await rowCounts(h.ds);
    for (const email of ['taken@test.example', 'Taken@Test.Example']) {
      assertProblem(await admin.post('/api/invitations', { email, name: 'Taken', role: 'recorder' }), 409);
    }
    assert.deepEqual(await rowCounts(h.ds), before, 'no invitation, no audit event, no mail');
    assert.equal((await mailsTo(h.ds, 'taken@test.example')).length, 0);
  });

  test('should answer 409 at accept when the address got an account since the invitation was sent', async () => {
    const token = await invite('overtaken@test.example');
    await addUser(h.ds, 'reviewer', 'overtaken@test.example');
    assertProblem(await visitor.post('/api/invitations/accept', { token, password: NEW_PASSWORD }), 409);
    assert.equal(await h.ds.getRepository(User).countBy({ email: 'overtaken@test.example' }), 1);
  });

  test('should record audit events for the invitation and its acceptance', async () => {
    const token = await invite('audited@test.example', 'reviewer');
    const accepted = await visitor.post('/api/invitations/accept', { token, password: NEW_PASSWORD }).expect(201);
    const events = ((await admin.get('/api/audit?pageSize=200').expect(200)).body as Page<AuditEventRow>).items;
    const created = events.find((e) => e.action === 'invitation.created' && e.detail?.['email'] === 'audited@test.example');
    assert.ok(created, 'invitation.created is recorded');
    assert.equal(created.actorEmail, (await admin.get('/api/auth/me')).body.user.email);
    const acceptance = events.find((e) => e.action === 'invitation.accepted' && e.actorId === accepted.body.user.id);
    assert.ok(acceptance, 'invitation.accepted is recorded');
    assert.equal(acceptance.detail?.['role'], 'reviewer');
  });
});
