// The reviewers' workflow in the real built app with the invented demo data: the demo reviewer
// sees drift on the drifting accession + character and none on the steady one, compares sites,
// works the review queue (one flag, one re-read request, by keyboard and buttons); the demo
// recorder on a phone sees the bell's count, opens the notice and reaches the reading; the
// re-read mail is in the admin's outbox. Screenshots go to tests/e2e/screenshots/.
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { BrowserContext, Page } from 'playwright-core';
import { DEMO_DRIFT, DEMO_STEADY } from '../../server/demo/demo-readings.js';
import { screenshot, signIn, choose, useApp } from './browser.js';

const app = useApp();

interface Named {
  id: number;
  code?: string;
  accessionNumber?: string;
  label?: string;
}

/** GET as the page's signed-in person. */
function getJson<T>(page: Page, path: string): Promise<T> {
  return page.evaluate((p) => fetch(p).then((r) => r.json()), path) as Promise<T>;
}

/** POST as the page's signed-in person, echoing the CSRF cookie as Angular does. */
function postJson<T>(page: Page, path: string, body: unknown): Promise<{ status: number; body: T }> {
  return page.evaluate(
    async ([p, b]) => {
      const token = decodeURIComponent(/(?:^|; )XSRF-TOKEN=([^;]*)/.exec(document.cookie)?.[1] ?? '');
      const r = await fetch(p as string, { method: 'POST', headers: { 'content-type': 'application/json', 'x-xsrf-token': token }, body: JSON.stringify(b) });
      return { status: r.status, body: await r.json() };
    },
    [path, body] as const,
  ) as Promise<{ status: number; body: T }>;
}

/** The reading id in the review dialog's title. */
async function dialogReadingId(page: Page): Promise<number> {
  const title = page.getByRole('dialog').locator('[mat-dialog-title]');
  await title.getByText(/Review reading \d+/).waitFor();
  return Number(/Review reading (\d+)/.exec(await title.innerText())![1]);
}

