// The one browser fixture of the browser tests: `useApp()` starts the real built app once per test
// file (its own data folder, the demo scenario) and one Chromium for that file; each group of tests
// takes its own context (cookies, storage, desk or phone window) from it. The helpers below wait
// for what a person would see — a route, an option gone, a field's value — never for a fixed time.
import assert from 'node:assert/strict';
import { mkdirSync } from 'node:fs';
import { after, before } from 'node:test';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type Browser as Chromium, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { startServer, type ServerProcess } from './server-process.js';

/** Where screenshots go (ignored by git); look at them. */
export const SCREENSHOTS = path.resolve(path.dirname(fileURLToPath(import.meta.url)), 'screenshots');

/** Debian's Chromium with the flags this machine needs (no network beyond loopback). */
const ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'];

/**
 * How long a wait may last before it fails. Generous on purpose: a loaded two-core machine may take
 * many seconds to answer, and a passing test does not wait any longer for it.
 */
const WAIT_MS = 60_000;

/** The phone window every phone test uses (a common 6.1-inch phone in CSS pixels). */
export const PHONE = { width: 390, height: 844 } as const;

/** What kind of window a context has. */
export interface WindowOptions {
  /** A 390×844 touch window at 2× instead of a 1280×800 desk window. */
  phone?: boolean;
  /** The browser's language (BCP 47, e.g. `en-GB`), for tests of how dates read; Chromium's own otherwise. */
  locale?: string;
  /**
   * Whether the page plays its animations. Off by default: the context asks for reduced motion, as a
   * person may in their system settings, and Angular Material then opens dialogs, selects and the
   * drawer at once instead of over 150–300 ms each, hundreds of times a run. The files that type
   * into dialogs or open the phone's drawer keep one test with motion on.
   */
  motion?: boolean;
  /**
   * Whether the app's service worker may install. Off by default: on install it fetches and hashes
   * the whole app (about 4 MB), in every context, which only the offline tests need.
   */
  serviceWorker?: boolean;
}

/** The app under test and the browser that drives it, shared by every test of one file. */
export interface App {
  /** The app's origin, e.g. `http://localhost:41234`. */
  readonly url: string;
  /** The server process (its output and data folder). */
  readonly server: ServerProcess;
  /** Requests any page made to an origin other than the app's. */
  readonly foreignRequests: string[];
  /** Resolves once the app and Chromium have started (the file's before() hook). */
  ready(): Promise<void>;
  /** A fresh context (its own cookies and storage). */
  newContext(opts?: WindowOptions): Promise<BrowserContext>;
  /** A page in a fresh context. */
  newPage(opts?: WindowOptions): Promise<Page>;
}

let chromiumPromise: Promise<Chromium> | undefined;

