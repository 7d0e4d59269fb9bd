import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { PasswordReset } from '../../server/auth/password-reset.entity.js';
import { hashToken } from '../../server/auth/tokens.js';
import { User } from '../../server/auth/user.entity.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { addUser, Client, mailsTo, PASSWORD, PUBLIC_URL, rowCounts, startHarness, tokenFromLink, type Harness } from './harness.js';

const NEW_PASSWORD = 'a-freshly-chosen-passphrase';

/*
 * POST /api/auth/password-reset allows 5 requests per address in 15 minutes (rate-limit.test.ts),
 * so each describe below starts its own app and stays within 5 requests.
 */

describe('asking for a password reset (POST /api/auth/password-reset)', () => {
  let h: Harness;
  let visitor: Client;

  before(async () => {
    h = await startHarness();
    visitor = await new Client(h.app).prime();
    await addUser(h.ds, 'recorder', 'known@test.example');
    await addUser(h.ds, 'reviewer', 'other-known@test.example');
    const gone = await addUser(h.ds, 'trainer', 'gone@test.example');
    await h.ds.getRepository(User).update({ id: gone.id }, { active: false });
  });
  after(() => h.close());

  test('should answer 202 and mail a reset link to a known address, whatever its case, keeping only a hash of the token', async () => {
    const res = await visitor.post('/api/auth/password-reset', { email: 'Known@Test.Example' });
    assert.equal(res.status, 202, res.text);
    const mails = await mailsTo(h.ds, 'known@test.example');
    assert.equal(mails.length, 1);
    assert.match(mails[0]!.subject, /reset/i);
    assert.ok(mails[0]!.text.includes(`${PUBLIC_URL}/reset-password/`), mails[0]!.text);
    const token = tokenFromLink(mails[0]!.text, 'reset-password');
    const stored = await h.ds.query('SELECT * FROM password_reset');
    assert.equal(stored.length, 1);
    assert.match(stored[0].tokenHash, /^[0-9a-f]{64}$/);
    assert.ok(!JSON.stringify(stored).includes(token), 'the raw token is not stored');
  });

  test('should answer an unknown address exactly as a known one, and send it no mail', async () => {
    const known = await visitor.post('/api/auth/password-reset', { email: 'other-known@test.example' });
    const mailsBefore = (await rowCounts(h.ds))['mail_message'];
    const unknown = await visitor.post('/api/auth/password-reset', { email: 'stranger@test.example' });
    assert.equal(unknown.status, 202);
    assert.equal(unknown.status, known.status);
    assert.deepEqual(unknown.body, known.body);
    assert.equal((await rowCounts(h.ds))['mail_message'], mailsBefore, 'no mail was sent');
    assert.equal((await mailsTo(h.ds, 'stranger@test.example')).length, 0);
    assert.equal(await h.ds.getRepository(PasswordReset).count(), 2, 'no reset was stored for the unknown address');
  });

  test('should answer 202 for a deactivated account but send it no mail', async () => {
    const res = await visitor.post('/api/auth/password-reset', { email: 'gone@test.example' });
    assert.equal(res.status, 202);
    assert.equal((await mailsTo(h.ds, 'gone@test.example')).length, 0);
  });
});

describe('following a reset link (POST /api/auth/password-reset/confirm)', () => {
  let h: Harness;
  let visitor: Client;

  before(async () => {
    h = await startHarness();
    visitor = await new Client(h.app).prime();
  });
  after(() => h.close());

  /** Adds a user, asks for a reset of their password and returns the token from the mail. */
  async function resetTokenFor(email: string): Promise<string> {
    await addUser(h.ds, 'recorder', email);
    await visitor.post('/api/auth/password-reset', { email }).expect(202);
    const [mail] = await mailsTo(h.ds, email);
    assert.ok(mail, `a reset mail to ${email} arrived`);
    return tokenFromLink(mail.text, 'reset-password');
  }

  async function signInStatus(email: string, password: string): Promise<number> {
    const client = await new Client(h.app).prime();
    return (await client.post('/api/auth/login', { email, password })).status;
  }

  test('should answer 204, after which the old password fails and the new one works', async () => {
    const token = await resetTokenFor('forgetful@test.example');
    const res = await visitor.post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD });
    assert.equal(res.status, 204, res.text);
    assert.equal(await signInStatus('forgetful@test.example', PASSWORD), 401);
    assert.equal(await signInStatus('forgetful@test.example', NEW_PASSWORD), 200);
  });

  test('should end every session of that user, and no one else\'s', async () => {
    await addUser(h.ds, 'reviewer', 'bystander@test.example');
    const token = await resetTokenFor('signed-in@test.example');
    const phone = await new Client(h.app).signIn('signed-in@test.example', PASSWORD);
    const bystander = await new Client(h.app).signIn('bystander@test.example', PASSWORD);
    await visitor.post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD }).expect(204);
    assertProblem(await phone.get('/api/auth/me'), 401);
    await bystander.get('/api/auth/me').expect(200);
  });

  test('should answer 410 to a second use of the link and keep the password set by the first', async () => {
    const token = await resetTokenFor('twice@test.example');
    await visitor.post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD }).expect(204);
    assertProblem(await visitor.post('/api/auth/password-reset/confirm', { token, password: 'a-third-long-passphrase' }), 410);
    assert.equal(await signInStatus('twice@test.example', NEW_PASSWORD), 200);
  });

  test('should answer 410 to an expired link and keep the old password', async () => {
    const token = await resetTokenFor('slow@test.example');
    await h.ds.getRepository(PasswordReset).update({ tokenHash: hashToken(token) }, { expiresAt: new Date(Date.now() - 1000) });
    assertProblem(await visitor.post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD }), 410);
    assert.equal(await signInStatus('slow@test.example', PASSWORD), 200);
  });

  test('should refuse an unknown token and a too-short password with 400 naming the field, leaving the link usable', async () => {
    assertInvalidFields(await visitor.post('/api/auth/password-reset/confirm', { token: 'B'.repeat(43), password: NEW_PASSWORD }), 'token');
    const token = await resetTokenFor('careful@test.example');
    const before = await rowCounts(h.ds);
    assertInvalidFields(await visitor.post('/api/auth/password-reset/confirm', { token, password: 'short' }), 'password');
    assert.deepEqual(await rowCounts(h.ds), before);
    await visitor.post('/api/auth/password-reset/confirm', { token, password: NEW_PASSWORD }).expect(204);
  });
});
