import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { SIGN_IN_LIMIT } from '../../server/auth/auth.routes.js';
import { assertProblem } from './assert-problem.js';
import { addUser, Client, PASSWORD, startHarness, type Harness } from './harness.js';

describe('sign-in and reset rate limits', () => {
  let h: Harness;

  before(async () => {
    h = await startHarness();
    for (const name of ['target', 'neighbour', 'spaced']) await addUser(h.ds, 'recorder', `${name}@test.example`);
  });
  after(() => h.close());

  async function attempt(email: string, password: string) {
    const client = await new Client(h.app).prime();
    return { client, res: await client.post('/api/auth/login', { email, password }) };
  }

  test(`should answer the ${SIGN_IN_LIMIT + 1}th sign-in after ${SIGN_IN_LIMIT} failures with 429 problem+json, even with the right password`, async () => {
    assert.equal(SIGN_IN_LIMIT, 10, 'the limit the product promises');
    // Sent together: the limiter counts each request as it arrives, and scrypt runs on the thread pool.
    const failures = await Promise.all(Array.from({ length: SIGN_IN_LIMIT }, (_, i) => attempt('target@test.example', `wrong-password-${i}`)));
    for (const [i, { res }] of failures.entries()) assert.equal(res.status, 401, `attempt ${i + 1} is an ordinary refusal`);
    const { client, res } = await attempt('target@test.example', PASSWORD);
    assertProblem(res, 429);
    assert.ok(Number(res.headers['retry-after']) > 0, `Retry-After says how long to wait: ${res.headers['retry-after']}`);
    assertProblem(await client.get('/api/auth/me'), 401);
  });

  test('should still let another account sign in from the same address', async () => {
    const { res } = await attempt('neighbour@test.example', PASSWORD);
    assert.equal(res.status, 200, res.text);
  });

  test('should count failures for one account whatever the case and spacing of its e-mail', async () => {
    const variants = ['spaced@test.example', ' spaced@test.example', 'spaced@test.example ', 'SPACED@test.example', '  Spaced@Test.Example', 'spaced@TEST.example  ', '\tspaced@test.example', 'spaced@test.example\t', '   spaced@test.example   ', 'Spaced@test.example '];
    assert.equal(variants.length, SIGN_IN_LIMIT);
    const failures = await Promise.all(variants.map((email) => attempt(email, 'wrong-password')));
    for (const [i, { res }] of failures.entries()) assert.equal(res.status, 401, `${JSON.stringify(variants[i])} is an ordinary refusal`);
    assertProblem((await attempt('    spaced@test.example', PASSWORD)).res, 429);
  });

  test('should answer the 6th reset request from one address within the window with 429 problem+json', async () => {
    const client = await new Client(h.app).prime();
    for (let i = 0; i < 5; i++) {
      const res = await client.post('/api/auth/password-reset', { email: `nobody-${i}@test.example` });
      assert.equal(res.status, 202, `request ${i + 1}: ${res.text}`);
    }
    assertProblem(await client.post('/api/auth/password-reset', { email: 'target@test.example' }), 429);
  });
});
