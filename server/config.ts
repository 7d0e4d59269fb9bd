import { isIP } from 'node:net';
import path from 'node:path';
import { z } from 'zod';

/** Runtime settings, read and validated once at start-up (README.md, Configuration). */
export interface Config {
  port: number;
  dataDir: string;
  demo: boolean;
  /** Real SMTP server URL; unset → the built-in fake SMTP server on loopback. */
  smtpUrl: string | null;
  /** Base URL put into links in mails. */
  publicUrl: string;
  /** Sender address of outgoing mail. */
  mailFrom: string;
  sessionSecret: string | null;
  /** Express "trust proxy": the number of proxies in front, or the addresses to trust; false when the app faces clients itself. */
  trustProxy: false | number | string;
  /** Whether cookies are marked Secure (sent over HTTPS only); on by default behind a trusted proxy. */
  secureCookies: boolean;
}

/** Express's names for address ranges (expressjs.com, "Express behind proxies"). */
const PROXY_RANGE_NAMES = new Set(['loopback', 'linklocal', 'uniquelocal']);

/** Whether one entry of a TRUST_PROXY list is a range name, an IP address, or an address/prefix. */
function isProxyAddress(entry: string): boolean {
  if (PROXY_RANGE_NAMES.has(entry)) return true;
  const [address, prefix, ...rest] = entry.split('/');
  const family = isIP(address ?? '');
  if (!family || rest.length) return false;
  if (prefix === undefined) return true;
  return /^\d{1,3}$/.test(prefix) && Number(prefix) <= (family === 4 ? 32 : 128);
}

const trustProxy = z
  .string()
  .trim()
  .optional()
  .transform((v, ctx): false | number | string => {
    if (v === undefined || v === '' || v === '0' || v === 'false') return false;
    if (/^\d+$/.test(v)) {
      const hops = Number(v);
      if (hops <= 10) return hops;
      ctx.addIssue({ code: 'custom', message: 'must be the number of proxies in front (1 to 10), or addresses to trust' });
      return z.NEVER;
    }
    const entries = v.split(',').map((e) => e.trim());
    if (entries.every(isProxyAddress)) return entries.join(',');
    ctx.addIssue({ code: 'custom', message: 'must be the number of proxies in front (1 to 10), or a comma-separated list of IP addresses, address/prefix ranges, loopback, linklocal or uniquelocal' });
    return z.NEVER;
  });

const schema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HUELEDGER_DATA_DIR: z.string().min(1).default('./data'),
  HUELEDGER_DEMO: z.enum(['0', '1', 'true', 'false', '']).default('0'),
  SMTP_URL: z.url({ protocol: /^smtps?$/, message: 'must be an smtp:// or smtps:// URL' }).optional(),
  PUBLIC_URL: z.url().optional(),
  MAIL_FROM: z.string().min(3).default('Hueledger <no-reply@hueledger.invalid>'),
  SESSION_SECRET: z.string().min(32, { message: 'must be at least 32 characters' }).optional(),
  TRUST_PROXY: trustProxy,
  SECURE_COOKIES: z.enum(['0', '1', 'true', 'false', '']).optional(),
});

/** Reads the environment; throws one readable error naming every bad variable. */
export function readConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  const publicUrl = (e.PUBLIC_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, '');
  const secureCookies = e.SECURE_COOKIES === undefined || e.SECURE_COOKIES === '' ? e.TRUST_PROXY !== false : e.SECURE_COOKIES === '1' || e.SECURE_COOKIES === 'true';
  if (secureCookies && !publicUrl.startsWith('https://')) {
    throw new Error(
      `Invalid configuration:\n  PUBLIC_URL: must be an https:// URL when cookies are Secure (TRUST_PROXY is set or SECURE_COOKIES=1); a browser never sends Secure cookies over http, got ${publicUrl}`,
    );
  }
  return {
    port: e.PORT,
    dataDir: path.resolve(e.HUELEDGER_DATA_DIR),
    demo: e.HUELEDGER_DEMO === '1' || e.HUELEDGER_DEMO === 'true',
    smtpUrl: e.SMTP_URL ?? null,
    publicUrl,
    mailFrom: e.MAIL_FROM,
    sessionSecret: e.SESSION_SECRET ?? null,
    trustProxy: e.TRUST_PROXY,
    secureCookies,
  };
}
