/** The four roles; each API route states which of them it allows (docs/architecture.md, roles). No zod here, so the client can import it cheaply. */
export const ROLES = ['admin', 'trainer', 'reviewer', 'recorder'] as const;
export type Role = (typeof ROLES)[number];

/** Minimum length of a new password; long passphrases beat complexity rules (NIST SP 800-63B §3.1.1.2). */
export const PASSWORD_MIN_LENGTH = 10;
