import type { Role } from '../../shared/api/auth.js';
import type { OutgoingMail } from './mailer.js';

/** The invitation mail with its single-use link. */
export function invitationMail(to: string, name: string, role: Role, invitedBy: string, link: string, expiresAt: Date): OutgoingMail {
  return {
    to,
    subject: 'You are invited to Hueledger',
    text: [
      `Hello ${name},`,
      '',
      `${invitedBy} has invited you to Hueledger as a ${role}.`,
      'Open this link to set your password and sign in:',
      '',
      link,
      '',
      `The link works once and expires on ${expiresAt.toUTCString()}.`,
      'If you did not expect this invitation, you can ignore this message.',
    ].join('\n'),
  };
}

/** The password-reset mail with its single-use link. */
export function passwordResetMail(to: string, name: string, link: string, expiresAt: Date): OutgoingMail {
  return {
    to,
    subject: 'Reset your Hueledger password',
    text: [
      `Hello ${name},`,
      '',
      'Someone (we hope you) asked to reset the password of this Hueledger account.',
      'Open this link to choose a new password:',
      '',
      link,
      '',
      `The link works once and expires on ${expiresAt.toUTCString()}.`,
      'If you did not ask for this, ignore this message: your password stays as it is.',
    ].join('\n'),
  };
}
