import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto';

/**
 * scrypt parameters: N = 2^15, r = 8, p = 1 — the interactive-login setting recommended by the
 * OWASP Password Storage Cheat Sheet ("scrypt with N=2^17 … or N=2^15 r=8 p=1 …", from memory).
 * 32 MiB per hash, so maxmem is raised above Node's 32 MiB default.
 */
const PARAMS: ScryptOptions = { N: 2 ** 15, r: 8, p: 1, maxmem: 64 * 1024 * 1024 };
const KEY_LENGTH = 32;

function scryptAsync(password: string, salt: Buffer, params: ScryptOptions): Promise<Buffer> {
  return new Promise((resolve, reject) =>
    scrypt(password.normalize('NFKC'), salt, KEY_LENGTH, params, (err, key) => (err ? reject(err) : resolve(key))),
  );
}

/** Hashes a password with a fresh 16-byte salt: `scrypt$N$r$p$salt$hash` (base64url). */
export async function hashPassword(password: string): Promise<string> {
  const salt = randomBytes(16);
  const key = await scryptAsync(password, salt, PARAMS);
  return ['scrypt', PARAMS.N, PARAMS.r, PARAMS.p, salt.toString('base64url'), key.toString('base64url')].join('$');
}

/** Whether the password matches the stored hash (constant-time compare). */
export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [scheme, n, r, p, salt, hash] = stored.split('$');
  if (scheme !== 'scrypt' || !salt || !hash) return false;
  const expected = Buffer.from(hash, 'base64url');
  const key = await scryptAsync(password, Buffer.from(salt, 'base64url'), { N: Number(n), r: Number(r), p: Number(p), maxmem: PARAMS.maxmem });
  return key.length === expected.length && timingSafeEqual(key, expected);
}

let decoy: Promise<string> | null = null;

/** A hash of a random password nobody knows: checking an unknown e-mail against it costs as much as a real check. */
export function decoyHash(): Promise<string> {
  return (decoy ??= hashPassword(randomBytes(24).toString('base64url')));
}
