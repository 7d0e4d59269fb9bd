// The review part of the invented demo scenario: the demo reviewer has worked through some of the
// demo recorder's readings, approving most, flagging one and asking for one re-read, so the queue,
// the reading history and the recorder's notices have something to show. Comments are invented.
// No mail is sent while seeding: the notices are in the app.
import { IsNull, type EntityManager } from 'typeorm';
import { recordAudit, SYSTEM } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { READING_ROW_RELATIONS } from '../readings/reading-view.js';
import { Reading } from '../readings/reading.entity.js';
import { recordReview } from '../reviews/reviews.js';

/** How many of the recorder's oldest readings in force the demo reviewer approves. */
const DEMO_APPROVED = 6;

/** The flag and the re-read request of the demo, with their invented comments. */
export const DEMO_FLAG_COMMENT = 'The swatch reads far greener than the other petioles of this plant; was the leaf still wet from the rain?';
export const DEMO_REREAD_COMMENT = 'Please read the sap again within a minute of cutting, in open shade; this one was read after it had browned.';

/**
 * Adds the demo reviews inside the demo's transaction, after the demo readings, as the demo
 * reviewer: approvals of the recorder's oldest readings, then one flag and one re-read request
 * (each with the recorder's notice). Returns how many reviews were added; 0 without readings.
 */
export async function seedDemoReviews(m: EntityManager): Promise<number> {
  const reviewer = await m.findOneByOrFail(User, { email: 'reviewer@demo.test' });
  const recorder = await m.findOneByOrFail(User, { email: 'recorder@demo.test' });
  const actor = { id: reviewer.id, email: reviewer.email, ip: null };
  const theirs = await m.find(Reading, { where: { observerId: recorder.id, supersededById: IsNull() }, relations: READING_ROW_RELATIONS, order: { observedAt: 'ASC', id: 'ASC' } });
  if (theirs.length === 0) return 0;
  let added = 0;
  for (const r of theirs.slice(0, DEMO_APPROVED)) {
    await recordReview(m, actor, reviewer, r, { decision: 'approve', comment: null });
    added++;
  }
  const flagged = theirs.slice(DEMO_APPROVED).find((r) => r.character!.code.startsWith('petiole.third'));
  if (flagged) {
    await recordReview(m, actor, reviewer, flagged, { decision: 'flag', comment: DEMO_FLAG_COMMENT });
    added++;
  }
  const reread = theirs.slice(DEMO_APPROVED).find((r) => r.character!.code.startsWith('sap') && r !== flagged);
  if (reread) {
    await recordReview(m, actor, reviewer, reread, { decision: 'reread', comment: DEMO_REREAD_COMMENT });
    added++;
  }
  await recordAudit(m, SYSTEM, 'demo.reviews.loaded', null, { reviews: added });
  return added;
}
