import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

/** Where screenshots go (ignored by git); look at them. */
export const SCREENSHOTS = path.resolve(path.dirname(fileURLToPath(import.meta.url)), 'screenshots');

/** Debian's Chromium with the flags this machine needs (no network beyond loopback). */
const ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

export interface Browser {
  context: BrowserContext;
  /** Requests the page made to any origin other than the app's. */
  foreignRequests: string[];
  newPage(): Promise<Page>;
  close(): Promise<void>;
}

/** A fresh Chromium profile; `phone` gives a 390×844 touch viewport. */
export async function openBrowser(appUrl: string, opts: { phone?: boolean } = {}): Promise<Browser> {
  mkdirSync(SCREENSHOTS, { recursive: true });
  const profile = mkdtempSync(path.join(tmpdir(), 'hueledger-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium',
    args: ARGS,
    headless: true,
    viewport: opts.phone ? { width: 390, height: 844 } : { width: 1280, height: 800 },
    deviceScaleFactor: opts.phone ? 2 : 1,
    isMobile: opts.phone ?? false,
    hasTouch: opts.phone ?? false,
  });
  const origin = new URL(appUrl).origin;
  const foreignRequests: string[] = [];
  context.on('request', (req) => {
    const u = req.url();
    if (!u.startsWith(origin) && !u.startsWith('data:') && !u.startsWith('blob:')) foreignRequests.push(u);
  });
  return {
    context,
    foreignRequests,
    newPage: () => context.newPage(),
    async close() {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** The demo accounts' password (README.md). */
export const DEMO_PASSWORD = 'demo-pass-2026';

/** Signs in through the sign-in page and waits until the app has left it. */
export async function signIn(page: Page, appUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${appUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}

/** Saves a full-page screenshot under tests/e2e/screenshots/NAME.png. */
export async function screenshot(page: Page, name: string): Promise<string> {
  const file = path.join(SCREENSHOTS, `${name}.png`);
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
