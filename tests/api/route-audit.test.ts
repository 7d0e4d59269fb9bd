// The route audit, by enumeration of what the app really mounts: which routes are open to
// everybody (only health, sign-in and sign-out, and the token links of invitations and password
// resets), and that every state-changing route refuses a request without the CSRF header.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { listApiRoutes } from './api-routes.js';
import { assertProblem } from './assert-problem.js';
import { rowCounts, signedInAs, startHarness, type Client, type Harness } from './harness.js';

/** The only routes anybody may call without signing in, and why each must be. */
const PUBLIC_ROUTES = [
  'GET /api/health', // hands out the CSRF cookie; load balancers poll it
  'POST /api/auth/login',
  'POST /api/auth/logout', // a client whose session has lapsed can still sign out cleanly
  'POST /api/auth/password-reset', // asking for a reset link: the person cannot sign in
  'POST /api/auth/password-reset/confirm', // the token in the mailed link is the credential
  'GET /api/invitations/:token',
  'POST /api/invitations/accept',
].sort();

const key = (r: { method: string; path: string }) => `${r.method} ${r.path}`;

describe('route audit', () => {
  let h: Harness;
  let admin: Client;

  before(async () => {
    h = await startHarness({ demo: true });
    admin = await signedInAs(h, 'admin');
  });
  after(() => h.close());

  test('every API route carries exactly one explicit access rule', () => {
    for (const r of listApiRoutes(h.app)) assert.equal(r.rules.length, 1, `${key(r)} has ${r.rules.length} access rules`);
  });

  test('only health, sign-in, sign-out and the mailed-token routes are public', () => {
    const open = listApiRoutes(h.app).filter((r) => r.rules[0]?.public).map(key).sort();
    assert.deepEqual(open, PUBLIC_ROUTES);
  });

  test('every state-changing route refuses a request without the CSRF header with 403, changing nothing', async () => {
    const changing = listApiRoutes(h.app).filter((r) => !['GET', 'HEAD', 'OPTIONS'].includes(r.method));
    assert.ok(changing.length >= 10, `only ${changing.length} state-changing routes found`);
    for (const r of changing) {
      const url = r.path.replace(/:[A-Za-z]+/g, '1');
      const before = JSON.stringify(await rowCounts(h.ds));
      const method = r.method.toLowerCase() as 'post' | 'patch' | 'put' | 'delete';
      // The session cookie and the XSRF cookie are sent; only the header that proves same-origin script is missing.
      const res = await admin.agent[method](url).send({});
      assertProblem(res, 403);
      assert.equal(JSON.stringify(await rowCounts(h.ds)), before, `${key(r)} changed rows`);
    }
  });
});
