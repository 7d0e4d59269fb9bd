import { readingUrl } from '../../shared/api/reading-answers.js';
import type { NotificationKind, ReviewDecision } from '../../shared/api/review-answers.js';
import { serverDay } from '../core/day-words.js';
import type { OutgoingMail } from '../mail/mailer.js';

/** What a review notice says about the reading it concerns. */
export interface ReviewedReading {
  id: number;
  accessionNumber: string;
  accessionName: string;
  characterLabel: string;
  siteCode: string;
  observedAt: Date;
}

/** The notice kind of a decision; approvals send none. */
export function noticeKindOf(decision: ReviewDecision): NotificationKind | null {
  return decision === 'flag' ? 'reading-flagged' : decision === 'reread' ? 'reread-requested' : null;
}

/** Which reading: the mail names the day it was observed; the in-app notice does not, since the app writes dates in each reader's own style beside it. */
function what(r: ReviewedReading, withDay = true): string {
  const which = `${r.characterLabel} of ${r.accessionNumber} ${r.accessionName} at ${r.siteCode}`;
  return withDay ? `${which}, observed ${serverDay(r.observedAt.toISOString().slice(0, 10))}` : `reading ${r.id}, ${which}`;
}

/** The in-app notice's plain words: what the reviewer decided, on which reading, and their comment. */
export function noticeMessage(kind: NotificationKind, reviewerName: string, reading: ReviewedReading, comment: string): string {
  const decided = kind === 'reading-flagged' ? 'flagged your reading' : 'asked you to read again';
  return `${reviewerName} ${decided}: ${what(reading, false)}. "${comment}"`;
}

/** The mail a recorder gets when a reviewer flags one of their readings or asks for a re-read, with a link to the reading. */
export function reviewNoticeMail(to: string, name: string, kind: NotificationKind, reviewerName: string, reading: ReviewedReading, comment: string, publicUrl: string): OutgoingMail {
  const link = `${publicUrl}${readingUrl(reading.id)}`;
  const flagged = kind === 'reading-flagged';
  return {
    to,
    subject: flagged ? `A reading of yours was flagged: ${reading.accessionNumber}, ${reading.characterLabel}` : `Please read again: ${reading.accessionNumber}, ${reading.characterLabel}`,
    text: [
      `Hello ${name},`,
      '',
      flagged ? `${reviewerName} has flagged your reading of the ${what(reading)}.` : `${reviewerName} asks you to read the ${what(reading)} again.`,
      '',
      'Their comment:',
      `  ${comment}`,
      '',
      'The reading, its provenance and its history:',
      link,
      '',
      flagged
        ? 'If the reading was wrong, correct it there: the correction becomes a new reading that replaces this one, and both stay in the record.'
        : 'Take the new reading there with "Correct": it replaces this one and goes back into the review queue; both stay in the record.',
    ].join('\n'),
  };
}
