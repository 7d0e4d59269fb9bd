import express, { type Express } from 'express';
import session from 'express-session';
import helmet from 'helmet';
import { existsSync } from 'node:fs';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { auditRoutes } from './audit/audit.routes.js';
import { authRoutes } from './auth/auth.routes.js';
import { invitationRoutes } from './auth/invitations.routes.js';
import { createPassport } from './auth/passport.js';
import { apiTokenRoutes } from './brapi/api-tokens.routes.js';
import { brapiFallback, brapiRoutes } from './brapi/brapi.routes.js';
import { SESSION_COOKIE, SqliteSessionStore } from './auth/session-store.js';
import { analysisRoutes } from './analysis/analysis.routes.js';
import { calibrationRoutes } from './calibration/calibration.routes.js';
import { collectionRoutes } from './collection/collection.routes.js';
import { descriptorRoutes } from './collection/descriptors.routes.js';
import { plantSheetRoutes } from './collection/plant-sheet.routes.js';
import { publicRoute } from './core/access.js';
import type { AppContext } from './core/context.js';
import { csrfProtection } from './core/csrf.js';
import { apiNotFound, problemHandler } from './core/problem.js';
import type { Mailer } from './mail/mailer.js';
import { DATA_FOLDER } from './operations/data-folder.js';
import { PhotoFiles } from './photos/photo-files.js';
import { outboxRoutes } from './mail/outbox.routes.js';
import { photoRoutes } from './photos/photos.routes.js';
import { profileRoutes } from './profile/profile.routes.js';
import { readingsRoutes } from './readings/readings.routes.js';
import { notificationRoutes, reviewQueueRoutes, reviewRoutes } from './reviews/reviews.routes.js';
import { referenceSetRoutes } from './reference-sets/reference-sets.routes.js';
import { printBatchRoutes } from './reference-sets/print-batches.routes.js';
import { ReferenceSets } from './reference-sets/reference-sets.js';
import { userRoutes } from './users/users.routes.js';
import { preferenceRoutes } from './users/preferences.routes.js';
import { APP_VERSION } from './version.js';

/** What createApp needs; main.ts and the tests both build one. */
export interface AppOptions {
  dataSource: DataSource;
  mailer: Mailer;
  sessionSecret: string;
  /** Base URL for links in mails. */
  publicUrl: string;
  /** Folder of the built Angular client; null serves the API only. */
  clientDir?: string | null;
  /** Whether cookies are marked Secure (behind HTTPS). */
  secureCookies?: boolean;
  /** Express "trust proxy" setting, for a reverse proxy in front. */
  trustProxy?: boolean | number | string;
  /** Where 5xx errors are logged. */
  logError?: (err: unknown) => void;
  /** Data folder; uploaded photos are kept under its `photos/`. Without it the photo routes answer 503. */
  dataDir?: string | null;
}

/** Session lifetime, renewed on activity: a working day in the field. */
const SESSION_MAX_AGE_MS = 12 * 60 * 60 * 1000;

/** Builds the Express app: security headers, sessions, CSRF, the API, the client, problem+json errors. */
export function createApp(options: AppOptions): Express {
  const app = express();
  app.disable('x-powered-by');
  if (options.trustProxy !== undefined) app.set('trust proxy', options.trustProxy);
  const secure = options.secureCookies ?? false;
  const sessions = new SqliteSessionStore(options.dataSource);
  const referenceSets = new ReferenceSets(options.dataSource);
  const photos = options.dataDir ? new PhotoFiles(path.join(options.dataDir, DATA_FOLDER.photos)) : null;
  const logError = options.logError ?? console.error;
  const ctx: AppContext = { ds: options.dataSource, mailer: options.mailer, publicUrl: options.publicUrl, sessions, referenceSets, photos, logError };
  const passport = createPassport(options.dataSource);

  app.use(helmet({ contentSecurityPolicy: { directives: cspDirectives() }, hsts: secure }));
  // Body parsing, sessions and passport only where they are needed: the built client's files are
  // served without a session lookup or a rolling-session write per asset.
  app.use('/api', express.json({ limit: '1mb' }));
  // /brapi is signed in by the same session as /api (or by a token, see server/brapi/).
  app.use(
    ['/api', '/brapi'],
    session({
      name: SESSION_COOKIE,
      secret: options.sessionSecret,
      store: sessions,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: 'lax', secure, maxAge: SESSION_MAX_AGE_MS },
    }),
  );
  app.use(['/api', '/brapi'], passport.initialize(), passport.session());

  const api = express.Router();
  api.use(csrfProtection(options.sessionSecret, secure));
  api.get('/health', publicRoute, (_req, res) => {
    res.json({ status: 'ok', version: APP_VERSION });
  });
  api.use('/auth', authRoutes(ctx, passport));
  api.use('/invitations', invitationRoutes(ctx));
  api.use('/users', userRoutes(ctx));
  api.use('/account', preferenceRoutes(ctx));
  api.use('/api-tokens', apiTokenRoutes(ctx));
  api.use('/outbox', outboxRoutes(ctx));
  api.use('/audit', auditRoutes(ctx));
  api.use('/', profileRoutes(ctx));
  api.use('/', collectionRoutes(ctx));
  api.use('/', descriptorRoutes(ctx));
  api.use('/', plantSheetRoutes(ctx));
  api.use('/', referenceSetRoutes(ctx));
  api.use('/print-batches', printBatchRoutes(ctx));
  api.use('/photos', photoRoutes(ctx));
  api.use('/calibration', calibrationRoutes(ctx));
  api.use('/readings', reviewRoutes(ctx));
  api.use('/readings', readingsRoutes(ctx));
  api.use('/reviews', reviewQueueRoutes(ctx));
  api.use('/notifications', notificationRoutes(ctx));
  api.use('/analysis', analysisRoutes(ctx));
  api.use(apiNotFound);
  app.use('/api', api);
  app.use('/brapi/v2', brapiRoutes(ctx));
  app.use('/brapi', brapiFallback(logError));

  if (options.clientDir) serveClient(app, options.clientDir);
  app.use(problemHandler(logError));
  return app;
}

/** Only our own origin: no CDN, no inline scripts. Styles allow inline because Angular injects component styles. */
function cspDirectives() {
  return {
    defaultSrc: ["'self'"],
    scriptSrc: ["'self'"],
    styleSrc: ["'self'", "'unsafe-inline'"],
    imgSrc: ["'self'", 'data:', 'blob:'],
    fontSrc: ["'self'"],
    connectSrc: ["'self'"],
    workerSrc: ["'self'"],
    manifestSrc: ["'self'"],
    objectSrc: ["'none'"],
    baseUri: ["'self'"],
    formAction: ["'self'"],
    frameAncestors: ["'none'"],
    upgradeInsecureRequests: null,
  };
}

/** Serves the built client: hashed files cached for a year, index.html never, deep links get index.html. */
function serveClient(app: Express, clientDir: string): void {
  const indexFile = path.join(clientDir, 'index.html');
  if (!existsSync(indexFile)) throw new Error(`The client is not built: ${indexFile} is missing. Run npm run build.`);
  app.use(
    express.static(clientDir, {
      index: false,
      setHeaders: (res, file) => {
        res.setHeader('Cache-Control', /-[A-Z0-9]{8}\.(js|css)$/.test(file) ? 'public, max-age=31536000, immutable' : 'no-cache');
      },
    }),
  );
  app.get('/{*splat}', (_req, res) => {
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
}
