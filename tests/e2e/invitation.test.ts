import assert from 'node:assert/strict';
import { after, before, test } from 'node:test';
import { openBrowser, screenshot, signIn, type Browser } from './browser.js';
import { startServer, type ServerProcess } from './server-process.js';

let server: ServerProcess;
let browser: Browser;

before(async () => {
  server = await startServer();
  browser = await openBrowser(server.url);
});
after(async () => {
  await browser?.close();
  await server?.stop();
});

test('should let an admin invite a trainer who follows the mailed link, sets a password and is signed in', async () => {
  const admin = await browser.newPage();
  await signIn(admin, server.url, 'admin@demo.test');

  await admin.goto(`${server.url}/admin/users`);
  await admin.getByRole('button', { name: /Invite/ }).click();
  const dialog = admin.getByRole('dialog');
  await dialog.getByLabel('E-mail').fill('new.trainer@demo.test');
  await dialog.getByLabel('Name').fill('Tamsin Ashgrove');
  await dialog.getByRole('combobox', { name: 'Role' }).click();
  await admin.getByRole('option', { name: /^trainer/ }).click();
  await screenshot(admin, 'invite-dialog');
  await dialog.getByRole('button', { name: 'Send invitation' }).click();
  await dialog.waitFor({ state: 'hidden' });
  await admin.getByText('new.trainer@demo.test').first().waitFor();

  await admin.goto(`${server.url}/admin/outbox`);
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
  await invitee.waitForURL((u) => u.pathname.startsWith('/collection'));
  assert.match(await invitee.locator('mat-toolbar').innerText(), /trainer/);
  const me = (await invitee.evaluate(() => fetch('/api/auth/me').then((r) => r.json()))) as { user: { email: string; role: string } };
  assert.deepEqual([me.user.email, me.user.role], ['new.trainer@demo.test', 'trainer']);

  // The link works once.
  await invitee.context().clearCookies();
  await invitee.goto(href);
  await invitee.getByRole('alert').waitFor();
  assert.match(await invitee.getByRole('alert').innerText(), /already (been used|accepted)/i);
  await invitee.close();
  assert.deepEqual(browser.foreignRequests, []);
});
