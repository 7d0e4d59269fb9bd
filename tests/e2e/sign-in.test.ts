import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { Role } from '../../shared/api/roles.js';
import type { BrowserContext } from 'playwright-core';
import { DEMO_PASSWORD, screenshot, signIn, useApp } from './browser.js';

const app = useApp();

/** What each role must and must not see in the side navigation (this sections). */
const EXPECTED_NAV: Record<Role, { shows: string[]; hides: string[] }> = {
  admin: { shows: ['Collection', 'Users', 'Outbox', 'BrAPI tokens', 'Audit', 'Account'], hides: [] },
  trainer: { shows: ['Collection', 'Account'], hides: ['Users', 'Outbox', 'BrAPI tokens', 'Audit'] },
  reviewer: { shows: ['Collection', 'Account'], hides: ['Users', 'Outbox', 'BrAPI tokens', 'Audit'] },
  recorder: { shows: ['Collection', 'Account'], hides: ['Users', 'Outbox', 'BrAPI tokens', 'Audit'] },
};

/** Where each role lands after signing in, and the heading it sees there. */
const LANDING = {
  admin: { path: '/collection', heading: 'Collection' },
  trainer: { path: '/calibration', heading: 'Calibration' },
  reviewer: { path: '/review', heading: 'Review' },
  recorder: { path: '/record', heading: 'New reading' },
} as const;

describe('signing in as each demo role in Chromium', () => {
  let browser: BrowserContext;

  before(async () => {
    browser = await app.newContext();
  });
  after(async () => {
    await browser?.close();
  });

  for (const role of ['admin', 'trainer', 'reviewer', 'recorder'] as const) {
    test(`should show the ${role} their own navigation, name and role, then sign out`, async () => {
      const page = await browser.newPage();
      await signIn(page, app.url, `${role}@demo.test`, DEMO_PASSWORD);
      // Each role starts on its own section.
      await page.waitForURL((u) => u.pathname === LANDING[role].path);
      await page.getByRole('heading', { name: LANDING[role].heading, exact: true }).waitFor();
      await page.locator('mat-toolbar', { hasText: role }).waitFor();
      if (role !== 'admin') await page.goto(`${app.url}/collection`);
      // After a full page load the shell draws its navigation once the session is known: wait for
      // the collection's first row, then read the links.
      await page.getByRole('tab', { name: /Accessions/ }).waitFor();
      await page.locator('text=HL-0001').first().waitFor();
      await page.locator('mat-sidenav a', { hasText: 'Collection' }).waitFor();
      const nav = (await page.locator('mat-sidenav a').allInnerTexts()).join(' | ');
      for (const label of EXPECTED_NAV[role].shows) assert.match(nav, new RegExp(`\\b${label}\\b`), `${role} should see ${label}`);
      for (const label of EXPECTED_NAV[role].hides) assert.doesNotMatch(nav, new RegExp(`\\b${label}\\b`), `${role} should not see ${label}`);
      await screenshot(page, `sign-in-${role}-desktop`);

      await page.getByRole('button', { name: 'Account menu' }).click();
      await page.getByRole('menuitem', { name: 'Sign out' }).click();
      await page.waitForURL((u) => u.pathname.startsWith('/sign-in'));
      const me = await page.evaluate(() => fetch('/api/auth/me').then((r) => r.status));
      assert.equal(me, 401);
      await page.close();
    });
  }

  test('should refuse a wrong password with a readable message', async () => {
    const page = await browser.newPage();
    await page.goto(`${app.url}/sign-in`);
    await page.getByLabel('E-mail').fill('recorder@demo.test');
    await page.getByLabel('Password', { exact: true }).fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('alert').waitFor();
    assert.match(await page.getByRole('alert').innerText(), /do not match|not right/i);
    assert.ok(new URL(page.url()).pathname.startsWith('/sign-in'));
    await page.close();
  });

  test('should send a recorder away from the admin pages', async () => {
    const page = await browser.newPage();
    await signIn(page, app.url, 'recorder@demo.test', DEMO_PASSWORD);
    await page.goto(`${app.url}/admin/users`);
    await page.getByRole('heading', { name: 'New reading' }).waitFor();
    assert.ok(!new URL(page.url()).pathname.startsWith('/admin'));
    await page.close();
  });

  test('should load nothing from another origin', () => {
    assert.deepEqual(app.foreignRequests, []);
  });
});

describe('a recorder on a phone', () => {
  let browser: BrowserContext;

  before(async () => {
    browser = await app.newContext({ phone: true, motion: true });
  });
  after(async () => {
    await browser?.close();
  });

  test('should find the navigation behind the menu button', async () => {
    const page = await browser.newPage();
    await page.goto(`${app.url}/sign-in`);
    // The page is drawn after it has loaded: photograph the form, not the blank page before it.
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    await screenshot(page, 'sign-in-phone');
    await signIn(page, app.url, 'recorder@demo.test', DEMO_PASSWORD);
    await page.waitForURL((u) => u.pathname === '/record');
    await page.getByRole('heading', { name: 'New reading' }).waitFor();
    await page.goto(`${app.url}/collection`);
    await page.getByRole('heading', { name: 'Collection' }).waitFor();
    await page.locator('text=HL-0001').first().waitFor();
    await screenshot(page, 'collection-recorder-phone');
    const drawer = page.locator('mat-sidenav');
    assert.equal(await drawer.isVisible(), false, 'the drawer starts closed on a phone');
    await page.getByRole('button', { name: 'Open navigation' }).click();
    await drawer.getByText('Collection').waitFor({ state: 'visible' });
    const box = await drawer.locator('a').first().boundingBox();
    assert.ok(box && box.height >= 48, `navigation targets are at least 48 px high (got ${box?.height})`);
    await screenshot(page, 'navigation-recorder-phone');
    await page.close();
  });

  test('should load nothing from another origin', () => {
    assert.deepEqual(app.foreignRequests, []);
  });
});
