// Answer types of the BrAPI token routes. No zod here, so the client can import them cheaply; the
// request schema is in api-tokens.ts, which re-exports everything below.

/** One token as the admin's table lists it; the secret itself is never listed. */
export interface ApiTokenRow {
  id: number;
  userId: number;
  userEmail: string;
  userName: string;
  label: string;
  /** The token's first characters, to tell tokens apart. */
  prefix: string;
  createdAt: string;
  createdByEmail: string;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** The answer to issuing a token: the only time the token itself is shown. */
export interface IssuedApiToken extends ApiTokenRow {
  token: string;
}
