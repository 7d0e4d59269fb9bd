import { calibrationSessionPath } from '../../shared/api/calibration-answers.js';
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
      `The calibration session "${title}" of ${heldOn} is closed, and your results are ready:`,
      'for each specimen, the chip you picked beside the reference colour, your mean ΔE00,',
      'your bias in L*, a* and b*, and whether you met the session\'s thresholds.',
      '',
      link,
      '',
      'Only you and the trainers see your own results.',
    ].join('\n'),
  };
}
