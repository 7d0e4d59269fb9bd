import { z } from 'zod';

export type { ApiTokenRow, IssuedApiToken } from './api-token-answers.js';

/** `POST /api/api-tokens` (admin): issue a BrAPI token to a user. */
export const createApiTokenBody = z.object({
  userId: z.number({ message: 'must be a user id' }).int({ message: 'must be a whole number' }).positive({ message: 'must be a user id' }),
  label: z.string({ message: 'is required' }).trim().min(1, { message: 'is required' }).max(80, { message: 'must be at most 80 characters' }),
});
export type CreateApiTokenBody = z.infer<typeof createApiTokenBody>;
