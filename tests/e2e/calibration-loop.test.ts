// What a trainer and an observer see after a calibration session, in Chromium with the demo data
// (issue 17): κ with its interval and the small-sample warning, what to tell each observer (the
// demo observer with every field chip right and a high mean ΔE00 is told why both hold), each
// observer's pick per specimen; the Certificates tab with current, lapsed and never-certified
// observers and a certificate PDF; an invitation that reaches the observer's notices; and the
// specimen form that empties without a red error after a specimen is added.
import assert from 'node:assert/strict';
import { before, describe, test } from 'node:test';
import type { Page } from 'playwright-core';
import { screenshot, signIn, useApp } from './browser.js';

const app = useApp();

interface SessionRow {
  id: number;
  title: string;
  status: string;
}

function getJson<T>(page: Page, path: string): Promise<T> {
  return page.evaluate((p) => fetch(p).then((r) => r.json()), path) as Promise<T>;
}

describe('calibration results people can act on', () => {
  let trainer: Page;
  let recorder: Page;
  let closed: SessionRow;
  let open: SessionRow;

  before(async () => {
    trainer = await app.newPage();
    await signIn(trainer, app.url, 'trainer@demo.test');
    const sessions = await getJson<SessionRow[]>(trainer, '/api/calibration/sessions');
    closed = sessions.find((s) => s.status === 'closed')!;
    open = sessions.find((s) => s.status === 'open')!;
    recorder = await app.newPage({ phone: true });
    await signIn(recorder, app.url, 'recorder@demo.test');
  });

  test("should show κ's interval, the small-sample warning, what to tell each observer, and each observer's pick", async () => {
    await trainer.goto(`${app.url}/calibration/sessions/${closed.id}`);
    const interval = trainer.locator('[data-testid="kappa-interval"]');
    await interval.waitFor();
    assert.match(await interval.innerText(), /^95 % interval of κ: −?\d\.\d{2} to −?\d\.\d{2} \(percentile bootstrap over specimens, 2000 resamples/);
    assert.match(await trainer.locator('[data-testid="sample-warning"]').first().innerText(), /Sample too small to judge: κ rests on 5 specimens/);
    const tamsin = trainer.locator('[data-testid="observer-advice"] li', { hasText: 'Tamsin Orrowby' });
    const advice = await tamsin.innerText();
    assert.match(advice, /Certified: no, because mean ΔE00 \d\.\d{2} is above the limit 1\.8/);
    assert.match(advice, /picked the reference's field chip on 100 % of specimens, but the chips they picked sit on average \d\.\d{2} ΔE00 from the references \(limit 1\.8\): a field chip is a coarse cell, so practise choosing the nearest fine chip within it/);
    const firstSpecimen = trainer.locator('table.specimens tbody tr').first();
    const picks = await firstSpecimen.locator('.pick').allInnerTexts();
    assert.equal(picks.length, 4, 'one pick per observer');
    assert.ok(picks.some((p) => /Tamsin Orrowby\s+ΔE00 \d\.\d{2}/.test(p)), picks.join(' | '));
    assert.ok(picks.every((p) => /F-\d{3}(\.\d{3})?/.test(p)));
    await tamsin.scrollIntoViewIfNeeded();
    await screenshot(trainer, 'calibration-loop-advice-desktop');
  });

  test('should show current, lapsed and never-certified observers on the Certificates tab, with a certificate PDF', async () => {
    await trainer.goto(`${app.url}/calibration/records`);
    const counts = trainer.locator('[data-testid="standing-counts"]');
    await counts.waitFor();
    assert.match(await counts.innerText(), /\d+ current, \d+ lapsed, \d+ never certified\./);
    const standings = trainer.locator('table.standings tbody tr');
    const texts = await standings.allInnerTexts();
    // The demo session closed on 2025-11-14: twelve months on, those certificates have lapsed by time.
    const today = new Date().toISOString().slice(0, 10);
    // Dates show in the browser's own style (formatDateTime): the same formatter writes the expected days.
    const [validUntil, lapsedOn] = await trainer.evaluate(() => [new Date(2026, 10, 14, 12), new Date(2026, 10, 15, 12)].map((d) => new Intl.DateTimeFormat(navigator.languages?.[0] ?? navigator.language, { year: 'numeric', month: 'short', day: 'numeric' }).format(d)));
    const expected = today > '2026-11-14' ? new RegExp(`lapsed[\\s\\S]*lapsed on ${lapsedOn}: 12 months passed since it was earned: calibrate again`) : new RegExp(`current[\\s\\S]*valid until ${validUntil}`);
    const juno = texts.find((t) => t.includes('Juno Pellbright')) ?? '';
    assert.match(juno, expected);
    const trainerName = ((await getJson<{ user: { name: string } }>(trainer, '/api/auth/me')).user.name);
    assert.match(texts.find((t) => t.includes(trainerName)) ?? '', /never certified/, 'the trainer took no session');
    const href = await standings.locator('a', { hasText: 'PDF' }).first().getAttribute('href');
    assert.ok(href);
    const pdf = await trainer.evaluate(async (u) => {
      const r = await fetch(u);
      return { type: r.headers.get('content-type'), start: new TextDecoder().decode((await r.arrayBuffer()).slice(0, 5)) };
    }, href);
    assert.deepEqual(pdf, { type: 'application/pdf', start: '%PDF-' });
    await screenshot(trainer, 'calibration-loop-certificates-desktop');
  });

  test('should empty the specimen form without a red error after a specimen is added', async () => {
    await trainer.goto(`${app.url}/calibration/sessions/${open.id}`);
    await trainer.getByText('Add a specimen').click();
    const form = trainer.locator('hl-specimen-form');
    await form.getByLabel('Specimen label').fill('4 — corm flesh, upper, cream');
    await form.getByLabel('L*', { exact: true }).fill('84');
    await form.getByLabel('a*', { exact: true }).fill('1');
    await form.getByLabel('b*', { exact: true }).fill('14');
    await form.getByRole('button', { name: 'Add specimen' }).click();
    await trainer.locator('ol.specimens li', { hasText: '4 — corm flesh, upper, cream' }).waitFor();
    assert.equal(await form.getByLabel('Specimen label').inputValue(), '');
    assert.equal(await form.locator('mat-error').count(), 0, 'no error shows on the emptied form');
    assert.equal(await form.locator('.mat-form-field-invalid').count(), 0, 'no field is marked invalid');
  });

  test('should tell an invited observer in their notices, and link to the session', async () => {
    // Invite the demo reviewer through the invite panel of the open session.
    await trainer.goto(`${app.url}/calibration/sessions/${open.id}`);
    await trainer.getByText('Invite observers').click();
    const panel = trainer.locator('hl-invite-panel');
    await panel.getByRole('checkbox', { name: /reviewer/ }).first().check();
    await panel.getByRole('button', { name: /Invite 1/ }).click();
    await panel.getByText('Invited 1; each was told in the app and by mail.').waitFor();

    const reviewer = await app.newPage({ phone: true });
    await signIn(reviewer, app.url, 'reviewer@demo.test');
    await reviewer.goto(`${app.url}/notifications`);
    const notice = reviewer.locator('li.item', { hasText: 'Invited to calibrate' });
    await notice.waitFor();
    assert.match(await notice.innerText(), /You are invited to the calibration session "Leaf blade greens, new observers"/);
    await notice.getByRole('link', { name: `Open session ${open.id}` }).click();
    await reviewer.waitForURL(new RegExp(`/calibration/sessions/${open.id}`));
    await screenshot(reviewer, 'calibration-loop-invited-phone');
  });

  test("should tell the observer in their notices that the demo session's results are out", async () => {
    await recorder.goto(`${app.url}/notifications`);
    const notice = recorder.locator('li.item', { hasText: 'Calibration results out' });
    await notice.waitFor();
    assert.match(await notice.innerText(), /The results of "Petiole and corm colours, morning group" are out, and you are certified/);
  });
});