/** The file's one Chromium, launched on first use. */
function launchChromium(): Promise<Chromium> {
  mkdirSync(SCREENSHOTS, { recursive: true });
  chromiumPromise ??= chromium.launch({ executablePath: process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium', args: ARGS, headless: true });
  return chromiumPromise;
}

/** A new context on the file's Chromium, recording requests that leave `origin`. */
async function openContext(origin: string, foreign: string[], opts: WindowOptions = {}): Promise<BrowserContext> {
  const context = await (await launchChromium()).newContext({
    viewport: opts.phone ? PHONE : { width: 1280, height: 800 },
    deviceScaleFactor: opts.phone ? 2 : 1,
    isMobile: opts.phone ?? false,
    hasTouch: opts.phone ?? false,
    acceptDownloads: true,
    reducedMotion: opts.motion ? 'no-preference' : 'reduce',
    serviceWorkers: opts.serviceWorker ? 'allow' : 'block',
    ...(opts.locale ? { locale: opts.locale } : {}),
  });
  context.setDefaultTimeout(WAIT_MS);
  context.on('request', (req) => {
    const u = req.url();
    if (!u.startsWith(origin) && !u.startsWith('data:') && !u.startsWith('blob:')) foreign.push(u);
  });
  return context;
}

/**
 * Starts the built app (demo scenario, own data folder) and Chromium before the file's first test,
 * and stops both after its last. Call once, at the top level of a test file.
 */
export function useApp(env: Record<string, string> = {}): App {
  let server: ServerProcess | undefined;
  const foreignRequests: string[] = [];
  const contexts: BrowserContext[] = [];
  const started = () => {
    assert.ok(server, 'useApp(): the app starts in the file’s before() hook; await app.ready() first');
    return server;
  };
  // Node 20 runs a file's top-level before() hooks side by side, not one after another: a file's
  // own top-level hook therefore awaits `ready` (newContext and newPage do) instead of its order.
  let markReady: (ok: boolean) => void = () => undefined;
  const ready = new Promise<boolean>((resolve) => (markReady = resolve));
  before(async () => {
    try {
      [server] = await Promise.all([startServer(env), launchChromium()]);
    } finally {
      markReady(server !== undefined);
    }
  });
  after(async () => {
    await Promise.all(contexts.map((c) => c.close().catch(() => undefined)));
    if (chromiumPromise) await (await chromiumPromise).close();
    chromiumPromise = undefined;
    await server?.stop();
  });
  const app: App = {
    get url() {
      return started().url;
    },
    get server() {
      return started();
    },
    foreignRequests,
    async ready() {
      assert.ok(await ready, 'the app started');
    },
    async newContext(opts) {
      await app.ready();
      const context = await openContext(new URL(started().url).origin, foreignRequests, opts);
      contexts.push(context);
      return context;
    },
    async newPage(opts) {
      return (await app.newContext(opts)).newPage();
    },
  };
  return app;
}

/** The demo accounts' password (printed in the README). */
export const DEMO_PASSWORD = 'demo-pass-2026';

/** Signs in through the sign-in page and waits until the app has left it. */
export async function signIn(page: Page, appUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${appUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
  // The shell is there once its navigation is: the first screen has finished starting.
  await page.locator('mat-sidenav').waitFor({ state: 'attached' });
}

/**
 * Follows a navigation entry, opening the drawer first on a phone, and waits until the app is on
 * that entry's route — not for a heading or tab that another screen may also show.
 */
export async function navigateTo(page: Page, label: string): Promise<void> {
  const link = page.locator('mat-sidenav').getByRole('link', { name: label, exact: true });
  const opener = page.getByRole('button', { name: 'Open navigation' });
  try {
    // Wait for the shell as a person would: on a phone the menu button (the closed drawer holds no
    // entries until it opens), on a desk the entry itself. Deciding before the toolbar was drawn
    // left the drawer shut and the entry never came.
    await opener.or(link).first().waitFor();
    if ((await opener.isVisible()) && !(await link.isVisible())) await opener.click();
    await link.waitFor();
  } catch (e) {
    const shown = await page.evaluate(() => document.body.innerText.slice(0, 300)).catch(() => '(no page)');
    await screenshot(page, `navigate-to-${label.toLowerCase().replace(/\W+/g, '-')}-failed`).catch(() => undefined);
    throw new Error(`no navigation entry "${label}" on ${page.url()}; the page shows: ${shown}`, { cause: e });
  }
  const href = await link.getAttribute('href');
  assert.ok(href, `the navigation entry ${label} has a link`);
  const target = new URL(href, page.url()).pathname;
  await link.click();
  // A section may redirect to its first page (/reference-set → /reference-set/match).
  await page.waitForURL((u) => u.pathname === target || u.pathname.startsWith(`${target}/`));
}

/**
 * The open dialog, once it is ready to type into: Material moves the focus into a dialog (to its
 * first field) when the opening animation ends, so text typed before that can land in that field
 * instead of the one meant. Waits, as a person's eye does, for the cursor to settle in the dialog.
 */
export async function openDialog(page: Page): Promise<Locator> {
  const dialog = page.getByRole('dialog');
  await dialog.waitFor();
  await page.waitForFunction(() => Boolean(document.activeElement?.closest('mat-dialog-container')));
  return dialog;
}

/** Chooses an option of a Material select by its label and the option's text, and waits for the list to close. */
export async function choose(page: Page, label: string, option: string | RegExp): Promise<void> {
  const box = page.getByRole('combobox', { name: label });
  const list = page.getByRole('listbox');
  // A Material select does not open while it has no options, and its options may still be on their
  // way from the server: as a person would, tap again until the list opens (within a minute).
  const deadline = Date.now() + 60_000;
  for (;;) {
    await box.click();
    try {
      await list.waitFor({ timeout: 2_000 });
      break;
    } catch (e) {
      if (Date.now() > deadline) throw e;
    }
  }
  await page.getByRole('option', { name: option }).first().click();
  await list.waitFor({ state: 'detached' });
}

/**
 * Waits until a field shows `expected`: the app redraws after an event in its own time (zoneless
 * change detection), so a value read at once after a click may still be the old one.
 */
export async function waitForValue(field: Locator, expected: string | RegExp): Promise<void> {
  const element = await field.elementHandle();
  const wanted = typeof expected === 'string' ? { exact: expected } : { source: expected.source, flags: expected.flags };
  const shown = await field
    .page()
    .waitForFunction(
      ([el, w]) => {
        const value = (el as HTMLInputElement).value;
        return 'exact' in w ? value === w.exact : new RegExp(w.source, w.flags).test(value);
      },
      [element, wanted] as const,
    )
    .then(() => true)
    .catch(() => false);
  if (shown) return;
  if (typeof expected === 'string') assert.equal(await field.inputValue(), expected, 'the field shows the expected value');
  else assert.match(await field.inputValue(), expected, 'the field shows the expected value');
}

/** Saves a full-page screenshot under tests/e2e/screenshots/NAME.png. */
export async function screenshot(page: Page, name: string): Promise<string> {
  const file = path.join(SCREENSHOTS, `${name}.png`);
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
  await page.screenshot({ path: file, fullPage: true });
  return file;
}
