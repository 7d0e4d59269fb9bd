import { cpSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import type { DataSource } from 'typeorm';
import type { Role } from '../../shared/api/auth.js';
import { MailMessage } from '../../server/mail/mail-message.entity.js';
import { createApp } from '../../server/app.js';
import { hashPassword } from '../../server/auth/passwords.js';
import { User } from '../../server/auth/user.entity.js';
import { seedCharacterCatalogue, seedDescriptorCatalogue } from '../../server/collection/seed-catalogue.js';
import { openDatabase } from '../../server/data-source.js';
import { loadReferenceSets } from '../../server/reference-sets/load-reference-sets.js';
import { seedDemo } from '../../server/demo/seed-demo.js';
import { startMailer, type Mailer } from '../../server/mail/mailer.js';
import { sharedTemplate } from '../shared-template.js';

/** A real app on a fresh SQLite file in a temporary folder, with the real fake-SMTP mailer. */
export interface Harness {
  dir: string;
  dbFile: string;
  ds: DataSource;
  mailer: Mailer;
  app: Express;
  /** Closes everything and removes the folder. */
  close(): Promise<void>;
  /** Closes the app and database but keeps the file, returning a new harness on the same file. */
  restart(): Promise<Harness>;
}

export const TEST_SECRET = 'test-session-secret-that-is-long-enough-0123456789';
export const PUBLIC_URL = 'http://hueledger.test';

/** What a harness can be started with. */
export interface HarnessOptions {
  /** Whether to load the invented demo scenario. */
  demo?: boolean;
  /** An existing folder (restart); a new temporary one by default. */
  dir?: string;
  /** Where the app logs 5xx errors; dropped by default. */
  logError?: (err: unknown) => void;
}

/** Migrates the database in `ds` and loads the catalogue, the reference sets and, when asked, the demo. */
async function seed(ds: DataSource, demo: boolean): Promise<void> {
  await seedCharacterCatalogue(ds);
  await seedDescriptorCatalogue(ds);
  await loadReferenceSets(ds, { log: () => {} });
  if (demo) await seedDemo(ds);
}

/**
 * A seeded data folder shared by the run's test files (tests/shared-template.ts): the same database
 * `seed` makes, made once per run instead of once per harness; null when the file runs alone.
 */
function seededTemplate(demo: boolean): Promise<string | null> {
  return sharedTemplate(demo ? 'api-demo' : 'api', async (into) => {
    const ds = await openDatabase(path.join(into, 'hueledger.sqlite'));
    await seed(ds, demo);
    await ds.destroy(); // closing the last connection checkpoints SQLite's write-ahead log into the file
  });
}

/** Starts a harness on a fresh SQLite file (or the one in `dir`). */
export async function startHarness(opts: HarnessOptions = {}): Promise<Harness> {
  let dir = opts.dir;
  let seeded = false;
  if (!dir) {
    dir = mkdtempSync(path.join(tmpdir(), 'hueledger-test-'));
    const template = await seededTemplate(opts.demo ?? false);
    if (template) {
      cpSync(template, dir, { recursive: true });
      seeded = true;
    }
  }
  const dbFile = path.join(dir, 'hueledger.sqlite');
  const ds = await openDatabase(dbFile);
  if (!seeded) await seed(ds, opts.demo ?? false);
  const mailer = await startMailer(ds, null, 'Hueledger <no-reply@hueledger.invalid>');
  const app = createApp({ dataSource: ds, mailer, sessionSecret: TEST_SECRET, publicUrl: PUBLIC_URL, logError: opts.logError ?? (() => {}), dataDir: dir });
  const shutdown = async () => {
    await mailer.close();
    await ds.destroy();
  };
  const harnessDir = dir;
  return {
    dir,
    dbFile,
    ds,
    mailer,
    app,
    async close() {
      await shutdown();
      rmSync(dir, { recursive: true, force: true });
    },
    async restart() {
      await shutdown();
      return startHarness({ dir: harnessDir, logError: opts.logError });
    },
  };
}

/** A supertest agent that keeps cookies and echoes the CSRF cookie, as Angular's HttpClient does. */
export class Client {
  readonly agent: ReturnType<typeof request.agent>;
  private csrf = '';

  constructor(app: Express) {
    this.agent = request.agent(app);
  }

  /** A client of another app (e.g. after a restart) holding this one's cookies, as a browser would. */
  static resume(app: Express, from: Client): Client {
    const client = new Client(app);
    client.agent.jar.setCookies(from.cookieHeader().split('; '), LOCAL_COOKIES.domain, LOCAL_COOKIES.path);
    client.csrf = from.csrf;
    return client;
  }

  /** The cookies this client would send, as a Cookie header value. */
  cookieHeader(): string {
    return this.agent.jar.getCookies(LOCAL_COOKIES).toValueString();
  }

  /** The value of one cookie this client holds. */
  cookie(name: string): string | undefined {
    return this.agent.jar.getCookie(name, LOCAL_COOKIES)?.value;
  }

  /** The CSRF token this client echoes: the cookie as it holds it now, as Angular reads it before each request. */
  get csrfToken(): string {
    return this.cookie('XSRF-TOKEN') ?? this.csrf;
  }

  /** Fetches the CSRF cookie (GET /api/health). */
  async prime(): Promise<this> {
    const res = await this.agent.get('/api/health').expect(200);
    const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('XSRF-TOKEN='));
    if (cookie) this.csrf = decodeURIComponent(cookie.split(';')[0]!.slice('XSRF-TOKEN='.length));
    return this;
  }

  get(url: string) {
    return this.agent.get(url);
  }
  post(url: string, body?: object) {
    return this.agent.post(url).set('X-XSRF-TOKEN', this.csrfToken).send(body ?? {});
  }
  patch(url: string, body?: object) {
    return this.agent.patch(url).set('X-XSRF-TOKEN', this.csrfToken).send(body ?? {});
  }
  put(url: string, body?: object) {
    return this.agent.put(url).set('X-XSRF-TOKEN', this.csrfToken).send(body ?? {});
  }
  delete(url: string) {
    return this.agent.delete(url).set('X-XSRF-TOKEN', this.csrfToken);
  }
  /** A request carrying the CSRF header and no body yet, for raw or malformed bodies. */
  raw(method: 'post' | 'patch', url: string) {
    return this.agent[method](url).set('X-XSRF-TOKEN', this.csrfToken);
  }

  /** Signs in; fails the test if refused. */
  async signIn(email: string, password: string): Promise<this> {
    await this.prime();
    const res = await this.post('/api/auth/login', { email, password });
    if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}: ${res.text}`);
    // Sign-in regenerates the session and hands out a CSRF cookie bound to it, which csrfToken reads.
    return this;
  }
}

/** Where supertest's ephemeral servers listen, for reading the cookie jar. */
const LOCAL_COOKIES = { domain: '127.0.0.1', path: '/', secure: false, script: false } as Parameters<Client['agent']['jar']['getCookies']>[0];

export const PASSWORD = 'correct-horse-battery';

/** One scrypt hash per distinct fixture password and process: hashing costs ~100 ms or more, and fixtures need no fresh salt. */
const fixtureHashes = new Map<string, Promise<string>>();

/** Adds a user directly to the database (faster than the API for fixtures). */
export async function addUser(ds: DataSource, role: Role, email = `${role}@test.example`, password = PASSWORD): Promise<User> {
  if (!fixtureHashes.has(password)) fixtureHashes.set(password, hashPassword(password));
  const passwordHash = await fixtureHashes.get(password)!;
  return ds.getRepository(User).save({ email, name: `Test ${role}`, role, passwordHash, active: true, lastLoginAt: null });
}

/** A client signed in as a new user of the role. */
export async function signedInAs(h: Harness, role: Role): Promise<Client> {
  const email = `${role}-${Math.random().toString(36).slice(2, 8)}@test.example`;
  await addUser(h.ds, role, email);
  return new Client(h.app).signIn(email, PASSWORD);
}

/** Row counts of every table of the schema (not TypeORM's migrations table), to show a refused request changed nothing. */
export async function rowCounts(ds: DataSource): Promise<Record<string, number>> {
  const tables: { name: string }[] = await ds.query(`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' AND name != 'migrations' ORDER BY name`);
  const counts: Record<string, number> = {};
  for (const { name } of tables) {
    const [row] = (await ds.query(`SELECT COUNT(*) AS n FROM "${name}"`)) as { n: number }[];
    counts[name] = row!.n;
  }
  return counts;
}

/** The mails the fake SMTP server received for one address, oldest first. */
export function mailsTo(ds: DataSource, address: string): Promise<MailMessage[]> {
  return ds.getRepository(MailMessage).find({ where: { recipients: address }, order: { id: 'ASC' } });
}

/** The token of the first link to `${PUBLIC_URL}/<page>/<token>` in a mail's text; fails when there is none. */
export function tokenFromLink(text: string, page: 'invitation' | 'reset-password'): string {
  const escaped = PUBLIC_URL.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
  const match = new RegExp(`${escaped}/${page}/([A-Za-z0-9_-]+)`).exec(text);
  if (!match) throw new Error(`No ${page} link in the mail:\n${text}`);
  return match[1]!;
}
