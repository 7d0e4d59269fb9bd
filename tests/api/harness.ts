import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import type { DataSource } from 'typeorm';
import type { Role } from '../../shared/api/auth.js';
import { createApp } from '../../server/app.js';
import { hashPassword } from '../../server/auth/passwords.js';
import { User } from '../../server/auth/user.entity.js';
import { seedCharacterCatalogue } from '../../server/collection/seed-catalogue.js';
import { openDatabase } from '../../server/data-source.js';
import { seedDemo } from '../../server/demo/seed-demo.js';
import { startMailer, type Mailer } from '../../server/mail/mailer.js';

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

/** Starts a harness; `demo` loads the invented demo scenario. */
export async function startHarness(opts: { demo?: boolean; dir?: string } = {}): Promise<Harness> {
  const dir = opts.dir ?? mkdtempSync(path.join(tmpdir(), 'hueledger-test-'));
  const dbFile = path.join(dir, 'hueledger.sqlite');
  const ds = await openDatabase(dbFile);
  await seedCharacterCatalogue(ds);
  if (opts.demo) await seedDemo(ds);
  const mailer = await startMailer(ds, null, 'Hueledger <no-reply@hueledger.invalid>');
  const app = createApp({ dataSource: ds, mailer, sessionSecret: TEST_SECRET, publicUrl: PUBLIC_URL, logError: () => {} });
  const shutdown = async () => {
    await mailer.close();
    await ds.destroy();
  };
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
      return startHarness({ dir });
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
    return this.agent.post(url).set('X-XSRF-TOKEN', this.csrf).send(body ?? {});
  }
  patch(url: string, body?: object) {
    return this.agent.patch(url).set('X-XSRF-TOKEN', this.csrf).send(body ?? {});
  }
  delete(url: string) {
    return this.agent.delete(url).set('X-XSRF-TOKEN', this.csrf);
  }

  /** Signs in; fails the test if refused. */
  async signIn(email: string, password: string): Promise<this> {
    await this.prime();
    const res = await this.post('/api/auth/login', { email, password });
    if (res.status !== 200) throw new Error(`sign-in as ${email} answered ${res.status}: ${res.text}`);
    // Sign-in regenerates the session; the CSRF cookie stays valid.
    return this;
  }
}

export const PASSWORD = 'correct-horse-battery';

/** Adds a user directly to the database (faster than the API for fixtures). */
export async function addUser(ds: DataSource, role: Role, email = `${role}@test.example`, password = PASSWORD): Promise<User> {
  return ds.getRepository(User).save({ email, name: `Test ${role}`, role, passwordHash: await hashPassword(password), active: true, lastLoginAt: null });
}

/** A client signed in as a new user of the role. */
export async function signedInAs(h: Harness, role: Role): Promise<Client> {
  const email = `${role}-${Math.random().toString(36).slice(2, 8)}@test.example`;
  await addUser(h.ds, role, email);
  return new Client(h.app).signIn(email, PASSWORD);
}
