import { z } from 'zod';
import path from 'node:path';

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
}

const schema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  HUELEDGER_DATA_DIR: z.string().min(1).default('./data'),
  HUELEDGER_DEMO: z.enum(['0', '1', 'true', 'false', '']).default('0'),
  SMTP_URL: z.url({ protocol: /^smtps?$/, message: 'must be an smtp:// or smtps:// URL' }).optional(),
  PUBLIC_URL: z.url().optional(),
  MAIL_FROM: z.string().min(3).default('Hueledger <no-reply@hueledger.invalid>'),
  SESSION_SECRET: z.string().min(32, { message: 'must be at least 32 characters' }).optional(),
});

/** Reads the environment; throws one readable error naming every bad variable. */
export function readConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = schema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Invalid configuration:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  return {
    port: e.PORT,
    dataDir: path.resolve(e.HUELEDGER_DATA_DIR),
    demo: e.HUELEDGER_DEMO === '1' || e.HUELEDGER_DEMO === 'true',
    smtpUrl: e.SMTP_URL ?? null,
    publicUrl: (e.PUBLIC_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, ''),
    mailFrom: e.MAIL_FROM,
    sessionSecret: e.SESSION_SECRET ?? null,
  };
}
