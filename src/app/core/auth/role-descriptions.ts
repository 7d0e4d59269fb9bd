import type { Role } from '../../../../shared/api/auth.js';

/** Every role, in the order offered in role pickers. */
export const ROLE_CHOICES: readonly Role[] = ['recorder', 'reviewer', 'trainer', 'admin'];

/** What each role does, in plain words, for pickers and the invitation page. */
export const ROLE_DESCRIPTIONS: Record<Role, string> = {
  recorder: 'takes colour readings in the field',
  reviewer: 'approves or flags readings and compares sites and seasons',
  trainer: 'runs calibration sessions for observers',
  admin: 'manages people, sites and the reference set',
};