describe('drift, the review queue and the recorder’s notice', () => {
  let desk: BrowserContext;
  let phone: BrowserContext;
  let reviewer: Page;
  let recorder: Page;
  let drift: { accessionId: number; characterId: number; characterLabel: string };
  let steady: { accessionId: number; characterId: number };
  let recorderId: number;
  let unreadBefore: number;
  let flaggedId: number;
  let rereadId: number;
  const REREAD_COMMENT = 'Please read it again in open shade, on a freshly exposed surface, with the chip touching it.';

  before(async () => {
    desk = await app.newContext();
    phone = await app.newContext({ phone: true });
    reviewer = await desk.newPage();
    await signIn(reviewer, app.url, 'reviewer@demo.test');
    recorder = await phone.newPage();
    await signIn(recorder, app.url, 'recorder@demo.test');
    const accessions = await getJson<Named[]>(reviewer, '/api/accessions');
    const characters = await getJson<Named[]>(reviewer, '/api/characters');
    const accession = (n: string) => accessions.find((a) => a.accessionNumber === n)!.id;
    const character = (c: string) => characters.find((ch) => ch.code === c)!;
    drift = { accessionId: accession(DEMO_DRIFT.accessionNumber), characterId: character(DEMO_DRIFT.characterCode).id, characterLabel: character(DEMO_DRIFT.characterCode).label! };
    steady = { accessionId: accession(DEMO_STEADY.accessionNumber), characterId: character(DEMO_STEADY.characterCode).id };
    recorderId = (await getJson<{ user: { id: number } }>(recorder, '/api/auth/me')).user.id;
    unreadBefore = (await getJson<{ unread: number }>(recorder, '/api/notifications')).unread;
  });
  after(async () => {
    await desk?.close();
    await phone?.close();
  });

  test('should show drift on the wet/dry comparison of the drifting accession, picked in the page', async () => {
    await reviewer.getByRole('link', { name: 'Drift', exact: true }).click();
    await reviewer.getByText(/Pick an accession and a colour character/).waitFor();
    await choose(reviewer, 'Accession', new RegExp(DEMO_DRIFT.accessionNumber));
    await choose(reviewer, 'Character', drift.characterLabel);
    await reviewer.locator('hl-comparison-list').waitFor();
    const url = new URL(reviewer.url());
    assert.equal(url.searchParams.get('accessionId'), String(drift.accessionId), 'the accession is kept in the URL');
    assert.equal(url.searchParams.get('characterId'), String(drift.characterId), 'the character is kept in the URL');

    const wetDry = reviewer.locator('hl-comparison-list li').filter({ hasText: /Dry \d{4}\s*→\s*Wet \d{4}/ }).first();
    assert.equal(await wetDry.getAttribute('data-state'), 'drift');
    assert.match(await wetDry.innerText(), /Drift/, 'drift is said in a word, not by colour alone');
    assert.match(await wetDry.innerText(), /ΔE00\s+\d+\.\d{2}\s+·\s+p/);
    assert.match(await reviewer.locator('.summary').innerText(), /Drift in \d+ of \d+ comparisons/);
    assert.equal(await reviewer.locator('hl-mean-swatches li').count(), 3, 'one mean swatch per season group');
    assert.match(await reviewer.locator('hl-groups-table').innerText(), /Wet/);

    await screenshot(reviewer, 'drift-desktop');
    // The a*b* plane draws, and its table holds one row per reading of the groups.
    const canvas = reviewer.locator('hl-ab-plane canvas');
    await canvas.waitFor();
    const box = await canvas.boundingBox();
    assert.ok(box && box.height >= 280, `the a*b* plane is at least 280 px tall (${box?.height})`);
    await reviewer.locator('hl-ab-plane').scrollIntoViewIfNeeded();
    await screenshot(reviewer, 'drift-desktop-charts');
    await reviewer.locator('hl-time-charts').scrollIntoViewIfNeeded();
    await screenshot(reviewer, 'drift-desktop-time');
    await reviewer.locator('hl-ab-plane mat-button-toggle', { hasText: 'Table' }).click();
    const answer = await getJson<{ points: unknown[] }>(reviewer, `/api/analysis/drift?accessionId=${drift.accessionId}&characterId=${drift.characterId}`);
    assert.equal(await reviewer.locator('hl-ab-plane table').nth(1).locator('tbody tr').count(), answer.points.length);
  });

  test('should show no drift for the steady accession', async () => {
    await reviewer.goto(`${app.url}/drift?accessionId=${steady.accessionId}&characterId=${steady.characterId}`);
    await reviewer.locator('hl-comparison-list li').first().waitFor();
    assert.equal(await reviewer.locator('hl-comparison-list li[data-state="drift"]').count(), 0);
    assert.ok((await reviewer.locator('hl-comparison-list li[data-state="steady"]').count()) > 0);
    assert.match(await reviewer.locator('.summary').innerText(), /No drift in \d+ comparisons/);
  });

  test('should read drift on a phone, charts stacked and tall enough', async () => {
    await recorder.goto(`${app.url}/drift?accessionId=${drift.accessionId}&characterId=${drift.characterId}`);
    await recorder.locator('hl-time-charts canvas').nth(2).waitFor();
    // A chart sizes its canvas when its box has been laid out, a frame or more after the canvas is
    // there: wait for the sizes to settle (or fail below, on what they are after a minute).
    await recorder
      .waitForFunction(() => {
        const boxes = [...document.querySelectorAll('hl-time-charts canvas')].slice(0, 3).map((c) => c.getBoundingClientRect());
        return boxes.length === 3 && boxes.every((b) => b.height >= 280 && b.width <= 390);
      })
      .catch(() => undefined);
    const boxes = await Promise.all([0, 1, 2].map((i) => recorder.locator('hl-time-charts canvas').nth(i).boundingBox()));
    for (const b of boxes) assert.ok(b && b.height >= 280 && b.width <= 390, 'each time chart fits the phone and is at least 280 px tall');
    assert.ok(boxes[1]!.y > boxes[0]!.y && boxes[2]!.y > boxes[1]!.y, 'the three charts stack vertically');
    await screenshot(recorder, 'drift-phone');
    for (const [part, name] of [['hl-comparison-list', 'drift-phone-comparisons'], ['hl-ab-plane', 'drift-phone-plane'], ['hl-time-charts', 'drift-phone-time']] as const) {
      await recorder.locator(part).scrollIntoViewIfNeeded();
      await screenshot(recorder, name);
    }
    const width = await recorder.evaluate(() => document.documentElement.scrollWidth);
    assert.ok(width <= 390, `nothing pushes the phone's page sideways (${width} px)`);
  });

  test('should compare sites, marking a pair at or above the threshold with a word', async () => {
    // Three readings of the drifting pair at a second site, clearly greener than at the first.
    const sites = await getJson<{ id: number; code: string }[]>(recorder, '/api/sites');
    const accession = await getJson<{ siteId: number }>(recorder, `/api/accessions/${drift.accessionId}`);
    const other = sites.find((s) => s.id !== accession.siteId)!;
    for (const [i, lab] of ([[45, 10, 4], [45.4, 10.3, 4.2], [44.7, 9.8, 3.7]] as const).entries()) {
      const saved = await postJson(recorder, '/api/readings', { accessionId: drift.accessionId, characterId: drift.characterId, siteId: other.id, method: 'instrument', lab, light: 'viewing-booth', observedAt: new Date(Date.now() - (i + 1) * 3_600_000).toISOString() });
      assert.equal(saved.status, 201, JSON.stringify(saved.body));
    }
    await reviewer.getByRole('link', { name: 'Drift', exact: true }).click();
    await reviewer.goto(`${app.url}/drift/sites?accessionId=${drift.accessionId}&characterId=${drift.characterId}`);
    await reviewer.locator('hl-site-matrix-table').waitFor();
    const marked = reviewer.locator('hl-site-matrix-table td.marked');
    assert.ok((await marked.count()) >= 2, 'both cells of the differing pair are marked');
    assert.match(await marked.first().innerText(), /\d+\.\d{2}\s*warning\s*differs|\d+\.\d{2}[\s\S]*differs/);
    assert.match(await reviewer.locator('hl-mean-swatches').innerText(), new RegExp(other.code));
    await screenshot(reviewer, 'drift-sites');
  });

  test('should flag one reading with a reason and ask for a re-read of the next, moving on after each', async () => {
    await reviewer.getByRole('link', { name: 'Review', exact: true }).click();
    await reviewer.waitForURL((u) => u.pathname === '/review');
    await reviewer.goto(`${app.url}/review?observerId=${recorderId}`);
    await reviewer.getByRole('button', { name: /^Review reading \d+/ }).first().click();
    const dialog = reviewer.getByRole('dialog');
    flaggedId = await dialogReadingId(reviewer);
    await dialog.locator('hl-reading-match').waitFor();
    assert.match(await dialog.innerText(), /Observer[\s\S]*Juno Pellbright/);
    assert.match(await dialog.locator('mat-dialog-actions').innerText(), /Approve\s*A[\s\S]*Flag\s*F[\s\S]*Ask for a re-read\s*R/, 'the shortcuts are shown');
    await screenshot(reviewer, 'review-dialog');

    // F opens the reason; it is required.
    await reviewer.keyboard.press('f');
    const reason = dialog.getByLabel('Why flag it?');
    await reason.waitFor();
    await dialog.getByRole('button', { name: 'Flag reading' }).click();
    await dialog.getByText('Say what is wrong: the recorder needs it.').waitFor();
    await reason.fill('The colour is far from this plant’s other readings; was the tissue still wet?');
    await dialog.getByRole('button', { name: 'Flag reading' }).click();
    await dialog.getByText(`Reading ${flaggedId} flagged; the recorder was e-mailed.`).waitFor();

    rereadId = await dialogReadingId(reviewer);
    assert.notEqual(rereadId, flaggedId, 'the next reading opened');
    await dialog.getByRole('button', { name: /Ask for a re-read/ }).click();
    await dialog.getByLabel('What should be read again, and how?').fill(REREAD_COMMENT);
    await screenshot(reviewer, 'review-dialog-reread');
    await dialog.getByRole('button', { name: 'Ask for a re-read' }).click();
    await dialog.getByText(`Reading ${rereadId} sent back for a re-read; the recorder was e-mailed.`).waitFor();
    await dialog.getByRole('button', { name: 'Close' }).click();
    await dialog.waitFor({ state: 'hidden' });

    const statuses = await Promise.all([flaggedId, rereadId].map((id) => getJson<{ status: string }>(reviewer, `/api/readings/${id}`)));
    assert.deepEqual(statuses.map((s) => s.status), ['flagged', 'reread-requested']);
    assert.equal(await reviewer.getByRole('button', { name: `Review reading ${flaggedId}` }).count(), 0, 'the decided reading left the queue');
  });

  test('should show the recorder the bell count on a phone and lead from the notice to the reading', async () => {
    await recorder.goto(`${app.url}/readings`);
    const bell = recorder.locator('mat-toolbar hl-notification-bell a');
    const expected = `Notifications: ${unreadBefore + 2} unread`;
    await recorder.waitForFunction((e) => document.querySelector('mat-toolbar hl-notification-bell a')?.getAttribute('aria-label') === e, expected);
    assert.match(await bell.innerText(), new RegExp(`${unreadBefore + 2}`));
    await bell.click();
    await recorder.waitForURL((u) => u.pathname === '/notifications');
    const notice = recorder.locator('li').filter({ hasText: `reading ${rereadId}` });
    await notice.waitFor();
    assert.match(await notice.innerText(), /Re-read asked for/);
    assert.match(await notice.innerText(), /unread/);
    assert.ok((await notice.innerText()).includes(REREAD_COMMENT), 'the reviewer’s words reach the recorder');
    await screenshot(recorder, 'notifications-phone');
    await notice.getByRole('link', { name: `Open reading ${rereadId}` }).click();
    await recorder.waitForURL((u) => u.pathname === `/readings/${rereadId}`);
    await recorder.getByRole('link', { name: /Correct this reading/ }).waitFor();
    // The reviewer's words head the reading, above its actions, not inside a history line.
    const note = recorder.getByTestId('review-comment');
    await note.waitFor();
    assert.ok((await note.innerText()).includes(REREAD_COMMENT), await note.innerText());
    assert.ok(await note.evaluate((el) => Boolean(el.compareDocumentPosition(document.querySelector('.actions')!) & Node.DOCUMENT_POSITION_FOLLOWING)), 'the note comes before the actions');
    await recorder.waitForFunction((e) => document.querySelector('mat-toolbar hl-notification-bell a')?.getAttribute('aria-label') === e, `Notifications: ${unreadBefore + 1} unread`);
  });

  test('should put the re-read mail, with its link to the reading, in the admin’s outbox', async () => {
    const admin = await app.newContext();
    try {
      const page = await admin.newPage();
      await signIn(page, app.url, 'admin@demo.test');
      await page.goto(`${app.url}/admin/outbox`);
      await page.getByRole('button', { name: /Please read again/ }).first().click();
      const article = page.locator('article');
      await article.getByText(REREAD_COMMENT).waitFor();
      assert.ok(await article.locator(`a[href$="/readings/${rereadId}"]`).count(), 'the mail links to the reading');
      const outbox = await getJson<{ to: string[] | string; subject: string }[]>(page, '/api/outbox');
      assert.ok(outbox.some((m) => /A reading of yours was flagged/.test(m.subject) && String(m.to).includes('recorder@demo.test')), 'the flag was mailed too');
    } finally {
      await admin.close();
    }
  });
});
