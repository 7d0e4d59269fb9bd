import { z } from 'zod';

/** The units a person types and reads lengths and masses in. */
export const UNIT_SYSTEMS = ['metric', 'imperial'] as const;

/** `GET /api/account/preferences`, and the answer of `PUT`: kept per person on the server, so every phone they sign in on agrees. */
export interface Preferences {
  unitSystem: (typeof UNIT_SYSTEMS)[number];
}

/** `PUT /api/account/preferences` (anyone signed in, for themselves) → 200 `Preferences`. */
export const preferencesBody = z.object({
  unitSystem: z.enum(UNIT_SYSTEMS, { message: `must be one of ${UNIT_SYSTEMS.join(', ')}` }),
});
