import { calibrationSessionPath } from '../../shared/api/calibration-answers.js';
import { serverDay } from '../core/day-words.js';
import type { OutgoingMail } from '../mail/mailer.js';

/** The mail every participant gets when a trainer closes a session: their own results are ready to read. */
export function resultsOutMail(to: string, name: string, title: string, heldOn: string, publicUrl: string, sessionId: number): OutgoingMail {
  const link = `${publicUrl}${calibrationSessionPath(sessionId)}`;
  return {
    to,
    subject: `Your calibration results are out: ${title}`,
    text: [
      `Hello ${name},`,
      '',
      `The calibration session "${title}" of ${serverDay(heldOn)} is closed, and your results are ready:`,
      'for each specimen, the chip you picked beside the reference colour, your mean ΔE00,',
      'your bias in L*, a* and b*, and whether you met the session\'s thresholds.',
      '',
      link,
      '',
      'Only you and the trainers see your own results.',
    ].join('\n'),
  };
}

/** The mail an observer gets when a trainer invites them to a session. */
export function invitedMail(to: string, name: string, title: string, heldOn: string, publicUrl: string, sessionId: number): OutgoingMail {
  const link = `${publicUrl}${calibrationSessionPath(sessionId)}/take`;
  return {
    to,
    subject: `You are invited to a calibration session: ${title}`,
    text: [
      `Hello ${name},`,
      '',
      `You are invited to the calibration session "${title}" of ${serverDay(heldOn)}.`,
      'For each specimen laid out, pick the chip you see as nearest, under the light the trainer sets.',
      'Wear gloves when handling raw corm, leaf or sap, and never taste raw tissue.',
      '',
      link,
    ].join('\n'),
  };
}

/**
 * The in-app notice of an invitation. It names no date: the text is stored once, while the app
 * writes dates in each reader's own style (the notice shows when it came, the session its day).
 */
export function invitedNotice(title: string): string {
  return `You are invited to the calibration session "${title}": open it and pick a chip for each specimen.`;
}

/** The in-app notice that a session's results are out, with the observer's own outcome. */
export function resultsNotice(title: string, certified: boolean, failedRules: readonly { text: string }[]): string {
  const outcome = certified ? 'you are certified' : `you are not certified${failedRules.length ? `: ${failedRules.map((r) => r.text).join('; ')}` : ''}`;
  return `The results of "${title}" are out, and ${outcome}. Open the session to see each of your picks beside the reference.`;
}
