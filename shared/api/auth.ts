import { z } from 'zod';

import { PASSWORD_MIN_LENGTH, ROLES, type Role } from './roles.js';

export { PASSWORD_MIN_LENGTH, ROLES, type Role };
export type { FieldError, Problem } from './problem.js';

/** An address has at most 254 characters (RFC 5321 §4.5.3.1.3: a 256-octet path less its angle brackets). */
const EMAIL_MAX_LENGTH = 254;

const email = z
  .string()
  .trim()
  .toLowerCase()
  .max(EMAIL_MAX_LENGTH, { message: `must be at most ${EMAIL_MAX_LENGTH} characters` })
  .pipe(z.email({ message: 'must be an e-mail address' }));
const newPassword = z
  .string()
  .min(PASSWORD_MIN_LENGTH, { message: `must be at least ${PASSWORD_MIN_LENGTH} characters` })
  .max(200, { message: 'must be at most 200 characters' });
const personName = z.string().trim().min(1, { message: 'is required' }).max(120);
const token = z.string().regex(/^[A-Za-z0-9_-]{20,100}$/, { message: 'is not a valid link token' });

/** The signed-in person as the client sees them. */
export interface UserSummary {
  id: number;
  email: string;
  name: string;
  role: Role;
}

/** A row of the admin's user table. */
export interface UserRow extends UserSummary {
  active: boolean;
  createdAt: string;
  lastLoginAt: string | null;
}

export const loginBody = z.object({ email, password: z.string().min(1, { message: 'is required' }).max(200) });
export type LoginBody = z.infer<typeof loginBody>;

export const changePasswordBody = z.object({
  currentPassword: z.string().min(1, { message: 'is required' }).max(200),
  newPassword,
});
export type ChangePasswordBody = z.infer<typeof changePasswordBody>;

export const createUserBody = z.object({ email, name: personName, role: z.enum(ROLES), password: newPassword });
export type CreateUserBody = z.infer<typeof createUserBody>;

export const updateUserBody = z
  .object({ name: personName.optional(), role: z.enum(ROLES).optional(), active: z.boolean().optional() })
  .refine((b) => Object.keys(b).length > 0, { message: 'name, role or active is required' });
export type UpdateUserBody = z.infer<typeof updateUserBody>;

export const inviteBody = z.object({ email, name: personName, role: z.enum(ROLES) });
export type InviteBody = z.infer<typeof inviteBody>;

/** What the public invitation page shows before the invitee sets a password. */
export interface InvitationView {
  email: string;
  name: string;
  role: Role;
  expiresAt: string;
}

/** A pending invitation in the admin's list. */
export interface InvitationRow extends InvitationView {
  id: number;
  invitedBy: string;
  createdAt: string;
  acceptedAt: string | null;
}

export const acceptInvitationBody = z.object({ token, password: newPassword });
export type AcceptInvitationBody = z.infer<typeof acceptInvitationBody>;

export const requestResetBody = z.object({ email });
export type RequestResetBody = z.infer<typeof requestResetBody>;

export const confirmResetBody = z.object({ token, password: newPassword });
export type ConfirmResetBody = z.infer<typeof confirmResetBody>;

/** A message caught by the built-in fake SMTP server, shown on the admin's outbox page. */
export interface OutboxMessage {
  id: number;
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
}

/** One audit event (sign-ins, failed sign-ins, user changes, …). */
export interface AuditEventRow {
  id: number;
  at: string;
  actorId: number | null;
  actorEmail: string | null;
  /** The actor's name now; null for the system or a signed-out caller. */
  actorName: string | null;
  action: string;
  subject: string | null;
  detail: Record<string, unknown> | null;
  ip: string | null;
  /** The event in plain words, e.g. "Juno Pellbright corrected reading 12 from … to …, because …". */
  sentence: string;
}

/** Any paginated list. */
export interface Page<T> {
  items: T[];
  total: number;
}

