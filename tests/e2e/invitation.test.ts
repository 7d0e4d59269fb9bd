import assert from 'node:assert/strict';
import { after, before, test } from 'node:test';
import type { BrowserContext } from 'playwright-core';
import { openDialog, screenshot, signIn, useApp } from './browser.js';

const app = useApp();
let browser: BrowserContext;

before(async () => {
  browser = await app.newContext({ motion: true });
});
after(async () => {
  await browser?.close();
});

test('should let an admin invite a trainer who follows the mailed link, sets a password and is signed in', async () => {
  const admin = await browser.newPage();
  await signIn(admin, app.url, 'admin@demo.test');

  await admin.goto(`${app.url}/admin/users`);
  await admin.getByRole('button', { name: /Invite/ }).click();
  const dialog = await openDialog(admin);
  await dialog.getByLabel('E-mail').fill('new.trainer@demo.test');
  await dialog.getByLabel('Name').fill('Tamsin Ashgrove');
  await dialog.getByRole('combobox', { name: 'Role' }).click();
  await admin.getByRole('option', { name: /^trainer/ }).click();
  await screenshot(admin, 'invite-dialog');
  await dialog.getByRole('button', { name: 'Send invitation' }).click();
  await dialog.waitFor({ state: 'hidden' });
  await admin.getByText('new.trainer@demo.test').first().waitFor();

  await admin.goto(`${app.url}/admin/outbox`);
  await admin.getByRole('button', { name: /You are invited to Hueledger/ }).first().click();
  const link = admin.locator('article a[href*="/invitation/"]');
  await link.waitFor();
  await screenshot(admin, 'outbox-invitation');
  const href = await link.getAttribute('href');
  assert.ok(href, 'the mail carries an invitation link');
  await admin.close();

  const invitee = await browser.newPage();
  await invitee.context().clearCookies();
  await invitee.goto(href);
  await invitee.getByText('Tamsin Ashgrove').waitFor();
  assert.match(await invitee.locator('dl').innerText(), /trainer/);
  await invitee.getByLabel('Choose a password').fill('a-long-trainer-passphrase');
  await invitee.getByLabel('Repeat it').fill('a-long-trainer-passphrase');
  await screenshot(invitee, 'invitation-accept');
  await invitee.getByRole('button', { name: 'Accept and sign in' }).click();
  // A trainer starts on Calibration.
  await invitee.waitForURL((u) => u.pathname.startsWith('/calibration'));
  // The toolbar names the new person once their account has loaded: wait for that, then read it.
  await invitee.locator('mat-toolbar', { hasText: 'trainer' }).waitFor();
  const me = (await invitee.evaluate(() => fetch('/api/auth/me').then((r) => r.json()))) as { user: { email: string; role: string } };
  assert.deepEqual([me.user.email, me.user.role], ['new.trainer@demo.test', 'trainer']);

  // The link works once.
  await invitee.context().clearCookies();
  await invitee.goto(href);
  await invitee.getByRole('alert').filter({ hasText: /already (been used|accepted)/i }).waitFor();
  await invitee.close();
  assert.deepEqual(app.foreignRequests, []);
});
