// The reviewers' workflow (issue 6): who may decide, what a decision needs, what it changes (the
// reading's status only), the history, the queue, the recorder's notice in the app and the mail
// at the real fake SMTP server; a refused request writes nothing.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { ReadingDetail, ReadingDto, ReadingList } from '../../shared/api/reading-answers.js';
import type { NotificationList, ReviewAnswer, ReviewDto } from '../../shared/api/review-answers.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { addUser, Client, mailsTo, PASSWORD, PUBLIC_URL, rowCounts, signedInAs, startHarness, type Harness } from './harness.js';

const RECORDER_EMAIL = 'field-recorder@test.example';
const OTHER_RECORDER_EMAIL = 'other-recorder@test.example';

describe('reviews, the queue and notices', () => {
  let h: Harness;
  let recorder: Client;
  let otherRecorder: Client;
  let reviewer: Client;
  let admin: Client;
  let trainer: Client;
  let accessionId: number;
  let characterId: number;

  /** A new instrument reading by the field recorder (or another client). */
  const take = async (by: Client = recorder, l = 45): Promise<number> => {
    const res = await by.post('/api/readings', { accessionId, characterId, method: 'instrument', lab: [l, 32, -14], light: 'open-shade' });
    assert.equal(res.status, 201, res.text);
    return res.body.id as number;
  };
  const review = (by: Client, id: number, body: object) => by.post(`/api/readings/${id}/review`, body);
  const readingRow = async (id: number) => ((await h.ds.query('SELECT * FROM "reading" WHERE "id" = ?', [id])) as Record<string, unknown>[])[0]!;
  const everything = async () => JSON.stringify([await rowCounts(h.ds), await h.ds.query('SELECT "id", "status" FROM "reading" ORDER BY "id"')]);

  before(async () => {
    h = await startHarness({ demo: true });
    await addUser(h.ds, 'recorder', RECORDER_EMAIL);
    await addUser(h.ds, 'recorder', OTHER_RECORDER_EMAIL);
    [recorder, otherRecorder, reviewer, admin, trainer] = await Promise.all([
      new Client(h.app).signIn(RECORDER_EMAIL, PASSWORD),
      new Client(h.app).signIn(OTHER_RECORDER_EMAIL, PASSWORD),
      signedInAs(h, 'reviewer'),
      signedInAs(h, 'admin'),
      signedInAs(h, 'trainer'),
    ]);
    accessionId = ((await admin.get('/api/accessions').expect(200)).body as { id: number }[])[0]!.id;
    characterId = ((await admin.get('/api/characters').expect(200)).body as { id: number; colour: boolean }[]).find((c) => c.colour)!.id;
  });
  after(() => h.close());

  describe('who may review', () => {
    for (const role of ['recorder', 'trainer'] as const) {
      test(`should refuse a ${role} the decision and the queue with 403, writing nothing`, async () => {
        const id = await take();
        const client = role === 'recorder' ? recorder : trainer;
        const before = await everything();
        assertProblem(await review(client, id, { decision: 'approve' }), 403);
        assertProblem(await client.get('/api/reviews/queue'), 403);
        assert.equal(await everything(), before);
      });
    }

    test('should refuse an admin a review of a reading they took themselves (403), writing nothing', async () => {
      const own = await take(admin);
      const before = await everything();
      assert.match(assertProblem(await review(admin, own, { decision: 'approve' }), 403).detail ?? '', /yourself/);
      assert.equal(await everything(), before);
    });

    test('should let an admin review someone else\'s reading', async () => {
      const id = await take();
      const res = await review(admin, id, { decision: 'approve' });
      assert.equal(res.status, 201, res.text);
      assert.equal((res.body as ReviewAnswer).reading.status, 'approved');
    });

    test('should answer 404 for an unknown reading, writing nothing', async () => {
      const before = await everything();
      assertProblem(await review(reviewer, 999_999, { decision: 'approve' }), 404);
      assertProblem(await reviewer.get('/api/readings/999999/reviews'), 404);
      assert.equal(await everything(), before);
    });
  });

  describe('what a decision needs', () => {
    test('should refuse flag and re-read without a comment with 400 naming comment, writing and mailing nothing', async () => {
      const id = await take();
      const before = await everything();
      const mails = (await mailsTo(h.ds, RECORDER_EMAIL)).length;
      assertInvalidFields(await review(reviewer, id, { decision: 'flag' }), 'comment');
      assertInvalidFields(await review(reviewer, id, { decision: 'reread', comment: '   ' }), 'comment');
      assertInvalidFields(await review(reviewer, id, { decision: 'flag', comment: null }), 'comment');
      assertInvalidFields(await review(reviewer, id, { decision: 'reread', comment: 'x'.repeat(1001) }), 'comment');
      assertInvalidFields(await review(reviewer, id, { decision: 'maybe', comment: 'Hmm.' }), 'decision');
      assertInvalidFields(await review(reviewer, id, {}), 'decision');
      assertProblem(await review(reviewer, id, { decision: 'approve', status: 'approved' }), 400);
      assert.equal(await everything(), before);
      assert.equal((await mailsTo(h.ds, RECORDER_EMAIL)).length, mails);
    });

    test('should approve without a comment, sending no notice and no mail', async () => {
      const id = await take();
      const mails = (await mailsTo(h.ds, RECORDER_EMAIL)).length;
      const notices = (await recorder.get('/api/notifications').expect(200)).body as NotificationList;
      const res = await review(reviewer, id, { decision: 'approve' });
      assert.equal(res.status, 201, res.text);
      const answer = res.body as ReviewAnswer;
      assert.deepEqual([answer.review.decision, answer.review.comment, answer.reading.status, answer.mailed], ['approve', null, 'approved', false]);
      assert.equal((await mailsTo(h.ds, RECORDER_EMAIL)).length, mails);
      assert.equal(((await recorder.get('/api/notifications').expect(200)).body as NotificationList).items.length, notices.items.length);
    });
  });

  describe('one reading through the workflow', () => {
    let id: number;
    let original: Record<string, unknown>;
    const FLAG = 'The basal ring looks read in direct sun; the swatch is far lighter than the plant.';
    const REREAD = 'Please read it again in open shade, the chip touching the petiole.';

    before(async () => {
      id = await take();
      original = await readingRow(id);
    });

    test('should flag with a reason: status flagged, a notice for the recorder, and a mail with the reading\'s link', async () => {
      const mails = (await mailsTo(h.ds, RECORDER_EMAIL)).length;
      const res = await review(reviewer, id, { decision: 'flag', comment: `  ${FLAG}  ` });
      assert.equal(res.status, 201, res.text);
      const answer = res.body as ReviewAnswer;
      assert.deepEqual([answer.review.decision, answer.review.comment, answer.review.readingId, answer.reading.id, answer.reading.status, answer.mailed], ['flag', FLAG, id, id, 'flagged', true]);
      const received = await mailsTo(h.ds, RECORDER_EMAIL);
      assert.equal(received.length, mails + 1);
      const mail = received.at(-1)!;
      assert.match(mail.subject, /flagged/);
      assert.ok(mail.text.includes(`${PUBLIC_URL}/readings/${id}`), mail.text);
      assert.ok(mail.text.includes(FLAG), 'the mail carries the comment');
      // The day observed in words (en-GB's style: a mail has no reader's language), never as an ISO date.
      const observed = new Date(`${String(original['observedAt']).replace(' ', 'T')}Z`);
      assert.ok(mail.text.includes(`observed ${new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(observed)}`), mail.text);
      assert.doesNotMatch(mail.text, /\b\d{4}-\d{2}-\d{2}\b/);
      const notices = (await recorder.get('/api/notifications').expect(200)).body as NotificationList;
      const notice = notices.items.find((n) => n.readingId === id)!;
      assert.deepEqual([notice.kind, notice.readAt], ['reading-flagged', null]);
      assert.ok(notice.message.includes(FLAG));
      // The stored notice names the reading, never a raw date: the app writes dates in each reader's style.
      assert.ok(notice.message.includes(`reading ${id}`), notice.message);
      assert.doesNotMatch(notice.message, /\d{4}-\d{2}-\d{2}/);
      assert.ok(notices.unread >= 1);
    });

    test('should take the reading out of the default queue once flagged, and show it under status=flagged', async () => {
      const queue = (await reviewer.get('/api/reviews/queue?pageSize=100').expect(200)).body as ReadingList;
      assert.ok(queue.items.every((r) => r.status === 'submitted'), 'the queue defaults to submitted');
      assert.ok(!queue.items.some((r) => r.id === id));
      const flagged = (await reviewer.get(`/api/reviews/queue?status=flagged&accessionId=${accessionId}`).expect(200)).body as ReadingList;
      assert.ok(flagged.items.some((r) => r.id === id));
      assert.ok(flagged.items.every((r) => r.status === 'flagged'));
    });

    test('should ask for a re-read: status reread-requested, a second notice and a second mail', async () => {
      const mails = (await mailsTo(h.ds, RECORDER_EMAIL)).length;
      const res = await review(reviewer, id, { decision: 'reread', comment: REREAD });
      assert.equal(res.status, 201, res.text);
      assert.deepEqual([(res.body as ReviewAnswer).reading.status, (res.body as ReviewAnswer).mailed], ['reread-requested', true]);
      const received = await mailsTo(h.ds, RECORDER_EMAIL);
      assert.equal(received.length, mails + 1);
      assert.match(received.at(-1)!.subject, /read again/i);
      assert.ok(received.at(-1)!.text.includes(REREAD));
      assert.ok(received.at(-1)!.text.includes(`${PUBLIC_URL}/readings/${id}`));
      const notices = (await recorder.get('/api/notifications').expect(200)).body as NotificationList;
      assert.deepEqual(notices.items.filter((n) => n.readingId === id).map((n) => n.kind), ['reread-requested', 'reading-flagged'], 'newest first');
    });

    test('should change nothing of the reading but its status', async () => {
      const now = await readingRow(id);
      assert.equal(now['status'], 'reread-requested');
      assert.deepEqual({ ...now, status: original['status'] }, original);
    });

    test('should list the reviews oldest first, and show every step in the reading\'s history', async () => {
      const reviews = (await recorder.get(`/api/readings/${id}/reviews`).expect(200)).body as ReviewDto[];
      assert.deepEqual(reviews.map((r) => [r.decision, r.comment]), [['flag', FLAG], ['reread', REREAD]]);
      assert.ok(reviews.every((r) => r.reviewerName === 'Test reviewer'));
      const detail = (await recorder.get(`/api/readings/${id}`).expect(200)).body as ReadingDetail;
      assert.deepEqual(detail.history.map((e) => e.action), ['reading.created', 'reading.reviewed', 'reading.reviewed']);
      assert.deepEqual(detail.history.slice(1).map((e) => [e.detail?.['decision'], e.detail?.['from'], e.detail?.['to']]), [['flag', 'submitted', 'flagged'], ['reread', 'flagged', 'reread-requested']]);
      assert.equal(detail.history[1]!.actorName, 'Test reviewer');
    });

    test('should start the recorder\'s correction as submitted, and refuse a review of the superseded reading with 409, writing nothing', async () => {
      const res = await recorder.post(`/api/readings/${id}/supersede`, { accessionId, characterId, method: 'instrument', lab: [47, 31, -13], light: 'open-shade', reason: 'Read again in open shade as asked.' });
      assert.equal(res.status, 201, res.text);
      const correction = res.body as ReadingDetail;
      assert.equal(correction.status, 'submitted');
      const queue = (await reviewer.get(`/api/reviews/queue?accessionId=${accessionId}&pageSize=100`).expect(200)).body as ReadingList;
      assert.ok(queue.items.some((r) => r.id === correction.id), 'the correction is back in the queue');
      const before = await everything();
      const mails = (await mailsTo(h.ds, RECORDER_EMAIL)).length;
      assertProblem(await review(reviewer, id, { decision: 'approve' }), 409);
      assertProblem(await review(reviewer, id, { decision: 'flag', comment: 'Still wrong.' }), 409);
      assert.equal(await everything(), before);
      assert.equal((await mailsTo(h.ds, RECORDER_EMAIL)).length, mails);
    });
  });

  describe('the queue', () => {
    test('should page the submitted readings with the readings filters, and refuse a bad filter with 400 naming it', async () => {
      for (let i = 0; i < 3; i++) await take(otherRecorder, 50 + i);
      const page = (await reviewer.get('/api/reviews/queue?pageSize=2&page=1').expect(200)).body as ReadingList;
      assert.equal(page.items.length, 2);
      assert.ok(page.total >= 3);
      const submitted = (await h.ds.query(`SELECT COUNT(*) AS n FROM "reading" WHERE "status" = 'submitted' AND "supersededById" IS NULL`)) as { n: number }[];
      assert.equal(page.total, submitted[0]!.n, 'total counts every submitted reading in force');
      const otherId = (await h.ds.query('SELECT "id" FROM "user" WHERE "email" = ?', [OTHER_RECORDER_EMAIL]))[0].id as number;
      const mine = (await reviewer.get(`/api/reviews/queue?observerId=${otherId}&sort=observedAt&dir=asc`).expect(200)).body as ReadingList;
      assert.equal(mine.total, 3);
      assert.deepEqual(mine.items.map((r: ReadingDto) => r.lab[0]), [50, 51, 52]);
      assertInvalidFields(await reviewer.get('/api/reviews/queue?status=lost'), 'status');
      assertInvalidFields(await reviewer.get('/api/reviews/queue?pageSize=1000'), 'pageSize');
    });
  });

  describe('notices', () => {
    test('should show each user only their own notices, and mark one read only for its owner', async () => {
      const id = await take();
      await review(reviewer, id, { decision: 'reread', comment: 'Cut a fresh corm face and read within a minute.' }).expect(201);
      const mine = (await recorder.get('/api/notifications').expect(200)).body as NotificationList;
      const notice = mine.items.find((n) => n.readingId === id)!;
      assert.ok(notice);
      const theirs = (await otherRecorder.get('/api/notifications').expect(200)).body as NotificationList;
      assert.deepEqual([theirs.items, theirs.unread], [[], 0]);

      const before = await everything();
      assertProblem(await otherRecorder.post(`/api/notifications/${notice.id}/read`), 404);
      assertProblem(await recorder.post('/api/notifications/999999/read'), 404);
      assert.equal(await everything(), before);

      await recorder.post(`/api/notifications/${notice.id}/read`).expect(204);
      const after = (await recorder.get('/api/notifications').expect(200)).body as NotificationList;
      const read = after.items.find((n) => n.id === notice.id)!;
      assert.ok(read.readAt && !Number.isNaN(Date.parse(read.readAt)));
      assert.equal(after.unread, mine.unread - 1);
      await recorder.post(`/api/notifications/${notice.id}/read`).expect(204);
      const again = (await recorder.get('/api/notifications').expect(200)).body as NotificationList;
      assert.equal(again.items.find((n) => n.id === notice.id)!.readAt, read.readAt, 'marking again keeps the first time');
    });
  });
});
